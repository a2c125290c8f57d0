import { existsSync, readFileSync, mkdtempSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { resultsToJson } from '../../core/batch';
import { makeDemoCohort } from '../../core/cohort';
import { cohortCommand } from '../../app/cli/cohort-command';
import { capturedIo } from './command-io';

// Source: demo data (invented synthetic embryos).
const dir = mkdtempSync(join(tmpdir(), 'eggline-cohort-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));


const demo = makeDemoCohort({ conditions: [{ name: 'ref', dosage: 1, count: 4 }, { name: 'dbl', dosage: 2, count: 4 }], seed: 5 });
const resultsDir = join(dir, 'run');
mkdirSync(resultsDir);
writeFileSync(join(resultsDir, 'results.json'), resultsToJson(demo.results));
writeFileSync(join(resultsDir, 'run.json'), JSON.stringify({ eggline: '0.1.0' }));
writeFileSync(join(dir, 'samples.csv'), demo.sheetCsv);

describe('eggline cohort', () => {
  it('reads results.json and writes the outputs (exit 0)', async () => {
    const b = capturedIo();
    const code = await cohortCommand([resultsDir, '--samples', join(dir, 'samples.csv'), '--normalise', 'minmax', '--lambda-posterior-el', '0.3', '--equivalence-margin', '0.2'], b.io);
    expect(b.err.join('')).toBe('');
    expect(code).toBe(0);
    expect(existsSync(join(resultsDir, 'cohort', 'report.html'))).toBe(true);
    expect(readFileSync(join(resultsDir, 'cohort', 'report.html'), 'utf8')).toContain('Equivalence margin ±0.2');
    expect(b.out.join('')).toMatch(/^wrote 17 files to .*cohort \(open report\.html\)\n$/);
  });
  it('--pattern with --dosage takes conditions from file names', async () => {
    const b = capturedIo();
    const out = join(dir, 'by-pattern');
    const code = await cohortCommand([resultsDir, '--pattern', '^(?<condition>[a-z]+)/', '--dosage', 'ref=1', '--dosage', 'dbl=2', '--out', out], b.io);
    expect(b.err.join('')).toBe('');
    expect(code).toBe(0);
    expect(existsSync(join(out, 'shifts.csv'))).toBe(true);
  });
  it('usage errors exit 2 with one line and a hint', async () => {
    const cases: [string[], string][] = [
      [[], 'eggline cohort: missing <results-dir> (see "eggline cohort --help")\n'],
      [[resultsDir], 'eggline cohort: --samples <csv> is required (see "eggline cohort --help")\n'],
      [[resultsDir, '--samples', 's.csv', '--normalise', 'log'], 'eggline cohort: --normalise must be scale-offset, none, amplitude or minmax (got "log") (see "eggline cohort --help")\n'],
      [[resultsDir, '--samples', 's.csv', '--lambda-posterior-el', '0'], 'eggline cohort: --lambda-posterior-el must be a positive number (got "0") (see "eggline cohort --help")\n'],
      [[resultsDir, '--samples', 's.csv', '--equivalence-margin', '1'], 'eggline cohort: --equivalence-margin must be a number between 0 and 1 (got "1") (see "eggline cohort --help")\n'],
    ];
    cases.push([[resultsDir, '--pattern', 'x', '--dosage', 'ref'], 'eggline cohort: --dosage must look like CONDITION=F with F > 0 (got "ref") (see "eggline cohort --help")\n']);
    cases.push([[resultsDir, '--pattern', 'x', '--samples', 's.csv'], 'eggline cohort: use either --samples or --pattern, not both (see "eggline cohort --help")\n']);
    for (const [argv, message] of cases) {
      const b = capturedIo();
      expect(await cohortCommand(argv, b.io)).toBe(2);
      expect(b.err.join('')).toBe(message);
    }
    const b = capturedIo();
    expect(await cohortCommand([resultsDir, '--bogus'], b.io)).toBe(2);
    expect(b.err.join('')).toMatch(/^eggline cohort: Unknown option '--bogus'.*\(see "eggline cohort --help"\)\n$/);
  });
  it('bad inputs exit 1 with one line naming the file', async () => {
    const b = capturedIo();
    expect(await cohortCommand([join(dir, 'nowhere'), '--samples', join(dir, 'samples.csv')], b.io)).toBe(1);
    expect(b.err.join('')).toBe(`eggline cohort: ${join(dir, 'nowhere', 'results.json')}: cannot read (ENOENT)\n`);
    const bad = join(dir, 'bad');
    mkdirSync(bad);
    writeFileSync(join(bad, 'results.json'), '{"schema":"other"}');
    const c = capturedIo();
    expect(await cohortCommand([bad, '--samples', join(dir, 'samples.csv')], c.io)).toBe(1);
    expect(c.err.join('')).toBe(`eggline cohort: ${join(bad, 'results.json')}: not an Eggline results file (schema must be "eggline-results")\n`);
    const d = capturedIo();
    expect(await cohortCommand([resultsDir, '--samples', join(dir, 'samples.csv'), '--reference', 'nope'], d.io)).toBe(1);
    expect(d.err.join('')).toBe('eggline cohort: samples.csv: reference condition "nope" is not in the sheet (conditions: ref, dbl)\n');
    const e = capturedIo();
    expect(await cohortCommand([resultsDir, '--pattern', '^(.*)/'], e.io)).toBe(1);
    expect(e.err.join('')).toBe('eggline cohort: file-name rule: the pattern needs a named group (?<condition>...)\n');
  });
  it('--help prints the usage (exit 0)', async () => {
    const b = capturedIo();
    expect(await cohortCommand(['--help'], b.io)).toBe(0);
    expect(b.out.join('')).toContain('Usage: eggline cohort <results-dir> --samples <csv> [options]');
  });
});

// `eggline cohort --background-condition` (and a sample sheet's role column) on a small demo-like set: outputs,
// report and one-line errors.
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { resultsToJson } from '../../core/batch';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { backgroundDemoCohort } from '../../core/cohort/background-demo.test-helper';
import { cohortCommand } from '../../app/cli/cohort-command';
import { capturedIo, csvRowsOf } from './command-io';
import { cohortSummaryFor } from '../../app/engine/cohort-summary';

// Source: demo data (invented: null-stained embryos share an additive background bump with the stained ones; the
// truth is λ = 0.2 EL and a dosage series 1, 2 whose target boundary moves by λ·ln 2).
const dir = mkdtempSync(join(tmpdir(), 'eggline-background-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const demo = backgroundDemoCohort(23, 4, 3, [{ name: 'dosage-1x', dosage: 1 }, { name: 'dosage-2x', dosage: 2 }]);
const run = join(dir, 'run');
mkdirSync(run);
writeFileSync(join(run, 'results.json'), resultsToJson(demo.results));
writeFileSync(join(run, 'run.json'), JSON.stringify({ settings: { ...DEFAULT_SETTINGS, boundaryChannels: ['target'] } }));
const sheetPath = join(dir, 'samples.csv');
writeFileSync(sheetPath, demo.sheet);



describe('eggline cohort --background-condition', () => {
  it('subtracts the null staining, refits, and writes the background tables, record and report section', async () => {
    const b = capturedIo();
    const out = join(dir, 'with');
    expect(await cohortCommand([run, '--samples', sheetPath, '--background-condition', 'null-stain', '--out', out], b.io)).toBe(0);
    expect(b.out.join('')).toContain('background condition "null-stain" (3 embryos) subtracted; λ and boundaries fitted again (background_refit.csv)');
    for (const f of ['background_profile.csv', 'background_refit.csv', 'background_conditions.csv', 'background_condition.json', 'background-condition.svg', 'background-condition.png']) {
      expect(existsSync(join(out, f))).toBe(true);
    }
    const record = JSON.parse(readFileSync(join(out, 'background_condition.json'), 'utf8'));
    expect(record.embryos).toEqual(['null_1.tif', 'null_2.tif', 'null_3.tif']);
    expect(record.namedBy).toBe('--background-condition');
    // The conditions table has the refitted λ, and no row for the background condition
    const lam = csvRowsOf(join(out, 'conditions.csv')).filter((r) => r.quantity === 'lambda' && r.unit === 'EL');
    expect(lam.map((r) => r.condition)).toEqual(['dosage-1x', 'dosage-2x']);
    for (const r of lam) expect(Math.abs(Number(r.mean) - 0.2)).toBeLessThan(0.01);
    const summary = csvRowsOf(join(out, 'background_conditions.csv')).find((r) => r.condition === 'dosage-1x' && r.quantity === 'lambda' && r.unit === 'EL')!;
    expect(Number(summary.mean_before)).toBeGreaterThan(0.25);
    expect(Number(summary.mean_after)).toBe(Number(lam[0].mean));
    expect(Number(summary.ci_low)).toBeLessThan(0.2);
    expect(Number(summary.ci_high)).toBeGreaterThan(0.2);
    expect(csvRowsOf(join(out, 'background_profile.csv')).filter((r) => r.channel === 'target')).toHaveLength(100);
    const html = readFileSync(join(out, 'report.html'), 'utf8');
    expect(html).toContain('<h2 id="background">Background condition</h2>');
    expect(html).toContain('Background condition subtracted:</strong> every λ, amplitude and boundary position in this report is refitted after subtracting the mean profile of <strong>null-stain</strong> (3 embryos');
    expect(html).toContain('null_1.tif, null_2.tif, null_3.tif');
    expect(html).toContain('<figure id="fig-background-condition">');
  });

  it('without the option the null staining is just another condition, and no background table is left from before', async () => {
    const b = capturedIo();
    const out = join(dir, 'with');
    expect(await cohortCommand([run, '--samples', sheetPath, '--out', out], b.io)).toBe(0);
    expect(existsSync(join(out, 'background_refit.csv'))).toBe(false);
    expect(existsSync(join(out, 'background-condition.svg'))).toBe(false);
    expect(csvRowsOf(join(out, 'conditions.csv')).some((r) => r.condition === 'null-stain')).toBe(true);
    expect(readFileSync(join(out, 'report.html'), 'utf8')).not.toContain('id="background"');
  });

  it('takes the background condition from the sheet\'s role column', async () => {
    const marked = join(dir, 'marked.csv');
    writeFileSync(marked, demo.sheet.split('\n').map((l, i) => (i === 0 ? `${l},role` : l === '' ? l : `${l},${l.startsWith('null') ? 'background' : 'sample'}`)).join('\n'));
    const b = capturedIo();
    const out = join(dir, 'marked');
    expect(await cohortCommand([run, '--samples', marked, '--out', out], b.io)).toBe(0);
    expect(JSON.parse(readFileSync(join(out, 'background_condition.json'), 'utf8')).namedBy).toBe('role column of the sample sheet');
  });

  describe('the choice "none": subtract nothing, even when the role column marks a condition', () => {
    // Source: this project's rule (README, Background condition), on demo data.
    const marked = join(dir, 'marked-none.csv');
    writeFileSync(marked, demo.sheet.split('\n').map((l, i) => (i === 0 ? `${l},role` : l === '' ? l : `${l},${l.startsWith('null') ? 'background' : 'sample'}`)).join('\n'));
    const plain = join(dir, 'plain.csv');
    writeFileSync(plain, demo.sheet.split('\n').filter((l) => !l.startsWith('null')).join('\n'));
    const tables = ['conditions.csv', 'shifts.csv', 'dosage_fit.csv', 'positional_error.csv'];

    it('eggline cohort --background-condition none: the batch\'s own numbers without the marked condition, the record says why', async () => {
      const out = join(dir, 'none');
      // First a run that subtracts (the role column), then "none" into the same folder: no subtraction table is left.
      expect(await cohortCommand([run, '--samples', marked, '--out', out], capturedIo().io)).toBe(0);
      expect(existsSync(join(out, 'background_refit.csv'))).toBe(true);
      const b = capturedIo();
      expect(await cohortCommand([run, '--samples', marked, '--background-condition', 'none', '--out', out], b.io)).toBe(0);
      expect(b.out.join('')).toContain('no background condition: --background-condition is "none": nothing is subtracted; "null-stain", marked background in the sample sheet\'s role column, is left out of the comparison (background_condition.json)');
      for (const f of ['background_profile.csv', 'background_refit.csv', 'background_conditions.csv', 'background-condition.svg', 'background-condition.png']) expect(existsSync(join(out, f))).toBe(false);
      const record = JSON.parse(readFileSync(join(out, 'background_condition.json'), 'utf8'));
      expect(record).toMatchObject({ condition: null, choice: 'none', namedBy: '--background-condition', setAside: 'null-stain', setAsideEmbryos: ['null_1.tif', 'null_2.tif', 'null_3.tif'], sampleSheet: 'marked-none.csv' });
      // The same tables as a sheet without the null-stained rows, byte for byte: nothing was subtracted.
      const ref = join(dir, 'plain-out');
      expect(await cohortCommand([run, '--samples', plain, '--out', ref], capturedIo().io)).toBe(0);
      for (const t of tables) expect(readFileSync(join(out, t), 'utf8')).toBe(readFileSync(join(ref, t), 'utf8'));
      const html = readFileSync(join(out, 'report.html'), 'utf8');
      expect(html).toContain('<strong>No background condition subtracted:</strong> --background-condition is &quot;none&quot;');
      expect(html).toContain('<h2 id="background">Background condition</h2><p>None: ');
      // Without any choice or role column there is no record at all.
      expect(existsSync(join(ref, 'background_condition.json'))).toBe(false);
    });

    it('from the project (and the flag over it): the record names who chose', async () => {
      const project = join(dir, 'none.eggline.json');
      writeFileSync(project, JSON.stringify({ schema: 'eggline-project', version: 2, folder: '.', settings: {}, files: {}, cohort: { backgroundCondition: 'none' } }));
      const out = join(dir, 'none-project');
      expect(await cohortCommand([run, '--samples', marked, '--project', project, '--out', out], capturedIo().io)).toBe(0);
      expect(JSON.parse(readFileSync(join(out, 'background_condition.json'), 'utf8'))).toMatchObject({ choice: 'none', namedBy: "the project's cohort.backgroundCondition" });
      const over = join(dir, 'none-over');
      expect(await cohortCommand([run, '--samples', marked, '--project', project, '--background-condition', 'null-stain', '--out', over], capturedIo().io)).toBe(0);
      expect(JSON.parse(readFileSync(join(over, 'background_condition.json'), 'utf8'))).toMatchObject({ condition: 'null-stain', choice: 'option', namedBy: '--background-condition' });
    });

    it('the window\'s summary with "none" says so first and offers the set-aside condition; its numbers are the command line\'s', async () => {
      const s = await cohortSummaryFor(demo.results, marked, { reference: null, backgroundCondition: 'none', backgroundConditionNamedBy: "the project's cohort.backgroundCondition", normalisation: 'scale-offset', lambdaPosteriorEl: null, equivalenceMargin: null, covariates: [] }, run);
      expect(s.warnings[0]).toBe('no background condition: the project\'s cohort.backgroundCondition is "none": nothing is subtracted; "null-stain", marked background in the sample sheet\'s role column, is left out of the comparison');
      expect(s.conditions.map((c) => c.name)).toEqual(['dosage-1x', 'dosage-2x']);
      expect(s.backgroundCondition).toBeNull();
      expect(s.backgroundSetAside).toBe('null-stain');
      const lam = csvRowsOf(join(dir, 'none', 'conditions.csv')).find((r) => r.condition === 'dosage-1x' && r.quantity === 'lambda' && r.unit === 'EL')!;
      expect(s.stats.find((x) => x.condition === 'dosage-1x' && x.quantity === 'lambda' && x.unit === 'EL')!.mean).toBe(Number(lam.mean));
    });
  });

  it('bad input: one line naming the sheet or condition, exit 1', async () => {
    const b = capturedIo();
    expect(await cohortCommand([run, '--samples', sheetPath, '--background-condition', 'secondary-only', '--out', join(dir, 'bad')], b.io)).toBe(1);
    expect(b.err.join('')).toBe('eggline cohort: samples.csv: background condition "secondary-only" is not in the sheet (conditions: dosage-1x, dosage-2x, null-stain)\n');
    const u = capturedIo();
    expect(await cohortCommand([run, '--samples', sheetPath, '--background-condition', ' '], u.io)).toBe(2);
    expect(u.err.join('')).toBe('eggline cohort: --background-condition needs a condition name (see "eggline cohort --help")\n');
  });
  it('the window\'s cohort summary (role column, settings from run.json) names the background condition first', async () => {
    const marked = join(dir, 'marked.csv');
    const s = await cohortSummaryFor(demo.results, marked, null, run);
    expect(s.warnings[0]).toBe('λ, amplitude and boundaries are refitted after subtracting background condition "null-stain" (3 embryos: null_1.tif, null_2.tif, null_3.tif); see report.html');
    expect(s.conditions.map((c) => c.name)).toEqual(['dosage-1x', 'dosage-2x']);
    expect(s.warnings.some((w) => w.startsWith('no batch settings'))).toBe(false);
  });
});

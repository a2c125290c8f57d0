// --edge-side each from the command line: each side's λ and their difference in embryos.csv and results.json, the
// setting in run.json, the cohort's side_differences.csv and report section, and --resume analysing again when only
// this setting changed (demo data: 2 embryos written by `eggline demo --count 2`).
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { resultsFromJson, SIDE_COLUMNS } from '../../core/batch';
import { parseCsv } from '../../core/csv';
import { cli, ensureBuilt } from './helpers';

const dir = mkdtempSync(join(tmpdir(), 'eggline-cli-sides-'));
const demo = join(dir, 'demo');
const out = join(dir, 'out');
const table = (path: string): Record<string, string>[] => {
  const [header, ...rows] = parseCsv(readFileSync(path, 'utf8'));
  return rows.map((r) => Object.fromEntries(header.map((h, i) => [h, r[i]])));
};

beforeAll(async () => {
  ensureBuilt();
  expect((await cli(['demo', demo, '--count', '2'])).code).toBe(0);
}, 180_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('eggline batch --edge-side each', () => {
  it('writes each side\'s λ and their difference, records the setting, summarises the condition, and --resume redoes only what changed', async () => {
    const r = await cli(['batch', demo, '--out', out, '--jobs', '1', '--samples', join(demo, 'samples.csv'), '--edge-side', 'each']);
    expect(r.code).toBe(0);
    const rows = table(join(out, 'embryos.csv'));
    expect(rows).toHaveLength(2);
    for (const row of rows) {
      expect(SIDE_COLUMNS.every((c) => row[c] !== '')).toBe(true);
      // Source: the definition of the paired difference (dorsal − ventral) and of its t interval around it.
      expect(Number(row.lambda_dorsal_minus_ventral_um)).toBeCloseTo(Number(row.lambda_dorsal_um) - Number(row.lambda_ventral_um), 6);
      expect(Number(row.lambda_dorsal_minus_ventral_ci_low_um)).toBeLessThan(Number(row.lambda_dorsal_minus_ventral_um));
    }
    const results = resultsFromJson(readFileSync(join(out, 'results.json'), 'utf8'));
    expect(results.every((x) => x.sides?.difference !== null && x.sides?.dorsalProfile.n.length === 100)).toBe(true);
    expect(JSON.parse(readFileSync(join(out, 'run.json'), 'utf8')).settings.profile.edgeSide).toBe('each');
    const sides = table(join(out, 'side_differences.csv'));
    // One embryo per condition in this demo subset: a mean, no interval and no test.
    expect(sides.map((s) => [s.condition, s.n, s.ci_low_el, s.p_zero])).toEqual([['dosage-0.5x', '1', '', ''], ['dosage-1x', '1', '', '']]);
    const report = readFileSync(join(out, 'report.html'), 'utf8');
    expect(report).toContain('id="sides"');
    expect(report).toContain('at least two embryos are needed for an interval');
    // The same run resumed reuses both files; with the pooled band only, both are analysed again and the side
    // columns are empty.
    expect(JSON.parse(readFileSync(join(out, 'run.json'), 'utf8')).reused ?? 0).toBe(0);
    const again = await cli(['batch', demo, '--out', out, '--jobs', '1', '--edge-side', 'each', '--resume']);
    expect(again.code).toBe(0);
    expect(JSON.parse(readFileSync(join(out, 'run.json'), 'utf8')).reused).toBe(2);
    const pooled = await cli(['batch', demo, '--out', out, '--jobs', '1', '--edge-side', 'both', '--resume']);
    expect(pooled.code).toBe(0);
    expect(JSON.parse(readFileSync(join(out, 'run.json'), 'utf8')).reused).toBe(0);
    expect(table(join(out, 'embryos.csv')).every((row) => SIDE_COLUMNS.every((c) => row[c] === ''))).toBe(true);
  }, 300_000);
});

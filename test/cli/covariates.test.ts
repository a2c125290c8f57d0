// `eggline batch --samples S --covariate COLUMN` on the built CLI: the cohort step after the batch adjusts the dosage
// regression, the project's cohort entry under the flag, run.json records the options in force.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseCsv } from '../../core/csv';
import { cli, ensureBuilt } from './helpers';

// Demo data: 8 synthetic embryos from `eggline demo --count 8` (two per dosage), with an invented stage and batch.
const dir = mkdtempSync(join(tmpdir(), 'eggline-cli-covariates-'));
const demo = join(dir, 'demo');
const sheet = join(dir, 'samples.csv');
const table = (path: string): Record<string, string>[] => {
  const [header, ...rows] = parseCsv(readFileSync(path, 'utf8'));
  return rows.map((r) => Object.fromEntries(header.map((h, i) => [h, r[i]])));
};

beforeAll(async () => {
  ensureBuilt();
  expect((await cli(['demo', demo, '--count', '8'])).code).toBe(0);
  const [head, ...lines] = readFileSync(join(demo, 'samples.csv'), 'utf8').trim().split(/\r?\n/);
  writeFileSync(sheet, [`${head},stage,batch`, ...lines.map((l, i) => `${l},${30 + ((i * 7) % 11)},${i % 2 === 0 ? 'B1' : 'B2'}`)].join('\n') + '\n');
  const projectPath = join(demo, 'eggline-project.json');
  const project = JSON.parse(readFileSync(projectPath, 'utf8')) as Record<string, unknown>;
  writeFileSync(projectPath, JSON.stringify({ ...project, cohort: { normalisation: 'minmax', covariates: ['stage:numeric'] } }));
}, 180_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('eggline batch --covariate', () => {
  it('adjusts the dosage regression after the batch, the flag over the project\'s list; run.json records the options', async () => {
    const out = join(dir, 'out');
    const r = await cli(['batch', demo, '--out', out, '--jobs', '2', '--samples', sheet, '--covariate', 'batch']);
    expect(r.code).toBe(0);
    expect([...new Set(table(join(out, 'covariates.csv')).map((x) => x.term))]).toEqual(['batch=B2']);
    expect(table(join(out, 'dosage_fit.csv')).some((x) => x.method === 'covariate-adjusted:batch')).toBe(true);
    const run = JSON.parse(readFileSync(join(out, 'run.json'), 'utf8')) as { cohortOptions?: unknown };
    expect(run.cohortOptions).toEqual({
      reference: null, backgroundCondition: null, backgroundConditionNamedBy: '--background-condition', normalisation: 'minmax',
      lambdaPosteriorEl: null, equivalenceMargin: null, covariates: ['batch'],
    });
  }, 180_000);

  it('--covariate without --samples is a usage error naming the flag', async () => {
    const r = await cli(['batch', demo, '--out', join(dir, 'x'), '--covariate', 'stage']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('--covariate needs --samples');
  });
});

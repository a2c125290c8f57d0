// `eggline cohort --covariate` (and the project's cohort.covariates) on demo-like results with a stage and a batch
// column: outputs, precedence, one-line errors, and no trace when no covariate is asked for.
import { existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { resultsToJson } from '../../core/batch';
import { makeDemoCohort } from '../../core/cohort';
import { withinGroupFit } from '../../core/stats';
import type { EmbryoResult } from '../../core/model';
import { cohortCommand } from '../../app/cli/cohort-command';
import { capturedIo, csvRowsOf } from './command-io';

// Source: demo data (invented). Four dosages, six embryos each, λ = 0.2 EL; stage (minutes) is later at higher
// dosage and moves every position by +0.003 EL per minute; batch B2 adds +0.01 EL. The unadjusted slope is therefore
// biased upwards (stage rises 3 min per doubling: +0.003·3/ln 2 ≈ +0.013 EL per unit ln f).
const dir = mkdtempSync(join(tmpdir(), 'eggline-covariates-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const dosages = [0.5, 1, 2, 4];
const demo = makeDemoCohort({ conditions: dosages.map((d) => ({ name: `dosage-${d}x`, dosage: d, count: 6 })), seed: 1515, positionSdEl: 0.01 });
const stageOf = (i: number): number => 30 + 3 * Math.floor(i / 6) + [-5, 2, 6, -3, 0, 4][i % 6];
const batchOf = (i: number): string => (i % 3 === 1 ? 'B2' : 'B1');
const shift = (i: number): number => 0.003 * (stageOf(i) - 30) + (batchOf(i) === 'B2' ? 0.01 : 0);
const results: EmbryoResult[] = demo.results.map((r, i) => ({
  ...r,
  boundaries: r.boundaries.map((b) => ({ ...b, positionEl: (b.positionEl as number) + shift(i) })),
  landmarks: r.landmarks.map((l) => ({ ...l, xEl: l.xEl + shift(i) })),
}));
const run = join(dir, 'run');
mkdirSync(run);
writeFileSync(join(run, 'results.json'), resultsToJson(results));
writeFileSync(join(run, 'run.json'), JSON.stringify({ eggline: '0.1.0' }));
const lines = demo.sheetCsv.trim().split('\n');
const sheet = join(dir, 'samples.csv');
writeFileSync(sheet, [`${lines[0]},stage,batch,session,note`, ...lines.slice(1).map((l, i) => `${l},${stageOf(i)},${batchOf(i)},s${Math.floor(i / 6)},${i === 4 ? 'late' : String(i)}`)].join('\n') + '\n');

const LOGISTIC = 'boundary:target:logistic';

describe('eggline cohort --covariate', () => {
  it('adds the adjusted row and covariates.csv; coefficients are the dummy-variable fit on the embryos\' positions', async () => {
    const out = join(dir, 'both');
    const b = capturedIo();
    expect(await cohortCommand([run, '--samples', sheet, '--covariate', 'stage:numeric', '--covariate', 'batch', '--out', out], b.io)).toBe(0);
    expect(b.err.join('')).toBe('');
    const fits = csvRowsOf(join(out, 'dosage_fit.csv')).filter((r) => r.quantity === LOGISTIC);
    const raw = fits.find((r) => r.method === 'condition-means')!;
    const adj = fits.find((r) => r.method === 'covariate-adjusted:stage+batch')!;
    expect(adj.n).toBe('24');
    expect(adj.dof).toBe('2');
    // The truth 0.2 EL (demo data): the adjusted slope is closer and its interval holds it.
    expect(Math.abs(Number(adj.slope_el) - 0.2)).toBeLessThan(Math.abs(Number(raw.slope_el) - 0.2));
    expect(Number(adj.ci_low)).toBeLessThan(0.2);
    expect(Number(adj.ci_high)).toBeGreaterThan(0.2);
    const cov = csvRowsOf(join(out, 'covariates.csv')).filter((r) => r.quantity === LOGISTIC);
    expect(cov.map((r) => [r.term, r.kind, r.base_level])).toEqual([['stage', 'numeric', ''], ['batch=B2', 'categorical', 'B1']]);
    // Independent of the cohort code path: the positions straight from the results, one dummy per condition.
    const pos = results.map((r) => r.boundaries.find((x) => x.method === 'logistic')!.positionEl as number);
    const w = withinGroupFit(results.map((_, i) => String(Math.floor(i / 6))), [results.map((_, i) => stageOf(i)), results.map((_, i) => (batchOf(i) === 'B2' ? 1 : 0))], pos);
    expect(Number(cov[0].coefficient_el)).toBeCloseTo(w.beta[0], 12);
    expect(Number(cov[1].se_el)).toBeCloseTo(w.se[1], 12);
    expect(Math.abs(Number(cov[0].coefficient_el) - 0.003)).toBeLessThan(3 * Number(cov[0].se_el));
  });

  it('takes the project\'s cohort.covariates, and the flag over it', async () => {
    const project = join(dir, 'p.eggline.json');
    writeFileSync(project, JSON.stringify({ schema: 'eggline-project', version: 2, folder: '.', settings: {}, files: {}, cohort: { covariates: ['stage'] } }));
    const fromProject = join(dir, 'project');
    expect(await cohortCommand([run, '--samples', sheet, '--project', project, '--out', fromProject], capturedIo().io)).toBe(0);
    expect([...new Set(csvRowsOf(join(fromProject, 'covariates.csv')).map((r) => r.term))]).toEqual(['stage']);
    const over = join(dir, 'over');
    expect(await cohortCommand([run, '--samples', sheet, '--project', project, '--covariate', 'batch', '--out', over], capturedIo().io)).toBe(0);
    expect([...new Set(csvRowsOf(join(over, 'covariates.csv')).map((r) => r.term))]).toEqual(['batch=B2']);
  });

  it.each([
    [['--covariate', 'stgae'], 'eggline cohort: samples.csv: no column "stgae" for the covariate (free columns: stage, batch, session, note)'],
    [['--covariate', 'session'], 'eggline cohort: samples.csv: covariate "session" is constant within every condition, so its effect cannot be told apart from the dosage\'s; leave it out'],
    [['--covariate', 'note:numeric'], 'eggline cohort: samples.csv line 6: covariate "note" is declared numeric but "late" (dosage-0.5x/embryo_05.ome.tif) is not a number'],
  ])('bad input %j: one line, exit 1', async (args, message) => {
    const b = capturedIo();
    expect(await cohortCommand([run, '--samples', sheet, ...args, '--out', join(dir, 'bad')], b.io)).toBe(1);
    expect(b.err.join('')).toBe(`${message}\n`);
  });

  it('an empty --covariate is a usage error (exit 2)', async () => {
    const b = capturedIo();
    expect(await cohortCommand([run, '--samples', sheet, '--covariate', ':numeric'], b.io)).toBe(2);
    expect(b.err.join('')).toContain('--covariate needs a column of the sample sheet');
  });

  it('without covariates: no adjusted row, and an earlier run\'s covariates.csv is removed', async () => {
    const out = join(dir, 'both');
    expect(await cohortCommand([run, '--samples', sheet, '--out', out], capturedIo().io)).toBe(0);
    expect(existsSync(join(out, 'covariates.csv'))).toBe(false);
    expect(csvRowsOf(join(out, 'dosage_fit.csv')).some((r) => r.method.startsWith('covariate-adjusted'))).toBe(false);
  });
});

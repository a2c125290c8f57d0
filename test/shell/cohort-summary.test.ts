import { describe, it, expect, beforeEach, afterEach } from 'vitest';
import { mkdtemp, mkdir, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { analyseCohort, makeDemoCohort, parseSampleSheet } from '../../core/cohort';
import { cohortFigures } from '../../core/figures';
import { cohortSummaryFor, findSampleSheet } from '../../app/engine/cohort-summary';

// Demo data: invented embryo results of a dosage series (core/cohort makeDemoCohort, known λ = 0.2 EL, seeded noise).
let root: string;
beforeEach(async () => { root = await mkdtemp(join(tmpdir(), 'eggline-cohort-summary-')); });
afterEach(async () => { await rm(root, { recursive: true, force: true }); });

const SERIES = [{ name: 'low', dosage: 0.5, count: 4 }, { name: 'ref', dosage: 1, count: 4 }, { name: 'high', dosage: 2, count: 4 }];

describe('finding the sample sheet', () => {
  it('finds samples.csv in the folder, and nothing when it is missing or not a file', async () => {
    expect(await findSampleSheet(root)).toBeNull();
    await mkdir(join(root, 'samples.csv'));
    expect(await findSampleSheet(root)).toBeNull();
    await rm(join(root, 'samples.csv'), { recursive: true });
    await writeFile(join(root, 'samples.csv'), 'file,condition,dosage\n');
    expect(await findSampleSheet(root)).toBe(join(root, 'samples.csv'));
  });
});

describe('cohort summary for the window', () => {
  it('carries the same numbers and figures as the cohort step computes from the sheet', async () => {
    const { results, sheetCsv } = makeDemoCohort({ conditions: SERIES, seed: 7 });
    const sheet = join(root, 'samples.csv');
    await writeFile(sheet, sheetCsv);
    const s = await cohortSummaryFor(results, sheet, null, join(root, 'out'));
    const a = analyseCohort(results, parseSampleSheet(sheetCsv, 'samples.csv'));
    expect(s.reportPath).toBe(join(root, 'out', 'report.html'));
    expect(s.sampleSheetPath).toBe(sheet);
    expect(s.reference).toBe('ref');
    expect(s.level).toBe(0.95);
    expect(s.conditions.map((c) => [c.name, c.dosage, c.factor, c.isReference, c.n])).toEqual([
      ['low', 0.5, 0.5, false, 4], ['ref', 1, 1, true, 4], ['high', 2, 2, false, 4],
    ]);
    expect(s.conditions[1].lambdaEl).toEqual(a.stats.find((t) => t.condition === 'ref' && t.quantity === 'lambda' && t.unit === 'EL'));
    expect(s.conditions[1].lambdaUm?.unit).toBe('um');
    expect(s.stats).toEqual(a.stats);
    expect(s.shifts).toEqual(a.shifts);
    expect(s.dosageFit).toEqual(a.dosageFits);
    expect(s.figures).toEqual(cohortFigures(a).map((f) => ({ name: f.name, title: f.title, svg: f.svg })));
    // Demo data built with λ = 0.2 EL and a fixed threshold: every position moves with slope λ within its CI.
    expect(s.dosageFit.length).toBeGreaterThan(0);
    for (const f of s.dosageFit) {
      expect(f.ciLow).toBeLessThan(0.2);
      expect(f.ciHigh).toBeGreaterThan(0.2);
    }
    // Sign rule (threshold model): f > 1 moves a boundary posterior, f < 1 anterior.
    for (const r of s.shifts) expect(Math.sign(r.observedShiftEl)).toBe(r.condition === 'high' ? 1 : -1);
    // Plain data: survives a structured clone (what IPC does) unchanged.
    expect(structuredClone(s)).toEqual(s);
  });

  it('copes with one embryo per condition: n = 1 and no interval instead of a failure', async () => {
    const { results, sheetCsv } = makeDemoCohort({ conditions: SERIES.map((c) => ({ ...c, count: 1 })), seed: 3 });
    const sheet = join(root, 'samples.csv');
    await writeFile(sheet, sheetCsv);
    const s = await cohortSummaryFor(results, sheet, null, root);
    expect(s.conditions.map((c) => c.n)).toEqual([1, 1, 1]);
    for (const c of s.conditions) {
      expect(Number.isFinite(c.lambdaEl?.mean)).toBe(true);
      expect(c.lambdaEl?.ciLow).toBeNaN();
    }
    expect(s.shifts.length).toBeGreaterThan(0);
    for (const r of s.shifts) {
      expect(Number.isFinite(r.observedShiftEl)).toBe(true);
      expect(r.ciLow).toBeNaN();
    }
    // Three embryos at three dosages: the regression still has one degree of freedom.
    expect(s.dosageFit.every((f) => f.n === 3)).toBe(true);
    expect(s.figures.map((f) => f.svg).join('')).not.toMatch(/NaN/);
  });

  it('names the sheet in one line when it is missing or malformed', async () => {
    const { results } = makeDemoCohort({ conditions: SERIES, seed: 1 });
    const missing = join(root, 'samples.csv');
    await expect(cohortSummaryFor(results, missing, null, root)).rejects.toThrow(`${missing}: cannot read the sample sheet (ENOENT)`);
    await writeFile(missing, 'file,group\na.tif,x\n');
    await expect(cohortSummaryFor(results, missing, null, root)).rejects.toThrow(/^samples\.csv: missing column "condition"/);
  });
});

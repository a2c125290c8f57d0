import { describe, expect, it } from 'vitest';
import type { EmbryoResult } from '../model';
import { assignConditions } from './assign';
import { CohortError } from './cohort-error';
import { makeDemoCohort } from './demo-cohort';
import { parseSampleSheet } from './sample-sheet';

// Source: demo data throughout (invented synthetic embryos).
const demo = makeDemoCohort({ conditions: [{ name: 'half', dosage: 0.5, count: 2 }, { name: 'ref', dosage: 1, count: 2 }], seed: 3 });

describe('assignConditions', () => {
  it('groups results by condition in sheet order; reference = the condition with dosage 1; f relative to it', () => {
    const a = assignConditions(demo.results, parseSampleSheet(demo.sheetCsv, 'samples.csv'));
    expect(a.reference).toBe('ref');
    expect(a.groups.map((g) => [g.condition.name, g.condition.factor, g.embryos.length])).toEqual([['half', 0.5, 2], ['ref', 1, 2]]);
    expect(a.warnings).toEqual([]);
  });
  it('matches by base name when the sheet lists bare file names, and warns about unmatched files both ways', () => {
    const sheet = parseSampleSheet('file,condition,dosage\nembryo_01.ome.tif,x,1\nmissing.tif,x,1\n', 's.csv');
    const only = [demo.results[0]];
    const a = assignConditions(only, sheet);
    expect(a.groups[0].embryos.map((e) => e.file)).toEqual(['half/embryo_01.ome.tif']);
    expect(a.warnings).toEqual(['s.csv: no analysed result for missing.tif']);
    const b = assignConditions(demo.results.slice(0, 2), sheet);
    expect(b.warnings).toContain('half/embryo_02.ome.tif: not in s.csv; left out of the cohort');
  });
  it('leaves failed results out', () => {
    const failed: EmbryoResult = { ...demo.results[0], status: 'error', error: 'bad' };
    const a = assignConditions([failed, ...demo.results.slice(1)], parseSampleSheet(demo.sheetCsv, 's.csv'));
    expect(a.groups[0].embryos.length).toBe(1);
  });
  it('a given reference rescales factors; unknown, ambiguous or conflicting references are errors', () => {
    const sheet = parseSampleSheet(demo.sheetCsv, 's.csv');
    expect(assignConditions(demo.results, sheet, 'half').groups.map((g) => g.condition.factor)).toEqual([1, 2]);
    expect(() => assignConditions(demo.results, sheet, 'nope')).toThrow(new CohortError('s.csv: reference condition "nope" is not in the sheet (conditions: half, ref)'));
    const two = parseSampleSheet('file,condition,dosage\na,x,1\nb,y,1\n', 's.csv');
    expect(() => assignConditions([], two)).toThrow('s.csv: several conditions have dosage 1 (x, y); choose the reference');
    const clash = parseSampleSheet('file,condition,dosage\na,x,1\nb,x,2\n', 's.csv');
    expect(() => assignConditions([], clash)).toThrow('s.csv: condition "x" has two dosages (1 and 2)');
  });
  it('without dosage 1 and without a reference, warns that the dosage test is skipped', () => {
    const sheet = parseSampleSheet('file,condition\na,x\n', 's.csv');
    const a = assignConditions([], sheet);
    expect(a.reference).toBeNull();
    expect(a.warnings[0]).toBe('s.csv: no condition has dosage 1 and no reference was given; the dosage test is skipped');
  });
});

// The window's cohort summary carries the report's reading (the same sentences and caveats as report.html). Demo data.
import { describe, expect, it } from 'vitest';
import { analyseCohort, makeDemoCohort, parseSampleSheet } from '../../core/cohort';
import { dosageReading } from '../cohort/reading';
import { summariseCohort } from './cohort-summary';

// Source: demo data (invented synthetic embryos over a dosage series).
const demo = makeDemoCohort({ conditions: [{ name: 'ref', dosage: 1, count: 4 }, { name: 'dbl', dosage: 2, count: 4 }], seed: 5 });
const sheet = parseSampleSheet(demo.sheetCsv, 's.csv');

describe('summariseCohort', () => {
  it('gives the reading and caveats of report.html with a reference, and none without one', () => {
    const a = analyseCohort(demo.results, sheet);
    const s = summariseCohort(a, '/d/s.csv', '/o', []);
    expect(s.reading).toEqual(dosageReading(a));
    expect(s.reading!.caveats.length).toBeGreaterThan(0);
    expect(s.reading!.findings[0].sentences[0]).toMatch(/^λ_eff\/λ_ref|ratio/i);
    const noRef = analyseCohort(demo.results, parseSampleSheet('file,condition\n' + demo.sheetCsv.split('\n').slice(1).filter((l) => l).map((l) => l.split(',').slice(0, 2).join(',')).join('\n'), 's.csv'));
    expect(noRef.reference).toBeNull();
    expect(summariseCohort(noRef, '/d/s.csv', '/o', []).reading).toBeUndefined();
  });
});

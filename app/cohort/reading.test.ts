import { describe, expect, it } from 'vitest';
import { analyseCohort, makeDemoCohort, parseSampleSheet, type CohortAnalysis } from '../../core/cohort';
import { dosageReading, prose } from './reading';

// Source: demo data (invented synthetic embryos, λ = 0.2 EL, fixed threshold).
const demo = makeDemoCohort({ conditions: [{ name: 'ref', dosage: 1, count: 6 }, { name: 'dbl', dosage: 2, count: 6 }, { name: 'few', dosage: 4, count: 3 }], seed: 8 });
const a = analyseCohort(demo.results, parseSampleSheet(demo.sheetCsv, 's.csv'));

describe('dosageReading', () => {
  it('says whether the predicted slope lies inside the fitted interval and which way each condition moved', () => {
    const r = dosageReading(a);
    expect(r.findings.map((f) => f.quantity)).toEqual(['boundary:target:logistic', 'boundary:target:half-max', 'landmark:furrow']);
    expect(r.findings.map((f) => f.label)).toEqual(['boundary in ‘target’ (logistic)', 'boundary in ‘target’ (half-max)', 'landmark ‘furrow’']);
    const s = r.findings[0].sentences;
    const m = /^Across 15 embryos, the boundary in ‘target’ \(logistic\) moves by 0\.\d{3,} x\/EL per unit ln f \(95% CI (0\.\d+) to (0\.\d+); /.exec(s[0]);
    expect(m).not.toBeNull();
    expect(m![1]).not.toBe(m![2]); // the interval's ends are printed with enough digits to differ
    expect(s[0]).toContain('which lies inside that interval');
    expect(s[0]).toMatch(/Counting the uncertainty of λ_ref as well, λ_eff\/λ_ref = \d\.\d+ \[\d\.\d+, \d\.\d+\], an interval that includes 1\./);
    expect(s[1]).toMatch(/^dbl \(f = 2, n = 6 vs 6 in the reference\): moved 0\.\d+ x\/EL posterior \(the direction the model expects\)/);
  });
  it('flags a slope below or above the prediction, and a shift against the expected direction', () => {
    const fit = a.dosageFits[0];
    const lower: CohortAnalysis = { ...a, dosageFits: [{ ...fit, slopeEl: 0.1, ciLow: 0.08, ciHigh: 0.12 }], shifts: [{ ...a.shifts[0], observedShiftEl: -0.05 }] };
    const r = dosageReading(lower);
    expect(r.findings[0].sentences[0]).toContain('which is above that interval: the position moves less than');
    expect(r.findings[0].sentences[1]).toContain('moved 0.0500 x/EL anterior (opposite to the direction the model expects)');
    const higher: CohortAnalysis = { ...a, dosageFits: [{ ...fit, slopeEl: 0.4, ciLow: 0.35, ciHigh: 0.45 }] };
    expect(dosageReading(higher).findings[0].sentences[0]).toContain('which is below that interval: the position moves more than');
    const close: CohortAnalysis = { ...a, dosageFits: [{ ...fit, predictedSlopeEl: 0.2, slopeEl: 0.197, ciLow: 0.1965, ciHigh: 0.1975 }] };
    expect(dosageReading(close).findings[0].sentences[0]).toContain('The difference is small, though (1.5% of the prediction).');
  });
  it('caveats name the reference λ and small conditions', () => {
    const c = dosageReading(a).caveats;
    expect(c[1]).toMatch(/^λ is measured on the reference condition "ref" \(n = 6, λ = 0\.\d+ x\/EL/);
    expect(c[c.length - 1]).toBe('Small samples (fewer than 5 embryos with a fitted λ): few. Treat their intervals with care.');
  });
  it('prose numbers: 3 significant digits (trailing zeros kept), optional sign, n/a for missing', () => {
    // Source: hand-computed
    expect([prose(0.123456), prose(0.5, true), prose(-0.5, true), prose(null), prose(NaN)]).toEqual(['0.123', '+0.500', '-0.500', 'n/a', 'n/a']);
  });
});

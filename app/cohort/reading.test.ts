import { describe, expect, it } from 'vitest';
import { analyseCohort, makeDemoCohort, parseSampleSheet, type CohortAnalysis } from '../../core/cohort';
import { dosageReading, fiellerG, prose, pText } from './reading';

// Source: demo data (invented synthetic embryos, λ = 0.2 EL, fixed threshold).
const demo = makeDemoCohort({ conditions: [{ name: 'ref', dosage: 1, count: 6 }, { name: 'dbl', dosage: 2, count: 6 }, { name: 'few', dosage: 4, count: 3 }], seed: 8 });
const a = analyseCohort(demo.results, parseSampleSheet(demo.sheetCsv, 's.csv'));
const caveats = (x: CohortAnalysis): string[] => dosageReading(x).caveats;

describe('dosageReading', () => {
  it('leads with the ratio and its interval, and says "not rejected" rather than "consistent"', () => {
    const r = dosageReading(a);
    expect(r.findings.map((f) => f.quantity)).toEqual(['boundary:target:logistic', 'boundary:target:half-max', 'landmark:furrow']);
    expect(r.findings.map((f) => f.label)).toEqual(['boundary in ‘target’ (logistic)', 'boundary in ‘target’ (half-max)', 'landmark ‘furrow’']);
    const s = r.findings[0].sentences;
    expect(s[0]).toMatch(/^The boundary in ‘target’ \(logistic\) moves λ_eff\/λ_ref = \d\.\d+ \[-?\d\.\d+, \d\.\d+\] times the shift a fixed threshold on this gradient predicts \(95% CI by the delta method, the uncertainties of the slope and of the reference λ both counted; Fieller's CI (\S+ to \S+, g = \S+|unbounded.*)\)\./);
    expect(s[0]).toContain('A ratio of 1 is not rejected at the 0.05 level. Not rejecting 1 does not show agreement');
    expect(s.join(' ')).not.toMatch(/consistent with|inside that interval/);
    expect(s[1]).toMatch(/^Slope of position on ln f: 0\.\d+ x\/EL per unit ln f \(95% CI .+\), fitted to the 3 condition means \(15 embryos; t on 1 degree of freedom; /);
    expect(s[1]).toContain('Treating every embryo as a replicate of its dose (HC3 errors) would give');
    expect(s[2]).toMatch(/^dbl \(f = 2, n = 6 vs 6 in the reference\): moved 0\.\d+ x\/EL posterior \(the direction the model expects\)/);
    expect(s[2]).toMatch(/p\(ratio = 1\) = [\d.]+, Holm-adjusted [\d.]+\.$/);
  });
  it('rejects a ratio of 1 only when its interval excludes 1, and says which way', () => {
    const fit = a.dosageFits[0];
    const lower: CohortAnalysis = { ...a, dosageFits: [{ ...fit, slopeEl: 0.1, slopeSeEl: 0.005 }], shifts: [{ ...a.shifts[0], observedShiftEl: -0.05 }] };
    const r = dosageReading(lower);
    expect(r.findings[0].sentences[0]).toContain('A ratio of 1 is rejected at the 0.05 level: the position moves less than a fixed threshold');
    expect(r.findings[0].sentences[2]).toContain('moved 0.0500 x/EL anterior (opposite to the direction the model expects)');
    const higher: CohortAnalysis = { ...a, dosageFits: [{ ...fit, slopeEl: 0.4, slopeSeEl: 0.005 }] };
    expect(dosageReading(higher).findings[0].sentences[0]).toContain('moves more than a fixed threshold');
  });
  it('claims equivalence only inside a chosen margin (two one-sided tests)', () => {
    const wide: CohortAnalysis = { ...a, options: { ...a.options, equivalenceMargin: 0.9 } };
    expect(dosageReading(wide).findings[0].sentences[0]).toMatch(/Equivalence margin ±0\.9: the 90% interval .+ lies inside \[0\.1, 1\.9\], so the shift equals the prediction within that margin/);
    const narrow: CohortAnalysis = { ...a, options: { ...a.options, equivalenceMargin: 0.001 } };
    expect(dosageReading(narrow).findings[0].sentences[0]).toContain('so equivalence within that margin is not shown.');
  });
  it('shows each caveat only when it applies', () => {
    const c = caveats(a);
    expect(c[1]).toMatch(/^λ is measured on the reference condition "ref" \(n = 6, λ = 0\.\d+ x\/EL/);
    expect(c.some((x) => x.includes('Holm-adjusted over the 6 tests'))).toBe(true);
    expect(c.some((x) => x.startsWith('Embryos of one condition share genotype'))).toBe(true);
    expect(c.some((x) => x.includes('measured amplitude ratios to the reference are 2.00 / 4.00 for nominal 2 / 4'))).toBe(true);
    expect(c.some((x) => x.startsWith('The sample sheet has no stage column'))).toBe(true);
    expect(c.some((x) => x.includes('f close to 1'))).toBe(false);
    // Precise reference λ: no Fieller caveat; fit range 0.1–0.6 holds the boundaries; one fit range.
    expect(c.some((x) => x.includes('Fieller'))).toBe(false);
    expect(c.some((x) => x.includes('outside the λ fit range'))).toBe(false);
    expect(c.some((x) => x.includes('different x/EL ranges'))).toBe(false);
    expect(c[c.length - 1]).toBe('Small samples (fewer than 5 embryos with a fitted λ): few. Treat their intervals with care.');
    const staged: CohortAnalysis = { ...a, sheetColumns: ['Stage'] };
    expect(caveats(staged).some((x) => x.includes('no stage column'))).toBe(false);
    const imprecise: CohortAnalysis = { ...a, referenceLambda: { ...a.referenceLambda!, seEl: 0.05 * a.referenceLambda!.lambdaEl * 5 } };
    expect(caveats(imprecise).some((x) => x.includes("Fieller's g = t²·CV²(λ)"))).toBe(true);
    const ranges: CohortAnalysis = { ...a, fitRanges: [{ startEl: 0.1, endEl: 0.3, embryos: 10 }, { startEl: 0.1, endEl: 0.6, embryos: 5 }] };
    const rc = caveats(ranges);
    expect(rc.some((x) => x.startsWith('λ was fitted over different x/EL ranges: 0.1–0.3 in 10 embryos, 0.1–0.6 in 5 embryos'))).toBe(true);
    expect(rc.some((x) => /^The boundary in ‘target’ \(logistic\) sits at 0\.\d+ x\/EL in the reference, outside the λ fit range 0\.1–0\.3/.test(x))).toBe(true);
  });
  it('names imprecise λ fits, positions not found in every embryo and a median far from the mean, only when they occur', () => {
    // Source: demo data; the counts below are set by hand on the analysis's reliability rows.
    expect(caveats(a).some((x) => x.startsWith('Imprecise λ fits'))).toBe(false);
    const rel = a.reliability[0];
    const q = Object.keys(rel.detected)[0];
    const flagged: CohortAnalysis = { ...a, reliability: [{ ...rel, lambdaImprecise: 2, detected: { ...rel.detected, [q]: rel.embryos - 1 }, lambdaFitted: 6, lambdaMeanEl: 0.2, lambdaMedianEl: 0.22 }, ...a.reliability.slice(1)] };
    const c = caveats(flagged);
    expect(c).toContain('Imprecise λ fits (SE above 25% of λ): 2 of 6 in ref. They enter the means unweighted; check them in the per-embryo table.');
    expect(c.some((x) => x.startsWith('Not every position was found: ') && x.includes(`in ${rel.embryos - 1} of ${rel.embryos} embryos of ref`))).toBe(true);
    expect(c.some((x) => x.startsWith('The median λ differs from the mean by more than 5% in ref (median 0.220, mean 0.200 x/EL)'))).toBe(true);
  });

  it("Fieller's g does not depend on f", () => {
    // Source: g = t²·(SE/λ)² (Fieller 1954; from memory) — t(0.975, 5) = 2.570582 (t table, from memory), CV = 0.1.
    expect(fiellerG({ condition: 'r', n: 6, lambdaEl: 0.2, seEl: 0.02, ciLowEl: 0, ciHighEl: 0, dof: 5 }, 0.95)).toBeCloseTo(2.570582 ** 2 * 0.01, 6);
  });
  it('prose numbers: 3 significant digits (trailing zeros kept), optional sign, n/a for missing; p-values', () => {
    // Source: hand-computed
    expect([prose(0.123456), prose(0.5, true), prose(-0.5, true), prose(null), prose(NaN)]).toEqual(['0.123', '+0.500', '-0.500', 'n/a', 'n/a']);
    expect([pText(0.04321), pText(0.00001), pText(null)]).toEqual(['0.043', '< 0.0001', 'n/a']);
  });
});

describe('the reading with covariates', () => {
  it('adds one sentence with the adjusted slope beside the unadjusted one and each coefficient, only when asked', () => {
    // Source: demo data; stage (minutes) and batch invented.
    const d = makeDemoCohort({ conditions: [{ name: 'ref', dosage: 1, count: 5 }, { name: 'dbl', dosage: 2, count: 5 }, { name: 'qd', dosage: 4, count: 5 }], seed: 9 });
    const [head, ...rows] = d.sheetCsv.trim().split('\n');
    const sheet = parseSampleSheet([`${head},stage,batch`, ...rows.map((r, i) => `${r},${20 + ((i * 7) % 11)},${i % 2 === 0 ? 'B1' : 'B2'}`)].join('\n'), 's.csv');
    const plain = dosageReading(analyseCohort(d.results, sheet)).findings[0].sentences[1];
    expect(plain).not.toContain('Adjusted for');
    const adjusted = analyseCohort(d.results, sheet, { covariates: ['stage:numeric', 'batch'] });
    const s = dosageReading(adjusted).findings[0].sentences[1];
    expect(s).toMatch(/Adjusted for stage and batch \(coefficients estimated within conditions, 15 embryos; each position moved to the covariates' mean before the condition means were fitted\), the slope is \S+ \(95% CI \S+ to \S+, the coefficients' own uncertainty included\) against \S+ unadjusted; stage \S+ x\/EL per unit of stage \(CI \S+ to \S+\); batch B2 vs B1 \S+ x\/EL \(CI \S+ to \S+\)\./);
    expect(s.match(/Adjusted for/g)).toHaveLength(1);
  });
});

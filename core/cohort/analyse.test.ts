import { describe, expect, it } from 'vitest';
import { withTimePoint } from '../model';
import { analyseCohort } from './analyse';
import { CohortError } from './cohort-error';
import { checkCohortOptions } from './options';
import { makeDemoCohort } from './demo-cohort';
import { parseSampleSheet } from './sample-sheet';
import { conditionsCsv, dosageFitCsv, positionalErrorCsv, shiftsCsv } from './tables';

// Source: demo data (invented synthetic embryos, λ = 0.2 EL, egg length 500 µm)
const demo = makeDemoCohort({ conditions: [{ name: 'ref', dosage: 1, count: 6 }, { name: 'double', dosage: 2, count: 6 }], seed: 7 });
const sheet = parseSampleSheet(demo.sheetCsv, 'samples.csv');

describe('analyseCohort', () => {
  it('per-condition statistics of λ (EL, µm), amplitude, egg length, boundaries and landmarks', () => {
    const a = analyseCohort(demo.results, sheet);
    const lam = a.stats.find((s) => s.condition === 'ref' && s.quantity === 'lambda' && s.unit === 'EL')!;
    expect(lam.n).toBe(6);
    expect(lam.mean).toBeCloseTo(0.2, 1);
    expect(lam.ciLow).toBeLessThan(lam.mean);
    expect(a.stats.map((s) => `${s.quantity} [${s.unit}]`).slice(0, 9)).toEqual([
      'lambda [EL]', 'lambda [um]', 'amplitude [a.u.]', 'egg_length [um]', 'boundary:target:logistic [EL]',
      'boundary:target:logistic [um]', 'boundary:target:half-max [EL]', 'boundary:target:half-max [um]', 'landmark:furrow [EL]',
    ]);
    const amp = a.stats.filter((s) => s.quantity === 'amplitude').map((s) => s.mean);
    expect(amp[1] / amp[0]).toBeCloseTo(2, 6);
  });
  it('leaves a fit that is not a decaying gradient out of λ statistics and lists it; the other quantities of that embryo stay', () => {
    const bad = demo.results.map((r, i) => (i === 0 && r.gradientFit ? { ...r, gradientFit: { ...r.gradientFit, lambdaEl: -0.16, lambdaUm: -79, amplitude: -5 } } : r));
    const a = analyseCohort(bad, sheet);
    const ref = (q: string, unit: string) => a.stats.find((s) => s.condition === 'ref' && s.quantity === q && s.unit === unit)!;
    expect(ref('lambda', 'EL').n).toBe(5);
    expect(ref('egg_length', 'um').n).toBe(6);
    expect(a.warnings).toContain(`λ left out of the statistics for 1 embryo whose fit is not a decaying gradient: ${bad[0].file} (λ = -79.0 µm is not positive; amplitude A = -5.00 is not positive)`);
  });
  it('counts a movie once, with its last analysed time point, when given results keyed by (file, time point)', () => {
    // demo data: the first reference embryo as a movie of three time points whose λ grows towards the embryo's own
    const [first, ...rest] = demo.results;
    const at = (t: number, scale: number) => withTimePoint({ ...first, gradientFit: { ...first.gradientFit!, lambdaEl: first.gradientFit!.lambdaEl * scale, lambdaUm: first.gradientFit!.lambdaUm * scale } }, t, 600 * t);
    const keyed = analyseCohort([at(0, 0.5), at(1, 0.8), at(2, 1), ...rest], sheet);
    const plain = analyseCohort(demo.results, sheet);
    const lam = (a: typeof plain) => a.stats.find((s) => s.condition === 'ref' && s.quantity === 'lambda' && s.unit === 'EL')!;
    expect(lam(keyed).n).toBe(6);
    expect(lam(keyed).mean).toBe(lam(plain).mean);
  });
  it('positional error of a boundary is its SD across embryos (about the 0.01 EL noise plus λ spread)', () => {
    const a = analyseCohort(demo.results, sheet);
    const b = a.stats.find((s) => s.condition === 'ref' && s.quantity === 'boundary:target:logistic' && s.unit === 'EL')!;
    expect(b.sd).toBeGreaterThan(0.003);
    expect(b.sd).toBeLessThan(0.05);
  });
  it('mean profiles on the grid with σx finite where the gradient is steep', () => {
    const a = analyseCohort(demo.results, sheet, { normalisation: 'amplitude' });
    expect(a.profiles.length).toBe(2);
    const p = a.profiles[0];
    expect(p.mean[20]).toBeCloseTo(Math.exp(-0.2 / 0.2) + 50 / 1000, 1);
    expect(Number.isFinite(p.sigmaXEl[20])).toBe(true);
    expect(a.options.normalisation).toBe('amplitude');
  });
  it('CSV tables have the agreed headers and one row per item', () => {
    const a = analyseCohort(demo.results, sheet);
    expect(conditionsCsv(a).split('\r\n')[0]).toBe('condition,dosage,quantity,unit,n,mean,sd,sem,ci_low,ci_high,median,sd_ci_low,sd_ci_high');
    expect(shiftsCsv(a).split('\r\n')[0]).toBe('quantity,condition,dosage,ln_f,observed_shift_el,ci_low,ci_high,predicted_shift_el,predicted_ci_low,predicted_ci_high,predicted_two_gradient_el,ratio,ratio_ci_low,ratio_ci_high,p_ratio_1,p_ratio_1_holm,predicted_local_el,ratio_fieller_low,ratio_fieller_high,fieller_g');
    expect(dosageFitCsv(a).split('\r\n')[0]).toBe('quantity,method,slope_el,slope_se_el,ci_low,ci_high,dof,p_slope,intercept_el,r2,n,conditions,lack_of_fit_f,lack_of_fit_p,tau2_el2,predicted_slope_el,predicted_two_gradient_slope_el,local_lambda_el,local_lambda_se_el');
    expect(shiftsCsv(a).trim().split('\r\n').length).toBe(1 + 3);
    expect(positionalErrorCsv(a).trim().split('\r\n').length).toBe(1 + 2 * 101);
  });
  it('a single embryo per condition gives empty spread cells, not a crash', () => {
    const one = makeDemoCohort({ conditions: [{ name: 'r', dosage: 1, count: 1 }, { name: 'h', dosage: 2, count: 1 }] });
    const a = analyseCohort(one.results, parseSampleSheet(one.sheetCsv, 's.csv'));
    expect(a.stats[0].sd).toBeNaN();
    expect(a.dosageFits.length).toBe(0);
    expect(conditionsCsv(a)).toContain('r,1,lambda,EL,1,');
  });
});

describe('checkCohortOptions', () => {
  it('fills defaults', () => {
    expect(checkCohortOptions()).toEqual({ reference: null, normalisation: 'scale-offset', lambdaPosteriorEl: null, gridStepEl: 0.01, slopeHalfWidthEl: 0.04, level: 0.95, equivalenceMargin: null });
  });
  it('rejects bad options with exact messages', () => {
    // Source: demo data
    const cases: [object, string][] = [
      [{ normalisation: 'log' }, 'normalisation must be one of none, amplitude, minmax, scale-offset (got "log")'],
      [{ lambdaPosteriorEl: -1 }, 'lambdaPosteriorEl must be a positive number (x/EL)'],
      [{ gridStepEl: 0 }, 'gridStepEl must be a number in (0, 0.5]'],
      [{ slopeHalfWidthEl: 0.001 }, 'slopeHalfWidthEl must be a number from gridStepEl to 0.25'],
      [{ level: 1 }, 'level must be a number in (0, 1)'],
      [{ reference: ' ' }, 'reference must be a non-empty condition name'],
    ];
    for (const [o, m] of cases) expect(() => checkCohortOptions(o)).toThrow(new CohortError(m));
  });
});

import { describe, expect, it } from 'vitest';
import { covariateAdjustedLine, withinGroupFit, WithinFitError } from './within';
import { createRng } from './rng';

// Demo data (same as test/stats-reference/within_reference.py): four conditions, four embryos each, stage in minutes,
// batch A/B coded 0/1 with base A.
const cond = [0, 0, 0, 0, 1, 1, 1, 1, 2, 2, 2, 2, 3, 3, 3, 3].map((c) => `c${c}`);
const lnf = [0, 0, 0, 0, 1, 1, 1, 1, 2, 2, 2, 2, 3, 3, 3, 3].map((c) => Math.log([0.5, 1, 2, 4][c]));
const stage = [10, 14, 18, 25, 12, 15, 22, 30, 20, 24, 27, 35, 28, 33, 36, 41];
const batchB = [0, 1, 0, 1, 0, 0, 1, 1, 1, 0, 1, 0, 1, 1, 0, 0];
const y = [0.301, 0.322, 0.310, 0.341, 0.351, 0.360, 0.368, 0.383, 0.402, 0.411, 0.425, 0.430, 0.455, 0.470, 0.468, 0.480];

describe('withinGroupFit', () => {
  it('equals least squares with one dummy per condition (Frisch–Waugh–Lovell)', () => {
    // Source: numpy lstsq on the full dummy design, test/stats-reference/within_reference.py (demo data).
    const f = withinGroupFit(cond, [stage, batchB], y);
    expect(f.beta[0]).toBeCloseTo(0.0018523489932885538, 12);
    expect(f.beta[1]).toBeCloseTo(0.005022651006711398, 12);
    expect(f.se[0]).toBeCloseTo(0.00023267108468760564, 12);
    expect(f.se[1]).toBeCloseTo(0.002666851166775198, 12);
    expect(f.cov[0][1]).toBeCloseTo(-5.4135833649706794e-08, 15);
    expect(f.s2).toBeCloseTo(2.8231837248322102e-05, 14);
    expect(f.dof).toBe(10);
  });

  it('recovers an exact coefficient when y is a group effect plus 0.01 per unit (hand-computable)', () => {
    const z = [1, 2, 3, 5, 6, 9];
    const g = ['a', 'a', 'a', 'b', 'b', 'b'];
    const yy = z.map((v, i) => (g[i] === 'a' ? 1 : 7) + 0.01 * v + (i === 1 ? 1e-4 : 0) - (i === 4 ? 1e-4 : 0));
    const f = withinGroupFit(g, [z], yy);
    // Within deviations of z: (−1, 0, 1) and (−1.667, −0.667, 2.333); the perturbations sit at deviation 0 and
    // −0.667, so β = 0.01 + (−1e-4·−0.667)/Σd² with Σd² = 2 + 8.667.
    expect(f.beta[0]).toBeCloseTo(0.01 + (1e-4 * (2 / 3)) / (2 + 26 / 3), 12);
  });

  it('says which term is constant within every group, and when terms are collinear', () => {
    const byGroup = cond.map((c) => (c === 'c0' ? 1 : 2));
    expect(() => withinGroupFit(cond, [stage, byGroup], y)).toThrow(WithinFitError);
    try { withinGroupFit(cond, [stage, byGroup], y); } catch (e) { expect((e as WithinFitError).reason).toBe('constant'); expect((e as WithinFitError).term).toBe(1); }
    try { withinGroupFit(cond, [stage, stage.map((s) => 2 * s + 1)], y); } catch (e) { expect((e as WithinFitError).reason).toBe('collinear'); }
    expect(() => withinGroupFit(cond, [stage, stage.map((s) => 2 * s + 1)], y)).toThrow(WithinFitError);
  });
});

describe('covariateAdjustedLine', () => {
  it('matches the adjusted condition-means line computed step by step', () => {
    // Source: test/stats-reference/within_reference.py (numpy; demo data).
    const a = covariateAdjustedLine(cond, lnf, [stage, batchB], y);
    expect(a.slope).toBeCloseTo(0.05620870593283657, 12);
    expect(a.intercept).toBeCloseTo(0.3728320469798657, 12);
    expect(a.slopeSeMeansOnly).toBeCloseTo(0.0011432943105326371, 12);
    expect(a.slopeSe).toBeCloseTo(0.002315919061105972, 12);
    expect(a.ciLow).toBeCloseTo(0.0462441104623154, 10);
    expect(a.ciHigh).toBeCloseTo(0.06617330140335774, 10);
    expect(a.dof).toBe(2);
    // Unadjusted condition-means slope of the same data, for contrast: 0.0722.
    expect(a.groupMeans.map((m) => m.mean)).toHaveLength(4);
  });

  it('is unbiased and covers ≥ 93% when stage is correlated with position within and between conditions', async () => {
    // Demo data: 5 dosages, 6 embryos each, shared condition offsets (SD 0.01 EL), stage later at higher dosage
    // (so the unadjusted slope is biased), position +0.002 EL per minute of stage, noise SD 0.015 EL.
    const rng = createRng(15015);
    const dose = [0.25, 0.5, 1, 2, 4];
    const trueSlope = 0.05;
    let covered = 0, sumAdj = 0, sumRaw = 0;
    const trials = 1000;
    for (let t = 0; t < trials; t++) {
      if (t % 100 === 0) await new Promise((r) => setTimeout(r, 0));
      const g: string[] = [], x: number[] = [], s: number[] = [], yy: number[] = [];
      dose.forEach((f, j) => {
        const offset = 0.01 * rng.normal();
        for (let e = 0; e < 6; e++) {
          const st = 20 + 4 * j + 8 * rng.normal();
          g.push(`d${j}`); x.push(Math.log(f)); s.push(st);
          yy.push(0.4 + trueSlope * Math.log(f) + 0.002 * (st - 20) + offset + 0.015 * rng.normal());
        }
      });
      const a = covariateAdjustedLine(g, x, [s], yy);
      sumAdj += a.slope;
      if (a.ciLow <= trueSlope && trueSlope <= a.ciHigh) covered++;
      const means = dose.map((_, j) => yy.filter((_, i) => g[i] === `d${j}`).reduce((p, v) => p + v, 0) / 6);
      const lx = dose.map(Math.log), xb = lx.reduce((p, v) => p + v, 0) / 5, mb = means.reduce((p, v) => p + v, 0) / 5;
      sumRaw += lx.reduce((p, v, j) => p + (v - xb) * (means[j] - mb), 0) / lx.reduce((p, v) => p + (v - xb) ** 2, 0);
    }
    // Common practice: 95% nominal, ≥ 93% over 1000 trials (binomial SD 0.7 points).
    expect(covered / trials).toBeGreaterThanOrEqual(0.93);
    expect(Math.abs(sumAdj / trials - trueSlope)).toBeLessThan(0.002);
    // Stage rises 4 min per dosage step (ln 2 in ln f): the unadjusted slope is biased by 0.002·4/ln 2 ≈ 0.0115.
    expect(sumRaw / trials - trueSlope).toBeGreaterThan(0.009);
  });
});

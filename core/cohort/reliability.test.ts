// Reliability flags, counted by hand on demo embryos whose λ, SE and fit range are set here (invented values).
import { describe, expect, it } from 'vitest';
import type { ConditionInfo, EmbryoResult } from '../model';
import { makeDemoCohort } from './demo-cohort';
import { observationsOf } from './observations';
import { conditionReliability, fitRangesUsed, lambdaPositionCorrelation, LAMBDA_RELATIVE_SE_LIMIT } from './reliability';

// Source: demo data (makeDemoCohort); the expected counts, means and medians are worked out by hand from the values set.
const demo = makeDemoCohort({ conditions: [{ name: 'ref', dosage: 1, count: 4 }], seed: 3 });
const ref: ConditionInfo = { name: 'ref', dosage: 1, factor: 1 };
const withFit = (r: EmbryoResult, lambdaEl: number, seEl: number, range: readonly [number, number] = [0.1, 0.6]): EmbryoResult =>
  ({ ...r, gradientFit: { ...r.gradientFit!, lambdaEl, lambdaSeEl: seEl, fitRangeEl: range } });

describe('conditionReliability', () => {
  it('counts fitted and imprecise λ (SE/|λ| above 25%), the mean and median, and how often each position was found', () => {
    expect(LAMBDA_RELATIVE_SE_LIMIT).toBe(0.25); // common practice
    const [e1, e2, e3, e4] = demo.results;
    const embryos = [
      withFit(e1, 0.2, 0.01), // 5%
      withFit(e2, 0.3, 0.09), // 30%: imprecise
      withFit(e3, 0.1, 0.025), // exactly 25%: not above the limit
      { ...e4, gradientFit: null, boundaries: [], landmarks: [] }, // no fit, no positions
    ];
    const observations = embryos.flatMap((e) => observationsOf(e, ref));
    const [r] = conditionReliability([{ condition: ref, embryos }], observations);
    expect([r.embryos, r.lambdaFitted, r.lambdaImprecise]).toEqual([4, 3, 1]);
    expect(r.lambdaMeanEl).toBeCloseTo(0.2, 15);
    expect(r.lambdaMedianEl).toBe(0.2);
    const positions = Object.keys(r.detected);
    expect(positions.length).toBeGreaterThan(0);
    for (const q of positions) expect(r.detected[q]).toBe(3);
    // A NaN SE counts as imprecise (it is not "at most 25%"); the median of an even count is the middle pair's mean.
    const [s] = conditionReliability([{ condition: ref, embryos: [withFit(e1, 0.2, NaN), withFit(e2, 0.4, 0.01)] }], []);
    expect([s.lambdaImprecise, s.lambdaMedianEl]).toEqual([1, 0.30000000000000004]);
  });
});

describe('fitRangesUsed', () => {
  it('lists each distinct x/EL fit range with its embryo count, most used first; embryos without a fit do not count', () => {
    const [e1, e2, e3, e4] = demo.results;
    const uses = fitRangesUsed([withFit(e1, 0.2, 0.01, [0.1, 0.3]), withFit(e2, 0.2, 0.01), withFit(e3, 0.2, 0.01), { ...e4, gradientFit: null }]);
    expect(uses).toEqual([{ startEl: 0.1, endEl: 0.6, embryos: 2 }, { startEl: 0.1, endEl: 0.3, embryos: 1 }]);
  });
});

describe('lambdaPositionCorrelation', () => {
  // Source: hand-computed Pearson correlations of three invented pairs.
  const obs = (lams: number[], pos: number[]) => lams.flatMap((l, i) => [
    { file: `e${i}`, condition: 'ref', quantity: 'lambda', kind: 'lambda', unit: 'EL', value: l },
    { file: `e${i}`, condition: 'ref', quantity: 'boundary:t:half-max', kind: 'boundary', unit: 'EL', value: pos[i] },
  ]) as unknown as Parameters<typeof lambdaPositionCorrelation>[0];
  it('is +1 and −1 for exact lines, 0.5 for (1,1),(2,3),(3,2), and NaN with fewer than three pairs or no spread', () => {
    expect(lambdaPositionCorrelation(obs([1, 2, 3], [2, 4, 6]), 'ref', 'boundary:t:half-max')).toBeCloseTo(1, 15);
    expect(lambdaPositionCorrelation(obs([1, 2, 3], [6, 4, 2]), 'ref', 'boundary:t:half-max')).toBeCloseTo(-1, 15);
    expect(lambdaPositionCorrelation(obs([1, 2, 3], [1, 3, 2]), 'ref', 'boundary:t:half-max')).toBeCloseTo(0.5, 15);
    expect(lambdaPositionCorrelation(obs([1, 2], [1, 2]), 'ref', 'boundary:t:half-max')).toBeNaN();
    expect(lambdaPositionCorrelation(obs([1, 1, 1], [1, 2, 3]), 'ref', 'boundary:t:half-max')).toBeNaN();
  });
});

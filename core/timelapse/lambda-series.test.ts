import { describe, expect, it } from 'vitest';
import type { Profile } from '../model';
import { fitLambdaSeries, shapeFormedAtS } from './lambda-series';

/** Demo data: an exponential profile A·exp(−x/λ) + B on 50 bins of a 500 µm egg. */
function profile(lambdaUm: number, amplitude: number): Profile {
  const xEl = Float64Array.from({ length: 50 }, (_, i) => (i + 0.5) / 50);
  const xUm = xEl.map((v) => v * 500);
  const mean = xUm.map((x) => amplitude * Math.exp(-x / lambdaUm) + 5);
  return { channel: 'gradient', xEl, xUm, mean, sd: mean.map(() => 1), n: mean.map(() => 10) };
}

describe('fitLambdaSeries', () => {
  it('fits λ per time point and reports a failed fit as a message, going on', () => {
    const flat = profile(100, 0);
    const series = fitLambdaSeries([
      { tS: 0, profile: flat, eggLengthUm: 500 },
      { tS: 60, profile: profile(60, 500), eggLengthUm: 500 },
      { tS: 120, profile: profile(100, 900), eggLengthUm: 500 },
    ], [0.1, 0.6]);
    expect(series[0].fit).toBeNull();
    expect(series[0].error).toMatch(/^fitExponentialDecay: /);
    // Exact exponentials: the fit returns the λ they were made with (demo data).
    expect(series[1].fit!.lambdaUm).toBeCloseTo(60, 6);
    expect(series[2].fit!.lambdaEl).toBeCloseTo(0.2, 8);
  });

  it('finds when the shape has formed: λ stays within 5% of its final value from then on', () => {
    const lambdas = [40, 60, 80, 92, 97, 99, 100, 100, 100];
    const series = fitLambdaSeries(lambdas.map((l, i) => ({ tS: i * 60, profile: profile(l, 800), eggLengthUm: 500 })), [0.1, 0.6]);
    expect(shapeFormedAtS(series)).toBe(240);
  });
});

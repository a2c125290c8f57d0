import { describe, expect, it } from 'vitest';
import { notDecayingReasons, notDecayingWarning } from './decay-check';
import { fitExponentialDecay } from '../fit';

describe('notDecayingReasons', () => {
  it('passes a decaying fit and names each way a fit can fail to decay', () => {
    expect(notDecayingReasons({ lambdaEl: 0.2, lambdaUm: 100, amplitude: 50 })).toEqual([]);
    expect(notDecayingWarning('gradient', { lambdaEl: -0.158, lambdaUm: -79, amplitude: -12.34 })).toBe(
      'the fit of gradient is not a decaying gradient (λ = -79.0 µm is not positive; amplitude A = -12.3 is not positive): '
      + 'look at the profile; this λ is left out of cohort λ statistics');
    expect(notDecayingReasons({ lambdaEl: 1.7, lambdaUm: 850, amplitude: 3 })).toEqual(['λ = 1.70 EL is longer than the egg']);
    expect(notDecayingReasons({ lambdaEl: 0.3, lambdaUm: Number.NaN, amplitude: 0 })).toEqual(['amplitude A = 0.00 is not positive']);
  });
  it('flags the fit of a plateau that drops near the posterior end (it bends the wrong way)', () => {
    // Demo data: 100 up to x = 0.6 EL, then a linear drop to 40 at 1 EL; egg length 500 µm.
    const xEl = Float64Array.from({ length: 50 }, (_, i) => (i + 0.5) / 50);
    const y = Float64Array.from(xEl, (x) => (x < 0.6 ? 100 : 100 - 150 * (x - 0.6)));
    const fit = fitExponentialDecay(Float64Array.from(xEl, (x) => x * 500), y, { eggLengthUm: 500, fitRangeEl: [0.1, 0.9], xEl });
    // A curve that is flat and then falls faster and faster is a negative amplitude times a rising exponential
    // (concave down), so λ < 0 and A < 0 (worked by hand from the shape: y'' < 0 needs A/λ² < 0).
    expect(fit.lambdaUm).toBeLessThan(0);
    expect(fit.amplitude).toBeLessThan(0);
    expect(notDecayingWarning('gradient', fit)).toMatch(/^the fit of gradient is not a decaying gradient \(λ = -\d+\.\d µm is not positive; amplitude A = -[\d.e+]+ is not positive\)/);
  });
});

import { describe, expect, it } from 'vitest';
import { gradientShapeAt } from './embryo';
import { movieFrame, planSyntheticMovie, syntheticMovieInfo } from './movie';
import { DEFAULT_SYNTH_PARAMS } from './params';

describe('gradientShapeAt', () => {
  it('is exp(−x/λ) by default and interpolates a sampled shape linearly, holding the last value', () => {
    expect(gradientShapeAt(DEFAULT_SYNTH_PARAMS, 100)).toBe(Math.exp(-1));
    const p = { ...DEFAULT_SYNTH_PARAMS, gradientShape: { stepUm: 10, values: Float64Array.of(1, 0.5, 0.25) } };
    expect(gradientShapeAt(p, 5)).toBeCloseTo(0.75, 12);
    expect(gradientShapeAt(p, 15)).toBeCloseTo(0.375, 12);
    expect(gradientShapeAt(p, 500)).toBe(0.25);
  });
});

describe('planSyntheticMovie (demo data)', () => {
  const movie = planSyntheticMovie({
    embryo: { widthPx: 200, heightPx: 120, pixelSizeUm: 3, sizeZ: 1 }, degradationPerS: 1 / 600,
    frameIntervalS: 600, frames: 12, framesBeforeOnset: 2,
  }, 17);

  it('has no gradient before the onset and approaches the steady state (1 at the pole) by the end', () => {
    expect(movie.onsetS).toBe(600);
    expect(Math.max(...movie.shapes[1])).toBe(0);
    // 9000 s after the onset is 15 degradation times: within 1e-4 of the steady state (model relaxation, demo).
    expect(movie.shapes[11][0]).toBeCloseTo(1, 3);
  });

  it('keeps the embryo in place and draws fresh noise per frame', () => {
    const a = movieFrame(movie, 10), b = movieFrame(movie, 11);
    expect(a.truth.centre).toEqual(b.truth.centre);
    expect(a.stack.planes[0]).not.toEqual(b.stack.planes[0]);
    expect(syntheticMovieInfo(movie).sizeT).toBe(12);
  });

  it('rejects bad movie parameters with one-line messages', () => {
    expect(() => planSyntheticMovie({ ...movie.params, framesBeforeOnset: 12 }, 1)).toThrow(
      'framesBeforeOnset must be an integer from 0 to frames − 1, got 12');
  });
});

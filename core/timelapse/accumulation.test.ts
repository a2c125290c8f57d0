import { describe, expect, it } from 'vitest';
import { createRng } from '../stats';
import {
  accumulationOfSeries, accumulationTruncationBias, frameNoiseSd, localAccumulationTime, trapezoidWeights,
} from './accumulation';
import { sddAccumulationTimeS } from './accumulation-model';
import { sddLambdaUm, solveSdd } from './sdd-solver';
import type { SddModel } from './sdd-solver';

const range = (n: number, step: number, start = 0): Float64Array => Float64Array.from({ length: n }, (_, i) => start + i * step);

/** Demo data: a relaxation C = C∞(1 − e^{−t/T}) sampled at `times`, one position per entry of `cInf`. */
function exponentialApproach(times: Float64Array, tauS: number, cInf: number[]): Float64Array[] {
  return Array.from(times, (t) => Float64Array.from(cInf, (c) => c * (1 - Math.exp(-t / tauS))));
}

describe('localAccumulationTime on known relaxations', () => {
  it('gives τ = T for C = C∞(1 − e^{−t/T}) on a long movie', () => {
    // Source: ∫₀^∞ e^{−t/T} dt = T (calculus).
    const times = range(801, 5);
    const r = localAccumulationTime(times, exponentialApproach(times, 300, [10, 1000]), { plateauFrames: 1 });
    expect(r.tauS[0] / 300 - 1).toBeCloseTo(0, 3);
    expect(r.tauS[1] / 300 - 1).toBeCloseTo(0, 3);
    expect(r.movieLengthS).toBe(4000);
    expect(Array.from(r.stillRising)).toEqual([0, 0]);
  });

  it('is biased low by −(T/τ)q/(1 − q) when the movie ends at T = 3τ, and flags the late rise', () => {
    // Source: the truncation bias derived in accumulation.ts's header (calculus on the exponential approach).
    const times = range(181, 5); // 900 s = 3τ
    const r = localAccumulationTime(times, exponentialApproach(times, 300, [1000]), { plateauFrames: 1 });
    expect(accumulationTruncationBias(3)).toBeCloseTo(-0.1572, 4);
    expect(r.tauS[0] / (300 * (1 + accumulationTruncationBias(3))) - 1).toBeCloseTo(0, 3);
    expect(r.stillRising[0]).toBe(1);
    // Rise over the last fifth (720–900 s): e^{−2.4} − e^{−3} ≈ 4.1% of C∞ (calculus; the line fit is close to it).
    expect(r.lateRise[0]).toBeCloseTo(Math.exp(-2.4) - Math.exp(-3), 2);
  });

  it('flags an exponential approach cut before about 3.5τ and not one cut after it', () => {
    // Rise over the last fifth: e^{−0.8u} − e^{−u} for a movie of u·τ (calculus): 3.4% at 3.3τ, 2.8% at 3.7τ.
    const flagged = (u: number): number => {
      const times = range(Math.round((u * 300) / 5) + 1, 5);
      return localAccumulationTime(times, exponentialApproach(times, 300, [1000]), { plateauFrames: 1 }).stillRising[0];
    };
    expect(flagged(3.3)).toBe(1);
    expect(flagged(3.7)).toBe(0);
    expect(accumulationTruncationBias(3.5)).toBeCloseTo(-0.109, 3);
  });

  it('does not flag a movie of 5τ, whose bias is only −3.4%', () => {
    const times = range(301, 5); // 1500 s = 5τ
    const r = localAccumulationTime(times, exponentialApproach(times, 300, [1000]), { plateauFrames: 1 });
    expect(accumulationTruncationBias(5)).toBeCloseTo(-0.0339, 4);
    expect(r.stillRising[0]).toBe(0);
  });

  it('counts the time from an onset before the first frame, where C = 0', () => {
    const times = range(700, 5, 100);
    const frames = exponentialApproach(range(700, 5, 100), 300, [1000]);
    const r = localAccumulationTime(times, frames, { baselineFrames: 0, onsetS: 0, plateauFrames: 1 });
    expect(r.tauS[0] / 300 - 1).toBeCloseTo(0, 2);
    // The same movie taken as starting at its first frame loses the first 100 s of the rise.
    const late = localAccumulationTime(times, frames, { baselineFrames: 0, plateauFrames: 1 });
    expect(late.tauS[0]).toBeLessThan(r.tauS[0] - 80);
  });

  it('subtracts the baseline frames (a constant autofluorescence) before the onset', () => {
    // Demo data: 40 units of constant signal under the relaxation; two frames before production starts at 10 s.
    const times = range(802, 5, -5);
    const frames = Array.from(times, (t) => Float64Array.of(40 + (t > 0 ? 1000 * (1 - Math.exp(-t / 300)) : 0)));
    const r = localAccumulationTime(times, frames, { baselineFrames: 2, plateauFrames: 1 });
    expect(r.tauS[0] / 300 - 1).toBeCloseTo(0, 3);
    expect(r.steadyState[0]).toBeCloseTo(1000, 2);
  });

  it('leaves NaN where a frame is missing a value or nothing accumulates', () => {
    const times = range(50, 10);
    const frames = exponentialApproach(times, 100, [100, 100, 0]);
    frames[7][1] = NaN;
    const r = localAccumulationTime(times, frames);
    expect(Number.isFinite(r.tauS[0])).toBe(true);
    expect(Number.isNaN(r.tauS[1])).toBe(true);
    expect(Number.isNaN(r.tauS[2])).toBe(true);
  });

  it('rejects bad options with one-line messages', () => {
    const times = range(5, 1);
    const frames = exponentialApproach(times, 1, [1]);
    expect(() => localAccumulationTime(times, frames.slice(1))).toThrow('localAccumulationTime: 5 times but 4 frames');
    expect(() => localAccumulationTime([0, 2, 1, 3, 4], frames)).toThrow('localAccumulationTime: times must be finite and increasing (time 2 is 1)');
    expect(() => localAccumulationTime(times, frames, { plateauFrames: 4 })).toThrow(
      'localAccumulationTime: need at least 6 frames after the onset (plateauFrames + 2), got 4');
    expect(() => localAccumulationTime(times, frames, { baselineFrames: 2, onsetS: 0 })).toThrow(
      'localAccumulationTime: the onset (0 s) is before the last baseline frame (1 s)');
  });
});

describe('the uncertainty of τ', () => {
  it('estimates frame noise from neighbour residuals: σ for a straight line plus noise', () => {
    // Demo data: a straight line plus seeded Gaussian noise of SD 2; common practice: the robust SD is within ~10%.
    const rng = createRng(11);
    const times = range(400, 3);
    const values = times.map((t) => 5 + 0.1 * t + 2 * rng.normal());
    expect(frameNoiseSd(times, values) / 2 - 1).toBeLessThan(0.1);
    expect(frameNoiseSd(times, values) / 2 - 1).toBeGreaterThan(-0.1);
  });

  it('has a standard error that matches the scatter of repeated noisy movies, and ~95% coverage', () => {
    // Demo data: 300 seeded noisy copies of one relaxation; the check is the spread of the estimates themselves.
    const rng = createRng(5);
    const times = range(80, 15);
    const truth = localAccumulationTime(times, exponentialApproach(times, 200, [100]), { plateauFrames: 5 }).tauS[0];
    const estimates: number[] = [], ses: number[] = [];
    let covered = 0;
    for (let rep = 0; rep < 300; rep++) {
      const frames = exponentialApproach(times, 200, [100]).map((f) => f.map((v) => v + 3 * rng.normal()));
      const r = localAccumulationTime(times, frames, { plateauFrames: 5 });
      estimates.push(r.tauS[0]);
      ses.push(r.tauSeS[0]);
      if (r.tauCiLowS[0] <= truth && truth <= r.tauCiHighS[0]) covered++;
    }
    const m = estimates.reduce((s, v) => s + v, 0) / estimates.length;
    const sd = Math.sqrt(estimates.reduce((s, v) => s + (v - m) ** 2, 0) / (estimates.length - 1));
    const meanSe = ses.reduce((s, v) => s + v, 0) / ses.length;
    expect(meanSe / sd).toBeGreaterThan(0.8);
    expect(meanSe / sd).toBeLessThan(1.25);
    expect(covered / 300).toBeGreaterThan(0.9);
  });

  it('propagates unit noise through trapezoid weights: the exact sum of squared derivatives', () => {
    // Hand calculation (demo data): onset 0, frames at 1, 2, 3 with values 0.5, 1, 1 and one plateau frame.
    expect(Array.from(trapezoidWeights(0, [1, 2, 3]))).toEqual([0.5, 1, 1, 0.5]);
    const r = accumulationOfSeries(0, [1, 2, 3], [0.5, 1, 1], 1);
    // τ = 0.5·1 + 1·0.5 + 1·0 + 0.5·0 = 1; ∂τ/∂C = (−1, −1, −0.5 + Σw·C) = (−1, −1, 1.5).
    expect(r.tauS).toBeCloseTo(1, 12);
    expect(r.seUnitNoise).toBeCloseTo(Math.sqrt(4.25), 12);
  });
});

describe('τ(x) of the synthesis–diffusion–degradation model', () => {
  it('matches (1 + x/λ)/(2k) where the far end does not matter', () => {
    // Source: τ(x) = (1 + x/λ)/(2k) for a flux source at x = 0 (Berezhkovskii, Sample & Shvartsman 2010,
    // Biophys. J. 99:L59 — from memory, re-derived in accumulation-model.ts) against our own Crank–Nicolson solution
    // of the equation (sdd-solver.ts, checked against closed forms in sdd-solver.test.ts). Demo parameters.
    const model: SddModel = { diffusionUm2PerS: 100 ** 2 / 600, degradationPerS: 1 / 600, sourceFlux: 1, lengthUm: 1200 };
    const times = range(901, 10); // 15 degradation times: the relaxation left is below 1e-6
    const sol = solveSdd(model, times);
    const r = localAccumulationTime(times, sol.concentration, { plateauFrames: 1 });
    const lambdaUm = sddLambdaUm(model);
    for (const xUm of [0, 50, 100, 200, 300]) {
      const i = Math.round(xUm / (sol.xUm[1] - sol.xUm[0]));
      expect(Math.abs(r.tauS[i] / sddAccumulationTimeS(xUm, lambdaUm, model.degradationPerS) - 1)).toBeLessThan(2e-3);
    }
  });
});

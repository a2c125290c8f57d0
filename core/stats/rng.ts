// A small seeded random number generator for demo data and tests: same numbers on every platform.
import { logGamma } from './log-gamma';

/** Seeded generator: uniform in [0, 1), standard normal, Poisson counts. */
export interface Rng {
  /** Uniform on [0, 1) with 32-bit resolution. */
  uniform(): number;
  /** Standard normal (mean 0, SD 1). */
  normal(): number;
  /** Poisson count with the given mean (≥ 0). */
  poisson(mean: number): number;
}

/** mulberry32 step: a 32-bit state, integer-only arithmetic, so results are identical across platforms. */
function mulberry32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Poisson by multiplying uniforms: exact and fast for small means. */
function poissonSmall(uniform: () => number, meanCount: number): number {
  const limit = Math.exp(-meanCount);
  let k = 0;
  let product = uniform();
  while (product > limit) {
    k++;
    product *= uniform();
  }
  return k;
}

/**
 * Poisson by transformed rejection with squeeze (PTRS, Hörmann 1993): exact, O(1) expected uniforms
 * for any mean ≥ 10, so large photon counts stay cheap.
 */
function poissonPtrs(uniform: () => number, lam: number): number {
  const slam = Math.sqrt(lam);
  const logLam = Math.log(lam);
  const b = 0.931 + 2.53 * slam;
  const a = -0.059 + 0.02483 * b;
  const invAlpha = 1.1239 + 1.1328 / (b - 3.4);
  const vr = 0.9277 - 3.6224 / (b - 2);
  for (;;) {
    const u = uniform() - 0.5;
    const v = uniform();
    const us = 0.5 - Math.abs(u);
    const k = Math.floor(((2 * a) / us + b) * u + lam + 0.43);
    if (us >= 0.07 && v <= vr) return k;
    if (k < 0 || (us < 0.013 && v > us)) continue;
    const lhs = Math.log(v) + Math.log(invAlpha) - Math.log(a / (us * us) + b);
    if (lhs <= -lam + k * logLam - logGamma(k + 1)) return k;
  }
}

/** Creates a seeded generator; the seed is reduced to an unsigned 32-bit integer. */
export function createRng(seed: number): Rng {
  if (!Number.isFinite(seed)) throw new RangeError(`createRng: seed must be a finite number, got ${seed}`);
  const uniform = mulberry32(Math.trunc(seed));
  let spare: number | null = null;
  const normal = (): number => {
    if (spare !== null) {
      const value = spare;
      spare = null;
      return value;
    }
    // Box–Muller; 1 − u lies in (0, 1], so the log is finite.
    const radius = Math.sqrt(-2 * Math.log(1 - uniform()));
    const angle = 2 * Math.PI * uniform();
    spare = radius * Math.sin(angle);
    return radius * Math.cos(angle);
  };
  const poisson = (meanCount: number): number => {
    if (!(meanCount >= 0) || !Number.isFinite(meanCount)) {
      throw new RangeError(`poisson: mean must be a finite number ≥ 0, got ${meanCount}`);
    }
    if (meanCount === 0) return 0;
    return meanCount < 10 ? poissonSmall(uniform, meanCount) : poissonPtrs(uniform, meanCount);
  };
  return { uniform, normal, poisson };
}

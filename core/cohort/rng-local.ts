// Seeded random numbers for demo data: mulberry32 (uniform) and Box–Muller (normal); deterministic everywhere.

/** A deterministic random source. */
export interface SeededRandom {
  uniform(): number;
  normal(): number;
}

/** Create a seeded generator; the same seed gives the same sequence on every platform. */
export function seededRandom(seed: number): SeededRandom {
  let state = seed >>> 0;
  const uniform = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const normal = (): number => {
    const u1 = Math.max(uniform(), 1e-300);
    const u2 = uniform();
    return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
  };
  return { uniform, normal };
}

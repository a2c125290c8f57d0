// Fieller's interval for a ratio a/b of two independent, normally distributed estimates (Fieller 1954, J. R. Statist.
// Soc. B 16:175; from memory). Where the delta method treats the ratio as normal, Fieller's inverts the exact t test
// of a − ρ·b = 0, so it stays right when b's own uncertainty is not small: with g = t²·sb²/b² ≥ 1, b is not
// distinguishable from 0 and the interval is unbounded.
import { tQuantile } from './t-distribution';

/** Fieller's interval of a/b: the limits (null when unbounded, g ≥ 1) and g = t²·sb²/b². */
export interface FiellerInterval {
  readonly low: number | null;
  readonly high: number | null;
  readonly g: number;
}

/**
 * Fieller's (level) interval of a/b for independent estimates a ± sa and b ± sb with `dof` degrees of freedom for the t
 * quantile: (ρ ± (t/|b|)·√(sa² + ρ²·sb² − g·sa²)) / (1 − g), ρ = a/b. Unbounded (null limits) when g ≥ 1.
 */
export function fiellerInterval(a: number, sa: number, b: number, sb: number, dof: number, level = 0.95): FiellerInterval {
  const t = tQuantile(1 - (1 - level) / 2, dof);
  const g = (t * sb / b) ** 2;
  if (!(g < 1) || !Number.isFinite(g)) return { low: null, high: null, g: Number.isFinite(g) ? g : Infinity };
  const rho = a / b;
  const half = (t / Math.abs(b)) * Math.sqrt(sa * sa + rho * rho * sb * sb - g * sa * sa);
  return { low: (rho - half) / (1 - g), high: (rho + half) / (1 - g), g };
}

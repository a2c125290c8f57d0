// Starting values for the logistic step y = L + (U − L)·σ((x − x0)/w), σ(z) = 1/(1 + e^z), by variable
// projection: x0 is held at the half-maximum crossing, and for each trial width on a log grid the levels L and U
// follow from a linear least-squares solve; the width with the smallest residual wins. One cheap pass (a few
// thousand exponentials) gives a start inside the basin of the step at the crossing, so a single LM run
// suffices. (x0 is deliberately not searched: over the whole profile the least residual can belong to a broad
// decay from an edge artefact whose LM run never converges.)

/** A starting point [lower, upper, x0, w] (x in x/EL, w > 0) and its weighted sum of squares. */
export interface LogisticStart {
  readonly params: [number, number, number, number];
  readonly rss: number;
  /** True when the narrowest trial width (a quarter bin) fits best: the step is at least that sharp. */
  readonly narrowest: boolean;
}

/** σ(z) = 1/(1 + e^z) without overflow for large |z|. */
export function logistic(z: number): number {
  if (z >= 0) {
    const e = Math.exp(-z);
    return e / (1 + e);
  }
  return 1 / (1 + Math.exp(z));
}

/**
 * Weighted least-squares levels (L, U) at fixed x0 and w from the 2×2 normal equations of the columns 1 − σ and σ
 * (a start needs no more precision than that, and this allocates nothing); null when the columns are dependent.
 */
function levelsAt(x: Float64Array, y: Float64Array, weight: Float64Array, x0: number, w: number): LogisticStart | null {
  let suu = 0, suv = 0, svv = 0, suy = 0, svy = 0, syy = 0;
  for (let i = 0; i < x.length; i++) {
    const v = logistic((x[i] - x0) / w), u = 1 - v, c = weight[i];
    suu += c * u * u; suv += c * u * v; svv += c * v * v;
    suy += c * u * y[i]; svy += c * v * y[i]; syy += c * y[i] * y[i];
  }
  const det = suu * svv - suv * suv;
  if (!(det > 1e-12 * suu * svv)) return null;
  const lower = (svv * suy - suv * svy) / det, upper = (suu * svy - suv * suy) / det;
  // Residual sum of squares of a least-squares solution: Σw·y² − (L·Σw·u·y + U·Σw·v·y).
  const rss = syy - lower * suy - upper * svy;
  return Number.isFinite(rss) ? { params: [lower, upper, x0, w], rss, narrowest: false } : null;
}

/**
 * Best start with x0 = crossingEl over widths from spacingEl/4 to spanEl (log-spaced, 24 values); x (x/EL,
 * ascending) and weight (per point, > 0) as in the fit. The sign of U − L carries the direction. Returns null
 * only when no width gives a finite solution.
 */
export function logisticStart(
  x: Float64Array, y: Float64Array, weight: Float64Array, crossingEl: number, spacingEl: number, spanEl: number,
): LogisticStart | null {
  const steps = 24, smallest = spacingEl / 4, ratio = spanEl / smallest;
  let best: LogisticStart | null = null;
  for (let s = 0; s < steps; s++) {
    const trial = levelsAt(x, y, weight, crossingEl, smallest * ratio ** (s / (steps - 1)));
    if (trial && (!best || trial.rss < best.rss)) best = { ...trial, narrowest: s === 0 };
  }
  return best;
}

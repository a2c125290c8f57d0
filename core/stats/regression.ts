// Straight-line least squares y = intercept + slope·x with t-based confidence intervals.
import { checkFiniteValues, checkLevel } from './check';
import { tQuantile } from './t-distribution';

/** Result of a straight-line fit; intervals are two-sided at `level`. */
export interface LinearRegression {
  readonly slope: number;
  readonly intercept: number;
  readonly slopeSe: number;
  readonly interceptSe: number;
  readonly slopeCi: readonly [number, number];
  readonly interceptCi: readonly [number, number];
  readonly r2: number;
  /** Residual standard deviation √(RSS/dof). */
  readonly residualSd: number;
  readonly n: number;
  readonly dof: number;
  readonly level: number;
}

function checkPairs(x: ArrayLike<number>, y: ArrayLike<number>, w: ArrayLike<number> | null, name: string): void {
  if (x.length !== y.length) throw new RangeError(`${name}: x and y differ in length (${x.length} vs ${y.length})`);
  checkFiniteValues(x, `${name} (x)`, 2);
  checkFiniteValues(y, `${name} (y)`, 2);
  if (w) {
    if (w.length !== x.length) throw new RangeError(`${name}: weights and x differ in length (${w.length} vs ${x.length})`);
    for (let i = 0; i < w.length; i++) {
      if (!(w[i] > 0 && Number.isFinite(w[i]))) throw new RangeError(`${name}: weight ${i} must be a positive finite number`);
    }
  }
}

/**
 * Weighted least squares with weights w (inverse variances up to a common factor). The residual variance is
 * estimated from the data (Σw·r²/(n−2)), as ordinary least squares does. With n = 2 the line is exact and
 * the standard errors and intervals are NaN.
 */
export function weightedLinearRegression(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  weights: ArrayLike<number>,
  level = 0.95,
): LinearRegression {
  checkPairs(x, y, weights, 'weightedLinearRegression');
  checkLevel(level, 'weightedLinearRegression');
  return regressionCore(x, y, weights, level, 'weightedLinearRegression');
}

/** Ordinary least squares line through (x, y); see weightedLinearRegression for the n = 2 case. */
export function linearRegression(x: ArrayLike<number>, y: ArrayLike<number>, level = 0.95): LinearRegression {
  checkPairs(x, y, null, 'linearRegression');
  checkLevel(level, 'linearRegression');
  return regressionCore(x, y, null, level, 'linearRegression');
}

function regressionCore(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  w: ArrayLike<number> | null,
  level: number,
  name: string,
): LinearRegression {
  const n = x.length;
  const wt = (i: number): number => (w ? w[i] : 1);
  let sw = 0, sx = 0, sy = 0;
  for (let i = 0; i < n; i++) { sw += wt(i); sx += wt(i) * x[i]; sy += wt(i) * y[i]; }
  const xBar = sx / sw, yBar = sy / sw;
  // Centred sums: far less cancellation than the raw-moment formulas.
  let sxx = 0, sxy = 0, syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i] - xBar, dy = y[i] - yBar;
    sxx += wt(i) * dx * dx; sxy += wt(i) * dx * dy; syy += wt(i) * dy * dy;
  }
  if (!(sxx > 0)) throw new RangeError(`${name}: all x values are equal, the slope is undefined`);
  const slope = sxy / sxx;
  const intercept = yBar - slope * xBar;
  let rss = 0;
  for (let i = 0; i < n; i++) rss += wt(i) * (y[i] - intercept - slope * x[i]) ** 2;
  const dof = n - 2;
  const s2 = dof > 0 ? rss / dof : NaN;
  const slopeSe = Math.sqrt(s2 / sxx);
  const interceptSe = Math.sqrt(s2 * (1 / sw + (xBar * xBar) / sxx));
  const t = dof > 0 ? tQuantile(0.5 + level / 2, dof) : NaN;
  const r2 = syy > 0 ? 1 - rss / syy : NaN;
  return {
    slope, intercept, slopeSe, interceptSe,
    slopeCi: [slope - t * slopeSe, slope + t * slopeSe],
    interceptCi: [intercept - t * interceptSe, intercept + t * interceptSe],
    r2, residualSd: Math.sqrt(s2), n, dof, level,
  };
}

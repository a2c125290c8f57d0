// Straight-line fits for condition-level dosage inference: ordinary least squares with HC3 standard errors, a
// lack-of-fit F test against the group means, a random-intercept (between-group variance) fit to group means with
// the Knapp–Hartung interval, and York's errors-in-both-variables fit.
import { fUpperP, tTwoSidedP } from './p-values';
import { tQuantile } from './t-distribution';

/** A straight-line slope with its standard error, interval at `level` and t-test against zero. */
export interface SlopeEstimate {
  readonly slope: number;
  readonly intercept: number;
  readonly slopeSe: number;
  readonly interceptSe: number;
  /** Degrees of freedom of the t quantile (NaN for a normal-theory interval). */
  readonly dof: number;
  readonly ciLow: number;
  readonly ciHigh: number;
  /** Two-sided p-value of slope = 0. */
  readonly pSlope: number;
}

function estimate(slope: number, intercept: number, slopeSe: number, interceptSe: number, dof: number, level: number): SlopeEstimate {
  const t = dof > 0 ? tQuantile(0.5 + level / 2, dof) : NaN;
  return {
    slope, intercept, slopeSe, interceptSe, dof,
    ciLow: slope - t * slopeSe, ciHigh: slope + t * slopeSe, pSlope: tTwoSidedP(slope / slopeSe, dof),
  };
}

function checkXy(x: readonly number[], y: readonly number[], name: string, min: number): void {
  if (x.length !== y.length) throw new RangeError(`${name}: x and y differ in length (${x.length} vs ${y.length})`);
  if (x.length < min) throw new RangeError(`${name}: need at least ${min} points, got ${x.length}`);
  if (![...x, ...y].every(Number.isFinite)) throw new RangeError(`${name}: x and y must be finite numbers`);
  if (new Set(x).size < 2) throw new RangeError(`${name}: all x values are equal, the slope is undefined`);
}

/** Weighted centred sums of a line fit: means, Sxx, slope, intercept. */
function weightedLine(x: readonly number[], y: readonly number[], w: readonly number[]) {
  let sw = 0, sx = 0, sy = 0;
  for (let i = 0; i < x.length; i++) { sw += w[i]; sx += w[i] * x[i]; sy += w[i] * y[i]; }
  const xBar = sx / sw, yBar = sy / sw;
  let sxx = 0, sxy = 0;
  for (let i = 0; i < x.length; i++) { sxx += w[i] * (x[i] - xBar) ** 2; sxy += w[i] * (x[i] - xBar) * (y[i] - yBar); }
  const slope = sxy / sxx;
  return { sw, xBar, yBar, sxx, slope, intercept: yBar - slope * xBar };
}

/**
 * Ordinary least squares with heteroscedasticity-consistent HC3 standard errors (MacKinnon & White 1985):
 * Cov = (XᵀX)⁻¹·Xᵀdiag(e_i²/(1 − h_i)²)X·(XᵀX)⁻¹, t with n − 2 degrees of freedom.
 */
export function olsHc3(x: readonly number[], y: readonly number[], level = 0.95): SlopeEstimate {
  checkXy(x, y, 'olsHc3', 3);
  const n = x.length;
  const { sw, xBar, sxx, slope, intercept } = weightedLine(x, y, x.map(() => 1));
  // With centred x, (XᵀX)⁻¹ is diagonal in (1, x − x̄): rows of the estimator are 1/n and (x − x̄)/Sxx.
  let vSlope = 0, vMean = 0, cov = 0;
  for (let i = 0; i < n; i++) {
    const d = x[i] - xBar;
    const h = 1 / sw + (d * d) / sxx;
    const e2 = (y[i] - intercept - slope * x[i]) ** 2 / (1 - h) ** 2;
    vSlope += ((d / sxx) ** 2) * e2;
    vMean += e2 / (n * n);
    cov += (d / sxx / n) * e2;
  }
  const vIntercept = vMean + xBar * xBar * vSlope - 2 * xBar * cov;
  return estimate(slope, intercept, Math.sqrt(vSlope), Math.sqrt(vIntercept), n - 2, level);
}

/** Lack-of-fit F test of a straight line against the group means (replicates at each x). */
export interface LackOfFit {
  readonly f: number;
  readonly df1: number;
  readonly df2: number;
  readonly p: number;
}

/**
 * F = [(RSS_line − SS_pure)/(k − 2)] / [SS_pure/(n − k)] with SS_pure the within-group sum of squares about each
 * group's mean (groups = distinct x); needs k ≥ 3 groups and n > k points (Draper & Smith, Applied Regression
 * Analysis, §2.1; from memory). NaN fields when not computable.
 */
export function lackOfFitTest(x: readonly number[], y: readonly number[]): LackOfFit {
  const groups = new Map<number, number[]>();
  x.forEach((v, i) => { const g = groups.get(v) ?? []; g.push(y[i]); groups.set(v, g); });
  const k = groups.size, n = x.length;
  if (k < 3 || n <= k) return { f: NaN, df1: k - 2, df2: n - k, p: NaN };
  const { slope, intercept } = weightedLine(x, y, x.map(() => 1));
  let rss = 0;
  for (let i = 0; i < n; i++) rss += (y[i] - intercept - slope * x[i]) ** 2;
  let pure = 0;
  for (const g of groups.values()) {
    const m = g.reduce((s, v) => s + v, 0) / g.length;
    for (const v of g) pure += (v - m) ** 2;
  }
  const df1 = k - 2, df2 = n - k;
  const f = pure > 0 ? ((rss - pure) / df1) / (pure / df2) : NaN;
  return { f, df1, df2, p: fUpperP(f, df1, df2) };
}

/** A line through group means with a between-group variance τ² (random intercept per group). */
export interface RandomInterceptLine extends SlopeEstimate {
  /** Between-group variance of the intercept (units of y²), method of moments, ≥ 0. */
  readonly tau2: number;
  /** Cochran's Q of the fixed-effect fit (weights 1/v) and its p-value on k − 2 degrees of freedom. */
  readonly q: number;
  readonly pHeterogeneity: number;
  readonly groups: number;
}

/**
 * Straight line through group means y_j with known sampling variances v_j (SEM²) and a random intercept per group:
 * τ² by the method of moments for meta-regression (DerSimonian & Laird 1986, extended to a covariate; Raudenbush
 * 2009), weights 1/(v_j + τ²), and the Knapp & Hartung (2003) variance, scaled by Σw·r²/(k − 2), with t on k − 2
 * degrees of freedom. Needs k ≥ 3 groups with v_j > 0.
 */
export function randomInterceptLine(x: readonly number[], y: readonly number[], v: readonly number[], level = 0.95): RandomInterceptLine {
  checkXy(x, y, 'randomInterceptLine', 3);
  if (v.length !== x.length || !v.every((e) => e > 0 && Number.isFinite(e))) {
    throw new RangeError('randomInterceptLine: every group needs a positive finite sampling variance');
  }
  const k = x.length;
  const w0 = v.map((e) => 1 / e);
  const fixed = weightedLine(x, y, w0);
  const q = x.reduce((s, xi, i) => s + w0[i] * (y[i] - fixed.intercept - fixed.slope * xi) ** 2, 0);
  // tr(P) = Σw − tr((XᵀWX)⁻¹XᵀW²X) for P = W − WX(XᵀWX)⁻¹XᵀW; with centred x the trace splits into two terms.
  let sw2 = 0, sw2d2 = 0;
  for (let i = 0; i < k; i++) { sw2 += w0[i] * w0[i]; sw2d2 += w0[i] * w0[i] * (x[i] - fixed.xBar) ** 2; }
  const trP = fixed.sw - sw2 / fixed.sw - sw2d2 / fixed.sxx;
  const tau2 = Math.max(0, (q - (k - 2)) / trP);
  const w = v.map((e) => 1 / (e + tau2));
  const line = weightedLine(x, y, w);
  const s2 = x.reduce((s, xi, i) => s + w[i] * (y[i] - line.intercept - line.slope * xi) ** 2, 0) / (k - 2);
  const slopeSe = Math.sqrt(s2 / line.sxx);
  const interceptSe = Math.sqrt(s2 * (1 / line.sw + (line.xBar * line.xBar) / line.sxx));
  return {
    ...estimate(line.slope, line.intercept, slopeSe, interceptSe, k - 2, level),
    // Q ~ χ²(k − 2) under no between-group variance; χ²_d/d is the limit of F(d, m) as m → ∞.
    tau2, q, pHeterogeneity: fUpperP(q / (k - 2), k - 2, 1e9), groups: k,
  };
}

/** York's fit with errors in both variables. */
export interface YorkFit extends SlopeEstimate {
  /** Σ W_i·(y_i − a − b·x_i)² / (n − 2): near 1 when the stated errors explain the scatter. */
  readonly mswd: number;
  readonly iterations: number;
}

/**
 * Straight line with errors in x and y (York 1966; York, Evensen, Martínez, De Basabe Delgado 2004, Am. J. Phys.
 * 72:367, their algorithm with uncorrelated errors): weights wx = 1/σx², wy = 1/σy². Standard errors are the
 * algorithm's (errors taken as known); the interval is normal-theory (dof NaN → z quantile). Deming regression is
 * the case of a constant ratio wx/wy.
 */
export function yorkFit(x: readonly number[], y: readonly number[], wx: readonly number[], wy: readonly number[], level = 0.95): YorkFit {
  checkXy(x, y, 'yorkFit', 3);
  if (wx.length !== x.length || wy.length !== x.length || ![...wx, ...wy].every((e) => e > 0 && Number.isFinite(e))) {
    throw new RangeError('yorkFit: every point needs positive finite weights in x and y');
  }
  const n = x.length;
  let b = weightedLine(x, y, wy).slope;
  let it = 0, W: number[] = [], xBar = 0, yBar = 0, beta: number[] = [];
  for (; it < 200; it++) {
    W = wx.map((a, i) => (a * wy[i]) / (a + b * b * wy[i]));
    const sW = W.reduce((s, e) => s + e, 0);
    xBar = W.reduce((s, e, i) => s + e * x[i], 0) / sW;
    yBar = W.reduce((s, e, i) => s + e * y[i], 0) / sW;
    beta = W.map((e, i) => e * ((x[i] - xBar) / wy[i] + (b * (y[i] - yBar)) / wx[i]));
    let num = 0, den = 0;
    for (let i = 0; i < n; i++) { num += W[i] * beta[i] * (y[i] - yBar); den += W[i] * beta[i] * (x[i] - xBar); }
    const next = num / den;
    const done = Math.abs(next - b) <= 1e-15 * Math.max(1, Math.abs(next));
    b = next;
    if (done) break;
  }
  const a = yBar - b * xBar;
  // Final weights and the adjusted x's at the converged slope (York et al. 2004, steps 5–8).
  W = wx.map((e, i) => (e * wy[i]) / (e + b * b * wy[i]));
  const sW = W.reduce((s, e) => s + e, 0);
  const xAdj = W.map((e, i) => xBar + e * ((x[i] - xBar) / wy[i] + (b * (y[i] - yBar)) / wx[i]));
  const uBar = W.reduce((s, e, i) => s + e * xAdj[i], 0) / sW;
  const suu = W.reduce((s, e, i) => s + e * (xAdj[i] - uBar) ** 2, 0);
  const slopeSe = Math.sqrt(1 / suu);
  const interceptSe = Math.sqrt(1 / sW + uBar * uBar / suu);
  const mswd = W.reduce((s, e, i) => s + e * (y[i] - a - b * x[i]) ** 2, 0) / (n - 2);
  const z = zQuantile(0.5 + level / 2);
  return {
    slope: b, intercept: a, slopeSe, interceptSe, dof: NaN, ciLow: b - z * slopeSe, ciHigh: b + z * slopeSe,
    pSlope: tTwoSidedP(b / slopeSe, 1e9), mswd, iterations: it + 1,
  };
}

/** Standard normal quantile through Student's t with 10⁹ degrees of freedom (agrees to ~1e-9). */
function zQuantile(p: number): number {
  return tQuantile(p, 1e9);
}

// Covariate adjustment of a group-level straight line. The covariates' coefficients are estimated within groups (the
// within, or fixed-effects, estimator: y and every covariate centred on its group's mean, then least squares without
// intercept), which by the Frisch–Waugh–Lovell theorem equals least squares with one dummy per group. Each y is then
// moved to the covariates' overall mean, and the straight line is fitted to the group means of the moved values, one
// observation per group (t on k − 2), as the unadjusted group-means line is. The slope is linear in the coefficients,
// so their estimation error adds d'·Cov(β)·d to the slope's variance (see covariateAdjustedLine).
import { CholeskyDecomposition, Matrix } from 'ml-matrix';
import { linearRegression } from './regression';
import { tTwoSidedP } from './p-values';
import { tQuantile } from './t-distribution';

/** Why a within fit cannot be made: a term with no spread inside any group, terms collinear inside groups, or too
 *  few embryos for the terms (`term` is the index of the offending column, or −1). */
export class WithinFitError extends Error {
  constructor(readonly reason: 'constant' | 'collinear' | 'dof', readonly term: number, message: string) {
    super(message);
  }
}

/** Coefficients of the covariates estimated within groups, with their covariance (s²·(Z̃ᵀZ̃)⁻¹). */
export interface WithinFit {
  readonly beta: readonly number[];
  readonly se: readonly number[];
  readonly cov: readonly (readonly number[])[];
  /** Residual variance of the within fit (units of y squared). */
  readonly s2: number;
  /** n − groups − terms. */
  readonly dof: number;
  readonly groups: number;
}

/** Group keys in first-seen order and each row's group index. */
function groupIndex(group: readonly string[]): { keys: string[]; index: number[] } {
  const keys: string[] = [];
  const at = new Map<string, number>();
  const index = group.map((g) => {
    let i = at.get(g);
    if (i === undefined) { i = keys.length; keys.push(g); at.set(g, i); }
    return i;
  });
  return { keys, index };
}

/** Each column's values minus its group's mean. */
function centreWithin(cols: readonly (readonly number[])[], index: readonly number[], k: number): number[][] {
  return cols.map((c) => {
    const sum = new Array<number>(k).fill(0), cnt = new Array<number>(k).fill(0);
    c.forEach((v, i) => { sum[index[i]] += v; cnt[index[i]] += 1; });
    return c.map((v, i) => v - sum[index[i]] / cnt[index[i]]);
  });
}

/**
 * The within (fixed-effects) estimator: `z` holds one array per covariate term (length n each), `group` each row's
 * group; throws WithinFitError when a term is constant within every group, terms are collinear within groups, or
 * n − groups − terms < 1. Coefficients are in units of y per unit of the term.
 */
export function withinGroupFit(group: readonly string[], z: readonly (readonly number[])[], y: readonly number[]): WithinFit {
  const n = y.length, p = z.length;
  if (z.some((c) => c.length !== n) || group.length !== n) throw new RangeError('withinGroupFit: group, z and y differ in length');
  if (![...y, ...z.flat()].every(Number.isFinite)) throw new RangeError('withinGroupFit: values must be finite numbers');
  const { keys, index } = groupIndex(group);
  const k = keys.length;
  const zt = centreWithin(z, index, k);
  const [yt] = centreWithin([y], index, k);
  for (let t = 0; t < p; t++) {
    const mean = z[t].reduce((s, v) => s + v, 0) / n;
    const total = z[t].reduce((s, v) => s + (v - mean) ** 2, 0);
    const within = zt[t].reduce((s, v) => s + v * v, 0);
    // Within-group spread below 1e-10 of the total (or none at all) is rounding, not information.
    if (!(within > 1e-10 * total) || within === 0) throw new WithinFitError('constant', t, `term ${t} is constant within every group`);
  }
  const dof = n - k - p;
  if (dof < 1) throw new WithinFitError('dof', -1, `${n} rows in ${k} groups leave no degrees of freedom for ${p} terms`);
  const a = new Matrix(p, p), b = new Matrix(p, 1);
  for (let r = 0; r < p; r++) {
    // Upper triangle mirrored: the sums are exactly symmetric (the factorisation checks it to the last bit).
    for (let c = r; c < p; c++) { const v = zt[r].reduce((s, x, i) => s + x * zt[c][i], 0); a.set(r, c, v); a.set(c, r, v); }
    b.set(r, 0, zt[r].reduce((s, v, i) => s + v * yt[i], 0));
  }
  // Scale to unit diagonal before the Cholesky factorisation so the collinearity test does not depend on units.
  const scale = Array.from({ length: p }, (_, t) => 1 / Math.sqrt(a.get(t, t)));
  const as = new Matrix(p, p);
  for (let r = 0; r < p; r++) for (let c = r; c < p; c++) { const v = a.get(r, c) * scale[r] * scale[c]; as.set(r, c, v); as.set(c, r, v); }
  const chol = new CholeskyDecomposition(as);
  const lower = chol.lowerTriangularMatrix;
  const minPivot = Math.min(...Array.from({ length: p }, (_, t) => lower.get(t, t)));
  if (!chol.isPositiveDefinite() || !(minPivot * minPivot > 1e-10)) throw new WithinFitError('collinear', -1, 'the terms are collinear within groups');
  const inv = chol.solve(Matrix.eye(p));
  const beta = Array.from({ length: p }, (_, r) => scale[r] * Array.from({ length: p }, (_, c) => inv.get(r, c) * scale[c] * b.get(c, 0)).reduce((s, v) => s + v, 0));
  let rss = 0;
  for (let i = 0; i < n; i++) {
    let fit = 0;
    for (let t = 0; t < p; t++) fit += zt[t][i] * beta[t];
    rss += (yt[i] - fit) ** 2;
  }
  const s2 = rss / dof;
  const cov = Array.from({ length: p }, (_, r) => Array.from({ length: p }, (_, c) => s2 * inv.get(r, c) * scale[r] * scale[c]));
  return { beta, se: cov.map((row, t) => Math.sqrt(row[t])), cov, s2, dof, groups: k };
}

/** A group-means line after covariate adjustment, beside the coefficients it used. */
export interface AdjustedLine {
  readonly slope: number;
  readonly intercept: number;
  /** SE of the slope with the coefficients' estimation error added (the one the interval uses). */
  readonly slopeSe: number;
  /** SE of the slope from the adjusted means' spread alone (the coefficients taken as known). */
  readonly slopeSeMeansOnly: number;
  readonly dof: number;
  readonly ciLow: number;
  readonly ciHigh: number;
  readonly pSlope: number;
  readonly r2: number;
  readonly within: WithinFit;
  /** The covariate terms' overall means, to which every y was moved. */
  readonly termMeans: readonly number[];
  /** Groups in first-seen order with their x, raw mean of y, adjusted mean of y and n. */
  readonly groupMeans: readonly { readonly group: string; readonly x: number; readonly mean: number; readonly adjustedMean: number; readonly n: number }[];
}

/**
 * Covariate-adjusted straight line of y on a group-level x: β from withinGroupFit, y_i − (z_i − z̄)·β averaged per
 * group, least squares of those means on x (t on k − 2). slope = Σ c_j ȳ_j − dᵀβ with c_j = (x_j − x̄)/Sxx and
 * d = Σ_j c_j (z̄_j − z̄), so Var = SE²(means line) + dᵀ Cov(β) d. Under independent normal errors the within-group
 * deviations that give β are independent of the group means (from memory: the one-way layout's orthogonal split), so
 * the terms add; the residual spread of the adjusted means already carries a little of the second term, so the
 * interval errs on the wide side. Needs ≥ 3 distinct x; throws RangeError or WithinFitError.
 */
export function covariateAdjustedLine(
  group: readonly string[], x: readonly number[], z: readonly (readonly number[])[], y: readonly number[], level = 0.95,
): AdjustedLine {
  const within = withinGroupFit(group, z, y);
  const n = y.length, p = z.length;
  const termMeans = z.map((c) => c.reduce((s, v) => s + v, 0) / n);
  const { keys, index } = groupIndex(group);
  const k = keys.length;
  const gx = new Array<number>(k).fill(NaN), sumY = new Array<number>(k).fill(0), sumA = new Array<number>(k).fill(0), cnt = new Array<number>(k).fill(0);
  const sumZ = z.map(() => new Array<number>(k).fill(0));
  for (let i = 0; i < n; i++) {
    const g = index[i];
    if (Number.isNaN(gx[g])) gx[g] = x[i];
    else if (gx[g] !== x[i]) throw new RangeError(`covariateAdjustedLine: x differs within group "${keys[g]}"`);
    let shift = 0;
    for (let t = 0; t < p; t++) { shift += (z[t][i] - termMeans[t]) * within.beta[t]; sumZ[t][g] += z[t][i]; }
    sumY[g] += y[i]; sumA[g] += y[i] - shift; cnt[g] += 1;
  }
  if (new Set(gx).size < 3) throw new RangeError('covariateAdjustedLine: need at least 3 distinct x');
  const adjusted = sumA.map((s, g) => s / cnt[g]);
  const line = linearRegression(gx, adjusted, level);
  const xBar = gx.reduce((s, v) => s + v, 0) / k;
  const sxx = gx.reduce((s, v) => s + (v - xBar) ** 2, 0);
  const d = z.map((_, t) => gx.reduce((s, xj, g) => s + ((xj - xBar) / sxx) * (sumZ[t][g] / cnt[g] - termMeans[t]), 0));
  let extra = 0;
  for (let r = 0; r < p; r++) for (let c = 0; c < p; c++) extra += d[r] * within.cov[r][c] * d[c];
  const slopeSe = Math.sqrt(line.slopeSe ** 2 + extra);
  const tq = tQuantile(0.5 + level / 2, line.dof);
  return {
    slope: line.slope, intercept: line.intercept, slopeSe, slopeSeMeansOnly: line.slopeSe, dof: line.dof,
    ciLow: line.slope - tq * slopeSe, ciHigh: line.slope + tq * slopeSe, pSlope: tTwoSidedP(line.slope / slopeSe, line.dof), r2: line.r2,
    within, termMeans,
    groupMeans: keys.map((group, g) => ({ group, x: gx[g], mean: sumY[g] / cnt[g], adjustedMean: adjusted[g], n: cnt[g] })),
  };
}

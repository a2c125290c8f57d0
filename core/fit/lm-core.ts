// Levenberg–Marquardt iterations written out here rather than delegated: the library loop stops at coarse
// tolerances (absolute error threshold, absolute finite-difference step, damping clamped to [1e-7, 1e7]) and
// cannot reach the ~10 significant digits that the certified reference problems need. This core solves each
// damped step by QR (full double precision), adapts the damping by the gain ratio, and scales parameters either
// by Jacobian column norms or not at all (some problems only converge from poor starts with unit scaling).
import { householderQr, solveLeastSquares, solveUpperTriangular } from './least-squares-qr';
import type { LeastSquaresProblem } from './problem';
import { modelJacobian, sumOfSquares, weightedResiduals } from './problem';

/** How parameters are scaled inside the damping term. */
export type ParameterScaling = 'column' | 'unit';

/** Outcome of one LM run (no statistics yet). */
export interface LmRun {
  readonly params: number[];
  readonly rss: number;
  readonly iterations: number;
  readonly converged: boolean;
}

/** R (m × m) and the first m entries of Qᵀr from a QR factorisation of J (n × m): all a damped step needs. */
interface ReducedJacobian {
  readonly r: Float64Array;
  readonly qtr: Float64Array;
}

/** Factorises J once per Jacobian, so each trial damping costs only a small (2m × m) factorisation. */
function reduceJacobian(j: Float64Array, r: Float64Array, n: number, m: number): ReducedJacobian {
  const { r: upper, qtb } = householderQr(j, r, n, m);
  return { r: upper, qtr: qtb };
}

/**
 * Solves the damped step min ‖[J; √μ·D] δ − [r; 0]‖ by QR; null when it cannot be solved. With J = Q·R this
 * equals min ‖[R; √μ·D] δ − [(Qᵀr)₁..ₘ; 0]‖ (the rest of Qᵀr does not depend on δ), a 2m × m problem.
 */
function dampedStep(reduced: ReducedJacobian, d: Float64Array, mu: number, m: number): Float64Array | null {
  const a = new Float64Array(2 * m * m);
  a.set(reduced.r);
  const b = new Float64Array(2 * m);
  b.set(reduced.qtr);
  const root = Math.sqrt(mu);
  for (let k = 0; k < m; k++) a[(m + k) * m + k] = root * d[k];
  const { r: upper, qtb } = householderQr(a, b, 2 * m, m);
  return solveUpperTriangular(upper, qtb, m);
}

/** Largest |cos| between the residual vector and a Jacobian column: 0 at an exact stationary point. */
export function gradientCosine(j: Float64Array, r: Float64Array, n: number, m: number): number {
  const rNorm = Math.sqrt(sumOfSquares(r));
  if (rNorm === 0) return 0;
  let worst = 0;
  for (let k = 0; k < m; k++) {
    let dot = 0, col = 0;
    for (let i = 0; i < n; i++) { dot += j[i * m + k] * r[i]; col += j[i * m + k] ** 2; }
    if (col > 0) worst = Math.max(worst, Math.abs(dot) / (Math.sqrt(col) * rNorm));
  }
  return worst;
}

function columnNorms(j: Float64Array, n: number, m: number): Float64Array {
  const out = new Float64Array(m);
  for (let k = 0; k < m; k++) {
    let s = 0;
    for (let i = 0; i < n; i++) s += j[i * m + k] ** 2;
    out[k] = Math.sqrt(s);
  }
  return out;
}

function weightedNorm(d: Float64Array, v: ArrayLike<number>): number {
  let s = 0;
  for (let k = 0; k < d.length; k++) s += (d[k] * v[k]) ** 2;
  return Math.sqrt(s);
}

/** A tried step: the trial point, its residuals and sum of squares, and the gain ratio ρ (≤ 0 = reject). */
interface Trial {
  readonly delta: Float64Array;
  readonly params: number[];
  readonly r: Float64Array;
  readonly rss: number;
  readonly predicted: number;
  readonly rho: number;
}

/** Mutable state of one LM run. */
interface LmState {
  p: number[];
  r: Float64Array;
  rss: number;
  j: Float64Array;
  /** QR of j, made on the first trial after j changes. */
  reduced: ReducedJacobian | null;
  /** Jᵀr at the current point. */
  g: Float64Array | null;
  readonly d: Float64Array;
  mu: number;
  nu: number;
}

/** Solves the damped step and evaluates it; null when the step cannot be solved. */
function tryStep(problem: LeastSquaresProblem, s: LmState, n: number, m: number): Trial | null {
  s.reduced ??= reduceJacobian(s.j, s.r, n, m);
  const delta = dampedStep(s.reduced, s.d, s.mu, m);
  if (!delta) return null;
  const params = s.p.map((v, k) => v + delta[k]);
  const r = weightedResiduals(problem, params);
  const rss = sumOfSquares(r);
  // Predicted decrease of the linear model: δᵀ(μD²δ + Jᵀr) (exact identity for the damped normal equations).
  const g = (s.g ??= jtr(s.j, s.r, n, m));
  const predicted = delta.reduce((acc, v, k) => acc + v * (g[k] + s.mu * s.d[k] * s.d[k] * v), 0);
  const rho = Number.isFinite(rss) && predicted > 0 ? (s.rss - rss) / predicted : -1;
  return { delta, params, r, rss, predicted, rho };
}

/** Takes an accepted step, updates scaling and damping; true when the run has converged. */
function acceptStep(problem: LeastSquaresProblem, s: LmState, t: Trial, scaling: ParameterScaling, n: number, m: number): boolean {
  const stepSize = weightedNorm(s.d, t.delta), size = weightedNorm(s.d, s.p);
  const relativeDecrease = (s.rss - t.rss) / s.rss;
  s.p = t.params; s.r = t.r; s.rss = t.rss;
  s.j = modelJacobian(problem, s.p);
  s.reduced = null;
  s.g = null;
  if (scaling === 'column') columnNorms(s.j, n, m).forEach((v, k) => { s.d[k] = Math.max(s.d[k], v); });
  s.mu *= Math.max(1 / 3, 1 - (2 * t.rho - 1) ** 3);
  s.nu = 2;
  // Converged when the step is at rounding level or the sum of squares stops moving in its last digits.
  return stepSize <= 1e-13 * (size + 1e-300) || (relativeDecrease <= 1e-15 && t.predicted / s.rss <= 1e-15);
}

/** Initial state: scaling D (column norms or ones) and damping μ = 1e-3 × largest scaled diagonal of JᵀJ. */
function initialState(problem: LeastSquaresProblem, p: number[], r: Float64Array, rss: number, scaling: ParameterScaling): LmState {
  const n = problem.x.length, m = p.length;
  const j = modelJacobian(problem, p);
  const norms = columnNorms(j, n, m);
  const d = scaling === 'unit' ? new Float64Array(m).fill(1) : norms.map((v) => v || 1);
  let mu = 1e-3 * Math.max(...norms.map((v, k) => (v / d[k]) ** 2));
  if (!(mu > 0) || !Number.isFinite(mu)) mu = 1e-3;
  return { p, r, rss, j, reduced: null, g: null, d, mu, nu: 2 };
}

/** Runs LM from `start`; never throws for numeric trouble (NaN trial points are treated as rejected steps). */
export function runLevenbergMarquardt(
  problem: LeastSquaresProblem, start: readonly number[], scaling: ParameterScaling, maxIterations: number,
): LmRun {
  const n = problem.x.length, m = start.length;
  const p = start.slice();
  const r = weightedResiduals(problem, p);
  const rss = sumOfSquares(r);
  if (!Number.isFinite(rss)) return { params: p, rss, iterations: 0, converged: false };
  const s = initialState(problem, p, r, rss, scaling);
  const muLimit = s.mu * 1e40;
  for (let it = 1; it <= maxIterations; it++) {
    if (s.rss === 0 || gradientCosine(s.j, s.r, n, m) <= 1e-14) return { params: s.p, rss: s.rss, iterations: it - 1, converged: true };
    const trial = tryStep(problem, s, n, m);
    if (trial && trial.rho > 0) {
      if (acceptStep(problem, s, trial, scaling, n, m)) return { params: s.p, rss: s.rss, iterations: it, converged: true };
      continue;
    }
    s.mu *= s.nu;
    s.nu *= 2;
    // No representable improvement is left: converged if (nearly) stationary, else stuck.
    if (!(s.mu <= muLimit)) {
      return { params: s.p, rss: s.rss, iterations: it, converged: gradientCosine(s.j, s.r, n, m) <= 1e-6 };
    }
  }
  return { params: s.p, rss: s.rss, iterations: maxIterations, converged: false };
}

function jtr(j: Float64Array, r: Float64Array, n: number, m: number): Float64Array {
  const out = new Float64Array(m);
  for (let i = 0; i < n; i++) for (let k = 0; k < m; k++) out[k] += j[i * m + k] * r[i];
  return out;
}

/**
 * Undamped Gauss–Newton steps after LM has converged: LM's damping shrinks each step, so it can stop a few
 * digits short on well-conditioned problems; full steps finish the job. Near the optimum the sum of squares
 * cannot tell the points apart (its change is below rounding), so a step is kept when the sum of squares does
 * not grow beyond rounding and the gradient (cosine measure) does not get worse.
 */
export function polishGaussNewton(problem: LeastSquaresProblem, run: LmRun, maxSteps = 10): LmRun {
  const n = problem.x.length, m = run.params.length;
  let p = run.params.slice(), rss = run.rss, steps = 0;
  let j = modelJacobian(problem, p), r = weightedResiduals(problem, p);
  let cosine = gradientCosine(j, r, n, m);
  for (; steps < maxSteps && cosine > 0; steps++) {
    const delta = solveLeastSquares(j, r, n, m);
    if (!delta) break;
    const trial = p.map((v, k) => v + delta[k]);
    const trialR = weightedResiduals(problem, trial);
    const trialRss = sumOfSquares(trialR);
    if (!(trialRss <= rss * (1 + 1e-12))) break;
    const trialJ = modelJacobian(problem, trial);
    const trialCosine = gradientCosine(trialJ, trialR, n, m);
    if (!(trialCosine <= cosine)) break;
    const relativeStep = Math.max(...delta.map((v, k) => Math.abs(v) / (Math.abs(p[k]) || 1)));
    p = trial; r = trialR; j = trialJ; rss = trialRss; cosine = trialCosine;
    if (relativeStep <= 1e-15) break;
  }
  return { ...run, params: p, rss, iterations: run.iterations + steps };
}

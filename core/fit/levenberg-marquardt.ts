// General nonlinear least squares: ml-levenberg-marquardt for a first pass, then our own LM runs (see lm-core)
// from several starts and scalings to full double precision, and the statistics at the solution.
import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { inverseNormalMatrix } from './covariance';
import { FitError } from './fit-error';
import type { LmRun } from './lm-core';
import { polishGaussNewton, runLevenbergMarquardt } from './lm-core';
import type { NonlinearOptions } from './nonlinear-options';
import { checkNonlinearInput } from './nonlinear-options';
import type { LeastSquaresProblem, ModelFunction } from './problem';
import { modelJacobian, sumOfSquares, weightedResiduals } from './problem';

/** Result of a nonlinear least-squares fit (units those of the parameters and of y). */
export interface NonlinearFit {
  readonly params: number[];
  /** Standard errors √diag(covariance). */
  readonly se: number[];
  /** s²·(JᵀWJ)⁻¹ with s² = rss/dof. */
  readonly covariance: number[][];
  /** Weighted residual sum of squares Σ w·(y − f)². */
  readonly rss: number;
  /** n − p. */
  readonly dof: number;
  /** √(rss/dof). */
  readonly residualSd: number;
  /** LM iterations of the run that gave the result (library pass included when it was the start). */
  readonly iterations: number;
  /** 1 − rss / Σ w·(y − ȳ_w)². */
  readonly r2: number;
}

/** A first pass with the library, with relative finite-difference steps; null if it fails or does not help. */
function libraryPass(problem: LeastSquaresProblem, initial: number[], initialRss: number): LmRun | null {
  try {
    const result = levenbergMarquardt(
      { x: problem.x, y: problem.y },
      problem.model,
      {
        initialValues: initial,
        weights: Array.from(problem.sqrtW, (s) => 1 / s),
        gradientDifference: initial.map((p) => 1e-6 * (p === 0 ? 1 : Math.abs(p))),
        centralDifference: true,
        maxIterations: 100,
        errorTolerance: 0,
        ...(problem.jacobian ? { jacobianFunction: problem.jacobian } : {}),
      },
    );
    const params = result.parameterValues;
    if (!params.every(Number.isFinite)) return null;
    const rss = sumOfSquares(weightedResiduals(problem, params));
    return rss < initialRss ? { params, rss, iterations: result.iterations, converged: false } : null;
  } catch {
    return null;
  }
}

/** One column-scaled LM run plus polishing; null when it does not converge. */
function singleRun(problem: LeastSquaresProblem, initial: number[], maxIterations: number): LmRun | null {
  const run = runLevenbergMarquardt(problem, initial, 'column', maxIterations);
  return run.converged && Number.isFinite(run.rss) ? polishGaussNewton(problem, run) : null;
}

/** Distance between parameter vectors, each coordinate relative to the start's magnitude. */
function relativeDistance(a: readonly number[], start: readonly number[]): number {
  return Math.hypot(...a.map((v, k) => (v - start[k]) / (Math.abs(start[k]) || 1)));
}

/**
 * Best converged run over starts {initial, library result} × scalings {column, unit}, by RSS. Runs whose RSS ties
 * the best (relative 1e-9) count as the same minimum; of those the one nearest the start wins, so a model with a
 * symmetry (e.g. (b1, b2) → (−b1, −b2)) returns the branch the user started on.
 */
function bestRun(problem: LeastSquaresProblem, initial: number[], initialRss: number, maxIterations: number): LmRun | null {
  const starts: { params: number[]; iterations: number }[] = [{ params: initial, iterations: 0 }];
  const library = libraryPass(problem, initial, initialRss);
  if (library) starts.push({ params: library.params, iterations: library.iterations });
  const runs: LmRun[] = [];
  for (const start of starts) {
    for (const scaling of ['column', 'unit'] as const) {
      const run = runLevenbergMarquardt(problem, start.params, scaling, maxIterations);
      if (run.converged && Number.isFinite(run.rss)) {
        runs.push({ ...polishGaussNewton(problem, run), iterations: run.iterations + start.iterations });
      }
    }
  }
  if (runs.length === 0) return null;
  const lowest = Math.min(...runs.map((r) => r.rss));
  const ties = runs.filter((r) => r.rss <= lowest * (1 + 1e-9) + 1e-300);
  ties.sort((a, b) => relativeDistance(a.params, initial) - relativeDistance(b.params, initial));
  return ties[0];
}

function weightedTotalSumOfSquares(y: Float64Array, w: Float64Array): number {
  let sw = 0, swy = 0;
  for (let i = 0; i < y.length; i++) { sw += w[i]; swy += w[i] * y[i]; }
  const yBar = swy / sw;
  let tss = 0;
  for (let i = 0; i < y.length; i++) tss += w[i] * (y[i] - yBar) ** 2;
  return tss;
}

/**
 * Fits y ≈ model(params)(x) by weighted least squares starting from `initial`. Throws FitError: 'bad-input'
 * (data/options), 'nan' (model not finite at the start, or statistics not finite), 'not-converged'.
 */
export function fitNonlinear(
  x: Float64Array, y: Float64Array, model: ModelFunction, initial: number[], options: NonlinearOptions = {},
): NonlinearFit {
  const checked = checkNonlinearInput(x, y, initial, options);
  const problem: LeastSquaresProblem = {
    x, y, model, jacobian: checked.jacobian, sqrtW: checked.weights.map(Math.sqrt),
  };
  const initialRss = sumOfSquares(weightedResiduals(problem, initial.slice()));
  if (!Number.isFinite(initialRss)) {
    throw new FitError('nan', 'fitNonlinear: the model gives NaN or Infinity at the starting parameters');
  }
  const single = checked.restarts ? null : singleRun(problem, initial.slice(), checked.maxIterations);
  const run = single ?? (checked.restarts || checked.fallback ? bestRun(problem, initial.slice(), initialRss, checked.maxIterations) : null);
  if (!run) {
    throw new FitError('not-converged', `fitNonlinear: no convergence within ${checked.maxIterations} iterations`);
  }
  return fitStatistics(problem, run, checked.weights);
}

/** Standard errors, covariance, R² at the solution of `run`. */
function fitStatistics(problem: LeastSquaresProblem, run: LmRun, weights: Float64Array): NonlinearFit {
  const n = problem.x.length, m = run.params.length;
  const dof = n - m;
  const j = modelJacobian(problem, run.params);
  const inverse = inverseNormalMatrix(j, n, m);
  if (!inverse) {
    throw new FitError('nan', 'fitNonlinear: the parameters are not identifiable from these data (singular Jacobian)');
  }
  const s2 = run.rss / dof;
  const covariance = inverse.map((row) => row.map((v) => v * s2));
  const se = covariance.map((row, k) => Math.sqrt(row[k]));
  if (!se.every(Number.isFinite) || !run.params.every(Number.isFinite)) {
    throw new FitError('nan', 'fitNonlinear: the fit produced NaN or Infinity in the parameters or their errors');
  }
  const tss = weightedTotalSumOfSquares(problem.y, weights);
  return {
    params: run.params.slice(), se, covariance, rss: run.rss, dof,
    residualSd: Math.sqrt(s2), iterations: run.iterations, r2: tss > 0 ? 1 - run.rss / tss : NaN,
  };
}

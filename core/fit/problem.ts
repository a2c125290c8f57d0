// A weighted least-squares problem: residuals and Jacobian of √w·(y − f(x; p)).

/** The model: given parameters, returns y as a function of x. */
export type ModelFunction = (params: number[]) => (x: number) => number;

/** Optional analytic Jacobian: given parameters, returns ∂f/∂p_j at x for every parameter. */
export type JacobianFunction = (params: number[]) => (x: number) => number[];

/** Everything the solver needs; sqrtW holds √weight per point (all ones when unweighted). */
export interface LeastSquaresProblem {
  readonly x: Float64Array;
  readonly y: Float64Array;
  readonly sqrtW: Float64Array;
  readonly model: ModelFunction;
  readonly jacobian: JacobianFunction | null;
}

/** Weighted residuals √w·(y − f); entries are NaN when the model is not finite there. */
export function weightedResiduals(problem: LeastSquaresProblem, params: number[]): Float64Array {
  const f = problem.model(params);
  const out = new Float64Array(problem.x.length);
  for (let i = 0; i < out.length; i++) out[i] = problem.sqrtW[i] * (problem.y[i] - f(problem.x[i]));
  return out;
}

/** Sum of squares; NaN as soon as one entry is not finite. */
export function sumOfSquares(values: Float64Array): number {
  let s = 0;
  for (let i = 0; i < values.length; i++) {
    if (!Number.isFinite(values[i])) return NaN;
    s += values[i] * values[i];
  }
  return s;
}

/**
 * Jacobian of the weighted model √w·∂f/∂p (rows = points, row-major). Analytic when the problem has one, else
 * central differences with a relative step h = ε^(1/3)·|p| (ε^(1/3) when p = 0), error ~ε^(2/3) relative.
 */
export function modelJacobian(problem: LeastSquaresProblem, params: number[]): Float64Array {
  const n = problem.x.length, m = params.length;
  const out = new Float64Array(n * m);
  if (problem.jacobian) {
    const g = problem.jacobian(params);
    for (let i = 0; i < n; i++) {
      const row = g(problem.x[i]);
      for (let j = 0; j < m; j++) out[i * m + j] = problem.sqrtW[i] * row[j];
    }
    return out;
  }
  for (let j = 0; j < m; j++) {
    const h = 6.0554544523933395e-6 * (params[j] === 0 ? 1 : Math.abs(params[j]));
    const up = params.slice(), down = params.slice();
    up[j] += h;
    down[j] -= h;
    const span = up[j] - down[j]; // the step actually representable in floating point
    const fUp = problem.model(up), fDown = problem.model(down);
    for (let i = 0; i < n; i++) {
      out[i * m + j] = (problem.sqrtW[i] * (fUp(problem.x[i]) - fDown(problem.x[i]))) / span;
    }
  }
  return out;
}

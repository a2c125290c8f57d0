// Options of fitNonlinear and their checks (exact messages pinned by tests).
import { FitError } from './fit-error';
import type { JacobianFunction } from './problem';

/** Options of fitNonlinear. */
export interface NonlinearOptions {
  /** Analytic ∂f/∂p; central differences are used when absent. */
  readonly jacobian?: JacobianFunction;
  /** Weight per point (e.g. 1/σ²), all > 0; default all 1. */
  readonly weights?: Float64Array;
  /** Iteration limit of each LM run. @default 500 */
  readonly maxIterations?: number;
  /**
   * true: library pass plus LM runs from every start × scaling, best kept (robust on hard problems, ~10× the
   * work). false: one column-scaled LM run from `initial`, falling back to the thorough search only if it fails;
   * for callers that already have a good start. @default true
   */
  readonly restarts?: boolean;
  /**
   * With restarts false: whether a failed single run falls back to the thorough search (true) or throws
   * FitError('not-converged') at once (false; for callers with their own fallback). @default true
   */
  readonly fallback?: boolean;
}

/** Options with defaults filled in. */
export interface CheckedNonlinearOptions {
  readonly jacobian: JacobianFunction | null;
  readonly weights: Float64Array;
  readonly maxIterations: number;
  readonly restarts: boolean;
  readonly fallback: boolean;
}

function bad(message: string): FitError {
  return new FitError('bad-input', `fitNonlinear: ${message}`);
}

function checkFinite(values: ArrayLike<number>, name: string): void {
  for (let i = 0; i < values.length; i++) {
    if (!Number.isFinite(values[i])) throw bad(`${name}[${i}] is not a finite number`);
  }
}

/** Validates data, starting values and options; throws FitError('bad-input') with an exact message. */
export function checkNonlinearInput(
  x: Float64Array, y: Float64Array, initial: readonly number[], options: NonlinearOptions,
): CheckedNonlinearOptions {
  if (x.length !== y.length) throw bad(`x and y differ in length (${x.length} vs ${y.length})`);
  if (initial.length === 0) throw bad('initial must hold at least one parameter');
  if (x.length <= initial.length) {
    throw bad(`need more data points (${x.length}) than parameters (${initial.length})`);
  }
  checkFinite(x, 'x');
  checkFinite(y, 'y');
  checkFinite(initial, 'initial');
  const maxIterations = options.maxIterations ?? 500;
  if (!Number.isInteger(maxIterations) || maxIterations < 1) {
    throw bad(`maxIterations must be a positive integer, got ${maxIterations}`);
  }
  const weights = options.weights ?? new Float64Array(x.length).fill(1);
  if (weights.length !== x.length) throw bad(`weights and x differ in length (${weights.length} vs ${x.length})`);
  for (let i = 0; i < weights.length; i++) {
    if (!(weights[i] > 0 && Number.isFinite(weights[i]))) throw bad(`weights[${i}] must be a positive finite number`);
  }
  return {
    jacobian: options.jacobian ?? null, weights, maxIterations,
    restarts: options.restarts ?? true, fallback: options.fallback ?? true,
  };
}

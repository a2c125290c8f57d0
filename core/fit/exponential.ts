// The gradient fit: y = A·exp(−x/λ) + B over the points whose x/EL lies in a chosen range.
// x is in µm from the anterior pole. A negative λ is reported as such: it means the profile RISES towards the
// posterior over the fit range (a gradient from the other end); the caller decides whether to warn.
import type { ExponentialFit } from '../model';
import { tQuantile } from '../stats';
import { exponentialStart } from './exponential-start';
import { FitError } from './fit-error';
import { fitNonlinear } from './levenberg-marquardt';
import type { SerialCovariance } from './serial-covariance';
import { ar1Covariance } from './serial-covariance';

/** Options of fitExponentialDecay; xEl (x/EL per point) selects the points, weights (e.g. 1/σ²) are optional. */
export interface ExponentialOptions {
  readonly eggLengthUm: number;
  readonly fitRangeEl: readonly [number, number];
  readonly xEl: Float64Array;
  readonly weights?: Float64Array;
}

const NAME = 'fitExponentialDecay';

function bad(message: string): FitError {
  return new FitError('bad-input', `${NAME}: ${message}`);
}

/** Validates the options and returns the indices of the points inside the fit range (inclusive). */
function selectPoints(xUm: Float64Array, y: Float64Array, options: ExponentialOptions): number[] {
  const { eggLengthUm, fitRangeEl, xEl, weights } = options;
  if (xUm.length !== y.length || xEl.length !== y.length) {
    throw bad(`xUm, xEl and y differ in length (${xUm.length}, ${xEl.length}, ${y.length})`);
  }
  if (!(eggLengthUm > 0 && Number.isFinite(eggLengthUm))) throw bad(`eggLengthUm must be a positive number, got ${eggLengthUm}`);
  const [start, end] = fitRangeEl ?? [NaN, NaN];
  if (!(Number.isFinite(start) && Number.isFinite(end) && start < end)) {
    throw bad(`fitRangeEl must be [start, end] with start < end, got [${fitRangeEl?.join(', ')}]`);
  }
  if (weights && weights.length !== y.length) throw bad(`weights and y differ in length (${weights.length} vs ${y.length})`);
  const used: number[] = [];
  for (let i = 0; i < y.length; i++) {
    if (!(xEl[i] >= start && xEl[i] <= end)) continue;
    if (!Number.isFinite(y[i]) || !Number.isFinite(xUm[i])) {
      throw bad(`point ${i} (x/EL ${xEl[i]}) is NaN or Infinity inside the fit range`);
    }
    if (weights && !(weights[i] > 0 && Number.isFinite(weights[i]))) throw bad(`weights[${i}] must be a positive finite number`);
    used.push(i);
  }
  if (used.length < 4) throw bad(`only ${used.length} points in the fit range [${start}, ${end}] x/EL; need at least 4`);
  return used;
}

/** Covariance of g(p) from that of p by the delta method: G·C·Gᵀ. */
function transformCovariance(g: number[][], c: number[][]): number[][] {
  const gc = g.map((row) => c[0].map((_, j) => row.reduce((s, v, k) => s + v * c[k][j], 0)));
  return gc.map((row) => g.map((gRow) => row.reduce((s, v, k) => s + v * gRow[k], 0)));
}

/** A fit with the weights it gave its points (in fit.xEl order; null = unweighted). */
export interface WeightedExponentialFit {
  readonly fit: ExponentialFit;
  readonly weights: Float64Array | null;
}

/**
 * Fits A·exp(−x/λ) + B to (xUm, y) restricted to points with xEl in fitRangeEl (inclusive). Returns λ in µm and
 * EL (λ/eggLengthUm) with standard errors from the Jacobian and a 95% t interval. Throws FitError.
 */
export function fitExponentialDecay(xUm: Float64Array, y: Float64Array, options: ExponentialOptions): ExponentialFit {
  return fitExponentialDecayWeighted(xUm, y, options).fit;
}

/** fitExponentialDecay, returning also the weights of the points it used (options.weights at those points). */
export function fitExponentialDecayWeighted(xUm: Float64Array, y: Float64Array, options: ExponentialOptions): WeightedExponentialFit {
  const used = selectPoints(xUm, y, options);
  const x = Float64Array.from(used, (i) => xUm[i]);
  const yy = Float64Array.from(used, (i) => y[i]);
  const w = options.weights ? Float64Array.from(used, (i) => options.weights![i]) : undefined;
  // Amplitude is fitted at the mean x of the range (A0), far better conditioned than at x = 0.
  const xRef = x.reduce((s, v) => s + v, 0) / x.length;
  if (yy.every((v) => v === yy[0])) throw bad('the profile is constant in the fit range');
  const start = exponentialStart(x, yy, w ? w.map(Math.sqrt) : new Float64Array(x.length).fill(1), xRef);
  if (!start) throw bad(`the points in the fit range span no distance in x`);
  const fit = runFit(x, yy, w, xRef, [start.a0, start.k, start.b]);
  const [a0, k, b] = fit.params;
  const lambdaUm = 1 / k;
  if (!Number.isFinite(lambdaUm) || Math.abs(lambdaUm) > 1000 * options.eggLengthUm) {
    throw new FitError('not-converged', `${NAME}: no decay in the fit range (the profile is flat)`);
  }
  // A "decay" over less than two point spacings is one or two points fitted by an exponential (noise or an
  // edge artefact), not a gradient; report it rather than a meaningless λ.
  const spacingUm = Math.abs(x[x.length - 1] - x[0]) / (x.length - 1);
  if (Math.abs(lambdaUm) < 2 * spacingUm) {
    throw new FitError('not-converged',
      `${NAME}: the decay length (${lambdaUm.toPrecision(3)} µm) is shorter than two point spacings; no gradient resolved in the fit range`);
  }
  const growth = Math.exp(k * xRef);
  const g = [[growth, a0 * xRef * growth, 0], [0, -1 / (k * k), 0], [0, 0, 1]];
  const modelCov = transformCovariance(g, fit.covariance);
  const serial = serialCovariance(x, yy, w, xRef, fit.params);
  const serialCov = serial ? transformCovariance(g, serial.covariance) : null;
  const lambdaSeModelUm = Math.sqrt(modelCov[1][1]);
  const lambdaSeSerialUm = serialCov ? Math.sqrt(serialCov[1][1]) : NaN;
  // The wider of the two is used: the serial estimate is itself noisy, and where the residuals alternate in sign
  // (negative lag-1 correlation) it is narrower than the model-based one, which is then the cautious choice.
  const useSerial = serialCov !== null && lambdaSeSerialUm > lambdaSeModelUm;
  const cov = useSerial ? serialCov : modelCov;
  const lambdaSeUm = Math.sqrt(cov[1][1]);
  // Positively correlated residuals carry fewer independent pieces of information about σ² than there are
  // points: the t quantile then uses the effective number n·(1 − ρ)/(1 + ρ) (common practice for AR(1) series).
  const t = tQuantile(0.975, serial ? effectiveDof(x.length, serial.rho, 3) : fit.dof);
  const model = (v: number): number => a0 * Math.exp(-k * (v - xRef)) + b;
  const result: ExponentialFit = {
    amplitude: a0 * growth, amplitudeSe: Math.sqrt(cov[0][0]),
    lambdaUm, lambdaSeUm, lambdaCiLowUm: lambdaUm - t * lambdaSeUm, lambdaCiHighUm: lambdaUm + t * lambdaSeUm,
    lambdaEl: lambdaUm / options.eggLengthUm, lambdaSeEl: lambdaSeUm / options.eggLengthUm,
    lambdaSeModelUm, lambdaSeSerialUm, lambdaSeSource: useSerial ? 'serial' : 'model',
    residualLag1: serial ? serial.residualLag1 : NaN, weighted: w !== undefined,
    background: b, backgroundSe: Math.sqrt(cov[2][2]),
    r2: fit.r2, rss: fit.rss, dof: fit.dof, iterations: fit.iterations,
    fitRangeEl: [options.fitRangeEl[0], options.fitRangeEl[1]],
    xEl: Float64Array.from(used, (i) => options.xEl[i]),
    residuals: yy.map((v, i) => v - model(x[i])),
  };
  return { fit: result, weights: w ?? null };
}

/** Degrees of freedom n·(1 − ρ)/(1 + ρ) − p for ρ > 0 (n − p otherwise), at least 1. */
export function effectiveDof(n: number, rho: number, p: number): number {
  const nEff = rho > 0 ? (n * (1 - rho)) / (1 + rho) : n;
  return Math.max(1, nEff - p);
}

/**
 * The whitened Jacobian of A0·e^(−k(x − xRef)) + B in (A0, k, B) at the given A0 and k: n × 3, row-major, row i scaled
 * by √w_i (weights absent or null = unweighted).
 */
export function whitenedDecayJacobian(x: Float64Array, w: Float64Array | null | undefined, xRef: number, a0: number, k: number): Float64Array {
  const n = x.length;
  const j = new Float64Array(n * 3);
  for (let i = 0; i < n; i++) {
    const sw = w ? Math.sqrt(w[i]) : 1;
    const e = Math.exp(-k * (x[i] - xRef));
    j[3 * i] = sw * e; j[3 * i + 1] = -sw * a0 * (x[i] - xRef) * e; j[3 * i + 2] = sw;
  }
  return j;
}

/** AR(1) sandwich covariance of (A0, k, B) on the whitened problem, points in x order; null if not computable. */
function serialCovariance(x: Float64Array, y: Float64Array, w: Float64Array | undefined, xRef: number, params: number[]): SerialCovariance | null {
  const [a0, k, b] = params;
  const n = x.length;
  const j = whitenedDecayJacobian(x, w, xRef, a0, k);
  const u = Float64Array.from(y, (yi, i) => (w ? Math.sqrt(w[i]) : 1) * (yi - a0 * Math.exp(-k * (x[i] - xRef)) - b));
  return ar1Covariance(j, u, n, 3);
}

/** The LM refinement with an analytic Jacobian; FitErrors are re-labelled with this function's name. */
function runFit(x: Float64Array, y: Float64Array, w: Float64Array | undefined, xRef: number, initial: number[]) {
  try {
    return fitNonlinear(x, y, ([a0, k, b]) => (v) => a0 * Math.exp(-k * (v - xRef)) + b, initial, {
      jacobian: ([a0, k]) => (v) => {
        const e = Math.exp(-k * (v - xRef));
        return [e, -a0 * (v - xRef) * e, 1];
      },
      ...(w ? { weights: w } : {}),
      // The variable-projection start is already close; the thorough search runs only if this fails.
      restarts: false,
    });
  } catch (e) {
    if (e instanceof FitError) throw new FitError(e.code, e.message.replace(/^fitNonlinear: /, `${NAME}: `));
    throw e;
  }
}

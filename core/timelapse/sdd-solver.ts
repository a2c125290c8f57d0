// Numerical solution of the synthesis–diffusion–degradation (SDD) equation on a line segment:
//   ∂C/∂t = D ∂²C/∂x² − k·C on 0 ≤ x ≤ L, C(x, 0) = 0,
//   −D ∂C/∂x = j at x = 0 (a constant flux source at the anterior pole from t = 0), ∂C/∂x = 0 at x = L (reflecting).
// Second-order finite differences in x (ghost nodes for both boundary conditions) and Crank–Nicolson in time
// (Crank & Nicolson 1947), started with implicit Euler half-steps (Rannacher 1984) so the switch-on of the source
// does not ring. Trapezoid weights make the discrete total amount obey dM/dt = j − k·M exactly, as the equation does.

/** The SDD model: diffusion coefficient (µm²/s), degradation rate (1/s), source flux (concentration·µm/s), length (µm). */
export interface SddModel {
  readonly diffusionUm2PerS: number;
  readonly degradationPerS: number;
  readonly sourceFlux: number;
  readonly lengthUm: number;
}

/** Grid of the solver: nodes along x (including both ends) and the largest time step (s). */
export interface SddGrid {
  readonly nodes: number;
  readonly maxStepS: number;
}

/** C(x, t) on the grid: xUm[i] and concentration[t][i] at each requested time. */
export interface SddSolution {
  readonly xUm: Float64Array;
  readonly timesS: Float64Array;
  readonly concentration: readonly Float64Array[];
}

/** λ = √(D/k), the steady-state decay length in µm. */
export function sddLambdaUm(model: SddModel): number {
  return Math.sqrt(model.diffusionUm2PerS / model.degradationPerS);
}

/** Exact steady state of the SDD model on [0, L] with a reflecting far end: (jλ/D)·cosh((L−x)/λ)/sinh(L/λ). */
export function sddSteadyState(model: SddModel, xUm: number): number {
  const lambdaUm = sddLambdaUm(model);
  const { lengthUm: L, sourceFlux: j, diffusionUm2PerS: d } = model;
  // cosh((L−x)/λ)/sinh(L/λ) written with decaying exponentials so long domains do not overflow.
  const a = Math.exp(-xUm / lambdaUm), b = Math.exp(-(2 * L - xUm) / lambdaUm), c = Math.exp(-2 * L / lambdaUm);
  return ((j * lambdaUm) / d) * (a + b) / (1 - c);
}

/** Default grid: 20 nodes per λ (at least 50 in all) and a step of 1/200 of the degradation time 1/k. */
export function defaultSddGrid(model: SddModel): SddGrid {
  const lambdaUm = sddLambdaUm(model);
  return { nodes: Math.max(50, Math.ceil((20 * model.lengthUm) / lambdaUm) + 1), maxStepS: 0.005 / model.degradationPerS };
}

function checkModel(model: SddModel, grid: SddGrid, timesS: ArrayLike<number>): void {
  const positive = ['diffusionUm2PerS', 'degradationPerS', 'lengthUm'] as const;
  for (const key of positive) {
    if (!(model[key] > 0 && Number.isFinite(model[key]))) throw new RangeError(`solveSdd: ${key} must be a positive number, got ${model[key]}`);
  }
  if (!Number.isFinite(model.sourceFlux)) throw new RangeError(`solveSdd: sourceFlux must be a finite number, got ${model.sourceFlux}`);
  if (!(Number.isInteger(grid.nodes) && grid.nodes >= 3)) throw new RangeError(`solveSdd: nodes must be an integer ≥ 3, got ${grid.nodes}`);
  if (!(grid.maxStepS > 0 && Number.isFinite(grid.maxStepS))) throw new RangeError(`solveSdd: maxStepS must be a positive number, got ${grid.maxStepS}`);
  let previous = 0;
  for (let i = 0; i < timesS.length; i++) {
    if (!(Number.isFinite(timesS[i]) && timesS[i] >= previous)) {
      throw new RangeError(`solveSdd: times must be finite, ≥ 0 and non-decreasing (time ${i} is ${timesS[i]})`);
    }
    previous = timesS[i];
  }
}

/** Tridiagonal operator A of dC/dt = A·C + b: sub-, main and super-diagonal, and the source vector's first entry. */
interface Operator { readonly lower: Float64Array; readonly main: Float64Array; readonly upper: Float64Array; readonly source0: number }

function buildOperator(model: SddModel, n: number): Operator {
  const h = model.lengthUm / (n - 1);
  const r = model.diffusionUm2PerS / (h * h);
  const k = model.degradationPerS;
  const lower = new Float64Array(n).fill(r), main = new Float64Array(n).fill(-2 * r - k), upper = new Float64Array(n).fill(r);
  // Ghost nodes: C₋₁ = C₁ + 2hj/D (flux in at x = 0) and C_N = C_{N−2} (no flux at x = L).
  upper[0] = 2 * r;
  lower[n - 1] = 2 * r;
  lower[0] = 0;
  upper[n - 1] = 0;
  return { lower, main, upper, source0: (2 * model.sourceFlux) / h };
}

/**
 * One θ-step in place: (I − θ·dt·A)·C⁺ = (I + (1−θ)·dt·A)·C + dt·b, solved by the Thomas algorithm
 * (the matrix is diagonally dominant, so no pivoting is needed). `work` holds two scratch arrays of length n.
 */
function thetaStep(c: Float64Array, op: Operator, dt: number, theta: number, work: [Float64Array, Float64Array]): void {
  const n = c.length;
  const [rhs, cp] = work;
  const e = (1 - theta) * dt;
  for (let i = 0; i < n; i++) {
    let v = c[i] + e * op.main[i] * c[i];
    if (i > 0) v += e * op.lower[i] * c[i - 1];
    if (i < n - 1) v += e * op.upper[i] * c[i + 1];
    rhs[i] = v;
  }
  rhs[0] += dt * op.source0;
  const a = theta * dt;
  // Forward sweep of (1 − a·main)·x_i − a·lower·x_{i−1} − a·upper·x_{i+1} = rhs_i.
  let denom = 1 - a * op.main[0];
  cp[0] = (-a * op.upper[0]) / denom;
  rhs[0] /= denom;
  for (let i = 1; i < n; i++) {
    const sub = -a * op.lower[i];
    denom = 1 - a * op.main[i] - sub * cp[i - 1];
    cp[i] = i < n - 1 ? (-a * op.upper[i]) / denom : 0;
    rhs[i] = (rhs[i] - sub * rhs[i - 1]) / denom;
  }
  c[n - 1] = rhs[n - 1];
  for (let i = n - 2; i >= 0; i--) c[i] = rhs[i] - cp[i] * c[i + 1];
}

/**
 * Solves the SDD model from C = 0 at t = 0 and returns C(x, t) at each of `timesS` (seconds, non-decreasing,
 * ≥ 0) on `grid.nodes` equally spaced nodes from 0 to L µm. Each interval between output times is split into equal
 * steps no longer than grid.maxStepS. Throws RangeError on bad options.
 */
export function solveSdd(model: SddModel, timesS: ArrayLike<number>, grid: SddGrid = defaultSddGrid(model)): SddSolution {
  checkModel(model, grid, timesS);
  const n = grid.nodes;
  const op = buildOperator(model, n);
  const c = new Float64Array(n);
  const work: [Float64Array, Float64Array] = [new Float64Array(n), new Float64Array(n)];
  const out: Float64Array[] = [];
  let t = 0;
  let started = false;
  for (let m = 0; m < timesS.length; m++) {
    let remaining = timesS[m] - t;
    if (!started && remaining > 0) {
      // Rannacher start: four implicit Euler steps of half the step damp the stiff modes the switch-on excites.
      const half = Math.min(grid.maxStepS, remaining) / 2;
      const first = Math.min(remaining, 4 * half);
      for (let s = 0; s < 4; s++) thetaStep(c, op, first / 4, 1, work);
      remaining -= first;
      started = true;
    }
    const steps = Math.ceil(remaining / grid.maxStepS - 1e-9);
    for (let s = 0; s < steps; s++) thetaStep(c, op, remaining / steps, 0.5, work);
    t = timesS[m];
    out.push(Float64Array.from(c));
  }
  const h = model.lengthUm / (n - 1);
  return { xUm: Float64Array.from({ length: n }, (_, i) => i * h), timesS: Float64Array.from(timesS), concentration: out };
}

/** Linear interpolation of one solution row at xUm (clamped to the grid). */
export function sddValueAt(solution: SddSolution, timeIndex: number, xUm: number): number {
  const { xUm: grid } = solution;
  const row = solution.concentration[timeIndex];
  const h = grid[1] - grid[0];
  const u = Math.min(grid.length - 1, Math.max(0, xUm / h));
  const i = Math.min(grid.length - 2, Math.floor(u));
  const f = u - i;
  return row[i] * (1 - f) + row[i + 1] * f;
}

// Demo data: invented synthetic embryo results for a dosage series, built from known parameters with seeded noise.
// Gradient C(x) = A·f·exp(−x/λ) + B; a boundary where C crosses a fixed threshold T sits at x_b = λ·ln(A·f/T).
import type { Boundary, EmbryoResult, ExponentialFit, LandmarkPosition, Profile } from '../model';
import { createRng, type Rng } from '../stats';

/** Parameters of the demo series (all positions in x/EL, lengths in µm). */
export interface DemoCohortSpec {
  readonly conditions: readonly { readonly name: string; readonly dosage: number; readonly count: number }[];
  readonly lambdaEl?: number;
  /** Embryo-to-embryo SD of λ (x/EL). */
  readonly lambdaSdEl?: number;
  readonly amplitude?: number;
  readonly background?: number;
  /** Threshold of the boundary and of the landmark, in the units of A. */
  readonly thresholds?: { readonly boundary: number; readonly landmark: number };
  /** Extra positional noise of boundaries and landmarks (SD, x/EL). */
  readonly positionSdEl?: number;
  readonly eggLengthUm?: number;
  readonly seed?: number;
}

/** Make demo EmbryoResults and the matching sample sheet (CSV text with file, condition, dosage). */
export function makeDemoCohort(spec: DemoCohortSpec): { results: EmbryoResult[]; sheetCsv: string } {
  const rng = createRng(spec.seed ?? 1);
  const results: EmbryoResult[] = [];
  const lines = ['file,condition,dosage'];
  for (const c of spec.conditions) {
    for (let i = 0; i < c.count; i++) {
      const file = `${c.name}/embryo_${String(i + 1).padStart(2, '0')}.ome.tif`;
      results.push(demoEmbryo(file, c.dosage, spec, rng));
      lines.push(`${file},${c.name},${c.dosage}`);
    }
  }
  return { results, sheetCsv: lines.join('\n') + '\n' };
}

function demoEmbryo(file: string, f: number, spec: DemoCohortSpec, rng: Rng): EmbryoResult {
  const lambdaEl = (spec.lambdaEl ?? 0.2) + (spec.lambdaSdEl ?? 0.01) * rng.normal();
  const A = (spec.amplitude ?? 1000) * f;
  const B = spec.background ?? 50;
  const L = (spec.eggLengthUm ?? 500) * (1 + 0.03 * rng.normal());
  const T = spec.thresholds ?? { boundary: 105, landmark: 192 };
  const sdPos = spec.positionSdEl ?? 0.01;
  const xb = lambdaEl * Math.log(A / T.boundary) + sdPos * rng.normal();
  const xl = lambdaEl * Math.log(A / T.landmark) + sdPos * rng.normal();
  const profile = demoProfile(A, lambdaEl, B, L, rng);
  return {
    file, status: 'ok', error: null, warnings: [], pixelSizeUm: 1, pixelSizeSource: 'ome', eggLengthUm: L, eggWidthUm: L * 0.38,
    axis: { anterior: { x: 10, y: 100 }, posterior: { x: 10 + L, y: 100 }, source: 'auto' },
    gradientChannel: 'gradient', gradientProfile: profile, gradientFit: demoFit(A, lambdaEl, B, L, rng),
    boundaryProfiles: [], boundaries: [demoBoundary('target', 'logistic', xb, L), demoBoundary('target', 'half-max', xb + 0.003 * rng.normal(), L)],
    landmarks: [demoLandmark('furrow', xl, L)], backgrounds: [{ channel: 'gradient', method: 'outside', value: 12 }],
  };
}

function demoProfile(A: number, lambdaEl: number, B: number, L: number, rng: Rng): Profile {
  const xEl = Float64Array.from({ length: 100 }, (_, i) => (i + 0.5) / 100);
  const mean = xEl.map((x) => A * Math.exp(-x / lambdaEl) + B + 0.02 * A * rng.normal());
  return { channel: 'gradient', xEl, xUm: xEl.map((x) => x * L), mean, sd: mean.map((m) => 0.1 * Math.abs(m) + 5), n: xEl.map(() => 40) };
}

function demoFit(A: number, lambdaEl: number, B: number, L: number, rng: Rng): ExponentialFit {
  const fitted = lambdaEl * (1 + 0.01 * rng.normal());
  const se = 0.01 * fitted;
  return {
    amplitude: A, amplitudeSe: 0.01 * A, lambdaUm: fitted * L, lambdaSeUm: se * L, lambdaCiLowUm: (fitted - 2 * se) * L,
    lambdaCiHighUm: (fitted + 2 * se) * L, lambdaEl: fitted, lambdaSeEl: se,
    lambdaSeModelUm: se * L, lambdaSeSerialUm: se * L, lambdaSeSource: 'model', residualLag1: 0, weighted: true, background: B, backgroundSe: 1, r2: 0.99,
    rss: 1, dof: 48, iterations: 7, fitRangeEl: [0.1, 0.6], xEl: new Float64Array(0), residuals: new Float64Array(0),
  };
}

function demoBoundary(channel: string, method: Boundary['method'], xEl: number, L: number): Boundary {
  return { channel, method, positionEl: xEl, positionUm: xEl * L, widthEl: method === 'logistic' ? 0.02 : null, positionSeEl: 0.004, direction: 'falling', note: null };
}

function demoLandmark(name: string, xEl: number, L: number): LandmarkPosition {
  return { name, point: { x: 10 + xEl * L, y: 100 }, xEl, xUm: xEl * L, offAxisUm: 0 };
}

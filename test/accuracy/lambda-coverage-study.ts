// The λ-interval coverage study on the project's own synthetic embryos (demo data: invented embryos with known
// λ = 100 µm; random position, rotation 0–360°, either AP direction, nuclear texture, z-blur, shot and read noise),
// shared by the suite's test (n = 50) and scripts/lambda-coverage.ts (any n, any band depth).
import { analyseStack } from '../../core/pipeline';
import { DEFAULT_SETTINGS } from '../../core/settings';
import type { AnalysisSettings } from '../../core/settings';
import { makeSyntheticEmbryo, syntheticPlaneSource, syntheticStackInfo } from '../../core/synth';

/** One embryo's estimate against the truth. */
export interface CoverageRow {
  readonly seed: number;
  readonly lambdaUm: number;
  readonly seUm: number;
  readonly covered: boolean;
}

/** Summary of a study: how many intervals held the truth, the mean error and its SE, the RMS of error/SE. */
export interface CoverageSummary {
  readonly n: number;
  readonly covered: number;
  readonly biasUm: number;
  readonly biasSeUm: number;
  readonly sdUm: number;
  readonly meanSeUm: number;
  readonly rmsZ: number;
}

/**
 * Analyse `n` embryos at the demo's 1.5 µm/px and its 8 slices 3 µm apart (a 384 × 384 frame instead of 512 × 384,
 * so that the suite stays quick; the embryo is the same 500 × 190 µm) with the default settings plus `profile`.
 */
export async function lambdaCoverageStudy(n: number, firstSeed: number, profile: Partial<AnalysisSettings['profile']> = {}): Promise<CoverageRow[]> {
  const settings: AnalysisSettings = { ...DEFAULT_SETTINGS, profile: { ...DEFAULT_SETTINGS.profile, ...profile } };
  const rows: CoverageRow[] = [];
  for (let k = 0; k < n; k++) {
    const seed = firstSeed + 17 * k;
    const e = makeSyntheticEmbryo({ widthPx: 384, heightPx: 384, pixelSizeUm: 1.5, sizeZ: 8, dosage: [0.5, 1, 2, 4][k % 4] }, seed);
    const r = await analyseStack(syntheticStackInfo(e), syntheticPlaneSource(e), settings, { fileLabel: `embryo-${k}` });
    const f = r.gradientFit;
    const truth = e.truth.lambdaUm;
    rows.push(f
      ? { seed, lambdaUm: f.lambdaUm, seUm: f.lambdaSeUm, covered: f.lambdaCiLowUm <= truth && truth <= f.lambdaCiHighUm }
      : { seed, lambdaUm: NaN, seUm: NaN, covered: false });
    await new Promise((resolve) => setTimeout(resolve, 0)); // let a test runner's messages through
  }
  return rows;
}

/** Summarise a study against the true λ (µm). */
export function summariseCoverage(rows: readonly CoverageRow[], truthUm: number): CoverageSummary {
  const ok = rows.filter((r) => Number.isFinite(r.lambdaUm));
  const d = ok.map((r) => r.lambdaUm - truthUm);
  const m = d.reduce((s, v) => s + v, 0) / d.length;
  const sd = Math.sqrt(d.reduce((s, v) => s + (v - m) ** 2, 0) / (d.length - 1));
  return {
    n: rows.length, covered: rows.filter((r) => r.covered).length, biasUm: m, biasSeUm: sd / Math.sqrt(d.length), sdUm: sd,
    meanSeUm: ok.reduce((s, r) => s + r.seUm, 0) / ok.length,
    rmsZ: Math.sqrt(ok.reduce((s, r, i) => s + (d[i] / r.seUm) ** 2, 0) / ok.length),
  };
}

/** One line for a log: coverage, bias ± SE, SD between embryos against the mean SE, RMS of error/SE. */
export function coverageLine(label: string, s: CoverageSummary): string {
  const f = (v: number): string => v.toFixed(2);
  return `${label}: ${s.covered}/${s.n} intervals hold λ; bias ${f(s.biasUm)} ± ${f(s.biasSeUm)} µm; SD between embryos ${f(s.sdUm)} µm, mean SE ${f(s.meanSeUm)} µm; RMS of error/SE ${f(s.rmsZ)}`;
}

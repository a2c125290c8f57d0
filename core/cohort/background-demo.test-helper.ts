// Demo data for the background-condition tests (invented): stained embryos over a dosage series and null-stained
// embryos, as binned profiles with the results a batch would give (fits and boundaries by the batch's own functions).
import type { EmbryoResult, Profile } from '../model';
import { DEFAULT_SETTINGS } from '../settings';
import { createRng, type Rng } from '../stats';
import { findBoundaries } from '../fit';
import { filledBins, fitProfile } from '../profile';

// Demo data: synthetic binned profiles (100 bins over 0–1 x/EL, egg length 500 µm at 1 µm/px). Every embryo's profile
// is A·exp(−x/λ) + B + bg(x) + noise, and each background embryo's is bg(x) + noise: bg is an additive, non-flat
// background (a bump over the fit range, as tissue autofluorescence would give) that the fit's constant B cannot take.
export const L = 500, LAMBDA_EL = 0.2, BOUNDARY_EL = 0.45;
export const xEl = Float64Array.from({ length: 100 }, (_, i) => (i + 0.5) / 100);
const bump = (x: number): number => 60 * Math.exp(-(((x - 0.4) / 0.15) ** 2));
const boundaryBump = (x: number): number => 300 * Math.exp(-(((x - 0.55) / 0.12) ** 2));
const N_PX = 40, BIN_SD = 4; // SD of one bin mean; pixel SD = BIN_SD·√N_PX

function profile(channel: string, f: (x: number) => number, rng: Rng): Profile {
  const mean = xEl.map((x) => f(x) + BIN_SD * rng.normal());
  return { channel, xEl, xUm: xEl.map((x) => x * L), mean, sd: mean.map(() => BIN_SD * Math.sqrt(N_PX)), n: mean.map(() => N_PX) };
}

function embryo(file: string, gradient: Profile, target: Profile): EmbryoResult {
  const warnings: string[] = [];
  const settings = DEFAULT_SETTINGS;
  return {
    file, status: 'ok', error: null, warnings, pixelSizeUm: 1, pixelSizeSource: 'ome', eggLengthUm: L, eggWidthUm: 190,
    axis: { anterior: { x: 10, y: 100 }, posterior: { x: 10 + L, y: 100 }, source: 'auto' },
    gradientChannel: 'gradient', gradientProfile: gradient, gradientFit: fitProfile(gradient, L, 1, settings.fitRangeEl, warnings),
    boundaryProfiles: [target], boundaries: findBoundaries(filledBins(target), ['logistic', 'half-max'], 0.5, L),
    landmarks: [], backgrounds: [{ channel: 'gradient', method: 'outside', value: 10 }, { channel: 'target', method: 'outside', value: 10 }],
  };
}

/** `stained` embryos per condition (dosage f: amplitude ×f, the target's boundary at BOUNDARY_EL + λ·ln f) and `nulls`
 *  null-stained ones (condition "null-stain", no dosage), with the sample sheet's text. */
export function backgroundDemoCohort(seed: number, stained = 6, nulls = 4, conditions: readonly { name: string; dosage: number }[] = [{ name: 'stained', dosage: 1 }]): { results: EmbryoResult[]; sheet: string } {
  const rng = createRng(seed);
  const results: EmbryoResult[] = [];
  const lines = ['file,condition,dosage'];
  for (const c of conditions) {
    for (let i = 0; i < stained; i++) {
      const at = BOUNDARY_EL + LAMBDA_EL * Math.log(c.dosage);
      const g = profile('gradient', (x) => 1000 * c.dosage * Math.exp(-x / LAMBDA_EL) + 20 + bump(x), rng);
      const t = profile('target', (x) => 20 + 800 / (1 + Math.exp((x - at) / 0.02)) + boundaryBump(x), rng);
      const file = conditions.length === 1 ? `${c.name}_${i + 1}.tif` : `${c.name}/embryo_${i + 1}.tif`;
      results.push(embryo(file, g, t));
      lines.push(`${file},${c.name},${c.dosage}`);
    }
  }
  for (let i = 0; i < nulls; i++) {
    results.push(embryo(`null_${i + 1}.tif`, profile('gradient', (x) => 20 + bump(x), rng), profile('target', (x) => 20 + boundaryBump(x), rng)));
    lines.push(`null_${i + 1}.tif,null-stain,`);
  }
  return { results, sheet: lines.join('\n') + '\n' };
}


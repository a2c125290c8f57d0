// The demo data set (demo data, our own invented scenario): a gene-dosage series of synthetic embryos.
import { createRng } from '../stats';
import { DEFAULT_SYNTH_PARAMS } from './params';
import type { SyntheticEmbryoParams } from './params';
import type { SyntheticMovieParams } from './movie';

/** One demo file: name, its condition and dosage factor, and how to make it. */
export interface DemoItem {
  readonly fileName: string;
  readonly condition: string;
  readonly dosage: number;
  readonly params: SyntheticEmbryoParams;
  readonly seed: number;
}

/** Dosage factors of the demo series (multiples of the gradient source amplitude). */
export const DEMO_DOSAGES: readonly number[] = [0.5, 1, 2, 4];

/** Embryos per condition in the demo series. */
export const DEMO_EMBRYOS_PER_CONDITION = 6;

/**
 * Embryo-to-embryo variation of the demo scenario, as coefficients of variation (demo data: invented values of a
 * plausible size, so the cohort statistics have something to show).
 */
export const DEMO_VARIATION = Object.freeze({ lambdaCv: 0.05, amplitudeCv: 0.1, eggLengthCv: 0.03, eggWidthCv: 0.03 });

/**
 * How much the furrow's gradient threshold follows the dosage: its threshold is multiplied by f^FURROW_BUFFERING, so
 * the furrow moves by (1 − FURROW_BUFFERING)·λ·ln f instead of λ·ln f (demo scenario: a partly buffered landmark).
 */
export const FURROW_BUFFERING = 0.5;

/** The parameters of one demo embryo: the defaults at dosage f, varied per embryo from its seed. */
function demoParams(dosage: number, seed: number): SyntheticEmbryoParams {
  const rng = createRng(seed ^ 0x5eed);
  const vary = (value: number, cv: number): number => value * Math.max(0.5, 1 + cv * rng.normal());
  const d = DEFAULT_SYNTH_PARAMS;
  return {
    ...d, dosage,
    lambdaUm: vary(d.lambdaUm, DEMO_VARIATION.lambdaCv),
    gradientAmplitude: vary(d.gradientAmplitude, DEMO_VARIATION.amplitudeCv),
    eggLengthUm: vary(d.eggLengthUm, DEMO_VARIATION.eggLengthCv),
    eggWidthUm: vary(d.eggWidthUm, DEMO_VARIATION.eggWidthCv),
    furrowThreshold: d.furrowThreshold * dosage ** FURROW_BUFFERING,
  };
}

/**
 * The demo dosage series: 4 conditions × 6 embryos (512×384 px, 8 slices, 2 channels). The boundary threshold is
 * fixed, so the boundary moves by λ·ln f with dosage factor f (λ ≈ 100 µm ≈ 0.2 EL, boundary near 0.35 EL at f = 1);
 * the furrow is partly buffered (see FURROW_BUFFERING), so it moves about half as far as the threshold model predicts.
 */
export function demoDataSet(): DemoItem[] {
  const items: DemoItem[] = [];
  DEMO_DOSAGES.forEach((dosage, ci) => {
    const condition = `dosage-${dosage}x`;
    for (let k = 1; k <= DEMO_EMBRYOS_PER_CONDITION; k++) {
      const seed = 7001 + ci * 100 + k;
      items.push({
        fileName: `${condition}_embryo-${String(k).padStart(2, '0')}.ome.tif`,
        condition, dosage, seed, params: demoParams(dosage, seed),
      });
    }
  });
  return items;
}

/** The demo movie's file (relative to the demo folder) and the seed of its embryo. */
export const DEMO_MOVIE_FILE = 'timelapse/forming-gradient_embryo-01.ome.tif';
export const DEMO_MOVIE_SEED = 9101;

/**
 * The demo movie (demo data): a gradient forming by synthesis at the anterior pole, diffusion and degradation
 * (λ = 100 µm, degradation time 20 min, so τ(x) = (1 + x/λ)·10 min), imaged every 4 min for 3 h from one frame
 * before production starts; 400×240 px at 2 µm/px, 2 slices, 2 channels. The boundary channel follows the forming
 * gradient, so the boundary moves posterior over the movie.
 */
export const DEMO_MOVIE_PARAMS: SyntheticMovieParams = Object.freeze({
  embryo: Object.freeze({ widthPx: 400, heightPx: 240, pixelSizeUm: 2, sizeZ: 2, zStepUm: 4, angleDeg: 8 }),
  degradationPerS: 1 / 1200,
  frameIntervalS: 240,
  frames: 46,
  framesBeforeOnset: 1,
});

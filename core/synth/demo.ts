// The demo data set (demo data, our own invented scenario): a gene-dosage series of synthetic embryos.
import { DEFAULT_SYNTH_PARAMS } from './params';
import type { SyntheticEmbryoParams } from './params';

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
 * The demo dosage series: 4 conditions × 6 embryos (512×384 px, 8 slices, 2 channels). The boundary and furrow
 * thresholds are fixed, so they move by λ·ln f with dosage factor f (λ = 100 µm, boundary at 0.35 EL for f = 1).
 */
export function demoDataSet(): DemoItem[] {
  const items: DemoItem[] = [];
  DEMO_DOSAGES.forEach((dosage, ci) => {
    const condition = `dosage-${dosage}x`;
    for (let k = 1; k <= DEMO_EMBRYOS_PER_CONDITION; k++) {
      const seed = 7001 + ci * 100 + k;
      items.push({
        fileName: `${condition}_embryo-${String(k).padStart(2, '0')}.ome.tif`,
        condition, dosage, seed,
        params: { ...DEFAULT_SYNTH_PARAMS, dosage },
      });
    }
  });
  return items;
}

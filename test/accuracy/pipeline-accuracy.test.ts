// Accuracy of the whole analysis on seeded synthetic embryos (demo data: invented embryos with known truth):
// random position, rotation 0–360°, either AP direction, nuclear layer, z-blur, shot and read noise.
import { describe, expect, it } from 'vitest';
import type { EmbryoResult } from '../../core/model';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { analyseStack } from '../../core/pipeline';
import { makeSyntheticEmbryo, syntheticPlaneSource, syntheticStackInfo } from '../../core/synth';
import type { SyntheticTruth } from '../../core/synth';
import { median } from '../../core/stats';

const EMBRYOS = 24;
const DOSAGES = [0.5, 1, 2, 4];
const settings = { ...DEFAULT_SETTINGS, boundaryChannels: [2] };

interface Case { seed: number; truth: SyntheticTruth; pixelSizeUm: number; result: EmbryoResult }

async function runCase(k: number): Promise<Case> {
  const seed = 20_000 + 17 * k;
  // Smaller frames than the demo (2 µm/px, 6 slices) keep the suite quick; the embryo is the same 500 × 190 µm.
  const e = makeSyntheticEmbryo({ widthPx: 400, heightPx: 320, pixelSizeUm: 2, sizeZ: 6, dosage: DOSAGES[k % 4] }, seed);
  const result = await analyseStack(syntheticStackInfo(e), syntheticPlaneSource(e), settings, { fileLabel: `embryo-${k}` });
  return { seed, truth: e.truth, pixelSizeUm: e.pixelSizeUm, result };
}

describe('pipeline accuracy on synthetic embryos (demo data)', () => {
  let cases: Case[] = [];

  it(`analyses ${EMBRYOS} embryos without errors`, async () => {
    cases = [];
    for (let k = 0; k < EMBRYOS; k++) {
      cases.push(await runCase(k));
      await new Promise((resolve) => setTimeout(resolve, 0)); // let the test runner's messages through
    }
    expect(cases.filter((c) => c.result.status !== 'ok').map((c) => c.result.error)).toEqual([]);
    const angles = cases.map((c) => c.truth.angleDeg);
    expect(Math.min(...angles)).toBeLessThan(60);
    expect(Math.max(...angles)).toBeGreaterThan(300);
  }, 300_000);

  it('finds the anterior pole within 2% EL and the egg length within 2%', () => {
    // Source: project accuracy requirement (2% EL); truth from the generator.
    for (const c of cases) {
      const a = c.result.axis!;
      const el = c.truth.eggLengthUm / c.pixelSizeUm;
      const err = Math.hypot(a.anterior.x - c.truth.anterior.x, a.anterior.y - c.truth.anterior.y) / el;
      expect(err, `seed ${c.seed}`).toBeLessThan(0.02);
      expect(Math.abs(c.result.eggLengthUm! / c.truth.eggLengthUm - 1), `seed ${c.seed}`).toBeLessThan(0.02);
    }
  });

  it('recovers λ with median relative error ≤ 3%', () => {
    // Source: project accuracy requirement; λ = 100 µm in the generator.
    const rel = cases.map((c) => Math.abs(c.result.gradientFit!.lambdaUm / c.truth.lambdaUm - 1));
    console.log(`λ relative error: median ${median(rel).toFixed(4)}, max ${Math.max(...rel).toFixed(4)}`);
    expect(median(rel)).toBeLessThanOrEqual(0.03);
  });

  it('places the boundary with median error ≤ 0.005 EL', () => {
    // Source: project accuracy requirement; the boundary lies where the gradient crosses the fixed threshold.
    const err = cases.map((c) => {
      const b = c.result.boundaries.find((x) => x.method === 'logistic' && x.positionEl !== null)!;
      return Math.abs(b.positionEl! - c.truth.boundaryEl);
    });
    console.log(`boundary error (EL): median ${median(err).toFixed(4)}, max ${Math.max(...err).toFixed(4)}`);
    expect(median(err)).toBeLessThanOrEqual(0.005);
  });
});

// Flat-field and background-image corrections end to end, on a synthetic embryo (demo data: λ = 100 µm) imaged
// under an invented illumination fall-off and stray-light ramp.
import { describe, expect, it } from 'vitest';
import type { Plane } from '../model';
import { DEFAULT_SETTINGS } from '../settings';
import { makeSyntheticEmbryo, syntheticPlaneSource, syntheticStackInfo } from '../synth';
import type { SyntheticEmbryo } from '../synth';
import { backgroundImage, normaliseFlatField } from '../image';
import { analyseStack } from './analyse';

const W = 384, H = 300;
// The embryo lies along x (A→P to the right); illumination falls from 1 at the left edge to 0.55 at the right.
const embryo = makeSyntheticEmbryo({ widthPx: W, heightPx: H, pixelSizeUm: 1.5, sizeZ: 4, angleDeg: 0, centre: { x: W / 2, y: H / 2 } }, 4242);
const OFFSET = embryo.params.cameraOffset;
const illumination = (x: number): number => 1 - 0.45 * (x / (W - 1));
const strayLight = (x: number, y: number): number => 60 + 120 * (x / (W - 1)) + 20 * (y / (H - 1));

/** The embryo's planes mapped pixel by pixel (rounded back to uint16). */
function mapped(e: SyntheticEmbryo, f: (v: number, x: number, y: number) => number): SyntheticEmbryo {
  const planes = e.stack.planes.map((p) => Uint16Array.from(p, (v, i) => Math.round(f(v, i % W, Math.floor(i / W)))));
  return { ...e, stack: { ...e.stack, planes } };
}
const image = (f: (x: number, y: number) => number): Plane[] => [0, 1].map(() => ({ width: W, height: H, data: Float32Array.from({ length: W * H }, (_, i) => f(i % W, Math.floor(i / W))) }));

async function lambdaUm(e: SyntheticEmbryo, corrections: Parameters<typeof analyseStack>[3]['corrections'] = null): Promise<number> {
  const r = await analyseStack(syntheticStackInfo(e), syntheticPlaneSource(e), DEFAULT_SETTINGS, { fileLabel: 'e.tif', corrections });
  expect(r.error).toBeNull();
  return r.gradientFit!.lambdaUm;
}

describe('flat field and background image on a synthetic embryo (demo data)', () => {
  it('an illumination fall-off biases λ; the dark image and the flat field recover the uncorrected value', async () => {
    const plain = await lambdaUm(embryo);
    // The light falls off; the camera offset does not: raw = offset + light·illumination.
    const dimmed = mapped(embryo, (v, x) => OFFSET + (v - OFFSET) * illumination(x));
    const biased = await lambdaUm(dimmed);
    const flat = normaliseFlatField('flat.tif', image((x) => illumination(x)));
    const corrected = await lambdaUm(dimmed, { flat, background: backgroundImage('dark.tif', image(() => OFFSET)) });
    console.log(`λ: evenly lit ${plain.toFixed(2)} µm, with fall-off ${biased.toFixed(2)} µm, flat-field corrected ${corrected.toFixed(2)} µm`);
    // Source: demo data: the fall-off multiplies the profile by a falling ramp, shortening λ (by 4–5% here); (raw − dark)/flat
    // undoes it up to uint16 rounding (the flat's mean-1 scaling only changes the amplitude).
    expect(biased / plain).toBeLessThan(0.97);
    expect(Math.abs(corrected / plain - 1)).toBeLessThan(0.005);
    expect(Math.abs(corrected / 100 - 1)).toBeLessThan(0.03);
  }, 60_000);

  it('a stray-light ramp biases λ; subtracting the background image recovers it', async () => {
    const plain = await lambdaUm(embryo);
    const lit = mapped(embryo, (v, x, y) => v + strayLight(x, y));
    const biased = await lambdaUm(lit);
    const corrected = await lambdaUm(lit, { flat: null, background: backgroundImage('stray.tif', image(strayLight)) });
    console.log(`λ: plain ${plain.toFixed(2)} µm, with stray light ${biased.toFixed(2)} µm, background image subtracted ${corrected.toFixed(2)} µm`);
    expect(Math.abs(biased / plain - 1)).toBeGreaterThan(0.05);
    expect(Math.abs(corrected / plain - 1)).toBeLessThan(0.005);
  }, 60_000);

  it('a flat field of another size gives an error row naming the image', async () => {
    const flat = normaliseFlatField('flat.tif', [{ width: 10, height: 10, data: new Float32Array(100).fill(1) }, { width: 10, height: 10, data: new Float32Array(100).fill(1) }]);
    const r = await analyseStack(syntheticStackInfo(embryo), syntheticPlaneSource(embryo), DEFAULT_SETTINGS, { fileLabel: 'e.tif', corrections: { flat, background: null } });
    expect([r.status, r.error]).toEqual(['error', 'e.tif: the flat-field image flat.tif is 10×10 px but the stack is 384×300 px']);
  });
});

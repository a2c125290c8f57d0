// The automatic slice choice (projection "slice" without an index) scores each slice as the flat field and the
// background image make it, so that a correction that changes which slice has the most contrast changes the choice.
import { describe, expect, it } from 'vitest';
import type { PlaneSource, StackInfo } from '../model';
import { DEFAULT_SETTINGS } from '../settings';
import { backgroundImage, normaliseFlatField, projectStack } from '../image';
import { correctedProjection } from './analyse';

// Demo data: one channel, 4×1 px, two slices, given as the camera recorded them (hand-computed below).
function stack(slices: readonly number[][]): { info: StackInfo; source: PlaneSource } {
  const info: StackInfo = {
    byteOrder: 'II', bigTiff: false, isOme: false, sizeX: 4, sizeY: 1, sizeZ: slices.length, sizeC: 1, sizeT: 1,
    dimensionOrder: 'XYZCT', sampleType: 'uint16', samplesPerPixel: 1, channelNames: ['gradient'], pixelSize: { xUm: 1, yUm: 1, zUm: 1, source: 'ome' },
    compression: 'none', planeIfd: Int32Array.from(slices, (_, z) => z), ifdCount: slices.length, description: null, warnings: [],
  };
  const source: PlaneSource = {
    async readPlane(z) { return { width: 4, height: 1, data: Uint16Array.from(slices[z]) }; },
    async close() { /* nothing */ },
  };
  return { info, source };
}

const auto = { ...DEFAULT_SETTINGS, projection: 'slice' as const, sliceIndex: null };
const one = (values: number[]) => [{ width: 4, height: 1, data: Float32Array.from(values) }];

describe('automatic slice choice with corrections', () => {
  it('a flat field that reveals the dim side\'s contrast makes that slice the choice', async () => {
    // Scene: slice 0 = [100, 300, 100, 100] (variance 7500), slice 1 = [100, 100, 100, 500] (variance 30000);
    // illumination [1, 1, 0.5, 0.25] records slice 0 as [100, 300, 50, 25] (variance 11680) and slice 1 as
    // [100, 100, 50, 125] (variance 742), so the raw planes favour slice 0 and the corrected ones slice 1.
    // Source: hand computation (population variance of four values).
    const { info, source } = stack([[100, 300, 50, 25], [100, 100, 50, 125]]);
    const flat = normaliseFlatField('flat.tif', one([1, 1, 0.5, 0.25]));
    expect((await projectStack(info, source, auto)).sliceIndex).toBe(0);
    const raw = await projectStack(info, source, auto, { flat, background: null });
    expect(raw.sliceIndex).toBe(1);
    expect(Array.from(raw.channels[0].data)).toEqual([100, 100, 50, 125]);
    // The corrected projection is the chosen slice divided by the flat (scene × mean illumination 0.6875).
    const corrected = await correctedProjection(info, source, auto, { flat, background: null });
    expect(corrected.sliceIndex).toBe(1);
    [100, 100, 100, 500].forEach((v, i) => expect(corrected.channels[0].data[i]).toBeCloseTo(v * 0.6875, 3));
  });

  it('a background image that carries a slice\'s apparent contrast moves the choice to the slice with real contrast', async () => {
    // Stray light [0, 300, 0, 0]: slice 0 = flat scene 100 + stray → [100, 400, 100, 100] (variance 16875);
    // slice 1 = scene [100, 50, 100, 250] + stray → [100, 350, 100, 250] (variance 11250); minus the background the
    // variances are 0 and 5625. Source: hand computation.
    const { info, source } = stack([[100, 400, 100, 100], [100, 350, 100, 250]]);
    const background = backgroundImage('stray.tif', one([0, 300, 0, 0]));
    expect((await projectStack(info, source, auto)).sliceIndex).toBe(0);
    expect((await correctedProjection(info, source, auto, { flat: null, background })).sliceIndex).toBe(1);
  });

  it('a correction image of another size leaves the choice to the raw planes; the projection\'s correction then names it', async () => {
    const { info, source } = stack([[100, 300, 50, 25], [100, 100, 50, 125]]);
    const flat = normaliseFlatField('flat.tif', [{ width: 2, height: 1, data: Float32Array.of(1, 0.5) }]);
    expect((await projectStack(info, source, auto, { flat, background: null })).sliceIndex).toBe(0);
    await expect(correctedProjection(info, source, auto, { flat, background: null })).rejects.toThrow('the flat-field image flat.tif is 2×1 px but the stack is 4×1 px');
  });
});

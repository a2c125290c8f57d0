import { describe, expect, it } from 'vitest';
import type { Plane, ProjectedStack } from '../model';
import { applyImageCorrections, backgroundImage, correctionMismatch, normaliseFlatField } from './corrections';
import { createProjector } from './projector';

const plane = (width: number, height: number, values: number[]): Plane => ({ width, height, data: Float32Array.from(values) });
const projected = (channels: Plane[]): ProjectedStack => ({
  channels, channelNames: channels.map((_, c) => `C${c + 1}`), pixelSizeUm: 1, pixelSizeSource: 'ome', projection: 'mean', sliceIndex: null, warnings: [],
});

describe('flat-field and background-image corrections (demo data)', () => {
  it('normalises a flat field to mean 1 per channel', () => {
    const f = normaliseFlatField('flat.tif', [plane(2, 2, [1, 2, 3, 2]), plane(2, 2, [10, 10, 10, 10])]);
    // Source: definition (each pixel divided by the channel's mean, 2 and 10 here).
    expect(Array.from(f.channels[0])).toEqual([0.5, 1, 1.5, 1]);
    expect(Array.from(f.channels[1])).toEqual([1, 1, 1, 1]);
  });

  it('refuses a flat field with a pixel ≤ 0, naming the file and channel', () => {
    expect(() => normaliseFlatField('flat.tif', [plane(2, 1, [1, 1]), plane(2, 1, [1, 0])]))
      .toThrow('flat.tif: channel 2 of the flat-field image has 1 pixel(s) ≤ 0 or not finite; a flat field must be positive everywhere');
  });

  it('computes (projection − planes·background) / flat per pixel', () => {
    const flat = normaliseFlatField('flat.tif', [plane(2, 1, [0.5, 1.5])]);
    const bg = backgroundImage('dark.tif', [plane(2, 1, [10, 20])]);
    const p = projected([plane(2, 1, [60, 170])]);
    // Source: definition: (60 − 10)/0.5 = 100, (170 − 20)/1.5 = 100; a sum of 3 planes carries the background 3 times.
    expect(Array.from(applyImageCorrections(p, { flat, background: bg }, 1).channels[0].data)).toEqual([100, 100]);
    expect(Array.from(applyImageCorrections(projected([plane(2, 1, [80, 210])]), { flat, background: bg }, 3).channels[0].data)).toEqual([100, 100]);
    expect(applyImageCorrections(p, { flat: null, background: null }, 1)).toBe(p);
  });

  it('commutes with the mean, sum and max projections (corrected planes projected = projection corrected)', () => {
    // Demo data: three 3×1 planes, a positive flat and a background image.
    const planes = [[110, 220, 330], [150, 260, 310], [130, 200, 390]];
    const flatValues = [0.8, 1, 1.2];
    const bgValues = [100, 105, 110];
    for (const method of ['mean', 'sum', 'max'] as const) {
      const corrected = createProjector(3, 1, method);
      const raw = createProjector(3, 1, method);
      for (const v of planes) {
        corrected.add({ width: 3, height: 1, data: Float32Array.from(v, (x, i) => (x - bgValues[i]) / flatValues[i]) });
        raw.add({ width: 3, height: 1, data: Float32Array.from(v) });
      }
      const flat = { label: 'f', width: 3, height: 1, channels: [Float32Array.from(flatValues)] };
      const out = applyImageCorrections(projected([raw.result()]), { flat, background: backgroundImage('b', [plane(3, 1, bgValues)]) }, method === 'sum' ? 3 : 1);
      const want = corrected.result().data;
      out.channels[0].data.forEach((v, i) => expect(v, method).toBeCloseTo(want[i], 3));
    }
  });

  it('refuses an image of another size or channel count with one line naming it', () => {
    const flat = normaliseFlatField('flat.tif', [plane(2, 1, [1, 1])]);
    expect(correctionMismatch(flat, 'flat-field image', 3, 1, 1)).toBe('the flat-field image flat.tif is 2×1 px but the stack is 3×1 px');
    expect(correctionMismatch(flat, 'flat-field image', 2, 1, 2)).toBe('the flat-field image flat.tif has 1 channel(s) but the stack has 2');
    expect(() => applyImageCorrections(projected([plane(3, 1, [1, 2, 3])]), { flat, background: null }, 1))
      .toThrow('the flat-field image flat.tif is 2×1 px but the stack is 3×1 px');
  });
});

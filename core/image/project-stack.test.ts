import { describe, expect, it } from 'vitest';
import type { PlaneSource, StackInfo } from '../model';
import { DEFAULT_SETTINGS } from '../settings';
import { chooseSliceScore, projectStack } from './project-stack';
import { reusedPlaneArrays } from './plane-arrays';

// Demo data: a 3×1 stack with 2 channels and 3 slices; plane (z, c) holds values (10c + z) · [1, 2, 3],
// except slice 1 of both channels, which has the most contrast.
function tinyStack(pixelSize: StackInfo['pixelSize']): { info: StackInfo; source: PlaneSource; reads: string[] } {
  const reads: string[] = [];
  const info: StackInfo = {
    byteOrder: 'II', bigTiff: false, isOme: false, sizeX: 3, sizeY: 1, sizeZ: 3, sizeC: 2, sizeT: 1,
    dimensionOrder: 'XYZCT', sampleType: 'uint16', samplesPerPixel: 1, channelNames: ['first', ''], pixelSize,
    compression: 'none', planeIfd: new Int32Array(6), ifdCount: 6, description: null, warnings: [],
  };
  const source: PlaneSource = {
    async readPlane(z, c, t) {
      reads.push(`${z},${c},${t}`);
      const k = 10 * c + z;
      const data = z === 1 ? new Uint16Array([0, 50, 100]) : new Uint16Array([k, 2 * k, 3 * k]);
      return { width: 3, height: 1, data };
    },
    async close() { /* nothing */ },
  };
  return { info, source, reads };
}

const known = { xUm: 0.5, yUm: 0.5, zUm: 1, source: 'ome' } as const;
const none = { xUm: null, yUm: null, zUm: null, source: 'unknown' } as const;

describe('projectStack', () => {
  it('mean-projects every channel reading each plane once', async () => {
    const { info, source, reads } = tinyStack(known);
    const p = await projectStack(info, source, { ...DEFAULT_SETTINGS, projection: 'mean' });
    // Source: hand computation, channel 0: ([0,0,0] + [0,50,100] + [2,4,6]) / 3.
    expect(Array.from(p.channels[0].data)).toEqual([2 / 3, 54 / 3, 106 / 3].map(Math.fround));
    expect(Array.from(p.channels[1].data)).toEqual([(10 + 12) / 3, (20 + 50 + 24) / 3, (30 + 100 + 36) / 3].map(Math.fround));
    expect(reads).toHaveLength(6);
    expect(p.channelNames).toEqual(['first', 'C2']);
    expect(p.pixelSizeUm).toBe(0.5);
    expect(p.pixelSizeSource).toBe('ome');
    expect(p.sliceIndex).toBeNull();
  });

  it('lends its plane arrays to the source: slot c for one plane per channel (kept as rawPlanes), slots 0, 1 in turn for several', async () => {
    // Demo data: the tiny stack above, with a source that decodes into the lent array (as the direct TIFF path does).
    const { info, source } = tinyStack(known);
    const lentTo: string[] = [];
    const lending: PlaneSource = {
      async readPlane(z, c, t, into) {
        const plane = await source.readPlane(z, c, t);
        if (!(into instanceof Uint16Array)) return plane;
        lentTo.push(`${z},${c}`);
        into.set(plane.data);
        return { ...plane, data: into };
      },
      close: () => source.close(),
    };
    const arrays = reusedPlaneArrays();
    const slice = { ...DEFAULT_SETTINGS, projection: 'slice' as const, sliceIndex: 2 };
    const p = await projectStack(info, lending, slice, null, null, arrays);
    expect(p.rawPlanes?.map((r) => Array.from(r.data))).toEqual([[2, 4, 6], [12, 24, 36]]);
    expect(p.rawPlanes?.[0].data).toBe(arrays.at(0, 'uint16', 3));
    expect(p.rawPlanes?.[1].data).toBe(arrays.at(1, 'uint16', 3));
    // The next projection with the same arrays decodes into the same ones.
    const again = await projectStack(info, lending, { ...slice, sliceIndex: 0 }, null, null, arrays);
    expect(again.rawPlanes?.[1].data).toBe(p.rawPlanes?.[1].data);
    expect(Array.from(again.rawPlanes![1].data)).toEqual([10, 20, 30]);
    // Several planes per channel: the same values as without lent arrays, and no rawPlanes (no one plane holds them).
    const mean = await projectStack(info, lending, { ...DEFAULT_SETTINGS, projection: 'mean' }, null, null, arrays);
    const fresh = await projectStack(info, source, { ...DEFAULT_SETTINGS, projection: 'mean' });
    expect(mean.channels.map((c) => Array.from(c.data))).toEqual(fresh.channels.map((c) => Array.from(c.data)));
    expect(mean.rawPlanes).toBeUndefined();
    expect(lentTo).toHaveLength(2 + 2 + 6);
    // Without lent arrays nothing is kept.
    expect((await projectStack(info, source, slice)).rawPlanes).toBeUndefined();
  });

  it('lazy: converts a one-plane channel to floats only when its data is read, to the same values', async () => {
    // Demo data: the tiny stack above, slice 2 decoded into lent arrays; the floats go into the caller's arrays.
    const { info, source } = tinyStack(known);
    const lending: PlaneSource = {
      async readPlane(z, c, t, into) {
        const plane = await source.readPlane(z, c, t);
        if (!(into instanceof Uint16Array)) return plane;
        into.set(plane.data);
        return { ...plane, data: into };
      },
      close: () => source.close(),
    };
    const slice = { ...DEFAULT_SETTINGS, projection: 'slice' as const, sliceIndex: 2 };
    const into = [new Float32Array(3).fill(-1), new Float32Array(3).fill(-1)];
    const lazy = await projectStack(info, lending, slice, null, into, reusedPlaneArrays(), true);
    // Nothing converted yet: the caller's arrays are untouched, the raw planes are there.
    expect(Array.from(into[0])).toEqual([-1, -1, -1]);
    expect(lazy.rawPlanes?.map((r) => Array.from(r.data))).toEqual([[2, 4, 6], [12, 24, 36]]);
    expect(lazy.channels[1].width).toBe(3);
    expect(Array.from(into[1])).toEqual([-1, -1, -1]);
    // Read: the same floats as the eager projection, in the caller's array, made once.
    const eager = await projectStack(info, lending, slice, null, null, reusedPlaneArrays());
    expect(Array.from(lazy.channels[1].data)).toEqual(Array.from(eager.channels[1].data));
    expect(lazy.channels[1].data).toBe(into[1]);
    expect(Array.from(into[0])).toEqual([-1, -1, -1]);
    // Without lent plane arrays there are no raw planes to keep, so lazy changes nothing.
    expect(Array.from((await projectStack(info, source, slice, null, null, null, true)).channels[0].data)).toEqual([2, 4, 6]);
  });

  it('takes the chosen slice and reads only it', async () => {
    const { info, source, reads } = tinyStack(known);
    const p = await projectStack(info, source, { ...DEFAULT_SETTINGS, projection: 'slice', sliceIndex: 2 });
    expect(Array.from(p.channels[1].data)).toEqual([12, 24, 36]);
    expect(reads).toEqual(['2,0,0', '2,1,0']);
    expect(p.sliceIndex).toBe(2);
  });

  it('picks the slice with the most contrast when sliceIndex is null', async () => {
    const { info, source } = tinyStack(known);
    const p = await projectStack(info, source, { ...DEFAULT_SETTINGS, projection: 'slice', sliceIndex: null });
    expect(p.sliceIndex).toBe(1);
    expect(Array.from(p.channels[0].data)).toEqual([0, 50, 100]);
  });

  it('falls back to the user pixel size, then to unknown with a warning', async () => {
    const { info, source } = tinyStack(none);
    const user = await projectStack(info, source, { ...DEFAULT_SETTINGS, pixelSizeUm: 1.25 });
    expect([user.pixelSizeUm, user.pixelSizeSource]).toEqual([1.25, 'user']);
    const unknown = await projectStack(info, source, DEFAULT_SETTINGS);
    expect([unknown.pixelSizeUm, unknown.pixelSizeSource]).toEqual([null, 'unknown']);
    expect(unknown.warnings).toContain('pixel size unknown: lengths are in pixels and µm values are left empty');
  });

  it('rejects out-of-range indices with exact messages', async () => {
    const { info, source } = tinyStack(known);
    await expect(projectStack(info, source, { ...DEFAULT_SETTINGS, timeIndex: 1 })).rejects.toThrow('time index 1 is out of range (the file has 1 time point(s))');
    await expect(projectStack(info, source, { ...DEFAULT_SETTINGS, projection: 'slice', sliceIndex: 3 })).rejects.toThrow('slice index 3 is out of range (the file has 3 slice(s))');
  });

  it('scores slices by summed variance', () => {
    // Source: hand computation, variance of [0, 2] is 1, of [1, 1] is 0.
    expect(chooseSliceScore([{ width: 2, height: 1, data: new Float32Array([0, 2]) }, { width: 2, height: 1, data: new Float32Array([1, 1]) }])).toBe(1);
  });
});

describe('projectStack with non-finite values', () => {
  it('sets NaN and infinite projected values to 0 with a warning', async () => {
    const { info } = tinyStack(known);
    const source: PlaneSource = {
      async readPlane(z) { return { width: 3, height: 1, data: new Float32Array([z === 0 ? NaN : 1, Infinity, 2]) }; },
      async close() { /* nothing */ },
    };
    const p = await projectStack({ ...info, sampleType: 'float32' }, source, { ...DEFAULT_SETTINGS, projection: 'max' });
    expect(Array.from(p.channels[0].data)).toEqual([1, 0, 2]);
    expect(p.warnings).toContain('2 projected pixel value(s) were NaN or infinite and were set to 0');
  });
});

describe('projectStack read-ahead', () => {
  it('reads planes in stack order with at most one read ahead, and reports the first failing plane', async () => {
    const { info } = tinyStack(known);
    let inFlight = 0;
    let most = 0;
    const reads: string[] = [];
    const source: PlaneSource = {
      async readPlane(z, c) {
        reads.push(`${z},${c}`);
        inFlight++;
        most = Math.max(most, inFlight);
        await new Promise((r) => setTimeout(r, 1));
        inFlight--;
        // Demo data: every read from slice 1 on fails, so the read ahead of a later plane fails too (and must not
        // surface as an unhandled rejection, which vitest would report).
        if (z >= 1) throw new Error(`plane z=${z} c=${c} is unreadable`);
        return { width: 3, height: 1, data: new Uint16Array([1, 2, 3]) };
      },
      async close() { /* nothing */ },
    };
    await expect(projectStack(info, source, { ...DEFAULT_SETTINGS, projection: 'max' })).rejects.toThrow('plane z=1 c=0 is unreadable');
    expect(reads.slice(0, 3)).toEqual(['0,0', '0,1', '1,0']);
    expect(most).toBe(2);
  });
});

import { describe, expect, it } from 'vitest';
import type { PlaneSource, StackInfo } from '../model';
import { PREFETCH_MAX_BYTES, prefetchingSource } from './prefetch';

/** Demo data: a 3×2 movie of 2 channels and `sizeT` time points; plane (z, c, t) holds 100t + 10c + z + pixel index.
 *  The source decodes into the lent array when it fits, as the direct TIFF path does, and fails plane (0, 1, bad). */
function movie(sizeT: number, bad = -1, width = 3, height = 2): { info: StackInfo; source: PlaneSource; reads: string[] } {
  const reads: string[] = [];
  const info = {
    sizeX: width, sizeY: height, sizeZ: 1, sizeC: 2, sizeT, sampleType: 'uint16', samplesPerPixel: 1,
  } as StackInfo;
  const source: PlaneSource = {
    async readPlane(z, c, t, into) {
      reads.push(`${z},${c},${t}`);
      await new Promise((r) => setTimeout(r, 1));
      if (t === bad && c === 1) throw new Error(`movie: cannot decode plane z=${z} c=${c} t=${t}`);
      const data = into instanceof Uint16Array && into.length === width * height ? into : new Uint16Array(width * height);
      for (let i = 0; i < data.length; i++) data[i] = 100 * t + 10 * c + z + i;
      return { width, height, data };
    },
    async close() { /* nothing */ },
  };
  return { info, source, reads };
}

describe('prefetchingSource', () => {
  it('gives the same planes as the source and reads each next time point ahead, once', async () => {
    const { info, source, reads } = movie(4);
    const times = [0, 1, 3];
    const ahead = prefetchingSource(source, info, times);
    const got: number[][] = [];
    for (const t of times) {
      for (const c of [0, 1]) got.push(Array.from((await ahead.readPlane(0, c, t)).data));
      // Both planes of the next time point were asked for before this one is used (here: right away).
      const next = times[times.indexOf(t) + 1];
      if (next !== undefined) expect(reads).toEqual(expect.arrayContaining([`0,0,${next}`, `0,1,${next}`]));
    }
    await ahead.settle();
    const direct = movie(4).source;
    const expected: number[][] = [];
    for (const t of times) for (const c of [0, 1]) expected.push(Array.from((await direct.readPlane(0, c, t)).data));
    expect(got).toEqual(expected);
    expect([...reads].sort()).toEqual(['0,0,0', '0,0,1', '0,0,3', '0,1,0', '0,1,1', '0,1,3']);
  });

  it('keeps a plane valid until the same plane of the time point after next is read', async () => {
    const { info, source } = movie(5);
    const ahead = prefetchingSource(source, info, [0, 1, 2, 3, 4]);
    const p0 = await ahead.readPlane(0, 0, 0);
    const first = Array.from(p0.data);
    const p1 = await ahead.readPlane(0, 0, 1); // starts the read of t = 2 into p0's array
    expect(p1.data).not.toBe(p0.data);
    expect(Array.from(p1.data)).toEqual([100, 101, 102, 103, 104, 105]);
    expect(first).toEqual([0, 1, 2, 3, 4, 5]);
    const p2 = await ahead.readPlane(0, 0, 2);
    expect(p2.data).toBe(p0.data);
    await ahead.settle();
  });

  it('reports a failed read when its plane is asked for, with the source\'s message, never before', async () => {
    const { info, source } = movie(3, 1);
    const unhandled: unknown[] = [];
    const onUnhandled = (e: unknown) => unhandled.push(e);
    process.on('unhandledRejection', onUnhandled);
    try {
      const ahead = prefetchingSource(source, info, [0, 1, 2]);
      await ahead.readPlane(0, 0, 0);
      await ahead.readPlane(0, 1, 0); // starts the failing read of (0, 1, 1)
      await new Promise((r) => setTimeout(r, 20));
      await ahead.readPlane(0, 0, 1);
      await expect(ahead.readPlane(0, 1, 1)).rejects.toThrow('movie: cannot decode plane z=0 c=1 t=1');
      expect(Array.from((await ahead.readPlane(0, 1, 2)).data)).toEqual([210, 211, 212, 213, 214, 215]);
      await ahead.settle();
      expect(unhandled).toEqual([]);
    } finally {
      process.off('unhandledRejection', onUnhandled);
    }
  });

  it('does not read ahead when two time points\' planes would exceed its memory bound', async () => {
    // 2 channels × 2 time points × 2 bytes × w × h just over the bound.
    const side = Math.ceil(Math.sqrt(PREFETCH_MAX_BYTES / 8)) + 1;
    const { info, source, reads } = movie(3, -1, side, side);
    const ahead = prefetchingSource(source, info, [0, 1, 2]);
    await ahead.readPlane(0, 0, 0);
    await ahead.settle();
    expect(reads).toEqual(['0,0,0']);
  });
});

import { describe, expect, it } from 'vitest';
import type { AxisRoles } from './axes';
import { createChunkPlaneSource, type ChunkedArray, type DecodedChunk } from './plane-reader';

/** Demo data: value of element (c, z, y, x) of a 4-D array. */
const value = (c: number, z: number, y: number, x: number) => c * 1000 + z * 100 + y * 10 + x;

/**
 * A fake (c, z, y, x) array of the given shape and chunk shape, chunks laid out in C order (or F order when asked);
 * counts getChunk calls. Edge chunks are full size, as Zarr stores them.
 */
function fakeArray(shape: number[], chunks: number[], order: 'C' | 'F' = 'C'): ChunkedArray & { calls: number } {
  const strides = (s: number[]) => s.map((_, d) => (order === 'C' ? s.slice(d + 1) : s.slice(0, d)).reduce((a, b) => a * b, 1));
  const stride = strides(chunks);
  return {
    shape, chunks, calls: 0,
    async getChunk(coords: number[]): Promise<DecodedChunk> {
      this.calls++;
      const data = new Uint16Array(chunks.reduce((a, b) => a * b, 1));
      for (let c = 0; c < chunks[0]; c++) for (let z = 0; z < chunks[1]; z++) for (let y = 0; y < chunks[2]; y++) for (let x = 0; x < chunks[3]; x++) {
        const g = [coords[0] * chunks[0] + c, coords[1] * chunks[1] + z, coords[2] * chunks[2] + y, coords[3] * chunks[3] + x];
        if (g.every((v, d) => v < shape[d])) data[c * stride[0] + z * stride[1] + y * stride[2] + x * stride[3]] = value(g[0], g[1], g[2], g[3]);
      }
      return { data, shape: chunks, stride };
    },
  };
}

const CZYX: AxisRoles = { c: 0, z: 1, y: 2, x: 3, t: -1 };

/** The expected plane (z, c) of the demo array, row-major. */
function expectedPlane(z: number, c: number, h: number, w: number): number[] {
  return Array.from({ length: h * w }, (_, i) => value(c, z, Math.floor(i / w), i % w));
}

describe('createChunkPlaneSource', () => {
  it('assembles planes from tiles that do not divide the plane (edge chunks padded)', async () => {
    const array = fakeArray([2, 3, 7, 9], [1, 1, 3, 4]);
    const source = createChunkPlaneSource(array, CZYX, 'uint16', 'a.zarr', { cacheChunks: 0 });
    for (const [z, c] of [[0, 0], [2, 1], [1, 0]]) {
      const p = await source.readPlane(z, c, 0);
      expect([p.width, p.height]).toEqual([9, 7]);
      expect(Array.from(p.data)).toEqual(expectedPlane(z, c, 7, 9));
    }
  });

  it('reads Fortran-order chunks (strides other than 1 along x)', async () => {
    const array = fakeArray([2, 3, 7, 9], [2, 2, 4, 4], 'F');
    const source = createChunkPlaneSource(array, CZYX, 'uint16', 'a.zarr', { cacheChunks: 8 });
    expect(Array.from((await source.readPlane(2, 1, 0)).data)).toEqual(expectedPlane(2, 1, 7, 9));
  });

  it('decodes a chunk deeper than one plane once while its planes are read in turn', async () => {
    const array = fakeArray([2, 4, 6, 5], [1, 4, 6, 5]);
    const source = createChunkPlaneSource(array, CZYX, 'uint16', 'a.zarr', { cacheChunks: 3 });
    for (let z = 0; z < 4; z++) for (let c = 0; c < 2; c++) expect(Array.from((await source.readPlane(z, c, 0)).data)).toEqual(expectedPlane(z, c, 6, 5));
    expect(array.calls).toBe(2);
  });

  it('rejects planes outside the stack with RangeError', async () => {
    const source = createChunkPlaneSource(fakeArray([2, 3, 4, 4], [1, 1, 4, 4]), CZYX, 'uint16', 'a.zarr', { cacheChunks: 1 });
    await expect(source.readPlane(3, 0, 0)).rejects.toThrow(new RangeError('plane (z=3, c=0, t=0) is outside the stack (Z 3, C 2, T 1)'));
    await expect(source.readPlane(0, 0, 1)).rejects.toBeInstanceOf(RangeError);
  });

  it('names the chunk when it cannot be decoded or decodes to the wrong size', async () => {
    const broken: ChunkedArray = {
      shape: [1, 1, 4, 4], chunks: [1, 1, 4, 4],
      async getChunk() { throw Object.assign(new Error('Failed to decode chunk via codec "blosc"'), { cause: new Error('blosc: bad header') }); },
    };
    await expect(createChunkPlaneSource(broken, CZYX, 'uint16', 'b.ome.zarr', { cacheChunks: 1 }).readPlane(0, 0, 0))
      .rejects.toMatchObject({ code: 'decode', message: 'b.ome.zarr: chunk (0, 0, 0, 0) cannot be decoded: blosc: bad header' });
    const short: ChunkedArray = { shape: [1, 1, 4, 4], chunks: [1, 1, 4, 4], async getChunk() { return { data: new Uint16Array(3), shape: [1, 1, 4, 4], stride: [16, 16, 4, 1] }; } };
    await expect(createChunkPlaneSource(short, CZYX, 'uint16', 'b.ome.zarr', { cacheChunks: 1 }).readPlane(0, 0, 0))
      .rejects.toThrow('b.ome.zarr: chunk (0, 0, 0, 0) decodes to 3 values, expected 16 (chunk shape 1×1×4×4)');
  });
});

import Blosc from 'numcodecs/blosc';
import { describe, expect, it } from 'vitest';
import { decodeBloscLz4, unshuffleBytes } from './blosc-lz4';

/** Demo data: smooth 16-bit ramps with noise (compressible, like images), or bytes from a seeded generator. */
function demoBytes(n: number, smooth: boolean): Uint8Array {
  const out = new Uint8Array(n);
  let s = 12345;
  for (let i = 0; i < n; i++) {
    s = (s * 1103515245 + 12345) >>> 0;
    out[i] = smooth ? (i % 2 === 0 ? (i >> 7) & 255 : (s >>> 24) & 7) : s >>> 24;
  }
  return out;
}

describe('decodeBloscLz4', () => {
  // Source: streams written by c-blosc 1.x (numcodecs' WebAssembly build, which always writes type size 1) and
  // decoded by it as the reference. Type size 2 with byte shuffle is checked on the chunks Python's numcodecs writes
  // (test/zarr/python-written.test.ts).
  const configs = [
    { cname: 'lz4', shuffle: 1, n: 2 * 1024 * 1024 + 6, blocksize: 0 },
    { cname: 'lz4', shuffle: 0, n: 300_000, blocksize: 0 },
    { cname: 'lz4hc', shuffle: 1, n: 100_003, blocksize: 16384 },
    { cname: 'lz4', shuffle: 1, n: 70_000, blocksize: 4096 },
    { cname: 'lz4', shuffle: 1, n: 100, blocksize: 0 },
  ];
  it.each(configs)('matches c-blosc on $cname, shuffle $shuffle, $n bytes, block size $blocksize', async ({ cname, shuffle, n, blocksize }) => {
    for (const smooth of [true, false]) {
      const codec = Blosc.fromConfig({ id: 'blosc', cname, clevel: 5, shuffle, blocksize });
      const encoded = await codec.encode(demoBytes(n, smooth));
      const expected = await codec.decode(encoded);
      const ours = decodeBloscLz4(encoded);
      expect(ours).not.toBeNull();
      expect(ours!.length).toBe(expected.length);
      expect(Buffer.from(ours!).equals(Buffer.from(expected))).toBe(true);
    }
  });

  it('leaves other inner compressors to numcodecs and refuses damaged streams in one line', async () => {
    const zstd = await Blosc.fromConfig({ id: 'blosc', cname: 'zstd', clevel: 3, shuffle: 1 }).encode(demoBytes(10_000, true));
    expect(decodeBloscLz4(zstd)).toBeNull();
    const lz4 = await Blosc.fromConfig({ id: 'blosc', cname: 'lz4', clevel: 5, shuffle: 1 }).encode(demoBytes(100_000, true));
    expect(() => decodeBloscLz4(lz4.subarray(0, 10))).toThrow('Blosc stream is shorter than its 16-byte header');
    expect(() => decodeBloscLz4(lz4.subarray(0, lz4.length - 50))).toThrow(/^(Blosc stream is cut short|an LZ4 block decodes to \d+ bytes, expected \d+)$/);
  });
});

describe('unshuffleBytes', () => {
  it('puts byte k of element i back from position k·n + i, leftover bytes as stored', () => {
    // Source: c-blosc shuffle.c (from memory) — known answer worked by hand: elements 0x0201, 0x0403, 0x0605 of
    // 2 bytes stored as [01 03 05 | 02 04 06], then one leftover byte 07.
    const out = new Uint8Array(7);
    unshuffleBytes(Uint8Array.from([1, 3, 5, 2, 4, 6, 7]), out, 0, 2);
    expect(Array.from(out)).toEqual([1, 2, 3, 4, 5, 6, 7]);
  });
});

describe('unshuffleBytes of 2-byte elements, word at a time', () => {
  it('gives what the definition gives, at every alignment and length (demo data)', () => {
    // Source: c-blosc shuffle.c (from memory) — byte k of element i is stored at k·n + i; checked against that rule
    // written out byte by byte, on lengths that do and do not fill whole words and at odd destination offsets.
    for (const elements of [4, 8, 12, 1000, 1001, 4096]) {
      for (const destOffset of [0, 2, 4, 6]) {
        const values = demoBytes(2 * elements, false);
        const shuffled = new Uint8Array(2 * elements);
        for (let i = 0; i < elements; i++) { shuffled[i] = values[2 * i]; shuffled[elements + i] = values[2 * i + 1]; }
        const out = new Uint8Array(destOffset + 2 * elements);
        unshuffleBytes(shuffled, out, destOffset, 2);
        expect(Buffer.from(out.subarray(destOffset)).equals(Buffer.from(values))).toBe(true);
      }
    }
  });
});

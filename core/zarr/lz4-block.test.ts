import Blosc from 'numcodecs/blosc';
import { decompressBlock } from 'lz4js';
import { describe, expect, it } from 'vitest';
import { decodeLz4Block } from './lz4-block';

const bytes = (s: string): Uint8Array => Uint8Array.from(s, (c) => c.charCodeAt(0));
const text = (b: Uint8Array): string => String.fromCharCode(...b);

/** Demo data: runs of equal bytes, short repeating patterns of `period` bytes, and noise, in seeded turns. */
function demoBytes(n: number, seed: number): Uint8Array {
  const out = new Uint8Array(n);
  let s = seed;
  const next = () => (s = (s * 1103515245 + 12345) >>> 0) >>> 24;
  let i = 0;
  while (i < n) {
    const kind = next() % 3;
    const len = 1 + (next() << 2);
    if (kind === 0) { out.fill(next(), i, i + len); i += len; continue; }
    if (kind === 1) {
      const period = 2 + (next() % 40);
      for (let k = 0; k < len && i < n; k++, i++) out[i] = k < period ? next() : out[i - period];
      continue;
    }
    for (let k = 0; k < len && i < n; k++, i++) out[i] = next();
  }
  return out;
}

/** The LZ4 streams inside a Blosc stream without shuffle, in order: [start, length, decoded length]. */
function lz4Blocks(stream: Uint8Array): [number, number, number][] {
  // Source: c-blosc 1.x README_HEADER.rst and blosc.c — 16-byte header (flags at 2, type size at 3, nbytes at 4,
  // blocksize at 8), then one 32-bit start per block; a whole block is split into one stream per byte of the type
  // unless flag 0x10 is set; each stream is a 32-bit compressed size, then the LZ4 block (or raw bytes when equal).
  const view = new DataView(stream.buffer, stream.byteOffset, stream.byteLength);
  const split = (stream[2] & 0x10) === 0;
  const typesize = stream[3];
  const nbytes = view.getUint32(4, true);
  const blocksize = view.getUint32(8, true);
  const streams: [number, number, number][] = [];
  for (let b = 0; b * blocksize < nbytes; b++) {
    const bsize = Math.min(blocksize, nbytes - b * blocksize);
    const parts = split && bsize === blocksize ? typesize : 1;
    let at = view.getInt32(16 + 4 * b, true);
    for (let p = 0; p < parts; p++) {
      const length = view.getInt32(at, true);
      streams.push([at + 4, length, bsize / parts]);
      at += 4 + length;
    }
  }
  return streams;
}

describe('decodeLz4Block', () => {
  it('decodes hand-made sequences: literals, an overlapping match, a length extension (known answers)', () => {
    // Source: LZ4 Block Format Description (lz4/lz4 doc/lz4_Block_format.md), worked by hand — token 0x26 = 2
    // literals and a match of 6 + 4 bytes at offset 2, so "ab" repeats; token 0x10 = 1 literal, the last sequence.
    const out = new Uint8Array(13);
    expect(decodeLz4Block(bytes('\x26ab\x02\x00\x10c'), 0, 7, out, 0, 13)).toBe(13);
    expect(text(out)).toBe('ababababababc');
    // Match length 15 + 20 (one extension byte) + 4 = 39 at offset 3: "xyz" then 39 more bytes of the pattern.
    const long = new Uint8Array(42);
    expect(decodeLz4Block(bytes('\x3fxyz\x03\x00\x14'), 0, 7, long, 0, 42)).toBe(42);
    expect(text(long)).toBe('xyz'.repeat(14));
    // Literal length 15 + 255 + 10 = 280 (two extension bytes), then the end of the block.
    const lits = demoBytes(280, 7);
    const block = Uint8Array.from([0xf0, 255, 10, ...lits]);
    const got = new Uint8Array(280);
    expect(decodeLz4Block(block, 0, block.length, got, 0, 280)).toBe(280);
    expect(got).toEqual(lits);
  });

  const cases = [
    { cname: 'lz4', clevel: 5, n: 300_000, seed: 1 },
    { cname: 'lz4', clevel: 9, n: 131_072, seed: 2 },
    { cname: 'lz4hc', clevel: 9, n: 200_001, seed: 3 },
    { cname: 'lz4hc', clevel: 5, n: 65_536, seed: 4 },
    { cname: 'lz4', clevel: 1, n: 5000, seed: 5 },
  ];
  it.each(cases)('gives back what the LZ4 library inside c-blosc compressed ($cname level $clevel, $n bytes)', async ({ cname, clevel, n, seed }) => {
    // Source: c-blosc 1.x with its bundled LZ4 / LZ4HC (numcodecs' WebAssembly build) as the writer; lz4js's byte
    // loop decoder as a second reader of the same blocks.
    const data = demoBytes(n, seed);
    const stream = await Blosc.fromConfig({ id: 'blosc', cname, clevel, shuffle: 0, blocksize: 0 }).encode(data);
    const out = new Uint8Array(n);
    const ref = new Uint8Array(n);
    let at = 0;
    for (const [start, length, decoded] of lz4Blocks(stream)) {
      if (length === decoded) { out.set(stream.subarray(start, start + length), at); ref.set(stream.subarray(start, start + length), at); at += decoded; continue; }
      expect(decodeLz4Block(stream, start, length, out, at, decoded)).toBe(at + decoded);
      expect(decompressBlock(stream, ref, start, length, at)).toBe(at + decoded);
      at += decoded;
    }
    expect(at).toBe(n);
    expect(Buffer.from(out).equals(Buffer.from(data))).toBe(true);
    expect(Buffer.from(ref).equals(Buffer.from(data))).toBe(true);
  });

  it('refuses damaged blocks in one line without writing outside its part of the output', () => {
    const out = new Uint8Array(20).fill(0xee);
    // Offset 0 and an offset reaching before the output's start (demo data).
    expect(() => decodeLz4Block(bytes('\x26ab\x00\x00'), 0, 5, out, 2, 16)).toThrow('an LZ4 block refers to data before its start');
    expect(() => decodeLz4Block(bytes('\x26ab\x05\x00'), 0, 5, out, 2, 16)).toThrow('an LZ4 block refers to data before its start');
    // More output than the part allows, in literals and in a match.
    expect(() => decodeLz4Block(bytes('\x50abcde'), 0, 6, out, 2, 4)).toThrow('an LZ4 block decodes to more bytes than expected');
    expect(() => decodeLz4Block(bytes('\x2fab\x01\x00\x40'), 0, 6, out, 2, 16)).toThrow('an LZ4 block decodes to more bytes than expected');
    // Cut short: in literals, in an offset, in a length extension.
    expect(() => decodeLz4Block(bytes('\x50ab'), 0, 3, out, 2, 16)).toThrow('an LZ4 block is cut short in its literals');
    expect(() => decodeLz4Block(bytes('\x26ab\x02'), 0, 4, out, 2, 16)).toThrow('an LZ4 block is cut short in an offset');
    expect(() => decodeLz4Block(bytes('\xf0\xff'), 0, 2, out, 2, 16)).toThrow('an LZ4 block is cut short in a length');
    expect(() => decodeLz4Block(bytes('\x10a'), 0, 9, out, 0, 4)).toThrow('an LZ4 block lies outside its buffers');
    expect(out[0]).toBe(0xee);
    expect(out[1]).toBe(0xee);
    expect(out[18]).toBe(0xee);
  });

  it('never throws anything but a one-line Error on random damage to real blocks', async () => {
    // Demo data: a c-blosc LZ4 block with seeded bytes overwritten; the result may be wrong, never a crash or an
    // out-of-bounds write (the output part is followed by a guard byte).
    const data = demoBytes(50_000, 9);
    const stream = await Blosc.fromConfig({ id: 'blosc', cname: 'lz4', clevel: 5, shuffle: 0, blocksize: 0 }).encode(data);
    const [[start, length, decoded]] = lz4Blocks(stream);
    let s = 99;
    for (let trial = 0; trial < 300; trial++) {
      const damaged = stream.slice(start, start + length);
      for (let k = 0; k < 4; k++) { s = (s * 1103515245 + 12345) >>> 0; damaged[s % length] = s >>> 24; }
      const out = new Uint8Array(decoded + 1);
      try {
        decodeLz4Block(damaged, 0, length, out, 0, decoded);
      } catch (err) {
        expect(err).toBeInstanceOf(Error);
        expect((err as Error).message).not.toContain('\n');
      }
      expect(out[decoded]).toBe(0);
    }
  });
});

import { describe, expect, it } from 'vitest';
import { deflateSync } from 'node:zlib';
import { inflateChunk, inflateChunkAuto, inflateChunkReused } from './node-codecs';

/** Demo data: n bytes of a repeating ramp. */
const ramp = (n: number) => Uint8Array.from({ length: n }, (_, i) => (i * 31) % 251);

describe('inflateChunkAuto', () => {
  // Source: RFC 1950/1951 zlib streams as written by node:zlib's deflateSync (zlib itself); the decoded bytes are
  // the input given to it.
  it('inflates small and large chunks on the spot, to the same bytes as inflateSync', () => {
    for (const n of [1, 8192, 32 * 1024, 32 * 1024 + 1, 100_000, 2 * 1024 * 1024]) {
      const raw = ramp(n);
      const z = deflateSync(raw);
      const out = new Uint8Array(n);
      const r = inflateChunkAuto(z, out);
      expect(typeof r).toBe('number');
      expect(r).toBe(n);
      expect(out).toEqual(raw);
      const reference = new Uint8Array(n);
      expect(inflateChunk(z, reference)).toBe(n);
      expect(reference).toEqual(out);
    }
  });

  it('gives inflateSync\'s one-line messages for a corrupt or oversized stream', async () => {
    const raw = ramp(4000);
    const z = deflateSync(raw);
    const corrupt = Uint8Array.from(z);
    corrupt[0] = 0x00; // not a zlib header (RFC 1950 §2.2: CMF = 8 for Deflate)
    const run = async (f: (i: Uint8Array, o: Uint8Array) => number | Promise<number>, input: Uint8Array, size: number) => {
      try { await f(input, new Uint8Array(size)); return 'no error'; } catch (e) { return (e as Error).message; }
    };
    for (const [input, size] of [[corrupt, 4000], [z, 1000]] as const) {
      const sync = await run(inflateChunk, input, size);
      expect(sync).not.toBe('no error');
      expect(sync).not.toContain('\n');
      expect(await run(inflateChunkAuto, input, size)).toBe(sync);
    }
    expect(await run(inflateChunk, z, 1000)).toBe("the stream holds more than the chunk's 1000 bytes");
  });
});

describe('inflateChunkReused', () => {
  /** What a decoder gives for `input` into `size` bytes: the bytes written and the bytes, or the message. */
  const outcome = (f: (i: Uint8Array, o: Uint8Array) => number, input: Uint8Array, size: number): string => {
    const out = new Uint8Array(size);
    try {
      const n = f(input, out);
      return `${n}:${Buffer.from(out.subarray(0, n)).toString('base64')}`;
    } catch (e) {
      return `error: ${(e as Error).message}`;
    }
  };
  // Source: RFC 1950/1951 zlib streams as written by node:zlib's deflateSync (zlib itself) from demo data; the
  // reference is inflateChunk (node:zlib's inflateSync), which the reused stream must match in every case.
  it('gives inflateSync\'s bytes, counts and messages for whole, short, long, cut, corrupt and padded streams', () => {
    let state = 7;
    const noisy = (n: number) => Uint8Array.from({ length: n }, (_, i) => { state = (state * 1103515245 + 12345) >>> 0; return (i % 64) + (state >>> 29); });
    const cases: [Uint8Array, number][] = [];
    for (const n of [1, 100, 4000, 8192, 32 * 1024, 65_536, 300_000]) {
      const raw = noisy(n);
      const z = deflateSync(raw);
      cases.push([z, n], [z, n + 10], [z, Math.max(1, n - 1)], [z.subarray(0, z.length >> 1), n], [Uint8Array.from([...z, 1, 2, 3]), n]);
      for (const at of [0, 1, 2, 5, z.length >> 2, z.length >> 1, z.length - 3, z.length - 1]) {
        const bad = Uint8Array.from(z);
        bad[at] ^= 0x5a;
        cases.push([bad, n]);
      }
    }
    cases.push([new Uint8Array(0), 16], [Uint8Array.from([0x78, 0x9c]), 16]);
    for (const [input, size] of cases) {
      const want = outcome(inflateChunk, input, size);
      expect(outcome(inflateChunkReused, input, size), `${input.length} bytes into ${size}`).toBe(want);
    }
  });

  it('goes on after a failure with a fresh stream', () => {
    const raw = ramp(3000);
    const z = deflateSync(raw);
    const bad = Uint8Array.from(z);
    bad[0] = 0;
    expect(() => inflateChunkReused(bad, new Uint8Array(3000))).toThrow(/incorrect header check/);
    const out = new Uint8Array(3000);
    expect(inflateChunkReused(z, out)).toBe(3000);
    expect(out).toEqual(raw);
  });
});


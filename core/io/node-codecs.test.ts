import { describe, expect, it } from 'vitest';
import { deflateSync } from 'node:zlib';
import { inflateChunk, inflateChunkAsync, inflateChunkAuto, SYNC_INFLATE_MAX_BYTES } from './node-codecs';

/** Demo data: n bytes of a repeating ramp. */
const ramp = (n: number) => Uint8Array.from({ length: n }, (_, i) => (i * 31) % 251);

describe('inflateChunkAuto', () => {
  // Source: RFC 1950/1951 zlib streams as written by node:zlib's deflateSync (zlib itself); the decoded bytes are
  // the input given to it.
  it('inflates small chunks on the spot and larger ones on the thread pool, to the same bytes', async () => {
    for (const n of [1, 8192, SYNC_INFLATE_MAX_BYTES, SYNC_INFLATE_MAX_BYTES + 1, 100_000]) {
      const raw = ramp(n);
      const out = new Uint8Array(n);
      const r = inflateChunkAuto(deflateSync(raw), out);
      expect(typeof r === 'number').toBe(n <= SYNC_INFLATE_MAX_BYTES);
      expect(await r).toBe(n);
      expect(out).toEqual(raw);
    }
  });

  it('gives the same one-line messages either way for a corrupt or oversized stream', async () => {
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
      expect(await run(inflateChunkAsync, input, size)).toBe(sync);
    }
    expect(await run(inflateChunk, z, 1000)).toBe("the stream holds more than the chunk's 1000 bytes");
  });
});

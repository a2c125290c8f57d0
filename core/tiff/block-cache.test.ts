import { describe, expect, it } from 'vitest';
import { cachedByteSource } from './block-cache';
import { memoryByteSource, type ByteSource } from './byte-source';

/** Demo data: 100 bytes 0..99, counting the reads that reach the underlying source. */
function counting(): { source: ByteSource; reads: () => number } {
  const inner = memoryByteSource(Uint8Array.from({ length: 100 }, (_, i) => i));
  let reads = 0;
  return { source: { size: inner.size, read: (o, l) => { reads++; return inner.read(o, l); } }, reads: () => reads };
}

describe('cachedByteSource', () => {
  it('returns the same bytes as the source, across block edges and at the end', async () => {
    const { source } = counting();
    const cached = cachedByteSource(source, 16, 2);
    for (const [o, l] of [[0, 4], [14, 4], [30, 16], [95, 10], [100, 3], [40, 40]]) {
      expect(Array.from(await cached.read(o, l))).toEqual(Array.from(await source.read(o, l)));
    }
  });

  it('reads each block once while it stays cached', async () => {
    const { source, reads } = counting();
    const cached = cachedByteSource(source, 16, 4);
    for (let i = 0; i < 16; i++) await cached.read(i, 1);
    expect(reads()).toBe(1);
    await cached.read(20, 2);
    expect(reads()).toBe(2);
  });
});

import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { memoryByteSource } from '../../core/tiff';
import { hashingByteSource } from './hashing-source';

/** Demo data: 300 000 pseudo-random bytes. */
const bytes = Uint8Array.from({ length: 300_000 }, (_, i) => (i * 2654435761) >>> 24);
// Source: node:crypto's SHA-256 (OpenSSL) of the same bytes, read in one piece.
const expected = createHash('sha256').update(bytes).digest('hex');

describe('hashingByteSource', () => {
  it('hashes reads in order without reading anything again', async () => {
    const s = hashingByteSource(memoryByteSource(bytes));
    for (let at = 0; at < bytes.length; at += 70_000) await s.read(at, 70_000);
    expect(await s.finish()).toEqual({ sha256: expected, bytes: bytes.length, rereadBytes: 0 });
  });

  it('holds reads ahead of a gap until the gap is read, and overlapping reads count once', async () => {
    const s = hashingByteSource(memoryByteSource(bytes));
    await s.read(200_000, 100_000);
    await s.read(0, 120_000);
    await s.read(100_000, 110_000);
    expect(await s.finish()).toEqual({ sha256: expected, bytes: bytes.length, rereadBytes: 0 });
  });

  it('reads only the bytes never read, at the end; readInto is hashed as read', async () => {
    const s = hashingByteSource(memoryByteSource(bytes));
    const target = new Uint8Array(1000);
    await s.readInto!(0, target);
    target.fill(0); // the caller changing its buffer afterwards does not change the hash
    await s.read(250_000, 10);
    const result = await s.finish();
    expect(result.sha256).toBe(expected);
    expect(result.rereadBytes).toBe(bytes.length - 1000 - 10);
  });
});

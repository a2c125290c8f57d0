// SHA-256 of a file from the bytes its decoder reads, so a batch reads each input once: reads that continue where
// the hash stands are hashed as they come; reads ahead of it wait (as copies) until the gap is read; only the bytes
// the decoder never read (padding between planes, tags) are read again at the end.
import { createHash } from 'node:crypto';
import type { ByteSource } from '../../core/tiff';

/** Bytes held as copies while waiting for a gap before them; past this the rest is read again at the end instead. */
const MAX_PENDING_BYTES = 32 * 2 ** 20;

/** A ByteSource that hashes what passes through it; finish() completes the hash (reading what was never read). */
export interface HashingByteSource extends ByteSource {
  /** Hex SHA-256 and size of the whole file, plus how many bytes had to be read a second time. */
  finish(): Promise<{ sha256: string; bytes: number; rereadBytes: number }>;
}

/** Wraps `source` so that every byte it delivers in file order goes into a SHA-256. */
export function hashingByteSource(source: ByteSource): HashingByteSource {
  const hash = createHash('sha256');
  let pos = 0;
  let pending = new Map<number, Uint8Array>();
  let pendingBytes = 0;
  let overflowed = false;
  let finished: Promise<{ sha256: string; bytes: number; rereadBytes: number }> | null = null;

  /** Hashes the part of [offset, offset + data.length) beyond pos, when it touches pos. */
  const advance = (offset: number, data: Uint8Array): boolean => {
    if (offset > pos || offset + data.length <= pos) return offset + data.length <= pos;
    hash.update(data.subarray(pos - offset));
    pos = offset + data.length;
    return true;
  };
  const drain = (): void => {
    let moved = true;
    while (moved && pending.size > 0) {
      moved = false;
      for (const [offset, data] of pending) {
        if (offset <= pos) {
          advance(offset, data);
          pending.delete(offset);
          pendingBytes -= data.length;
          moved = true;
        }
      }
    }
  };
  const consume = (offset: number, data: Uint8Array): void => {
    if (finished || data.length === 0) return;
    if (advance(offset, data)) { drain(); return; }
    if (overflowed) return;
    if (pendingBytes + data.length > MAX_PENDING_BYTES) {
      overflowed = true;
      pending = new Map();
      pendingBytes = 0;
      return;
    }
    const previous = pending.get(offset);
    if (previous && previous.length >= data.length) return;
    pending.set(offset, data.slice());
    pendingBytes += data.length - (previous?.length ?? 0);
  };
  return {
    size: source.size,
    async read(offset: number, length: number): Promise<Uint8Array> {
      const data = await source.read(offset, length);
      consume(Math.max(0, offset), data);
      return data;
    },
    async readInto(offset: number, target: Uint8Array): Promise<number> {
      const n = source.readInto ? await source.readInto(offset, target) : copyInto(await source.read(offset, target.length), target);
      consume(Math.max(0, offset), target.subarray(0, n));
      return n;
    },
    finish() {
      finished ??= (async () => {
        let rereadBytes = 0;
        const step = 4 * 2 ** 20;
        // Read only the gaps the decoder left (alignment padding, tags read through another cache), using the
        // copies held for what lies after each gap; then whatever was never read.
        for (;;) {
          drain();
          const ahead = [...pending.keys()].filter((o) => o > pos);
          const until = ahead.length > 0 ? Math.min(...ahead) : source.size;
          if (pos >= until) break;
          const data = await source.read(pos, Math.min(step, until - pos));
          if (data.length === 0) break;
          rereadBytes += data.length;
          hash.update(data);
          pos += data.length;
        }
        pending = new Map();
        return { sha256: hash.digest('hex'), bytes: pos, rereadBytes };
      })();
      return finished;
    },
  };
}

function copyInto(data: Uint8Array, target: Uint8Array): number {
  target.set(data.subarray(0, target.length));
  return Math.min(data.length, target.length);
}

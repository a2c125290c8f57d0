// A read-through block cache over a ByteSource: tag reading makes many tiny reads close together.
import type { ByteSource } from './byte-source';

/**
 * Serves reads of up to `blockBytes` from aligned blocks kept in a small LRU cache (at most `maxBlocks`),
 * so walking thousands of IFDs costs one file read per block instead of several per IFD.
 */
export function cachedByteSource(source: ByteSource, blockBytes = 65536, maxBlocks = 64): ByteSource {
  const blocks = new Map<number, Promise<Uint8Array>>();
  const block = (index: number): Promise<Uint8Array> => {
    let hit = blocks.get(index);
    if (hit) {
      blocks.delete(index); // re-insert to mark as most recently used
    } else {
      hit = source.read(index * blockBytes, blockBytes);
    }
    blocks.set(index, hit);
    if (blocks.size > maxBlocks) blocks.delete(blocks.keys().next().value as number);
    return hit;
  };
  return {
    size: source.size,
    async read(offset: number, length: number): Promise<Uint8Array> {
      const start = Math.min(Math.max(0, offset), source.size);
      const end = Math.min(source.size, start + Math.max(0, length));
      if (end - start > blockBytes) return source.read(start, end - start);
      const first = Math.floor(start / blockBytes);
      const last = Math.floor(Math.max(start, end - 1) / blockBytes);
      if (first === last) {
        const b = await block(first);
        return b.subarray(start - first * blockBytes, end - first * blockBytes);
      }
      const [a, b] = await Promise.all([block(first), block(last)]);
      const out = new Uint8Array(end - start);
      out.set(a.subarray(start - first * blockBytes));
      out.set(b.subarray(0, end - last * blockBytes), a.length - (start - first * blockBytes));
      return out;
    },
  };
}

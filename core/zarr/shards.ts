// Sharded Zarr v3 arrays are read by zarrita (its sharding_indexed codec); this wraps the store it reads them from so
// that an index at the start of each shard is found, and a damaged index fails in one line instead of decoding
// whatever bytes lie where it points.
import type { ZarrStore } from './store';

type Json = Record<string, unknown>;
const isObject = (v: unknown): v is Json => typeof v === 'object' && v !== null && !Array.isArray(v);

/** Where each shard keeps its index, for a v3 array whose outermost codec is sharding_indexed; null when unsharded. */
export function shardIndexLocation(meta: Json): 'start' | 'end' | null {
  // Source: Zarr v3.0 sharding codec ("sharding_indexed", version 1.0) — index_location "start" or "end", default "end".
  const first = Array.isArray(meta.codecs) ? meta.codecs[0] : undefined;
  if (!isObject(first) || first.name !== 'sharding_indexed') return null;
  const config = isObject(first.configuration) ? first.configuration : {};
  return config.index_location === 'start' ? 'start' : 'end';
}

/**
 * The store as the sharded array's reader should see it. zarrita reads a shard's index as the last bytes of the
 * shard file (a suffix read) and each inner chunk as a range; here a suffix read becomes a read of the first bytes
 * when the index is at the start, a shard shorter than its index or an index pointing past the shard's end throws a
 * one-line Error naming the shard, and so does an offset or size no file can have.
 */
export function shardedStore(store: ZarrStore, indexLocation: 'start' | 'end'): ZarrStore {
  const getRange = store.getRange?.bind(store);
  if (!getRange) return store;
  return {
    get: store.get.bind(store),
    ...(store.close ? { close: store.close.bind(store) } : {}),
    async getRange(key, range, opts) {
      const name = key.slice(1);
      if ('suffixLength' in range) {
        const bytes = indexLocation === 'start' ? await getRange(key, { offset: 0, length: range.suffixLength }, opts) : await getRange(key, range, opts);
        if (bytes && bytes.length < range.suffixLength) throw new Error(`shard ${name} is ${bytes.length} bytes, shorter than its ${range.suffixLength}-byte index`);
        return bytes;
      }
      if (!Number.isSafeInteger(range.offset) || !Number.isSafeInteger(range.length)) {
        throw new Error(`the index of shard ${name} gives an offset or size no file can have (${range.offset}, ${range.length} bytes)`);
      }
      const bytes = await getRange(key, range, opts);
      if (bytes === undefined) throw new Error(`shard ${name} disappeared after its index was read`);
      if (bytes.length < range.length) throw new Error(`the index of shard ${name} points past its end (${range.length} bytes at offset ${range.offset})`);
      return bytes;
    },
  };
}

// What the OME-Zarr reader needs from a store: whole values by key, optionally byte ranges (sharded arrays).
import type { AsyncReadable } from 'zarrita';
import { ZarrError } from './errors';

/**
 * Reads the chunk file at `key` and decodes it as a Blosc stream elsewhere (another thread), at most `maxBytes`
 * decoded: the bytes, undefined when the key is missing, or null when that Blosc stream is one it does not decode (the
 * reader then goes through zarrita's codecs). Rejects with a one-line Error for a damaged stream.
 */
export type BloscChunkReader = (key: string, maxBytes: number) => Promise<Uint8Array | undefined | null>;

/** A read-only key-value store (keys start with "/"); undefined for a missing key. */
export type ZarrStore = AsyncReadable & { close?(): Promise<void>; readBloscChunk?: BloscChunkReader };

/** Largest metadata document read (a real .zattrs or zarr.json is a few KB). */
export const MAX_METADATA_BYTES = 16 * 2 ** 20;

/** True for keys that hold metadata rather than chunk bytes. */
export function isMetadataKey(key: string): boolean {
  return /(^|\/)(zarr\.json|\.zattrs|\.zarray|\.zgroup|\.zmetadata)$/.test(key);
}

/** Parses the JSON document at `key`; undefined when it is missing; ZarrError('bad-metadata') when it is malformed. */
export async function readJson(store: ZarrStore, key: `/${string}`, label: string): Promise<Record<string, unknown> | undefined> {
  const name = key.slice(1);
  let bytes: Uint8Array | undefined;
  try {
    bytes = await store.get(key);
  } catch (err) {
    throw new ZarrError('io', label, `cannot read ${name} (${err instanceof Error ? err.message : String(err)})`);
  }
  if (bytes === undefined) return undefined;
  if (bytes.length > MAX_METADATA_BYTES) throw new ZarrError('too-large', label, `${name} is ${bytes.length} bytes, over the ${MAX_METADATA_BYTES}-byte limit for metadata`);
  let value: unknown;
  try {
    value = JSON.parse(new TextDecoder().decode(bytes));
  } catch (err) {
    throw new ZarrError('bad-metadata', label, `${name} is not valid JSON (${err instanceof Error ? err.message : String(err)})`);
  }
  if (typeof value !== 'object' || value === null || Array.isArray(value)) throw new ZarrError('bad-metadata', label, `${name} is not a JSON object`);
  return value as Record<string, unknown>;
}

/**
 * Wraps a store so that chunk keys it does not hold are counted: Zarr reads a missing chunk as the fill value, which
 * the reader does, but a missing chunk in a microscope image is more often a copy cut short than an empty region.
 */
export function trackMissingChunks(store: ZarrStore, onMissing: (key: string) => void): ZarrStore {
  return {
    async get(key, opts) {
      const value = await store.get(key, opts);
      if (value === undefined && !isMetadataKey(key)) onMissing(key);
      return value;
    },
    ...(store.getRange ? { getRange: store.getRange.bind(store) } : {}),
    ...(store.close ? { close: store.close.bind(store) } : {}),
    // A missing chunk is counted when the reader falls back to get() for it.
    ...(store.readBloscChunk ? { readBloscChunk: store.readBloscChunk } : {}),
  };
}

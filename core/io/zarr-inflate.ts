// Bounded zlib/gzip decoding for OME-Zarr chunks through node:zlib (core/zarr installs it in zarrita's registry).
import { gunzipSync, inflateSync } from 'node:zlib';

/** Decodes a zlib or gzip stream; node:zlib stops at `maxBytes`, so a damaged stream cannot grow past the chunk. */
export function inflateZarrChunk(bytes: Uint8Array, maxBytes: number, format: 'zlib' | 'gzip'): Uint8Array {
  try {
    const out = (format === 'gzip' ? gunzipSync : inflateSync)(bytes, { maxOutputLength: Math.max(1, maxBytes) });
    return new Uint8Array(out.buffer, out.byteOffset, out.byteLength);
  } catch (err) {
    if ((err as { code?: string }).code === 'ERR_BUFFER_TOO_LARGE') throw new Error(`${format} stream holds more than the chunk's ${maxBytes} bytes`);
    throw new Error((err instanceof Error ? err.message : String(err)).split(/\r?\n/)[0]);
  }
}

// Decoders that need node built-ins, for the direct decode path: Deflate and Adobe Deflate through node:zlib.
import { constants, inflate, inflateSync } from 'node:zlib';
import { PURE_CHUNK_CODECS, type ChunkCodecs } from '../tiff';

/**
 * Inflates a zlib stream (compression 8, and 32946, the old code for the same) into `out`. node:zlib stops at
 * `maxOutputLength`, so a damaged stream can never grow past the chunk; a stream cut short decodes as far as it
 * goes (the caller then reports the missing bytes).
 */
export function inflateChunk(input: Uint8Array, out: Uint8Array): number {
  let result: Buffer;
  try {
    result = inflateSync(input, { maxOutputLength: out.length, finishFlush: constants.Z_SYNC_FLUSH });
  } catch (err) {
    throw zlibReason(err, out.length);
  }
  out.set(result);
  return result.length;
}

/** The reason for a zlib failure, one line. */
function zlibReason(err: unknown, outBytes: number): Error {
  if ((err as { code?: string }).code === 'ERR_BUFFER_TOO_LARGE') return new Error(`the stream holds more than the chunk's ${outBytes} bytes`);
  return new Error((err instanceof Error ? err.message : String(err)).split(/\r?\n/)[0]);
}

/**
 * inflateChunk on libuv's thread pool: the strips of a plane inflate in parallel while the JS thread goes on (with
 * read-ahead, adding the previous plane to the projection). Same limits and results as inflateChunk.
 */
export function inflateChunkAsync(input: Uint8Array, out: Uint8Array): Promise<number> {
  return new Promise((resolve, reject) => {
    inflate(input, { maxOutputLength: out.length, finishFlush: constants.Z_SYNC_FLUSH }, (err, result) => {
      if (err) { reject(zlibReason(err, out.length)); return; }
      out.set(result);
      resolve(result.length);
    });
  });
}

/** Chunks up to this many decoded bytes are inflated on the JS thread (see inflateChunkAuto). */
export const SYNC_INFLATE_MAX_BYTES = 32 * 1024;

/**
 * inflateChunk for small chunks, inflateChunkAsync for larger ones. Why: a call through the thread pool costs tens
 * of microseconds of bookkeeping (stream, callback, promise), more than inflating a few kilobytes; a file of many
 * small planes (or libtiff's default 8 KiB strips) spent most of its decode time there. Larger chunks keep
 * inflating off the JS thread while the previous plane is used. Same limits, results and messages either way.
 */
export function inflateChunkAuto(input: Uint8Array, out: Uint8Array): number | Promise<number> {
  return out.length <= SYNC_INFLATE_MAX_BYTES ? inflateChunk(input, out) : inflateChunkAsync(input, out);
}

/** The pure decoders plus Deflate through node:zlib (small chunks inline, larger ones on the thread pool). */
export const NODE_CHUNK_CODECS: ChunkCodecs = { ...PURE_CHUNK_CODECS, 8: inflateChunkAuto, 32946: inflateChunkAuto };

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
    const code = (err as { code?: string }).code;
    if (code === 'ERR_BUFFER_TOO_LARGE') throw new Error(`the stream holds more than the chunk's ${out.length} bytes`);
    throw new Error((err instanceof Error ? err.message : String(err)).split(/\r?\n/)[0]);
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

/** The pure decoders plus Deflate through node:zlib (asynchronous, on the thread pool). */
export const NODE_CHUNK_CODECS: ChunkCodecs = { ...PURE_CHUNK_CODECS, 8: inflateChunkAsync, 32946: inflateChunkAsync };

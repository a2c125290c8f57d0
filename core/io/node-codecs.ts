// Decoders that need node built-ins, for the direct decode path: Deflate and Adobe Deflate through node:zlib.
import { constants, createInflate, inflateSync, type Inflate } from 'node:zlib';
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

/** The part of a node:zlib stream that inflateSync itself drives (node's lib/zlib.js, processChunkSync): the native
 *  handle's writeSync(flush, in, inOff, inLen, out, outOff, outLen), which leaves the output and input space left
 *  in the stream's writeState, and reset(), zlib's inflateReset. Not a documented API, so its presence is checked. */
interface NativeInflate {
  writeSync(flush: number, input: Uint8Array, inOff: number, inLen: number, out: Uint8Array, outOff: number, outLen: number): void;
  reset(): void;
}

/** A zlib stream kept for inflating one small chunk after another, or null where node:zlib lacks what it drives. */
interface ReusedInflate { readonly stream: Inflate; readonly handle: NativeInflate; readonly state: Uint32Array }

function newReusedInflate(): ReusedInflate | null {
  const stream = createInflate();
  // A failure destroys the stream and emits 'error' later; it is read synchronously below (stream.errored).
  stream.on('error', () => undefined);
  const inner = stream as unknown as { _handle?: Partial<NativeInflate>; _writeState?: unknown };
  const handle = inner._handle;
  if (!handle || typeof handle.writeSync !== 'function' || typeof handle.reset !== 'function' || !(inner._writeState instanceof Uint32Array)) {
    stream.destroy();
    return null;
  }
  return { stream, handle: handle as NativeInflate, state: inner._writeState };
}

let reused: ReusedInflate | null | undefined;
/** One byte of output space, to learn whether a stream holds more than its chunk. */
const PROBE = new Uint8Array(1);

/**
 * inflateChunk through one zlib stream reset for every chunk, writing straight into `out`: what inflateSync does,
 * without making a new stream (and a result Buffer) per chunk, which cost about a quarter of the CPU time of an
 * 8 KiB chunk (a file of 65,535 small planes: one stream each), and without a result buffer the size of a large one. Same bytes, limits and messages as inflateChunk,
 * which it falls back to where node:zlib does not offer what it drives.
 */
export function inflateChunkReused(input: Uint8Array, out: Uint8Array): number {
  if (reused === undefined) reused = newReusedInflate();
  const z = reused;
  if (z === null) return inflateChunk(input, out);
  z.handle.reset();
  z.handle.writeSync(constants.Z_SYNC_FLUSH, input, 0, input.length, out, 0, out.length);
  let failure = streamFailure(z);
  const written = out.length - z.state[0];
  // The output is full: a stream that still gives a byte is longer than the chunk (inflateSync's maxOutputLength).
  if (failure === null && written === out.length) {
    z.handle.writeSync(constants.Z_SYNC_FLUSH, input, input.length - z.state[1], z.state[1], PROBE, 0, 1);
    failure = streamFailure(z) ?? (z.state[0] === 0 ? new Error(`the stream holds more than the chunk's ${out.length} bytes`) : null);
  }
  if (failure !== null) throw failure;
  return written;
}

/** The one-line reason when the last write failed (the stream is then destroyed and replaced), else null. */
function streamFailure(z: ReusedInflate): Error | null {
  if (!z.stream.destroyed) return null;
  reused = undefined;
  return zlibReason(z.stream.errored ?? new Error('inflate failed'), 0);
}

/**
 * The Deflate decoder of the direct decode path: every chunk, small or large, through the one reused stream on the
 * JS thread, straight into the plane. Why: large strips used to go to libuv's thread pool (node:zlib's inflate), whose
 * result buffers, allocated outside V8's heap, raised the process's memory while a Deflate stack was read; inflated
 * in place they cost no buffer at all. Two Deflate 1024² × 2 × 24 stacks in one process, alternated three times
 * each way (`npm run bench`'s child runs): decoding took 590–630 ms of CPU time against 920–1070 ms on the thread
 * pool with 43–49 MiB of peak RSS against 52–61, and the whole pipeline 1330–1450 ms against 1770–1790 with 62–74
 * MiB against 70–79. Same bytes, limits and messages as inflateChunk.
 */
export const inflateChunkAuto: (input: Uint8Array, out: Uint8Array) => number = inflateChunkReused;

/** The pure decoders plus Deflate through node:zlib (every chunk inflated in place on the JS thread). */
export const NODE_CHUNK_CODECS: ChunkCodecs = { ...PURE_CHUNK_CODECS, 8: inflateChunkAuto, 32946: inflateChunkAuto };

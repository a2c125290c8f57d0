// LZMA (TIFF compression 34925, as libtiff's tif_lzma.c writes it: one .xz stream per strip or tile, with the delta
// filter before LZMA2) through lzma-native (liblzma), with the stream's own index checked before anything is decoded.
import type LzmaModule from 'lzma-native';
import type { ChunkCodecs } from '../../core/tiff';
import { NODE_CHUNK_CODECS } from '../../core/io';

/** Reads a multibyte integer of the .xz format (xz file format 1.0.4 §1.2); returns [value, next offset]. */
function readVarint(bytes: Uint8Array, at: number): [number, number] {
  let value = 0;
  let scale = 1;
  for (let i = 0; i < 9; i++) {
    if (at + i >= bytes.length) throw new Error('xz index is cut short');
    const b = bytes[at + i];
    value += (b & 0x7f) * scale;
    if ((b & 0x80) === 0) return [value, at + i + 1];
    scale *= 128;
  }
  throw new Error('xz index holds an over-long number');
}

/**
 * The uncompressed size the last .xz stream in `input` declares in its index (xz file format 1.0.4 §2.1.2 Stream
 * Footer, §4 Index): the sum of its records' uncompressed sizes. The decoder checks the index against the blocks.
 */
export function xzDeclaredSize(input: Uint8Array): number {
  let end = input.length;
  while (end >= 4 && input[end - 1] === 0 && input[end - 2] === 0 && input[end - 3] === 0 && input[end - 4] === 0) end -= 4;
  if (end < 24 || input[end - 2] !== 0x59 || input[end - 1] !== 0x5a) throw new Error('not an xz stream (no stream footer)');
  const footer = end - 12;
  const backwardSize = (input[footer + 4] | (input[footer + 5] << 8) | (input[footer + 6] << 16) | (input[footer + 7] << 24) >>> 0) * 4 + 4;
  let at = footer - backwardSize;
  if (at < 12 || input[at] !== 0) throw new Error('not an xz stream (bad index)');
  const [records, afterCount] = readVarint(input, at + 1);
  at = afterCount;
  let total = 0;
  for (let r = 0; r < records; r++) {
    let uncompressed: number;
    [, at] = readVarint(input, at);
    [uncompressed, at] = readVarint(input, at);
    total += uncompressed;
  }
  return total;
}

/** liblzma's memory limit for one chunk's decoder (LZMA2 dictionaries of libtiff's presets need at most 64 MiB). */
const MEMLIMIT_BYTES = 256 * 2 ** 20;

let lzmaLoaded: Promise<typeof LzmaModule> | null = null;

/** lzma-native (native liblzma), loaded when the first LZMA chunk is met rather than by every worker at start. */
function loadLzma(): Promise<typeof LzmaModule> {
  lzmaLoaded ??= import('lzma-native').then((m) => m.default);
  return lzmaLoaded;
}

/** Decodes an .xz chunk into `out`; refuses before decoding when the stream declares more than the chunk holds. */
export async function decodeLzmaChunk(input: Uint8Array, out: Uint8Array): Promise<number> {
  const declared = xzDeclaredSize(input);
  if (declared > out.length) throw new Error(`the stream declares ${declared} bytes, more than the chunk's ${out.length}`);
  const lzma = await loadLzma();
  const result = await lzma.decompress(Buffer.from(input.buffer, input.byteOffset, input.length), { memlimit: MEMLIMIT_BYTES });
  const n = Math.min(result.length, out.length);
  out.set(result.subarray(0, n));
  return n;
}

/** Every decoder the app has: the pure ones, Deflate through node:zlib, and LZMA. */
export const APP_CHUNK_CODECS: ChunkCodecs = { ...NODE_CHUNK_CODECS, 34925: decodeLzmaChunk };

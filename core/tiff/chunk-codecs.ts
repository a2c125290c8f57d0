// The decompressors the direct decode path uses, by TIFF Compression code. Pure ones live here; those that need
// node built-ins or native code (Deflate through node:zlib, LZMA) are injected by the caller (core/io, app/decode).
import { decompress as zstdDecompress } from 'fzstd';
import { decodeLzw } from './lzw';
import { decodePackBits } from './packbits';

/**
 * Decompresses one strip or tile into `out`, whose length is the chunk's declared decoded size, and returns the
 * number of bytes written. It must never write past `out.length` nor allocate much more than it (a damaged stream
 * can never grow without bound); it throws an Error with a short reason for a corrupt stream.
 */
export type ChunkDecoder = (input: Uint8Array, out: Uint8Array) => number | Promise<number>;

/** Decoders by TIFF Compression code. */
export type ChunkCodecs = Readonly<Record<number, ChunkDecoder>>;

/** Compression 1: the bytes as stored (a longer chunk is cut at the declared size). */
export function copyChunk(input: Uint8Array, out: Uint8Array): number {
  const n = Math.min(input.length, out.length);
  out.set(input.subarray(0, n));
  return n;
}

/**
 * Zstandard (compression 50000, as libtiff's tif_zstd.c writes it: one frame per chunk) through fzstd, decoding
 * into `out` itself, so the output can never grow past the chunk. fzstd does not say how much it wrote, so a
 * frame whose header declares its content size must declare exactly the chunk's size.
 */
export function decodeZstd(input: Uint8Array, out: Uint8Array): number {
  const declared = zstdContentSize(input);
  if (declared !== null && declared !== out.length) throw new Error(`Zstandard frame declares ${declared} bytes, the chunk holds ${out.length}`);
  const result = zstdDecompress(input, out);
  if (result.buffer !== out.buffer) out.set(result.subarray(0, out.length));
  return Math.min(result.length, out.length);
}

/** Frame_Content_Size of the first Zstandard frame (RFC 8878 §3.1.1.1), or null when the header omits it. */
export function zstdContentSize(input: Uint8Array): number | null {
  if (input.length < 6 || input[0] !== 0x28 || input[1] !== 0xb5 || input[2] !== 0x2f || input[3] !== 0xfd) {
    throw new Error('not a Zstandard frame (bad magic number)');
  }
  const descriptor = input[4];
  const fcsFlag = descriptor >> 6;
  const singleSegment = (descriptor >> 5) & 1;
  const dictBytes = [0, 1, 2, 4][descriptor & 3];
  const fcsBytes = fcsFlag === 0 ? singleSegment : [1, 2, 4, 8][fcsFlag];
  if (fcsBytes === 0) return null;
  const at = 5 + (singleSegment ? 0 : 1) + dictBytes;
  if (at + fcsBytes > input.length) throw new Error('Zstandard frame header is cut short');
  let value = 0;
  for (let i = fcsBytes - 1; i >= 0; i--) value = value * 256 + input[at + i];
  return fcsBytes === 2 ? value + 256 : value;
}

/** The decoders that need nothing from the platform: none, LZW, PackBits and Zstandard. */
export const PURE_CHUNK_CODECS: ChunkCodecs = { 1: copyChunk, 5: decodeLzw, 32773: decodePackBits, 50000: decodeZstd };

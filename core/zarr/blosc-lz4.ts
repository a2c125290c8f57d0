// Blosc 1 chunks with LZ4 (or LZ4HC) inside, decoded in TypeScript: the Blosc container and byte unshuffle are read
// here and each LZ4 block by lz4-block.ts. Why: numcodecs' WebAssembly Blosc copies its input through a JS loop and
// took ~28 ms per 2 MiB plane (bench); this path takes about 1 ms. Streams it does not handle (other inner
// compressors, bit shuffle) return null and go to numcodecs.
import { decodeLz4Block } from './lz4-block';

// Source: c-blosc 1.x (blosc.c, README_HEADER.rst) — header byte 2 holds the flags: 0x1 byte shuffle, 0x2 stored
// without compression, 0x4 bit shuffle, 0x10 blocks not split by byte position, bits 5–7 the compressor (1 = LZ4).
const DOSHUFFLE = 0x1;
const MEMCPYED = 0x2;
const DOBITSHUFFLE = 0x4;
const DONTSPLIT = 0x10;
const LZ4_FORMAT = 1;
const HEADER_BYTES = 16;

/** Little-endian machine: a 2-byte element assembled as lo | hi << 8 is stored in the right byte order. */
const LITTLE_ENDIAN = new Uint8Array(Uint16Array.of(1).buffer)[0] === 1;

/**
 * Unshuffle of 2-byte elements (the common case: uint16 images). When the buffers allow 4-byte views, four low and
 * four high bytes are read as two words and written as two words (a quarter of the memory operations of a byte loop).
 */
function unshuffle2(src: Uint8Array, dest: Uint8Array, destOffset: number, elements: number): void {
  let i = 0;
  const at = dest.byteOffset + destOffset;
  if (elements >= 8 && src.byteOffset % 4 === 0 && elements % 4 === 0 && at % 4 === 0) {
    const words = elements >> 2;
    const lo = new Int32Array(src.buffer, src.byteOffset, words);
    const hi = new Int32Array(src.buffer, src.byteOffset + elements, words);
    const out = new Int32Array(dest.buffer, at, 2 * words);
    for (let j = 0; j < words; j++) {
      const l = lo[j];
      const h = hi[j];
      out[2 * j] = (l & 0xff) | ((h & 0xff) << 8) | ((l & 0xff00) << 8) | ((h & 0xff00) << 16);
      out[2 * j + 1] = ((l >>> 16) & 0xff) | ((h >>> 8) & 0xff00) | ((l >>> 8) & 0xff0000) | (h & 0xff000000);
    }
    i = words << 2;
  }
  const out = new Uint16Array(dest.buffer, at, elements);
  for (; i < elements; i++) out[i] = src[i] | (src[elements + i] << 8);
}

/** Reverses Blosc's byte shuffle of one block: byte k of element i was stored at k·(n/typesize) + i. */
export function unshuffleBytes(src: Uint8Array, dest: Uint8Array, destOffset: number, typesize: number): void {
  const n = src.length;
  const elements = Math.floor(n / typesize);
  if (typesize === 2 && LITTLE_ENDIAN && (dest.byteOffset + destOffset) % 2 === 0) {
    unshuffle2(src, dest, destOffset, elements);
    if (n % 2 === 1) dest[destOffset + n - 1] = src[n - 1];
    return;
  }
  for (let k = 0; k < typesize; k++) {
    const from = k * elements;
    for (let i = 0; i < elements; i++) dest[destOffset + i * typesize + k] = src[from + i];
  }
  // Bytes past the last whole element are stored as they are.
  for (let b = elements * typesize; b < n; b++) dest[destOffset + b] = src[b];
}

/** Decodes one split stream (a 4-byte size, then that many bytes of LZ4, or the raw bytes when the size says so). */
function decodeStream(src: Uint8Array, at: number, out: Uint8Array, outAt: number, length: number): number {
  if (at + 4 > src.length) throw new Error('Blosc stream is cut short');
  const size = src[at] | (src[at + 1] << 8) | (src[at + 2] << 16) | (src[at + 3] << 24);
  const start = at + 4;
  if (size < 0 || start + size > src.length) throw new Error('Blosc stream is cut short');
  if (size === length) {
    out.set(src.subarray(start, start + size), outAt);
  } else {
    const end = decodeLz4Block(src, start, size, out, outAt, length);
    if (end !== outAt + length) throw new Error(`an LZ4 block decodes to ${end - outAt} bytes, expected ${length}`);
  }
  return start + size;
}

/**
 * Decodes a Blosc 1 stream whose blocks are LZ4 (byte shuffle or none); returns null for any other Blosc stream.
 * Throws a one-line Error on a damaged stream; never writes past the size the header declares.
 */
export function decodeBloscLz4(src: Uint8Array): Uint8Array | null {
  if (src.length < HEADER_BYTES) throw new Error('Blosc stream is shorter than its 16-byte header');
  const view = new DataView(src.buffer, src.byteOffset, HEADER_BYTES);
  const flags = src[2];
  const typesize = src[3];
  const nbytes = view.getUint32(4, true);
  const blocksize = view.getUint32(8, true);
  if (flags & MEMCPYED) {
    if (src.length < HEADER_BYTES + nbytes) throw new Error('Blosc stream is cut short');
    return src.slice(HEADER_BYTES, HEADER_BYTES + nbytes);
  }
  if ((flags >> 5) !== LZ4_FORMAT || (flags & DOBITSHUFFLE)) return null;
  if (nbytes === 0) return new Uint8Array(0);
  if (blocksize === 0 || typesize === 0) throw new Error('Blosc header declares a block or type size of 0');
  const nblocks = Math.ceil(nbytes / blocksize);
  if (HEADER_BYTES + 4 * nblocks > src.length) throw new Error('Blosc stream is cut short');
  const out = new Uint8Array(nbytes);
  const shuffled = (flags & DOSHUFFLE) !== 0 && typesize > 1;
  const tmp = shuffled ? new Uint8Array(blocksize) : null;
  for (let b = 0; b < nblocks; b++) {
    const bsize = Math.min(blocksize, nbytes - b * blocksize);
    const leftover = bsize < blocksize;
    const splits = !(flags & DONTSPLIT) && !leftover ? typesize : 1;
    const neblock = Math.floor(bsize / splits);
    const target = tmp ? tmp : out;
    const base = tmp ? 0 : b * blocksize;
    if (splits * neblock !== bsize) throw new Error(`Blosc block of ${bsize} bytes does not split into ${splits} streams`);
    let at = new DataView(src.buffer, src.byteOffset + HEADER_BYTES + 4 * b, 4).getInt32(0, true);
    if (at < HEADER_BYTES) throw new Error(`Blosc block ${b} starts inside the header`);
    for (let s = 0; s < splits; s++) at = decodeStream(src, at, target, base + s * neblock, neblock);
    if (tmp) unshuffleBytes(tmp.subarray(0, bsize), out, b * blocksize, typesize);
  }
  return out;
}

// LZ4 block decoding (the raw block format Blosc uses inside its blocks), written for speed on image data: long
// literal runs and long matches are copied by the engine (TypedArray set / copyWithin / fill) rather than a byte at a
// time, which is where a byte loop spends its time on runs of equal bytes (a shuffled high-byte stream is mostly one
// match of offset 1). Every read and write is bounds-checked, so a damaged block fails with one line.

/** Copies below this many bytes go through a plain loop (a call into the engine costs more than the loop). */
const SHORT = 24;

/** Reads an LZ4 length extension (bytes of 255 continue it) starting at `at`; returns [added length, next index]. */
function extension(src: Uint8Array, at: number, end: number): [number, number] {
  let add = 0;
  let b: number;
  do {
    if (at >= end) throw new Error('an LZ4 block is cut short in a length');
    b = src[at++];
    add += b;
  } while (b === 255);
  return [add, at];
}

/**
 * Decodes the LZ4 block `src[srcStart, srcStart + srcLength)` into `dst` from `dstStart`, writing at most `dstLength`
 * bytes; returns the index in `dst` after the last byte written. Throws a one-line Error when the block is damaged
 * (a length or offset that leaves the block or the output, offset 0, or a match reaching before `dstStart`).
 */
export function decodeLz4Block(src: Uint8Array, srcStart: number, srcLength: number, dst: Uint8Array, dstStart: number, dstLength: number): number {
  // Source: LZ4 Block Format Description (lz4/lz4, doc/lz4_Block_format.md) — each sequence is a token (literal
  // length in the high 4 bits, match length − 4 in the low 4; 15 means more length bytes follow, each 255 adds and
  // continues), the literals, a 2-byte little-endian offset, then the match; the last sequence has literals only.
  let s = srcStart;
  const sEnd = srcStart + srcLength;
  let d = dstStart;
  const dEnd = dstStart + dstLength;
  if (sEnd > src.length || dEnd > dst.length) throw new Error('an LZ4 block lies outside its buffers');
  while (s < sEnd) {
    const token = src[s++];
    let literals = token >>> 4;
    if (literals === 15) {
      const [add, next] = extension(src, s, sEnd);
      literals += add;
      s = next;
    }
    if (literals > 0) {
      if (s + literals > sEnd) throw new Error('an LZ4 block is cut short in its literals');
      if (d + literals > dEnd) throw new Error('an LZ4 block decodes to more bytes than expected');
      if (literals < SHORT) {
        for (const stop = s + literals; s < stop;) dst[d++] = src[s++];
      } else {
        dst.set(src.subarray(s, s + literals), d);
        s += literals;
        d += literals;
      }
    }
    if (s >= sEnd) break;
    if (s + 2 > sEnd) throw new Error('an LZ4 block is cut short in an offset');
    const offset = src[s] | (src[s + 1] << 8);
    s += 2;
    if (offset === 0 || offset > d - dstStart) throw new Error('an LZ4 block refers to data before its start');
    let length = token & 15;
    if (length === 15) {
      const [add, next] = extension(src, s, sEnd);
      length += add;
      s = next;
    }
    length += 4;
    if (d + length > dEnd) throw new Error('an LZ4 block decodes to more bytes than expected');
    let m = d - offset;
    if (length < SHORT) {
      // A byte loop copies overlapping matches (offset < length) correctly: each byte is written before it is read.
      for (const stop = d + length; d < stop;) dst[d++] = dst[m++];
    } else if (offset === 1) {
      dst.fill(dst[m], d, d + length);
      d += length;
    } else if (offset >= length) {
      dst.copyWithin(d, m, m + length);
      d += length;
    } else {
      // Overlapping: the output repeats the last `offset` bytes. Copy whole periods from m, doubling each time (the
      // copied part is a whole number of periods, so m + copied stays in step with the pattern).
      let copied = 0;
      while (copied < length) {
        const n = Math.min(length - copied, offset + copied);
        dst.copyWithin(d + copied, m, m + n);
        copied += n;
      }
      d += length;
    }
  }
  return d;
}

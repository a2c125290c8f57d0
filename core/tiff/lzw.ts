// TIFF LZW decoding (TIFF 6.0 §13): codes of 9–12 bits, most-significant bit first, Clear = 256,
// EndOfInformation = 257, and the code width rising one code early (at 511, 1023 and 2047).

const CLEAR = 256;
const EOI = 257;
const FIRST_FREE = 258;
const TABLE_SIZE = 4096;

/** Thrown for a stream that cannot be LZW; the caller adds the file, plane and chunk. */
export class CorruptStreamError extends Error {}

/** The code table, kept between calls so a plane of many strips allocates it once. */
interface LzwTable {
  readonly prefix: Uint16Array;
  readonly suffix: Uint8Array;
  readonly length: Uint16Array;
  readonly first: Uint8Array;
}

let sharedTable: LzwTable | null = null;

function table(): LzwTable {
  if (sharedTable) return sharedTable;
  const t = { prefix: new Uint16Array(TABLE_SIZE), suffix: new Uint8Array(TABLE_SIZE), length: new Uint16Array(TABLE_SIZE), first: new Uint8Array(TABLE_SIZE) };
  for (let i = 0; i < 256; i++) { t.suffix[i] = i; t.length[i] = 1; t.first[i] = i; }
  sharedTable = t;
  return t;
}

/**
 * Decodes a TIFF LZW stream into `out`; returns the number of bytes written (at most `out.length`: decoding stops
 * when the output is full, so a damaged stream can never grow it). A missing EndOfInformation at the end of the
 * input is accepted, as libtiff does. Throws CorruptStreamError for a code that is not yet defined, and for the
 * old-style (bit-reversed) LZW of early writers, which this decoder does not read.
 */
export function decodeLzw(input: Uint8Array, out: Uint8Array): number {
  if (input.length >= 2 && input[0] === 0 && (input[1] & 0x01) === 1) {
    throw new CorruptStreamError('old-style LZW (bit-reversed codes) is not supported');
  }
  const { prefix, suffix, length, first } = table();
  const outLength = out.length;
  let ip = 0;
  let op = 0;
  let bits = 0;
  let bitCount = 0;
  let width = 9;
  let next = FIRST_FREE;
  let old = -1;
  while (op < outLength) {
    while (bitCount < width) {
      if (ip >= input.length) return op; // input ended without EndOfInformation
      bits = ((bits << 8) | input[ip++]) & 0xffffff;
      bitCount += 8;
    }
    bitCount -= width;
    const code = (bits >>> bitCount) & ((1 << width) - 1);
    if (code === EOI) break;
    if (code === CLEAR) {
      width = 9;
      next = FIRST_FREE;
      old = -1;
      continue;
    }
    let emit: number;
    if (old === -1) {
      if (code > 255) throw new CorruptStreamError(`code ${code} after Clear at byte ${ip}`);
      out[op++] = code;
      old = code;
      continue;
    }
    if (code < next) {
      emit = code;
      if (next < TABLE_SIZE) {
        prefix[next] = old; suffix[next] = first[code]; length[next] = length[old] + 1; first[next] = first[old];
        next++;
      }
    } else if (code === next && next < TABLE_SIZE) {
      prefix[next] = old; suffix[next] = first[old]; length[next] = length[old] + 1; first[next] = first[old];
      emit = next;
      next++;
    } else {
      throw new CorruptStreamError(`code ${code} is not yet defined (next free ${next}) at byte ${ip}`);
    }
    // Write the string of `emit` backwards from its last byte; only the part that fits is written.
    const len = length[emit];
    let c = emit;
    let end = op + len;
    if (end > outLength) {
      for (let skip = end - outLength; skip > 0; skip--) c = prefix[c];
      end = outLength;
    }
    for (let p = end - 1; p >= op; p--) { out[p] = suffix[c]; c = prefix[c]; }
    op = end;
    old = emit;
    if (next + 1 >= 1 << width && width < 12) width++;
  }
  return op;
}

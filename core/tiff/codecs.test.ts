import { describe, expect, it } from 'vitest';
import { decodeLzw } from './lzw';
import { decodePackBits } from './packbits';
import { zstdContentSize } from './chunk-codecs';
import { swapBytesInPlace, undoFloatingPointPredictor, undoHorizontalDifferencing } from './chunk-predictors';
import { parseShapeDescription } from './shape-description';
import { unsupportedCompression } from './compression';

const hex = (s: string) => Uint8Array.from(s.trim().split(/\s+/).map((h) => parseInt(h, 16)));

describe('decodePackBits', () => {
  // Source: TIFF 6.0 §9, the worked example (packed and unpacked bytes as printed there).
  const packed = hex('FE AA 02 80 00 2A FD AA 03 80 00 2A 22 F7 AA');
  const unpacked = hex('AA AA AA 80 00 2A AA AA AA AA 80 00 2A 22 AA AA AA AA AA AA AA AA AA AA');

  it('decodes the specification example', () => {
    const out = new Uint8Array(unpacked.length);
    expect(decodePackBits(packed, out)).toBe(unpacked.length);
    expect(out).toEqual(unpacked);
  });

  it('stops at the declared output size and skips the no-op header 0x80', () => {
    const out = new Uint8Array(5);
    expect(decodePackBits(packed, out)).toBe(5);
    expect(out).toEqual(unpacked.subarray(0, 5));
    const withNoop = new Uint8Array(2);
    expect(decodePackBits(hex('80 FF 07'), withNoop)).toBe(2);
    expect(withNoop).toEqual(hex('07 07'));
  });
});

/** Packs 9-bit codes most-significant bit first (TIFF 6.0 §13) — demo data for the decoder. */
function packCodes9(codes: number[]): Uint8Array {
  let bits = '';
  for (const c of codes) bits += c.toString(2).padStart(9, '0');
  while (bits.length % 8) bits += '0';
  return Uint8Array.from({ length: bits.length / 8 }, (_, i) => parseInt(bits.slice(i * 8, i * 8 + 8), 2));
}

describe('decodeLzw', () => {
  // Source: TIFF 6.0 §13 — Clear 256, EOI 257, first free code 258; the string table grows as codes are read.
  // Worked by hand (from memory of the LZW scheme): "ABABABA" = A B <AB> <ABA> → 65 66 258 260.
  it('decodes a hand-made stream including the KwKwK case', () => {
    const stream = packCodes9([256, 65, 66, 258, 260, 257]);
    const out = new Uint8Array(7);
    expect(decodeLzw(stream, out)).toBe(7);
    expect(new TextDecoder().decode(out)).toBe('ABABABA');
  });

  it('never writes past the declared size and rejects undefined codes', () => {
    const out = new Uint8Array(3);
    expect(decodeLzw(packCodes9([256, 65, 66, 258, 260, 257]), out)).toBe(3);
    expect(new TextDecoder().decode(out)).toBe('ABA');
    expect(() => decodeLzw(packCodes9([256, 65, 300, 257]), new Uint8Array(8))).toThrow(/code 300 is not yet defined/);
  });

  it('returns what it decoded when the stream ends without EndOfInformation', () => {
    expect(decodeLzw(packCodes9([256, 65, 66]), new Uint8Array(8))).toBe(2);
  });
});

describe('predictors', () => {
  // Source: TIFF 6.0 §14 — differences along each row, per sample, modulo 2^bits.
  it('undoes horizontal differencing per row and sample, wrapping modulo 2^16', () => {
    const v = Uint16Array.from([10, 20, 5, 1, 65535, 2]); // 2 rows × (1 pixel… 3 values), stride 1
    undoHorizontalDifferencing(new Uint8Array(v.buffer), 2, 3, 1);
    expect(Array.from(v)).toEqual([10, 30, 35, 1, 0, 2]);
    const two = Uint8Array.from([1, 2, 3, 4, 5, 6]); // one row of 3 pixels × 2 samples
    undoHorizontalDifferencing(two, 1, 6, 2);
    expect(Array.from(two)).toEqual([1, 2, 4, 6, 9, 12]);
  });

  // Source: Adobe Photoshop TIFF Technical Note 3 (floating-point predictor): bytes of a row regrouped most
  // significant first, then byte-differenced. Demo data: 1.0f = 3F 80 00 00 and -2.0f = C0 00 00 00.
  it('undoes the floating-point predictor into host order', () => {
    const planes = [0x3f, 0xc0, 0x80, 0x00, 0x00, 0x00, 0x00, 0x00];
    const diffed = planes.map((b, i) => (i === 0 ? b : (b - planes[i - 1]) & 0xff));
    const bytes = Uint8Array.from(diffed);
    undoFloatingPointPredictor(bytes, 4, 2, 1, new Uint8Array(8));
    expect(Array.from(new Float32Array(bytes.buffer))).toEqual([1, -2]);
  });

  it('swaps bytes of 2-, 4- and 8-byte values', () => {
    const b = Uint8Array.from([1, 2, 3, 4, 5, 6, 7, 8]);
    swapBytesInPlace(b, 2);
    expect(Array.from(b)).toEqual([2, 1, 4, 3, 6, 5, 8, 7]);
    swapBytesInPlace(b, 4);
    expect(Array.from(b)).toEqual([3, 4, 1, 2, 7, 8, 5, 6]);
    swapBytesInPlace(b, 8);
    expect(Array.from(b)).toEqual([6, 5, 8, 7, 2, 1, 4, 3]);
  });
});

describe('zstdContentSize', () => {
  // Source: RFC 8878 §3.1.1.1 — magic 28 B5 2F FD, descriptor bits 7–6 FCS flag, bit 5 single segment.
  it('reads the frame content size or null', () => {
    expect(zstdContentSize(hex('28 B5 2F FD 20 0A 00'))).toBe(10); // single segment, 1-byte size
    expect(zstdContentSize(hex('28 B5 2F FD 60 00 01 00'))).toBe(256 + 256); // 2-byte size + 256
    expect(zstdContentSize(hex('28 B5 2F FD 00 58 00 00'))).toBeNull();
    expect(() => zstdContentSize(hex('78 9C 4B 04 00 00 79 00 79'))).toThrow(/bad magic number/);
  });
});

describe('parseShapeDescription', () => {
  // Source: tifffile writes {"shape": [...]} as the first page's description by default (from memory; checked
  // against files it wrote in test/tiff/fixtures.test.ts).
  it('reads [Z], [Z, C] and [T, Z, C] before Y and X, and samples before or after', () => {
    expect(parseShapeDescription('{"shape": [5, 17, 33]}', 33, 17, 1, 5)).toMatchObject({ sizeZ: 5, sizeC: 1, sizeT: 1 });
    expect(parseShapeDescription('{"shape": [3, 2, 17, 33]}', 33, 17, 1, 6)).toMatchObject({ sizeZ: 3, sizeC: 2, sizeT: 1 });
    expect(parseShapeDescription('{"shape": [4, 3, 2, 17, 33]}', 33, 17, 1, 24)).toMatchObject({ sizeZ: 3, sizeC: 2, sizeT: 4 });
    expect(parseShapeDescription('{"shape": [3, 17, 33, 2]}', 33, 17, 2, 3)).toMatchObject({ sizeZ: 3, sizeC: 1 });
    expect(parseShapeDescription('{"shape": [3, 2, 17, 33]}', 33, 17, 2, 3)).toMatchObject({ sizeZ: 3, sizeC: 1 });
  });

  it('is null for other text, another image size or a page count that does not fit', () => {
    expect(parseShapeDescription('ImageJ=1.54', 33, 17, 1, 1)).toBeNull();
    expect(parseShapeDescription('{"shape": [3, 2, 17, 32]}', 33, 17, 1, 6)).toBeNull();
    expect(parseShapeDescription('{"shape": [3, 2, 17, 33]}', 33, 17, 1, 5)).toBeNull();
    expect(parseShapeDescription('{"shape": [3, 2', 33, 17, 1, 6)).toBeNull();
  });
});

describe('unsupportedCompression', () => {
  // Source: TIFF 6.0 §3 and the TIFF tag registry's Compression values (34712 JPEG 2000, 50001 WebP; from memory).
  it('names an unknown compression by number and, where known, name', () => {
    expect(unsupportedCompression(5)).toBeNull();
    expect(unsupportedCompression(50000)).toBeNull();
    expect(unsupportedCompression(34712)).toBe('compression 34712 (JPEG 2000) is not supported (Eggline reads none, LZW, PackBits, Deflate, LZMA, Zstandard and JPEG)');
    expect(unsupportedCompression(12345)).toMatch(/^compression 12345 is not supported/);
  });
});

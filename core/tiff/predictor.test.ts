import { describe, expect, it } from 'vitest';
import { undoHorizontalPredictor } from './predictor';

const u16 = (values: number[], le: boolean) => {
  const buf = new ArrayBuffer(values.length * 2);
  values.forEach((v, i) => new DataView(buf).setUint16(i * 2, v, le));
  return buf;
};
const readU16 = (buf: ArrayBuffer, le: boolean) => Array.from({ length: buf.byteLength / 2 }, (_, i) => new DataView(buf).getUint16(i * 2, le));

describe('undoHorizontalPredictor', () => {
  // Source: TIFF 6.0 §14 (each sample stored as the difference from the previous sample in the row, modulo 2^n).
  it('sums differences per row for 8-bit samples and wraps modulo 256', () => {
    const block = new Uint8Array([10, 5, 250, 10, /* row 2 */ 1, 1, 1, 1]).buffer;
    const out = new Uint8Array(undoHorizontalPredictor(block, { widthPx: 4, bitsPerSample: 8, stride: 1, littleEndian: true }));
    expect(Array.from(out)).toEqual([10, 15, 9, 19, 1, 2, 3, 4]);
    expect(Array.from(new Uint8Array(block))).toEqual([10, 5, 250, 10, 1, 1, 1, 1]); // input unchanged
  });

  // Source: libtiff tif_predict.c (16-bit accumulation after byte swapping) — carries must follow the file's byte order.
  it('carries correctly in big-endian and little-endian 16-bit data', () => {
    for (const le of [true, false]) {
      const out = undoHorizontalPredictor(u16([0x00ff, 0x0001, 0xffff, 0x0100], le), { widthPx: 4, bitsPerSample: 16, stride: 1, littleEndian: le });
      expect(readU16(out, le)).toEqual([0x00ff, 0x0100, 0x00ff, 0x01ff]);
    }
  });

  it('differences interleaved samples with their own kind (stride 2) and stops at a short last row', () => {
    const out = undoHorizontalPredictor(u16([1, 100, 1, 100, 1, 100, 7], false), { widthPx: 3, bitsPerSample: 16, stride: 2, littleEndian: false });
    expect(readU16(out, false)).toEqual([1, 100, 2, 200, 3, 300, 7]);
  });

  it('handles 32-bit wrap-around and rejects odd bit depths', () => {
    const buf = new ArrayBuffer(8);
    new DataView(buf).setUint32(0, 0xffffffff, false);
    new DataView(buf).setUint32(4, 2, false);
    const out = undoHorizontalPredictor(buf, { widthPx: 2, bitsPerSample: 32, stride: 1, littleEndian: false });
    expect(new DataView(out).getUint32(4, false)).toBe(1);
    expect(() => undoHorizontalPredictor(buf, { widthPx: 2, bitsPerSample: 12, stride: 1, littleEndian: true })).toThrow('horizontal predictor with 12-bit samples is not supported');
  });
});

import { describe, expect, it } from 'vitest';
import type { ImageLayout } from './layout';
import { sampleTypeOf } from './sample-type';
import { describeCompression } from './compression';

const layout = (bits: number[], sampleFormat: number): ImageLayout => ({
  widthPx: 1, heightPx: 1, bitsPerSample: bits, samplesPerPixel: bits.length, sampleFormat, compression: 1, predictor: 1,
  planarConfiguration: 1, photometric: 1, newSubfileType: 0, tiled: false, xResolution: null, yResolution: null, resolutionUnit: 2, chunkCount: 1,
});

describe('sampleTypeOf', () => {
  // Source: TIFF 6.0 §19 (SampleFormat 1 unsigned, 2 signed, 3 IEEE float; 5/6 complex in later extensions).
  it('maps SampleFormat × BitsPerSample', () => {
    expect(sampleTypeOf(layout([8], 1), 'a')).toBe('uint8');
    expect(sampleTypeOf(layout([8], 2), 'a')).toBe('int8');
    expect(sampleTypeOf(layout([16], 1), 'a')).toBe('uint16');
    expect(sampleTypeOf(layout([16], 2), 'a')).toBe('int16');
    expect(sampleTypeOf(layout([32], 1), 'a')).toBe('uint32');
    expect(sampleTypeOf(layout([32], 2), 'a')).toBe('int32');
    expect(sampleTypeOf(layout([32], 3), 'a')).toBe('float32');
    expect(sampleTypeOf(layout([64], 3), 'a')).toBe('float64');
    expect(sampleTypeOf(layout([16, 16, 16], 1), 'a')).toBe('uint16');
  });

  it('rejects 1-bit, 64-bit integers, complex, half floats and mixed depths with exact messages', () => {
    expect(() => sampleTypeOf(layout([1], 1), 'b.tif')).toThrow('b.tif: 1-bit (bilevel) images are not supported');
    expect(() => sampleTypeOf(layout([64], 1), 'b.tif')).toThrow('b.tif: 64-bit unsigned samples are not supported');
    expect(() => sampleTypeOf(layout([64], 6), 'b.tif')).toThrow('b.tif: complex samples (64-bit) not supported');
    expect(() => sampleTypeOf(layout([16], 3), 'b.tif')).toThrow('b.tif: 16-bit float samples are not supported');
    expect(() => sampleTypeOf(layout([8, 16], 1), 'b.tif')).toThrow('b.tif: samples of different bit depths (8, 16) are not supported');
  });
});

describe('describeCompression', () => {
  // Source: TIFF 6.0 §3 (1 none), §13 (5 LZW), §9 (32773 PackBits), §14 (Predictor 2); Adobe TIFF Technical Notes (8 Deflate, Predictor 3).
  it('names compression and predictor', () => {
    expect(describeCompression(1, 1)).toBe('none');
    expect(describeCompression(5, 2)).toBe('LZW + horizontal predictor');
    expect(describeCompression(8, 3)).toBe('Deflate + floating-point predictor');
    expect(describeCompression(32946, 1)).toBe('Deflate');
    expect(describeCompression(32773, 1)).toBe('PackBits');
    expect(describeCompression(4242, 1)).toBe('compression 4242');
  });
});

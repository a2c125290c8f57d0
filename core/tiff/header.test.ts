import { describe, expect, it } from 'vitest';
import { memoryByteSource } from './byte-source';
import { readTiffHeader } from './header';

const src = (bytes: number[]) => memoryByteSource(new Uint8Array(bytes));

describe('readTiffHeader', () => {
  // Source: TIFF 6.0 §2 (bytes 0–1 "II"/"MM", 42, 4-byte offset of IFD 0).
  it('reads classic little- and big-endian headers', async () => {
    const ii = [0x49, 0x49, 42, 0, 8, 0, 0, 0, ...new Array(8).fill(0)];
    const mm = [0x4d, 0x4d, 0, 42, 0, 0, 0, 8, ...new Array(8).fill(0)];
    expect(await readTiffHeader(src(ii), 'a.tif')).toEqual({ littleEndian: true, bigTiff: false, firstIfdOffset: 8 });
    expect(await readTiffHeader(src(mm), 'a.tif')).toEqual({ littleEndian: false, bigTiff: false, firstIfdOffset: 8 });
  });

  // Source: BigTIFF design (43, bytesize 8, 0, then an 8-byte offset).
  it('reads a BigTIFF header', async () => {
    const big = [0x49, 0x49, 43, 0, 8, 0, 0, 0, 16, 0, 0, 0, 0, 0, 0, 0, ...new Array(8).fill(0)];
    expect(await readTiffHeader(src(big), 'b.tif')).toEqual({ littleEndian: true, bigTiff: true, firstIfdOffset: 16 });
  });

  it('names the first bytes of a non-TIFF file', async () => {
    // Source: PNG specification §5.2 (signature 89 50 4E 47 0D 0A 1A 0A).
    await expect(readTiffHeader(src([0x89, 0x50, 0x4e, 0x47, 13, 10, 26, 10]), 'embryo3.tif')).rejects.toMatchObject({
      code: 'not-tiff', message: 'embryo3.tif: not a TIFF file (first bytes are 89 50 4E 47)',
    });
  });

  it('rejects empty, short and wrong-version files with exact messages', async () => {
    await expect(readTiffHeader(src([]), 'e.tif')).rejects.toMatchObject({ code: 'empty', message: 'e.tif: empty file (0 bytes)' });
    await expect(readTiffHeader(src([0x49, 0x49, 42, 0, 8]), 'h.tif')).rejects.toMatchObject({
      code: 'truncated', message: 'h.tif: file ends inside the TIFF header (5 bytes)',
    });
    await expect(readTiffHeader(src([0x49, 0x49, 41, 0, 8, 0, 0, 0]), 'v.tif')).rejects.toMatchObject({
      code: 'not-tiff', message: 'v.tif: not a TIFF file (byte order II but version 41, expected 42 or 43)',
    });
    await expect(readTiffHeader(src([0x49, 0x49, 42, 0, 0, 0, 0, 0]), 'z.tif')).rejects.toMatchObject({
      code: 'empty', message: 'z.tif: contains no images (first IFD offset is 0)',
    });
    await expect(readTiffHeader(src([0x49, 0x49, 42, 0, 0xff, 0, 0, 0]), 'o.tif')).rejects.toMatchObject({
      code: 'truncated', message: 'o.tif: file ends after the TIFF header (8 bytes)',
    });
    await expect(readTiffHeader(src([0x49, 0x49, 42, 0, 0xff, 0, 0, 0, 0, 0]), 'o.tif')).rejects.toMatchObject({
      code: 'bad-offset', message: 'o.tif: first IFD offset 255 is outside the file (10 bytes)',
    });
  });
});

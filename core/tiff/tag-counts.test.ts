import { describe, expect, it } from 'vitest';
import { memoryByteSource } from './byte-source';
import { readTiffHeader } from './header';
import { readIfdChain } from './ifd';
import { tinyTiff, type TinyEntry } from './tiny-tiff';

// Demo data: tiny one-IFD files; the allowed counts are the specification's.
const base: TinyEntry[] = [
  { tag: 256, type: 3, values: [4] }, { tag: 257, type: 3, values: [2] }, { tag: 258, type: 3, values: [16] },
];

async function read(entries: TinyEntry[], opts: { bigTiff?: boolean; tail?: Uint8Array } = {}) {
  const source = memoryByteSource(tinyTiff(entries, opts));
  return readIfdChain(source, await readTiffHeader(source, 'x.tif'), 'x.tif');
}

describe('tag counts', () => {
  it('accepts the counts TIFF 6.0 gives', async () => {
    // Source: TIFF 6.0 §8: BitsPerSample N = SamplesPerPixel; PageNumber N = 2.
    await expect(read([...base, { tag: 277, type: 3, values: [3] }, { tag: 297, type: 3, values: [0, 1] }])).resolves.toHaveLength(1);
  });
  it('refuses a one-value tag with more values, naming the tag and the limit', async () => {
    // Source: TIFF 6.0 §8, Compression: "N = 1".
    await expect(read([...base, { tag: 259, type: 3, values: [1, 1, 1] }])).rejects.toMatchObject({
      code: 'bad-tag', message: 'x.tif: IFD 0: Compression (259) has 3 values, TIFF 6.0 allows one (damaged tag entry)',
    });
  });
  it('refuses an inflated count before reading the value, in TIFF and BigTIFF', async () => {
    // A count patched to 2**31 − 1 (demo data), as damage to the entry's count field.
    const inflated = { tag: 277, type: 3, raw: new Uint8Array(2), count: 2 ** 31 - 1 };
    await expect(read([...base, inflated])).rejects.toMatchObject({
      code: 'bad-tag', message: 'x.tif: IFD 0: SamplesPerPixel (277) has 2147483647 values, TIFF 6.0 allows one (damaged tag entry)',
    });
    await expect(read([...base, { tag: 339, type: 3, raw: new Uint8Array(2), count: 70000 }], { bigTiff: true })).rejects.toMatchObject({
      message: 'x.tif: IFD 0: SampleFormat (339) has 70000 values, TIFF 6.0 allows at most 65535 (damaged tag entry)',
    });
  });
  it('refuses any tag whose values would be larger than the whole file', async () => {
    await expect(read([...base, { tag: 270, type: 2, raw: new Uint8Array(8), count: 1_000_000 }])).rejects.toMatchObject({
      code: 'bad-tag', message: expect.stringMatching(/^x\.tif: IFD 0: tag 270 has 1000000 values \(1000000 bytes\), more than the whole file \(\d+ bytes; damaged tag entry\)$/),
    });
  });
});

import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { memoryByteSource, readChunkPlan, readIfdChain, readTiffHeader } from '../../core/tiff';
import { hasTiffcp, makeTiffFixtures } from '../../scripts/make-tiff-fixtures';
import { decodeLzmaChunk, xzDeclaredSize } from './lzma-codec';

beforeAll(() => { makeTiffFixtures(); });

describe.runIf(hasTiffcp())('LZMA chunks written by libtiff (tiffcp -c lzma:2)', () => {
  // Source: xz file format 1.0.4 §4 (Index records hold each block's uncompressed size); the strip is 33×17 uint16
  // rows, 1122 bytes, as TIFF 6.0 §8 gives for one strip of the whole image.
  it('reads the declared size from the stream index and refuses a chunk too small before decoding', async () => {
    const bytes = new Uint8Array(readFileSync(join(__dirname, '../../test/fixtures/generated/tiff/uint16-lzma2.tif')));
    const source = memoryByteSource(bytes);
    const header = await readTiffHeader(source, 'x');
    const plan = await readChunkPlan(source, header, (await readIfdChain(source, header, 'x'))[0], 'x');
    const strip = bytes.subarray(plan.offsets[0], plan.offsets[0] + plan.byteCounts[0]);
    expect(xzDeclaredSize(strip)).toBe(1122);
    await expect(decodeLzmaChunk(strip, new Uint8Array(100))).rejects.toThrow('the stream declares 1122 bytes, more than the chunk\'s 100');
    expect(await decodeLzmaChunk(strip, new Uint8Array(1122))).toBe(1122);
    expect(() => xzDeclaredSize(Uint8Array.from([1, 2, 3]))).toThrow(/not an xz stream/);
  });
});

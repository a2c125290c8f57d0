// OME-Zarr stores written by Python's zarr 2 and numcodecs (an independent writer) from the pixels of an OME-TIFF:
// every plane must match the TIFF's pixel for pixel, and the analysis must give the same result.
import { cpSync, existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openStackForAnalysis, openZarrFirstPicture, readPreviewPlane, type OpenedStack } from '../../app/decode';
import { bloscChunkThread } from '../../app/decode/zarr-chunk-thread';
import { inflateZarrChunk, openZarrFolderStore, readBloscChunkFile } from '../../core/io';
import type { EmbryoResult } from '../../core/model';
import { analyseStack } from '../../core/pipeline';
import { decodeBloscLz4, firstPictureLevel, openOmeZarr } from '../../core/zarr';
import Blosc from 'numcodecs/blosc';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { allPlanes, comparableResult as comparable, pythonZarrMissing, REFERENCE, writePythonStores, writeReferenceTiff } from './stack-fixture';

const missing = pythonZarrMissing();
const dir = mkdtempSync(join(tmpdir(), 'eggline-zarr-py-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

// Source: the stores below are written by Debian's python3-zarr 2.13 and python3-numcodecs 0.11 through
// scripts/make-zarr-fixtures.py, one per codec, chunk layout and key separator; the pixels come from tifffile.
const CASES = [
  'blosc-lz4', 'blosc-lz4hc', 'blosc-zstd', 'blosc-zlib', 'blosc-blosclz', 'zlib', 'gzip', 'zstd', 'none',
  'blosc-lz4-slash-tiles', 'zlib-czyx-whole-stack', 'zstd-slash-f-order', 'blosc-lz4-pyramid',
];
const settings = { ...DEFAULT_SETTINGS, boundaryChannels: [2] };

describe.skipIf(missing !== null)(`OME-Zarr written by Python's zarr${missing ? ` (skipped: ${missing})` : ''}`, () => {
  let tiff: OpenedStack;
  let tiffPlanes: number[][];
  let tiffResult: EmbryoResult;

  beforeAll(async () => {
    const { path } = writeReferenceTiff(dir);
    expect(writePythonStores(path, dir)).toEqual(CASES);
    tiff = await openStackForAnalysis(path, 'reference.ome.tif');
    tiffPlanes = await allPlanes(tiff);
    tiffResult = await analyseStack(tiff.info, tiff.source, settings, { fileLabel: 'reference.ome.tif' });
    expect(tiffResult.status).toBe('ok');
  }, 60_000);

  it.each(CASES)('%s: same dimensions, channels and pixel size as the OME-TIFF', async (name) => {
    const zarr = await openStackForAnalysis(join(dir, `${name}.ome.zarr`), `${name}.ome.zarr`);
    const { info } = zarr;
    expect([info.sizeX, info.sizeY, info.sizeZ, info.sizeC, info.sizeT]).toEqual([tiff.info.sizeX, tiff.info.sizeY, 3, 2, 1]);
    expect(info.sampleType).toBe('uint16');
    expect(info.channelNames).toEqual(REFERENCE.channels);
    expect(info.pixelSize).toEqual({ xUm: REFERENCE.pixelSizeUm, yUm: REFERENCE.pixelSizeUm, zUm: REFERENCE.zStepUm, source: 'ome-zarr' });
    expect(zarr.warnings).toEqual([]);
    await zarr.source.close();
  });

  it('decodes the type-size-2 byte-shuffled Blosc-LZ4 chunks Python writes with the TypeScript path, as c-blosc does', async () => {
    for (const name of ['blosc-lz4', 'blosc-lz4hc']) {
      const chunk = new Uint8Array(readFileSync(join(dir, `${name}.ome.zarr`, '0', '0.1.2.0.0')));
      expect([chunk[2] & 0x1, chunk[3], chunk[2] >> 5]).toEqual([1, 2, 1]); // byte shuffle, type size 2, LZ4 inside
      const ours = decodeBloscLz4(chunk);
      const reference = await Blosc.fromConfig({ id: 'blosc', cname: 'lz4', clevel: 5, shuffle: 1 }).decode(chunk);
      expect(Buffer.from(ours!).equals(Buffer.from(reference))).toBe(true);
    }
  });

  it.each(CASES)('%s: pixel-identical planes and the same analysis result', async (name) => {
    const zarr = await openStackForAnalysis(join(dir, `${name}.ome.zarr`), `${name}.ome.zarr`);
    expect(await allPlanes(zarr)).toEqual(tiffPlanes);
    const result = await analyseStack(zarr.info, zarr.source, settings, { fileLabel: `${name}.ome.zarr` });
    expect(result.pixelSizeSource).toBe('ome-zarr');
    expect(comparable(result)).toEqual(comparable(tiffResult));
    await zarr.source.close();
  });
});

// The same stores read past zarrita: each Blosc chunk file read and decoded by readBloscChunkFile, in this thread and
// on the built chunk thread (dist/zarr-chunk-worker.mjs, after `npm run build`), as `eggline batch` reads them.
const BLOSC_CASES = ['blosc-lz4', 'blosc-lz4hc', 'blosc-lz4-slash-tiles', 'blosc-zstd'];
const builtWorker = resolve('dist/zarr-chunk-worker.mjs');
const readers: [string, () => ((path: string, maxBytes: number) => Promise<Uint8Array | undefined | null>) | null][] = [
  ['this thread', () => async (path, maxBytes) => readBloscChunkFile(path, maxBytes)],
  [existsSync(builtWorker) ? 'the chunk thread' : 'the chunk thread (skipped: run npm run build first)', () => (existsSync(builtWorker) ? bloscChunkThread(builtWorker) : null)],
];

describe.skipIf(missing !== null)('OME-Zarr Blosc chunks decoded past zarrita', () => {
  let tiffPlanes: number[][];
  let tiffResult: EmbryoResult;
  beforeAll(async () => {
    const tiff = await openStackForAnalysis(join(dir, 'reference.ome.tif'), 'reference.ome.tif');
    tiffPlanes = await allPlanes(tiff);
    tiffResult = await analyseStack(tiff.info, tiff.source, settings, { fileLabel: 'reference.ome.tif' });
    await tiff.source.close();
  }, 60_000);

  it.each(readers)('in %s: pixel-identical planes and the same analysis result; other inner compressors go to zarrita', async (_, make) => {
    const read = make();
    if (!read) return;
    for (const name of BLOSC_CASES) {
      const answers: string[] = [];
      const counted = async (path: string, maxBytes: number) => {
        const r = await read(path, maxBytes);
        answers.push(r === null ? 'other' : r === undefined ? 'missing' : 'bytes');
        return r;
      };
      const store = await openZarrFolderStore(join(dir, `${name}.ome.zarr`), name, { readBloscFile: counted });
      const zarr = await openOmeZarr(store, `${name}.ome.zarr`, { inflate: inflateZarrChunk });
      expect(await allPlanes(zarr)).toEqual(tiffPlanes);
      const result = await analyseStack(zarr.info, zarr.source, settings, { fileLabel: `${name}.ome.zarr` });
      expect(comparable(result)).toEqual(comparable(tiffResult));
      expect(new Set(answers)).toEqual(new Set([name === 'blosc-zstd' ? 'other' : 'bytes']));
      await zarr.source.close();
    }
  });

  it('a damaged or missing chunk file gives one line naming the store and the chunk', async () => {
    const copy = join(dir, 'damaged-lz4.ome.zarr');
    cpSync(join(dir, 'blosc-lz4.ome.zarr'), copy, { recursive: true });
    const chunk = join(copy, '0', '0.0.1.0.0');
    writeFileSync(chunk, readFileSync(chunk).subarray(0, 200));
    rmSync(join(copy, '0', '0.1.1.0.0'));
    const store = await openZarrFolderStore(copy, 'damaged-lz4.ome.zarr', { readBloscFile: async (p, m) => readBloscChunkFile(p, m) });
    const zarr = await openOmeZarr(store, 'damaged-lz4.ome.zarr', { inflate: inflateZarrChunk });
    await expect(zarr.source.readPlane(1, 0, 0)).rejects.toThrow(/^damaged-lz4\.ome\.zarr: chunk \(0, 0, 1, 0, 0\) cannot be decoded: (Blosc stream is cut short|an LZ4 block .*)$/);
    expect(Array.from((await zarr.source.readPlane(1, 1, 0)).data).every((v) => v === 0)).toBe(true);
    expect(zarr.warnings).toEqual(['damaged-lz4.ome.zarr: 1 chunk(s) missing (first 0/0.1.1.0.0); read as the fill value']);
    await zarr.source.close();
  });
});

describe.skipIf(missing !== null)('OME-Zarr resolution levels for the first picture', () => {
  // Source: NGFF 0.4 multiscales — datasets ordered from the highest resolution down, each with its own scale; the
  // pyramid written by Python's zarr holds levels 1 and 2 as numpy's [::2, ::2] and [::4, ::4] of the 200×130 stack.
  const name = 'blosc-lz4-pyramid';
  const path = () => join(dir, `${name}.ome.zarr`);

  it('picks the coarsest level that still fills the view, and full resolution when no lower level does', async () => {
    const store = await openZarrFolderStore(path(), name);
    expect(await firstPictureLevel(store, name, 200, 130)).toBe(0);
    expect(await firstPictureLevel(store, name, 101, 60)).toBe(0); // level 1 is 100 px wide
    expect(await firstPictureLevel(store, name, 100, 65)).toBe(1);
    expect(await firstPictureLevel(store, name, 50, 33)).toBe(2); // level 2: 50 × 33
    expect(await firstPictureLevel(store, name, 10, 10)).toBe(2);
    expect(await openZarrFirstPicture(path(), name, 400, 300)).toBeNull();
  });

  it('opens a lower level with its own pixels and pixel size; analysis still reads level 0', async () => {
    const tiff = await openStackForAnalysis(join(dir, 'reference.ome.tif'), 'reference.ome.tif');
    const full = await allPlanes(tiff);
    await tiff.source.close();
    const low = await openZarrFirstPicture(path(), name, 60, 40);
    expect(low).not.toBeNull();
    expect(low!.details.arrayPath).toBe('1');
    expect([low!.info.sizeX, low!.info.sizeY]).toEqual([100, 65]);
    expect(low!.info.pixelSize).toMatchObject({ xUm: 2 * REFERENCE.pixelSizeUm, yUm: 2 * REFERENCE.pixelSizeUm });
    const subsampled = full.map((plane) => plane.filter((_, i) => Math.floor(i / 200) % 2 === 0 && (i % 200) % 2 === 0));
    expect(await allPlanes(low!)).toEqual(subsampled);
    await low!.source.close();
    // The window's first picture: the middle slice of the first channel, from the level that fills the view.
    const preview = await readPreviewPlane(path(), name, 0, { width: 60, height: 40 });
    expect([preview.width, preview.height, preview.z]).toEqual([100, 65, 1]);
    expect(Array.from(preview.data)).toEqual(subsampled[1 * 2 + 0]);
    const fullPreview = await readPreviewPlane(path(), name);
    expect([fullPreview.width, fullPreview.height]).toEqual([200, 130]);
    const analysed = await openStackForAnalysis(path(), name);
    expect([analysed.info.sizeX, analysed.info.sizeY]).toEqual([200, 130]);
    await analysed.source.close();
  });
});

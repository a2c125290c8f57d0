// OME-Zarr stores in Zarr v3 with NGFF 0.5 metadata, written by zarrita (scripts/make-zarr-v3-fixtures.ts) from the
// pixels of an OME-TIFF: every plane must match the TIFF's pixel for pixel, and the analysis must give the same result.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openStackForAnalysis, openZarrStack, type OpenedStack } from '../../app/decode';
import { inflateZarrChunk, openZarrFolderStore, readBloscChunkFile } from '../../core/io';
import type { EmbryoResult } from '../../core/model';
import { openOmeZarr } from '../../core/zarr';
import { analyseStack } from '../../core/pipeline';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { V3_CASES, writeV3Store } from '../../scripts/make-zarr-v3-fixtures';
import { allPlanes, comparableResult, REFERENCE, v3Source, writeReferenceTiff } from './stack-fixture';

const dir = mkdtempSync(join(tmpdir(), 'eggline-zarr-v3-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const CASES = Object.keys(V3_CASES);
const settings = { ...DEFAULT_SETTINGS, boundaryChannels: [2] };

describe('OME-Zarr (Zarr v3, NGFF 0.5) written by zarrita', () => {
  let tiffPlanes: number[][];
  let tiffResult: EmbryoResult;

  beforeAll(async () => {
    const { path, embryo } = writeReferenceTiff(dir);
    for (const name of CASES) await writeV3Store(v3Source(embryo), dir, name);
    const tiff: OpenedStack = await openStackForAnalysis(path, 'reference.ome.tif');
    tiffPlanes = await allPlanes(tiff);
    tiffResult = await analyseStack(tiff.info, tiff.source, settings, { fileLabel: 'reference.ome.tif' });
    expect(tiffResult.status).toBe('ok');
  }, 60_000);

  it.each(CASES)('%s: metadata, pixel-identical planes and the same analysis result', async (name) => {
    const zarr = await openStackForAnalysis(join(dir, `${name}.ome.zarr`), `${name}.ome.zarr`);
    expect([zarr.info.sizeZ, zarr.info.sizeC, zarr.info.sizeT]).toEqual([3, 2, 1]);
    expect(zarr.info.channelNames).toEqual(REFERENCE.channels);
    // Source: NGFF 0.5 — scale [.., z, y, x] with unit "micrometer" gives the voxel size in µm.
    expect(zarr.info.pixelSize).toEqual({ xUm: REFERENCE.pixelSizeUm, yUm: REFERENCE.pixelSizeUm, zUm: REFERENCE.zStepUm, source: 'ome-zarr' });
    expect(await allPlanes(zarr)).toEqual(tiffPlanes);
    const result = await analyseStack(zarr.info, zarr.source, settings, { fileLabel: `${name}.ome.zarr` });
    expect(comparableResult(result)).toEqual(comparableResult(tiffResult));
    expect(zarr.warnings).toEqual([]);
    await zarr.source.close();
  });

  it('v3-blosc-lz4 read past zarrita (chunk keys c/…, each chunk file decoded by readBloscChunkFile): the same planes', async () => {
    // Source: Zarr v3.0 core specification — chunk key encoding "default": "c" then the indices joined by "/".
    const keys: string[] = [];
    const store = await openZarrFolderStore(join(dir, 'v3-blosc-lz4.ome.zarr'), 'v3-blosc-lz4', {
      readBloscFile: async (path, maxBytes) => { keys.push(relative(dir, path)); return readBloscChunkFile(path, maxBytes); },
    });
    const zarr = await openOmeZarr(store, 'v3-blosc-lz4.ome.zarr', { inflate: inflateZarrChunk });
    expect(await allPlanes(zarr)).toEqual(tiffPlanes);
    expect(keys).toContain(join('v3-blosc-lz4.ome.zarr', '0', 'c', '0', '1', '2', '0', '0'));
    await zarr.source.close();
  });

  it('reports the Zarr and NGFF versions, codecs, chunk shape and separator', async () => {
    const blosc = await openZarrStack(join(dir, 'v3-blosc-lz4.ome.zarr'), 'v3-blosc-lz4.ome.zarr');
    expect(blosc.details).toMatchObject({ zarrFormat: 3, ngffVersion: '0.5', arrayPath: '0', separator: '/', codecs: 'bytes (little) → blosc (lz4, level 5, shuffle)' });
    const zstd = await openZarrStack(join(dir, 'v3-zstd-dot.ome.zarr'), 'v3-zstd-dot.ome.zarr');
    expect(zstd.details).toMatchObject({ separator: '.', chunks: [1, 1, 1, 64, 64], codecs: 'bytes (little) → zstd (level 3)' });
    await Promise.all([blosc.source.close(), zstd.source.close()]);
  });
});

// `eggline batch` and `eggline inspect` on a folder of OME-Zarr stores, good and bad (demo data): each store is one
// row, bad ones get one line naming the store, and the batch goes on.
import { cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, unlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { deflateSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseCsv } from '../../core/csv';
import { writeV3Store } from '../../scripts/make-zarr-v3-fixtures';
import { cli, ensureBuilt } from '../cli/helpers';
import { v3Source, writeReferenceTiff } from './stack-fixture';

const dir = mkdtempSync(join(tmpdir(), 'eggline-zarr-batch-'));
const input = join(dir, 'in');
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Writes `files` (relative path → JSON value or bytes) under `root`. */
function writeTree(root: string, files: Record<string, unknown>): void {
  for (const [rel, value] of Object.entries(files)) {
    const path = join(root, rel);
    mkdirSync(join(path, '..'), { recursive: true });
    writeFileSync(path, value instanceof Uint8Array ? value : JSON.stringify(value));
  }
}

const ngff = { multiscales: [{ version: '0.4', axes: [{ name: 'y', type: 'space' }, { name: 'x', type: 'space' }], datasets: [{ path: '0' }] }] };

beforeAll(async () => {
  ensureBuilt();
  mkdirSync(input, { recursive: true });
  const { embryo } = writeReferenceTiff(input);
  await writeV3Store(v3Source(embryo), input, 'v3-blosc-lz4');
  cpSync(join(input, 'v3-blosc-lz4.ome.zarr'), join(input, 'sub', 'missing-chunk.ome.zarr'), { recursive: true });
  unlinkSync(join(input, 'sub', 'missing-chunk.ome.zarr', '0', 'c', '0', '1', '2', '0', '0'));
  writeTree(join(input, 'not-ngff.zarr'), { '.zgroup': { zarr_format: 2 } });
  writeTree(join(input, 'malformed.ome.zarr'), { '.zgroup': { zarr_format: 2 }, '.zattrs': new TextEncoder().encode('{"multiscales": [') });
  writeTree(join(input, 'plate.ome.zarr'), { '.zgroup': { zarr_format: 2 }, '.zattrs': { plate: { rows: [{ name: 'A' }], columns: [{ name: '1' }], wells: [{ path: 'A/1' }] } } });
  // A zlib chunk of 4×6 uint16 (48 bytes) that inflates to 10 MB.
  writeTree(join(input, 'bomb.ome.zarr'), {
    '.zgroup': { zarr_format: 2 }, '.zattrs': ngff,
    '0/.zarray': { zarr_format: 2, shape: [4, 6], chunks: [4, 6], dtype: '<u2', compressor: { id: 'zlib', level: 1 }, fill_value: 0, order: 'C', filters: null },
    '0/0.0': new Uint8Array(deflateSync(new Uint8Array(10 << 20))),
  });
}, 120_000);

describe('eggline batch over OME-Zarr stores', () => {
  it('analyses each store as one stack, reports bad ones in one line each, and goes on', async () => {
    const out = join(dir, 'out');
    const r = await cli(['batch', input, '--out', out, '--jobs', '2', '--boundary-channel', '2']);
    expect(r.code).toBe(1);
    const [header, ...rows] = parseCsv(readFileSync(join(out, 'embryos.csv'), 'utf8'));
    const byFile = Object.fromEntries(rows.map((row) => [row[header.indexOf('file')], Object.fromEntries(header.map((h, i) => [h, row[i]]))]));
    expect(Object.keys(byFile)).toEqual([
      'bomb.ome.zarr', 'malformed.ome.zarr', 'not-ngff.zarr', 'plate.ome.zarr', 'reference.ome.tif', 'sub/missing-chunk.ome.zarr', 'v3-blosc-lz4.ome.zarr',
    ]);
    expect(byFile['v3-blosc-lz4.ome.zarr']).toMatchObject({ status: 'ok', pixel_size_source: 'ome-zarr', lambda_um: byFile['reference.ome.tif'].lambda_um });
    expect(byFile['sub/missing-chunk.ome.zarr'].status).toBe('ok');
    expect(byFile['sub/missing-chunk.ome.zarr'].warnings).toContain('sub/missing-chunk.ome.zarr: 1 chunk(s) missing (first 0/c/0/1/2/0/0); read as the fill value');
    expect(byFile['plate.ome.zarr'].error).toBe('plate.ome.zarr: is an OME-Zarr plate (several wells and fields); plates are not read yet');
    expect(byFile['not-ngff.zarr'].error).toBe('not-ngff.zarr: has no .zattrs (no NGFF metadata): not an OME-Zarr image');
    expect(byFile['malformed.ome.zarr'].error).toMatch(/^malformed\.ome\.zarr: \.zattrs is not valid JSON \(.+\)$/);
    expect(byFile['bomb.ome.zarr'].error).toBe('bomb.ome.zarr: chunk (0, 0) cannot be decoded: zlib stream holds more than the chunk\'s 48 bytes');
    const run = JSON.parse(readFileSync(join(out, 'run.json'), 'utf8'));
    const store = run.inputs.find((i: { file: string }) => i.file === 'v3-blosc-lz4.ome.zarr');
    expect(store.sha256).toMatch(/^[0-9a-f]{64}$/);
  }, 180_000);

  it('inspect describes a store and names the problem of a bad one', async () => {
    const good = await cli(['inspect', join(input, 'v3-blosc-lz4.ome.zarr')]);
    expect(good.code).toBe(0);
    expect(good.stdout).toContain('format: OME-Zarr (NGFF 0.5, Zarr v3), full-resolution array "0" of 1 level');
    expect(good.stdout).toContain('pixel size: 3 µm × 3 µm, z step 2 µm (source: ome-zarr)');
    expect(good.stdout).toContain('chunk shape: 1 × 1 × 1 × 130 × 200 (chunk key separator "/")');
    expect(good.stdout).toContain('codecs: bytes (little) → blosc (lz4, level 5, shuffle)');
    const json = await cli(['inspect', '--json', join(input, 'v3-blosc-lz4.ome.zarr')]);
    expect(json.code).toBe(0);
    // The store's t axis has unit "second" and scale 1 (scripts/make-zarr-v3-fixtures.ts).
    expect(JSON.parse(json.stdout)).toMatchObject({
      format: 'OME-Zarr', sizeX: 200, sizeY: 130, sizeZ: 3, sizeC: 2, pixelSizeXUm: 3, pixelSizeSource: 'ome-zarr', zStepUm: 2,
      timeSource: 'ome-zarr', timesS: [0], zarr: { zarrFormat: 3, ngffVersion: '0.5', chunks: [1, 1, 1, 130, 200], codecs: 'bytes (little) → blosc (lz4, level 5, shuffle)' },
    });
    const plate = await cli(['inspect', join(input, 'plate.ome.zarr')]);
    expect(plate.code).toBe(1);
    expect(plate.stderr).toBe('eggline inspect: plate.ome.zarr: is an OME-Zarr plate (several wells and fields); plates are not read yet\n');
  }, 60_000);
});

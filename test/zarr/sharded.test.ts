// Sharded Zarr v3 stores (the sharding_indexed codec) laid out byte by byte from the specification by
// scripts/make-zarr-sharded-fixtures.py (Debian's Python, numpy, tifffile and numcodecs; neither Python's zarr 2.13
// nor zarrita writes shards) from the pixels of an OME-TIFF: planes pixel for pixel and the same analysis result.
import { mkdtempSync, readFileSync, rmSync, cpSync, writeFileSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openStackForAnalysis, openZarrStack } from '../../app/decode';
import type { EmbryoResult } from '../../core/model';
import { analyseStack } from '../../core/pipeline';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { allPlanes, comparableResult, PYTHON, pythonZarrMissing, REFERENCE, writeReferenceTiff } from './stack-fixture';

const missing = pythonZarrMissing();
const dir = mkdtempSync(join(tmpdir(), 'eggline-zarr-shards-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const settings = { ...DEFAULT_SETTINGS, boundaryChannels: [2] };

/** Runs the committed shard writer on the reference TIFF; returns the store names it wrote. */
function writeShardedStores(tiff: string): string[] {
  const script = join(__dirname, '../../scripts/make-zarr-sharded-fixtures.py');
  const r = spawnSync(PYTHON, [script, tiff, dir, '--pixel-size-um', String(REFERENCE.pixelSizeUm), '--z-step-um', String(REFERENCE.zStepUm),
    '--channels', REFERENCE.channels.join(',')], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`make-zarr-sharded-fixtures.py failed: ${r.stderr}`);
  return r.stdout.trim().split('\n');
}

describe.skipIf(missing !== null)(`sharded Zarr v3 (sharding_indexed codec)${missing ? ` (skipped: ${missing})` : ''}`, () => {
  let tiffPlanes: number[][];
  let tiffResult: EmbryoResult;

  beforeAll(async () => {
    const { path } = writeReferenceTiff(dir);
    expect(writeShardedStores(path)).toEqual(['v3-sharded', 'v3-sharded-blosc-start', 'v3-sharded-empty-chunk']);
    const tiff = await openStackForAnalysis(path, 'reference.ome.tif');
    tiffPlanes = await allPlanes(tiff);
    tiffResult = await analyseStack(tiff.info, tiff.source, settings, { fileLabel: 'reference.ome.tif' });
    await tiff.source.close();
  }, 60_000);

  // Source: Zarr v3.0 core specification and its sharding codec (sharding_indexed, version 1.0): index of
  // (offset, nbytes) uint64 pairs per inner chunk in C order, at the end (default) or the start of the shard,
  // optionally followed by a CRC-32C; 2^64 − 1 for an inner chunk not stored.
  it.each([
    ['v3-sharded', 'index at the end with CRC-32C, shards of 2 planes (the last one partly outside the array)'],
    ['v3-sharded-blosc-start', 'index at the start, Blosc-LZ4 inner chunks, one shard per time point'],
  ])('%s (%s): pixel-identical planes and the same analysis result', async (name) => {
    const zarr = await openStackForAnalysis(join(dir, `${name}.ome.zarr`), `${name}.ome.zarr`);
    expect(await allPlanes(zarr)).toEqual(tiffPlanes);
    const result = await analyseStack(zarr.info, zarr.source, settings, { fileLabel: `${name}.ome.zarr` });
    expect(comparableResult(result)).toEqual(comparableResult(tiffResult));
    expect(zarr.warnings).toEqual([]);
    await zarr.source.close();
  });

  it('reads an inner chunk the index marks as not stored (2^64 − 1) as the fill value; the rest as written', async () => {
    const zarr = await openStackForAnalysis(join(dir, 'v3-sharded-empty-chunk.ome.zarr'), 'v3-sharded-empty-chunk.ome.zarr');
    const planes = await allPlanes(zarr);
    // Planes in (z, c) order: the writer left out channel 1 (0-based) at z = 1.
    planes.forEach((p, i) => expect(p).toEqual(i === 1 * 2 + 1 ? tiffPlanes[i].map(() => 0) : tiffPlanes[i]));
    await zarr.source.close();
  });

  it('inspect names the sharding codec with its inner chunks and codecs', async () => {
    const zarr = await openZarrStack(join(dir, 'v3-sharded-blosc-start.ome.zarr'), 'v3-sharded-blosc-start.ome.zarr');
    expect(zarr.details.codecs).toBe(`sharding (inner chunks 1×1×1×${zarr.info.sizeY}×${zarr.info.sizeX}: bytes (little) → blosc (lz4, level 5, shuffle))`);
    await zarr.source.close();
  });

  /** A copy of a store with its shard at `shard` changed by `damage`. */
  function damaged(name: string, shard: string, damage: (bytes: Uint8Array) => Uint8Array): string {
    const copy = join(dir, `damaged-${Math.random().toString(36).slice(2)}-${name}.ome.zarr`);
    cpSync(join(dir, `${name}.ome.zarr`), copy, { recursive: true });
    const path = join(copy, '0', 'c', ...shard.split('/'));
    writeFileSync(path, damage(new Uint8Array(readFileSync(path))));
    return copy;
  }

  it('refuses a damaged shard index in one line naming the store, the chunk and the shard', async () => {
    // Demo damage on the writer's shards: cut to less than the index; an entry pointing past the end; an offset no
    // file can have (only its high bytes set to 2^64 − 1's).
    const cases: [string, (b: Uint8Array) => Uint8Array, RegExp][] = [
      ['cut', (b) => b.subarray(0, 20), /: chunk \(0, 0, 0, 0, 0\) cannot be decoded: shard 0\/c\/0\/0\/0\/0\/0 is 20 bytes, shorter than its 36-byte index$/],
      ['past the end', (b) => { const v = new DataView(b.buffer, b.byteOffset); v.setBigUint64(b.length - 36, BigInt(b.length), true); return b; },
        /: chunk \(0, 0, 0, 0, 0\) cannot be decoded: the index of shard 0\/c\/0\/0\/0\/0\/0 points past its end \(\d+ bytes at offset \d+\)$/],
      ['absurd offset', (b) => { const v = new DataView(b.buffer, b.byteOffset); v.setBigUint64(b.length - 36, 2n ** 63n, true); return b; },
        /: chunk \(0, 0, 0, 0, 0\) cannot be decoded: the index of shard 0\/c\/0\/0\/0\/0\/0 gives an offset or size no file can have/],
    ];
    for (const [, damage, message] of cases) {
      const path = damaged('v3-sharded', '0/0/0/0/0', damage);
      const zarr = await openStackForAnalysis(path, 'bad.ome.zarr');
      const error = await zarr.source.readPlane(0, 0, 0).then(() => null, (e: Error) => e.message);
      expect(error).toMatch(message);
      expect(error).toMatch(/^bad\.ome\.zarr: /);
      expect(error).not.toContain('\n');
      await zarr.source.close();
    }
  });
});

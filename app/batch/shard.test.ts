import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { writeV3Store } from '../../scripts/make-zarr-v3-fixtures';
import { v3Source, writeReferenceTiff } from '../../test/zarr/stack-fixture';
import { listStackFiles } from './list-stacks';
import { partDir, selectPart, sha256Text, workBytes } from './shard';

// Demo data: placeholder .tif files of chosen sizes (only their sizes matter here) and one OME-Zarr store.
const dir = mkdtempSync(join(tmpdir(), 'eggline-shard-'));
const input = join(dir, 'in');
const SIZES: Record<string, number> = { 'a.tif': 900, 'b.tif': 100, 'c.tif': 500, 'd/e.tif': 500, 'f.tif': 300, 'g.tif': 0 };
afterAll(() => rmSync(dir, { recursive: true, force: true }));

beforeAll(async () => {
  mkdirSync(join(input, 'd'), { recursive: true });
  for (const [name, bytes] of Object.entries(SIZES)) writeFileSync(join(input, name), new Uint8Array(bytes));
  const { embryo } = writeReferenceTiff(dir);
  await writeV3Store(v3Source(embryo), input, 'v3-bytes');
});

describe('workBytes', () => {
  it('is a file\'s size, and for an OME-Zarr store the decoded size its metadata declares', async () => {
    expect(await workBytes(join(input, 'a.tif'))).toBe(900);
    // Demo data: the store holds 200×130 px × 3 slices × 2 channels of uint16.
    expect(await workBytes(join(input, 'v3-bytes.ome.zarr'))).toBe(200 * 130 * 3 * 2 * 2);
    expect(await workBytes(join(input, 'gone.tif'))).toBe(0);
  });
});

describe('selectPart', () => {
  it('splits the sorted list by size into disjoint parts that cover it, with one input-list hash', async () => {
    const files = await listStackFiles(input);
    const parts = await Promise.all([1, 2, 3].map((k) => selectPart(files, { part: k, parts: 3 }, null)));
    // Worked by hand: the store (312000) → 1; a.tif (900) → 2; c.tif (500) → 3; d/e.tif (500) → 3 (500 < 900);
    // f.tif (300) → 2 (900 < 1000); b.tif (100) → 3 (1000 < 1200); g.tif (0) → 3 (1100 < 1200).
    expect(parts.map((p) => p.files.map((f) => f.file))).toEqual([['v3-bytes.ome.zarr'], ['a.tif', 'f.tif'], ['b.tif', 'c.tif', 'd/e.tif', 'g.tif']]);
    expect(new Set(parts.map((p) => p.info.inputListSha256)).size).toBe(1);
    expect(parts[0].info).toMatchObject({ part: 1, parts: 3, inputCount: 7, inputBytes: 2300 + 312000, projectSha256: null });
    const text = files.map((f) => `${f.file === 'v3-bytes.ome.zarr' ? 312000 : SIZES[f.file]}\t${f.file}\n`).join('');
    expect(parts[0].info.inputListSha256).toBe(sha256Text(text));
  });

  it('gives another input-list hash when a file changes size, and records the project file\'s hash', async () => {
    const before = await selectPart(await listStackFiles(input), { part: 1, parts: 2 }, null);
    writeFileSync(join(input, 'b.tif'), new Uint8Array(101));
    const project = join(dir, 'project.json');
    writeFileSync(project, '{}');
    const after = await selectPart(await listStackFiles(input), { part: 1, parts: 2 }, project);
    expect(after.info.inputListSha256).not.toBe(before.info.inputListSha256);
    // Source: SHA-256 of the two bytes "{}" (FIPS 180-4; the same digest `sha256sum` prints for that file).
    expect(after.info.projectSha256).toBe('44136fa355b3678a1146ad16f7e8649e94fb4fc21fe77e8310c060f61caaff8a');
  });

  it('writes each part to <out>/parts/K-of-N', () => {
    expect(partDir('/o', { part: 2, parts: 5 })).toBe(join('/o', 'parts', '2-of-5'));
  });
});

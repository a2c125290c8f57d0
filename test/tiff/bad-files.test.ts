// Bad files on disk, made from good bytes: each must fail fast with its code and a one-line message naming the file.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { openStackForAnalysis } from '../../app/decode';
import { writePlainTiff } from '../../core/tiff';
import { findEntry, patchInlineValue, patchUint32, tinyTiff } from '../../core/tiff/tiny-tiff';

const dir = mkdtempSync(join(tmpdir(), 'eggline-bad-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Demo data: two 40×30 uint16 planes. */
const good = writePlainTiff([0, 1].map((n) => ({ width: 40, height: 30, data: Uint16Array.from({ length: 1200 }, (_, i) => n * 5000 + i) })));
const ifd0 = findEntry(good, 256).ifdOffset;
const ifd1 = findEntry(good, 256, 1).ifdOffset;
const nextPointerOfIfd1 = ifd1 + 2 + new DataView(good.buffer).getUint16(ifd1, true) * 12;

/** Writes bytes as `name` in the temp folder and returns its path. */
function file(name: string, bytes: Uint8Array): string {
  const path = join(dir, name);
  writeFileSync(path, bytes);
  return path;
}

/** The error thrown by opening and decoding every plane, or null. */
async function failure(path: string, label: string): Promise<{ code?: string; message: string } | null> {
  try {
    const { info, source } = await openStackForAnalysis(path, label);
    try {
      for (let z = 0; z < info.sizeZ; z++) await source.readPlane(z, 0, 0);
    } finally {
      await source.close();
    }
    return null;
  } catch (err) {
    return err as { code?: string; message: string };
  }
}

describe('bad files fail fast with a clear one-line message', () => {
  // Source for the structures broken below: TIFF 6.0 §2 (header, IFD chain) and §8 (strips).
  const cutStrip = (() => {
    // IFD first, then a 4×4 uint16 strip of which only half remains.
    const entries = [
      { tag: 256, type: 3, values: [4] }, { tag: 257, type: 3, values: [4] }, { tag: 258, type: 3, values: [16] },
      { tag: 259, type: 3, values: [1] }, { tag: 262, type: 3, values: [1] }, { tag: 273, type: 4, values: [8 + 2 + 9 * 12 + 4] },
      { tag: 277, type: 3, values: [1] }, { tag: 278, type: 3, values: [4] }, { tag: 279, type: 4, values: [32] },
    ];
    return tinyTiff(entries, { tail: new Uint8Array(16) });
  })();
  const cases: [string, Uint8Array, string, RegExp][] = [
    ['not-a-tiff.tif', new TextEncoder().encode('%PDF-1.7 not an image'), 'not-tiff', /^not-a-tiff\.tif: not a TIFF file \(first bytes are 25 50 44 46\)$/],
    ['zero.tif', new Uint8Array(0), 'empty', /^zero\.tif: empty file \(0 bytes\)$/],
    ['header-only.tif', good.slice(0, 8), 'truncated', /^header-only\.tif: file ends after the TIFF header \(8 bytes\)$/],
    ['cut-ifd.tif', good.slice(0, ifd0 + 30), 'truncated', /^cut-ifd\.tif: file ends inside IFD 0 /],
    ['cut-strip.tif', cutStrip, 'truncated', /^cut-strip\.tif: plane z=0 c=0 t=0: strip 0 of IFD 0 runs past the end of the file/],
    ['far-ifd.tif', patchUint32(good, 4, 0x7fffffff), 'bad-offset', /^far-ifd\.tif: first IFD offset 2147483647 is outside the file/],
    ['far-strip.tif', patchInlineValue(good, 273, 0x7fffffff), 'bad-offset', /^far-strip\.tif: plane z=0 c=0 t=0: strip 0 of IFD 0 starts at 2147483647/],
    ['loop.tif', patchUint32(good, nextPointerOfIfd1, ifd0), 'ifd-loop', /^loop\.tif: IFD chain loops back to offset \d+ after 2 IFDs$/],
    ['huge.tif', patchInlineValue(patchInlineValue(good, 256, 2_000_000), 257, 2_000_000), 'truncated', /^huge\.tif: declares 2000000×2000000 uint16 pixels per plane \(7\.3 TB\) but the file has only 5\.0 KB$/],
    ['complex.tif', patchInlineValue(good, 339, 5), 'unsupported', /^complex\.tif: complex samples \(16-bit\) not supported$/],
  ];
  for (const [name, bytes, code, message] of cases) {
    it(name, async () => {
      const err = await failure(file(name, bytes), name);
      expect(err).not.toBeNull();
      expect(err?.code).toBe(code);
      expect(err?.message).toMatch(message);
      expect(err?.message).not.toContain('\n');
    }, 1000);
  }

  it('a missing file', async () => {
    expect(await failure(join(dir, 'nope.tif'), 'nope.tif')).toMatchObject({ code: 'io', message: 'nope.tif: cannot open file (no such file)' });
  }, 1000);

  it('the good file itself decodes', async () => {
    expect(await failure(file('good.tif', good), 'good.tif')).toBeNull();
  }, 2000);
});

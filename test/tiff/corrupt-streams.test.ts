// Damaged strips on the direct decode path: each gives a one-line TiffError naming the file, plane and strip,
// never an exception of another kind, and never output past the declared size.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { APP_CHUNK_CODECS } from '../../app/decode';
import { openFileByteSource, readStackInfoFromFile } from '../../core/io';
import { createDirectPlaneSource, memoryByteSource, readChunkPlan, readIfdChain, readTiffHeader, writePlainTiff } from '../../core/tiff';
import { patchInlineValue } from '../../core/tiff/tiny-tiff';
import { hasTiffcp, makeTiffFixtures } from '../../scripts/make-tiff-fixtures';

const dir = mkdtempSync(join(tmpdir(), 'eggline-corrupt-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const TIFFCP = hasTiffcp();
beforeAll(() => { makeTiffFixtures(); });

/** Offset and byte count of strip `i` of IFD 0. */
async function strip(bytes: Uint8Array, i = 0): Promise<{ offset: number; count: number }> {
  const source = memoryByteSource(bytes);
  const header = await readTiffHeader(source, 'x');
  const ifds = await readIfdChain(source, header, 'x');
  const plan = await readChunkPlan(source, header, ifds[0], 'x');
  return { offset: plan.offsets[i], count: plan.byteCounts[i] };
}

/** The error from decoding plane 0 of `bytes` on the direct path, saved as `name`. */
async function directFailure(name: string, bytes: Uint8Array): Promise<{ code?: string; message: string } | null> {
  const path = join(dir, name);
  writeFileSync(path, bytes);
  const info = await readStackInfoFromFile(path, name);
  const source = createDirectPlaneSource(await openFileByteSource(path, name), info, APP_CHUNK_CODECS, name);
  try {
    await source.readPlane(0, 0, 0);
    return null;
  } catch (err) {
    return err as { code?: string; message: string };
  } finally {
    await source.close();
  }
}

const fixture = (name: string) => new Uint8Array(readFileSync(join(__dirname, '../fixtures/generated/tiff', name)));

describe.runIf(TIFFCP)('corrupt streams in files written by libtiff (tiffcp)', () => {
  // Source: TIFF 6.0 §13 — with 258 the first free code, a 9-bit code 511 right after the first is undefined.
  it('LZW: an undefined code', async () => {
    const bytes = fixture('uint16-lzw2.tif');
    const { offset } = await strip(bytes);
    bytes.fill(0xff, offset + 2, offset + 12);
    const err = await directFailure('bad-lzw.tif', bytes);
    expect(err?.code).toBe('decode');
    expect(err?.message).toMatch(/^bad-lzw\.tif: cannot decode plane z=0 c=0 t=0 \(IFD 0\): strip 0: corrupt LZW stream \(code \d+ is not yet defined/);
    expect(err?.message).not.toContain('\n');
  });

  // Source: RFC 1950 §2.2 — the first two bytes are the zlib header (CMF, FLG); FF FF fails its check.
  it('Deflate: a broken zlib header and a stream cut short', async () => {
    const bytes = fixture('uint16-zip2.tif');
    const { offset, count } = await strip(bytes);
    const broken = bytes.slice();
    broken[offset] = 0xff;
    broken[offset + 1] = 0xff;
    const err = await directFailure('bad-zip.tif', broken);
    expect(err?.message).toMatch(/^bad-zip\.tif: cannot decode plane z=0 c=0 t=0 \(IFD 0\): strip 0: corrupt Deflate stream \(incorrect header check\)$/);
    const cut = patchInlineValue(bytes, 279, Math.floor(count / 2));
    const short = await directFailure('short-zip.tif', cut);
    expect(short?.message).toMatch(/^short-zip\.tif: cannot decode plane z=0 c=0 t=0 \(IFD 0\): strip 0 decodes to \d+ bytes, expected 1122$/);
  });
});

describe('wrong byte counts and short strips', () => {
  // Demo data: one 33×17 uint16 plane in one uncompressed strip (1122 bytes). Source: TIFF 6.0 §8 StripByteCounts.
  const good = writePlainTiff([{ width: 33, height: 17, data: Uint16Array.from({ length: 561 }, (_, i) => i) }]);

  it('decodes the good file', async () => {
    expect(await directFailure('good.tif', good)).toBeNull();
  });

  it('a byte count smaller than the strip', async () => {
    const err = await directFailure('small-count.tif', patchInlineValue(good, 279, 1000));
    expect(err?.message).toBe('small-count.tif: cannot decode plane z=0 c=0 t=0 (IFD 0): strip 0 decodes to 1000 bytes, expected 1122');
  });

  it('a strip running past the end of the file', async () => {
    const err = await directFailure('cut.tif', patchInlineValue(good, 279, 50_000));
    expect(err?.message).toMatch(/^cut\.tif: cannot decode plane z=0 c=0 t=0 \(IFD 0\): strip 0 runs past the end of the file \(\d+ > \d+ bytes\)$/);
  });
});

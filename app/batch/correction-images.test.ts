// Reading the correction images once per process, and again when one is replaced under the same name (a long-lived
// process such as the window's must not keep an image the user has since changed). Demo data: flat 8×8 planes.
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync, writeFileSync, utimesSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { writePlainTiff } from '../../core/tiff';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { correctionRecord, loadImageCorrections } from './correction-images';

const dir = mkdtempSync(join(tmpdir(), 'eggline-corrections-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** An 8×8 one-channel 16-bit image of one value. */
const image = (value: number): Uint8Array => writePlainTiff([{ width: 8, height: 8, data: new Uint16Array(64).fill(value) }]);

describe('loadImageCorrections', () => {
  const settings = { ...DEFAULT_SETTINGS, backgroundImageFile: 'dark.tif' };

  it('gives null when the settings name no image', () => {
    expect(loadImageCorrections(DEFAULT_SETTINGS, dir)).toBeNull();
  });

  it('reads an image once, and again when it is replaced under the same name', async () => {
    const path = join(dir, 'dark.tif');
    writeFileSync(path, image(100));
    utimesSync(path, 1_000, 1_000);
    const first = await loadImageCorrections(settings, dir);
    expect(first?.background?.channels[0][0]).toBe(100);
    // The same file: the same object, not read again.
    expect(await loadImageCorrections(settings, dir)).toBe(first);
    writeFileSync(path, image(250));
    utimesSync(path, 2_000, 2_000);
    const second = await loadImageCorrections(settings, dir);
    expect(second?.background?.channels[0][0]).toBe(250);
  });

  it('a missing image fails with one line naming it, and is read once it exists', async () => {
    const s = { ...DEFAULT_SETTINGS, flatFieldFile: 'flat.tif' };
    await expect(loadImageCorrections(s, dir)).rejects.toThrow(/^flat-field image flat\.tif/);
    writeFileSync(join(dir, 'flat.tif'), image(7));
    const loaded = await loadImageCorrections(s, dir);
    expect(loaded?.flat?.channels[0][0]).toBe(1);
  });
});

describe('correctionRecord', () => {
  it("gives each image's SHA-256 from the one read that decoded it", async () => {
    const s = { ...DEFAULT_SETTINGS, flatFieldFile: 'flat-2.tif', backgroundImageFile: 'dark-2.tif' };
    const flatPath = join(dir, 'flat-2.tif');
    const darkPath = join(dir, 'dark-2.tif');
    // Two planes each, so the decoder reads several separate byte ranges of the file.
    writeFileSync(flatPath, writePlainTiff([{ width: 8, height: 8, data: new Uint16Array(64).fill(9) }, { width: 8, height: 8, data: new Uint16Array(64).fill(11) }]));
    writeFileSync(darkPath, writePlainTiff([{ width: 8, height: 8, data: new Uint16Array(64).fill(3) }, { width: 8, height: 8, data: new Uint16Array(64).fill(5) }]));
    utimesSync(flatPath, 3_000, 3_000);
    utimesSync(darkPath, 3_000, 3_000);
    // Source: SHA-256 of the whole file by node:crypto (OpenSSL's FIPS 180-4 implementation), independent of the decoder.
    const sha = (p: string): string => createHash('sha256').update(readFileSync(p)).digest('hex');
    const expected = { flatField: { file: flatPath, sha256: sha(flatPath) }, backgroundImage: { file: darkPath, sha256: sha(darkPath) } };
    await loadImageCorrections(s, dir);
    expect(await correctionRecord(s, dir)).toEqual(expected);
    // Other bytes under the same size and modification time: the record still gives the digest of the bytes that were
    // decoded, so the images were not read a second time to hash them.
    writeFileSync(darkPath, Buffer.alloc(readFileSync(darkPath).length, 1));
    utimesSync(darkPath, 3_000, 3_000);
    expect(await correctionRecord(s, dir)).toEqual(expected);
  });

  it('gives null entries when the settings name no image', async () => {
    expect(await correctionRecord(DEFAULT_SETTINGS, dir)).toEqual({ flatField: null, backgroundImage: null });
  });
});

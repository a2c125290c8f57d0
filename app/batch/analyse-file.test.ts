import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { makeSyntheticEmbryo } from '../../core/synth';
import { writeOmeTiff } from '../../core/tiff';
import { analyseFileWithDigest } from './analyse-file';

const dir = mkdtempSync(join(tmpdir(), 'eggline-analyse-file-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('analyseFileWithDigest', () => {
  it("gives the SHA-256 of the whole file from the decoder's reads (run.json's digest, the file read once) and its time shape", async () => {
    // demo data: a small synthetic embryo as a Deflate OME-TIFF
    const e = makeSyntheticEmbryo({ widthPx: 160, heightPx: 96, sizeZ: 3, pixelSizeUm: 4, zStepUm: 2 }, 5);
    const bytes = writeOmeTiff(e.stack.planes.map((data) => ({ width: 160, height: 96, data })), {
      sizeZ: 3, sizeC: e.channelNames.length, sizeT: 1, dimensionOrder: 'XYZCT', channelNames: [...e.channelNames], physicalSizeXUm: e.pixelSizeUm, compression: 'deflate',
    });
    const path = join(dir, 'embryo.ome.tif');
    writeFileSync(path, bytes);
    const { input, shape } = await analyseFileWithDigest({ index: 0, path, file: 'embryo.ome.tif', settings: DEFAULT_SETTINGS, handEdits: null });
    // Source: node:crypto's SHA-256 (OpenSSL) of the file read in one piece.
    expect(input).toEqual({ sha256: createHash('sha256').update(readFileSync(path)).digest('hex'), bytes: bytes.length });
    expect(shape).toEqual({ sizeT: 1, sizeZ: 3, isOme: true });
  });

  it('gives the digest of a file that is not a TIFF when the decoder read it whole, and none for a missing file', async () => {
    const path = join(dir, 'not-a-tiff.tif');
    writeFileSync(path, 'not a TIFF at all');
    const bad = await analyseFileWithDigest({ index: 0, path, file: 'not-a-tiff.tif', settings: DEFAULT_SETTINGS, handEdits: null });
    expect(bad.result.status).toBe('error');
    // Source: node:crypto's SHA-256 (OpenSSL) of the file read in one piece.
    expect(bad.input).toEqual({ sha256: createHash('sha256').update('not a TIFF at all').digest('hex'), bytes: 17 });
    expect(bad.shape).toBeNull();
    const missing = await analyseFileWithDigest({ index: 1, path: join(dir, 'gone.tif'), file: 'gone.tif', settings: DEFAULT_SETTINGS, handEdits: null });
    expect(missing.result.status).toBe('error');
    expect(missing.input).toBeNull();
  });
});

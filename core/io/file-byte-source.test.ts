import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { writeOmeTiff } from '../tiff';
import { openFileByteSource } from './file-byte-source';
import { openStackFile, readStackInfoFromFile } from './open-stack';

const dir = mkdtempSync(join(tmpdir(), 'eggline-io-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('openFileByteSource', () => {
  it('reads byte ranges, clipped at the end of the file', async () => {
    const path = join(dir, 'bytes.bin');
    writeFileSync(path, Uint8Array.from({ length: 100 }, (_, i) => i));
    const source = await openFileByteSource(path);
    expect(source.size).toBe(100);
    expect(Array.from(await source.read(10, 3))).toEqual([10, 11, 12]);
    expect(Array.from(await source.read(98, 10))).toEqual([98, 99]);
    expect((await source.read(200, 4)).length).toBe(0);
    await source.close();
    await source.close(); // closing twice is harmless
  });

  it('names the file when it cannot be opened', async () => {
    await expect(openFileByteSource(join(dir, 'missing.tif'), 'missing.tif')).rejects.toMatchObject({
      code: 'io', message: 'missing.tif: cannot open file (no such file)',
    });
    await expect(openFileByteSource(dir, 'folder')).rejects.toMatchObject({ code: 'io', message: 'folder: cannot open file (is a folder, not a file)' });
  });
});

describe('openStackFile', () => {
  it('reads the stack info and decodes planes from disk', async () => {
    // Demo data: 2 z planes.
    const planes = [0, 1].map((n) => ({ width: 4, height: 2, data: Uint16Array.from({ length: 8 }, (_, i) => n * 10 + i) }));
    const path = join(dir, 'stack.ome.tif');
    writeFileSync(path, writeOmeTiff(planes, { sizeZ: 2, sizeC: 1, sizeT: 1, dimensionOrder: 'XYZCT', channelNames: ['a'], physicalSizeXUm: 1 }));
    const { info, source } = await openStackFile(path, 'stack.ome.tif');
    expect(info.sizeZ).toBe(2);
    expect(Array.from((await source.readPlane(1, 0, 0)).data)).toEqual([10, 11, 12, 13, 14, 15, 16, 17]);
    await source.close();
    expect((await readStackInfoFromFile(path, 'stack.ome.tif')).isOme).toBe(true);
  });

  it('passes reader errors through with the label', async () => {
    const path = join(dir, 'text.tif');
    writeFileSync(path, 'hello world');
    await expect(openStackFile(path, 'text.tif')).rejects.toMatchObject({ code: 'not-tiff', message: 'text.tif: not a TIFF file (first bytes are 68 65 6C 6C)' });
  });
});

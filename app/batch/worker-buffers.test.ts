import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { makeSyntheticEmbryo } from '../../core/synth';
import { writeOmeTiff } from '../../core/tiff';
import { analyseFileWithDigest } from './analyse-file';
import { workerBuffers } from './worker-buffers';

const dir = mkdtempSync(join(tmpdir(), 'eggline-worker-buffers-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('workerBuffers', () => {
  it('lends the same array while slot, type and length repeat, and views of one growing buffer per slot otherwise', () => {
    const b = workerBuffers();
    const a = b.planeArrays.at(0, 'uint16', 100);
    expect(a).toBeInstanceOf(Uint16Array);
    expect(b.planeArrays.at(0, 'uint16', 100)).toBe(a);
    const smaller = b.planeArrays.at(0, 'uint8', 50);
    expect(smaller).toBeInstanceOf(Uint8Array);
    expect(smaller.length).toBe(50);
    expect(smaller.buffer).toBe(a.buffer);
    const larger = b.planeArrays.at(0, 'float32', 1000);
    expect(larger.length).toBe(1000);
    expect(larger.buffer).not.toBe(a.buffer);
    expect(b.planeArrays.at(1, 'uint16', 100).buffer).not.toBe(larger.buffer);
    const p = b.projection(3, 64);
    expect(p.map((x) => x.length)).toEqual([64, 64, 64]);
    expect(new Set(p.map((x) => x.buffer)).size).toBe(3);
    expect(b.projection(2, 32)[1].buffer).toBe(p[1].buffer);
  });

  it("gives each file the result it gets with arrays of its own, files of other sizes and types in turn (demo data)", async () => {
    // One set of buffers for a worker's files in turn: a larger file after a smaller one, a one-slice file (its
    // planes kept for the background), 8-bit samples, and the first file again after the others.
    const files: { name: string; width: number; height: number; sizeZ: number; eight: boolean }[] = [
      { name: 'a.ome.tif', width: 160, height: 96, sizeZ: 3, eight: false },
      { name: 'b.ome.tif', width: 200, height: 120, sizeZ: 2, eight: false },
      { name: 'c.ome.tif', width: 180, height: 100, sizeZ: 1, eight: false },
      { name: 'd.ome.tif', width: 150, height: 90, sizeZ: 2, eight: true },
    ];
    for (const [k, f] of files.entries()) {
      const e = makeSyntheticEmbryo({ widthPx: f.width, heightPx: f.height, sizeZ: f.sizeZ, pixelSizeUm: 640 / f.width, zStepUm: 2 }, 30 + k);
      const planes = e.stack.planes.map((data) => ({ width: f.width, height: f.height, data: f.eight ? Uint8Array.from(data, (v) => Math.min(255, v >> 4)) : data }));
      writeFileSync(join(dir, f.name), writeOmeTiff(planes, {
        sizeZ: f.sizeZ, sizeC: e.channelNames.length, sizeT: 1, dimensionOrder: 'XYZCT', channelNames: [...e.channelNames], physicalSizeXUm: e.pixelSizeUm, compression: k % 2 ? 'deflate' : 'none',
      }));
    }
    const task = (name: string, index: number) => ({ index, path: join(dir, name), file: name, settings: DEFAULT_SETTINGS, handEdits: null });
    const buffers = workerBuffers();
    const order = [...files.map((f) => f.name), files[0].name];
    for (const [i, name] of order.entries()) {
      const own = await analyseFileWithDigest(task(name, i), true);
      const lent = await analyseFileWithDigest(task(name, i), true, buffers);
      expect(own.result.status, name).toBe('ok');
      // Source: the same analysis with new arrays (the result as analyseStack has always given it).
      expect(JSON.stringify(lent)).toBe(JSON.stringify(own));
    }
  });
});

// Time points of movies: OME Plane/@DeltaT and Pixels/@TimeIncrement, ImageJ hyperstack finterval, plain pages read
// as frames, and the reading cost of a movie with thousands of planes.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readStackInfoFromFile } from '../../core/io';
import {
  describeStack, memoryByteSource, pagesAsTimePoints, pagesAsTimePointsWithSource, readStackInfo, resolveTimeAxis, writeOmeTiff, writePlainTiff,
} from '../../core/tiff';
import type { ByteSource } from '../../core/tiff';
import type { PlaneSource } from '../../core/model';

const dir = mkdtempSync(join(tmpdir(), 'eggline-time-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const PYTHON = '/usr/bin/python3';
const hasTifffile = spawnSync(PYTHON, ['-c', 'import tifffile, numpy'], { encoding: 'utf8' }).status === 0;

/** Runs a Python snippet that writes files with tifffile into `dir` (passed as sys.argv[1]). */
function python(code: string): void {
  const r = spawnSync(PYTHON, ['-c', code, dir], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`python failed: ${r.stderr}`);
}

describe.skipIf(!hasTifffile)('time points in files written by Python tifffile', () => {
  it('OME Plane/@DeltaT with its unit wins over TimeIncrement; times start at 0', async () => {
    // Source: OME-TIFF written by tifffile (Plane DeltaT in minutes, Pixels TimeIncrement 2.5 s); ome.xsd UnitsTime.
    python(`import sys, numpy as np, tifffile
tifffile.imwrite(sys.argv[1] + '/delta.ome.tif', np.zeros((3, 2, 4, 5), np.uint16), metadata={'axes': 'TCYX',
  'TimeIncrement': 2.5, 'TimeIncrementUnit': 's', 'PhysicalSizeX': 0.5,
  'Plane': {'DeltaT': [0.5, 0.5, 2, 2, 3.7, 3.7], 'DeltaTUnit': ['min'] * 6}})`);
    const info = await readStackInfoFromFile(join(dir, 'delta.ome.tif'), 'delta.ome.tif');
    expect(info.sizeT).toBe(3);
    expect(info.time?.source).toBe('ome-plane');
    expect(Array.from(info.time!.timesS!)).toEqual([0, 90, 192]);
    expect(describeStack(info)).toContain('time points: 3, unevenly spaced, 0 to 192 s (source: ome-plane)');
  });

  it('OME Pixels/@TimeIncrement when no plane has a DeltaT', async () => {
    // Source: OME-TIFF written by tifffile with TimeIncrement 500 ms.
    python(`import sys, numpy as np, tifffile
tifffile.imwrite(sys.argv[1] + '/increment.ome.tif', np.zeros((4, 1, 4, 5), np.uint16), metadata={'axes': 'TCYX',
  'TimeIncrement': 500, 'TimeIncrementUnit': 'ms'})`);
    const info = await readStackInfoFromFile(join(dir, 'increment.ome.tif'), 'increment.ome.tif');
    expect(info.time?.source).toBe('ome-increment');
    expect(Array.from(info.time!.timesS!)).toEqual([0, 0.5, 1, 1.5]);
  });

  it('ImageJ hyperstack frames with finterval and tunit', async () => {
    // Source: ImageJ hyperstack written by tifffile (imagej=True, finterval=0.75, tunit='min').
    python(`import sys, numpy as np, tifffile
tifffile.imwrite(sys.argv[1] + '/hyper.tif', np.zeros((3, 1, 2, 4, 5), np.uint16), imagej=True,
  metadata={'axes': 'TZCYX', 'finterval': 0.75, 'tunit': 'min'})`);
    const info = await readStackInfoFromFile(join(dir, 'hyper.tif'), 'hyper.tif');
    expect([info.sizeT, info.sizeC, info.sizeZ]).toEqual([3, 2, 1]);
    expect(info.time?.source).toBe('imagej');
    expect(Array.from(info.time!.timesS!)).toEqual([0, 45, 90]);
  });
});

describe('time points from our own writer and from the user', () => {
  const plane = (v: number) => ({ width: 4, height: 3, data: new Uint16Array(12).fill(v) }); // demo data

  it('writes and reads back Pixels/@TimeIncrement', async () => {
    // Source: OME-TIFF specification, Pixels TimeIncrement (ome.xsd 2016-06; unit default s).
    const bytes = writeOmeTiff([plane(1), plane(2), plane(3)], {
      sizeZ: 1, sizeC: 1, sizeT: 3, dimensionOrder: 'XYZCT', channelNames: ['g'], physicalSizeXUm: 1, timeIncrementS: 150,
    });
    const info = await readStackInfo(memoryByteSource(bytes), 'ours.ome.tif');
    expect(info.time).toEqual({ timesS: Float64Array.of(0, 150, 300), source: 'ome-increment' });
    expect(describeStack(info)).toContain('time points: 3, every 150 s, 0 to 300 s (source: ome-increment)');
  });

  it('reads a plain multi-page file as frames with a time step the user gives', async () => {
    const bytes = writePlainTiff([plane(1), plane(2), plane(3), plane(4)], { pixelSizeUm: 1 });
    const info = await readStackInfo(memoryByteSource(bytes), 'pages.tif');
    expect(info.time).toEqual({ timesS: null, source: 'unknown' });
    const frames = pagesAsTimePoints(info);
    expect([frames.sizeZ, frames.sizeT]).toEqual([1, 4]);
    expect(Array.from(frames.planeIfd)).toEqual([0, 1, 2, 3]);
    expect(resolveTimeAxis(frames, 30)).toEqual({ timesS: Float64Array.of(0, 30, 60, 90), source: 'user' });
    // Its plane source serves time point t from page t (the file's own source knows only its Z slices).
    const asked: number[][] = [];
    const pages: PlaneSource = { readPlane: async (z, c, t) => { asked.push([z, c, t]); return plane(z + 1); }, close: async () => undefined };
    const timed = pagesAsTimePointsWithSource(info, pages);
    expect(timed.info.sizeT).toBe(4);
    expect((await timed.source.readPlane(0, 0, 2)).data[0]).toBe(3);
    expect(asked).toEqual([[2, 0, 0]]);
    await expect(timed.source.readPlane(1, 0, 0)).rejects.toThrow('plane (z=1, c=0, t=0) is outside the stack (Z 1, C 1, T 4)');
    expect(pagesAsTimePointsWithSource(frames, pages).source).toBe(pages);
    // The file's own times win over the user's step, with a warning, as the pixel size does.
    const ome = await readStackInfo(memoryByteSource(writeOmeTiff([plane(1), plane(2)], {
      sizeZ: 1, sizeC: 1, sizeT: 2, dimensionOrder: 'XYZCT', channelNames: ['g'], physicalSizeXUm: 1, timeIncrementS: 5,
    })), 'x.ome.tif');
    const warnings: string[] = [];
    expect(resolveTimeAxis(ome, 30, warnings).source).toBe('ome-increment');
    expect(warnings).toEqual(['time step 30 s ignored: the file gives the times (ome-increment)']);
  });
});

describe('reading a movie of thousands of planes', () => {
  /** Bytes and calls a ByteSource serves. */
  function counting(bytes: Uint8Array): { source: ByteSource; read: () => number } {
    const inner = memoryByteSource(bytes);
    let total = 0;
    return { source: { size: inner.size, read: async (o, l) => { const b = await inner.read(o, l); total += b.length; return b; } }, read: () => total };
  }

  it('reads the tags of a 2000-frame movie with at most 4× the bytes of a 500-frame one (linear, not quadratic)', async () => {
    // Demo data: tiny planes with a Plane/@DeltaT per plane, so the OME-XML grows with the movie too.
    const movie = (frames: number) => {
      const planes = Array.from({ length: 2 * frames }, () => ({ width: 2, height: 2, data: new Uint16Array(4) }));
      const ns = 'http://www.openmicroscopy.org/Schemas/OME/2016-06';
      const xml = `<?xml version="1.0" encoding="UTF-8"?><OME xmlns="${ns}"><Image ID="Image:0"><Pixels ID="Pixels:0" ` +
        `DimensionOrder="XYCZT" Type="uint16" SizeX="2" SizeY="2" SizeZ="1" SizeC="2" SizeT="${frames}" PhysicalSizeX="1">` +
        '<Channel ID="Channel:0:0"/><Channel ID="Channel:0:1"/>' + `<TiffData IFD="0" PlaneCount="${2 * frames}"/>` +
        Array.from({ length: frames }, (_, t) => `<Plane TheZ="0" TheC="0" TheT="${t}" DeltaT="${t * 2}" DeltaTUnit="s"/>`).join('') +
        '</Pixels></Image></OME>';
      return writePlainTiff(planes, { description: xml });
    };
    const small = counting(movie(500));
    const large = counting(movie(2000));
    const a = await readStackInfo(small.source, 'small.ome.tif');
    const b = await readStackInfo(large.source, 'large.ome.tif');
    expect(b.sizeT).toBe(2000);
    expect(b.time!.timesS![1999]).toBe(3998);
    expect(a.time!.source).toBe('ome-plane');
    const ratio = large.read() / small.read();
    // A fixed part (header, first IFD, cache blocks) makes it a little less than 4; a quadratic read would be 16.
    expect(ratio).toBeGreaterThan(2);
    expect(ratio).toBeLessThan(4.5);
  });
});

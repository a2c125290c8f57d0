// Pixel size read from real files: OME PhysicalSize with units, and TIFF resolution tags (cm, inch, large numerator).
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readStackInfoFromFile } from '../../core/io';
import { writeOmeTiff, writePlainTiff } from '../../core/tiff';
import { findEntry } from '../../core/tiff/tiny-tiff';

const dir = mkdtempSync(join(tmpdir(), 'eggline-px-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const plane = { width: 8, height: 4, data: new Uint16Array(32) }; // demo data

async function infoOf(name: string, bytes: Uint8Array) {
  const path = join(dir, name);
  writeFileSync(path, bytes);
  return readStackInfoFromFile(path, name);
}

/** Replaces the OME PhysicalSizeX attribute text (same-length-or-not is fine: the writer is re-run with a description). */
function omeWithUnit(value: string, unit: string): Uint8Array {
  const xml = new TextDecoder().decode(writeOmeTiff([plane], { sizeZ: 1, sizeC: 1, sizeT: 1, dimensionOrder: 'XYZCT', channelNames: ['a'], physicalSizeXUm: 1 }))
    .match(/<\?xml[\s\S]*<\/OME>/)![0]
    .replace('PhysicalSizeX="1" PhysicalSizeXUnit="\u00B5m"', `PhysicalSizeX="${value}" PhysicalSizeXUnit="${unit}"`)
    .replace('PhysicalSizeY="1" PhysicalSizeYUnit="\u00B5m"', `PhysicalSizeY="${value}" PhysicalSizeYUnit="${unit}"`);
  return writePlainTiff([plane], { description: xml });
}

describe('pixel size from OME-XML', () => {
  // Source: OME-TIFF specification / ome.xsd PhysicalSizeX + PhysicalSizeXUnit (UnitsLength: nm, µm, mm).
  it.each([
    ['325', 'nm', 0.325], ['0.325', '\u00B5m', 0.325], ['0.325', 'um', 0.325], ['0.000325', 'mm', 0.325], ['3250', '\u00C5', 0.325],
  ])('%s %s → %f µm', async (value, unit, um) => {
    const info = await infoOf(`ome-${unit}.ome.tif`, omeWithUnit(value, unit));
    expect(info.pixelSize.source).toBe('ome');
    expect(info.pixelSize.xUm).toBeCloseTo(um, 12);
    expect(info.pixelSize.yUm).toBeCloseTo(um, 12);
  });
});

describe('pixel size from resolution tags', () => {
  // Source: TIFF 6.0 §8 XResolution/ResolutionUnit (2 inch, 3 cm).
  it('cm and inch', async () => {
    const cm = await infoOf('cm.tif', writePlainTiff([plane], { pixelSizeUm: 0.325, resolutionUnit: 'cm' }));
    expect(cm.pixelSize).toEqual({ xUm: 0.325, yUm: 0.325, zUm: null, source: 'tiff-resolution' });
    const inch = await infoOf('inch.tif', writePlainTiff([plane], { pixelSizeUm: 1.27, pixelSizeYUm: 2.54, resolutionUnit: 'inch' }));
    expect(inch.pixelSize.xUm).toBeCloseTo(1.27, 12);
    expect(inch.pixelSize.yUm).toBeCloseTo(2.54, 12);
  });

  // Source: note tiff-ome.md — tifffile stored 0.325 µm as XResolution 4294967295/139586 per cm (numerator > 2³¹).
  it('a numerator above 2³¹', async () => {
    const bytes = writePlainTiff([plane], { pixelSizeUm: 1 });
    const view = new DataView(bytes.buffer);
    for (const tag of [282, 283]) {
      const valueAt = view.getUint32(findEntry(bytes, tag).entryOffset + 8, true);
      view.setUint32(valueAt, 4294967295, true);
      view.setUint32(valueAt + 4, 139586, true);
    }
    const info = await infoOf('big-numerator.tif', bytes);
    expect(info.pixelSize.source).toBe('tiff-resolution');
    expect(info.pixelSize.xUm).toBeCloseTo(1395860000 / 4294967295, 14);
    expect(info.pixelSize.xUm).toBeCloseTo(0.325, 5);
  });

  // Source: our rule (common practice): 72 dpi is a screen default, not a calibration.
  it('72 dpi means unknown', async () => {
    const info = await infoOf('72dpi.tif', writePlainTiff([plane], { pixelSizeUm: 25400 / 72, resolutionUnit: 'inch' }));
    expect(info.pixelSize.source).toBe('unknown');
  });
});

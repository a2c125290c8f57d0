import { describe, expect, it } from 'vitest';
import { memoryByteSource } from './byte-source';
import { readStackInfo } from './stack-info';
import { findEntry, patchInlineValue, patchUint32 } from './tiny-tiff';
import { writeOmeTiff, writePlainTiff } from './write';

// Demo data: small planes whose values encode their index.
const u16 = (n: number, w = 6, h = 4) => ({ width: w, height: h, data: Uint16Array.from({ length: w * h }, (_, i) => n * 1000 + i) });
const planes = (count: number) => Array.from({ length: count }, (_, n) => u16(n));
const info = (bytes: Uint8Array, label = 's.tif', opts = {}) => readStackInfo(memoryByteSource(bytes), label, opts);

/** An OME-XML document with the given Pixels attributes (demo data). */
function omeXml(pixelAttrs: string, type = 'uint16'): string {
  return `<?xml version="1.0" encoding="UTF-8"?><OME xmlns="http://www.openmicroscopy.org/Schemas/OME/2016-06"><Image ID="Image:0">` +
    `<Pixels ID="Pixels:0" DimensionOrder="XYZCT" Type="${type}" SizeX="6" SizeY="4" SizeZ="2" SizeC="1" SizeT="1" ${pixelAttrs}>` +
    '<Channel ID="Channel:0:0"/><TiffData/></Pixels></Image></OME>';
}

describe('readStackInfo: OME-TIFF', () => {
  it('reads sizes, order, channels, physical size and plane map from the writer output', async () => {
    const bytes = writeOmeTiff(planes(12), { sizeZ: 3, sizeC: 2, sizeT: 2, dimensionOrder: 'XYCZT', channelNames: ['dye-a', 'dye-b'], physicalSizeXUm: 0.4, physicalSizeZUm: 2, compression: 'deflate' });
    const s = await info(bytes, 'e.ome.tif');
    expect(s).toMatchObject({
      byteOrder: 'II', bigTiff: false, isOme: true, sizeX: 6, sizeY: 4, sizeZ: 3, sizeC: 2, sizeT: 2, dimensionOrder: 'XYCZT',
      sampleType: 'uint16', samplesPerPixel: 1, channelNames: ['dye-a', 'dye-b'], compression: 'Deflate', ifdCount: 12, warnings: [],
      pixelSize: { xUm: 0.4, yUm: 0.4, zUm: 2, source: 'ome' },
    });
    // Source: OME-TIFF specification: XYCZT → IFD = c + 2·(z + 3·t); planeIfd slot = (t·C + c)·Z + z.
    expect(Array.from(s.planeIfd)).toEqual([0, 2, 4, 1, 3, 5, 6, 8, 10, 7, 9, 11]);
  });

  // Source: ome.xsd PhysicalSizeXUnit (nm, mm) and "readers take the value from the TIFF structure" on disagreement.
  it('converts nm/mm, falls back to resolution tags for a pixel unit, and warns on a Type mismatch', async () => {
    const nm = await info(writePlainTiff(planes(2), { description: omeXml('PhysicalSizeX="250" PhysicalSizeXUnit="nm" PhysicalSizeZ="0.001" PhysicalSizeZUnit="mm"') }));
    expect(nm.pixelSize).toEqual({ xUm: 0.25, yUm: 0.25, zUm: 1, source: 'ome' });
    const px = await info(writePlainTiff(planes(2), { pixelSizeUm: 0.8, description: omeXml('PhysicalSizeX="1" PhysicalSizeXUnit="pixel"', 'uint8') }));
    expect(px.pixelSize.source).toBe('tiff-resolution');
    expect(px.pixelSize.xUm).toBeCloseTo(0.8, 12);
    expect(px.sampleType).toBe('uint16');
    expect(px.warnings).toEqual([
      'OME PhysicalSizeX unit "pixel" is not a length; ignored',
      'OME Type "uint8" differs from the TIFF sample type uint16; using the TIFF type',
    ]);
    const none = await info(writePlainTiff(planes(2), { description: omeXml('') }));
    expect(none.pixelSize).toEqual({ xUm: null, yUm: null, zUm: null, source: 'unknown' });
    expect(none.channelNames).toEqual(['C0']);
  });

  it('rejects an OME plane map that needs more IFDs than the file has', async () => {
    const bytes = writePlainTiff(planes(1), { description: omeXml('') });
    await expect(info(bytes, 'short.ome.tif')).rejects.toMatchObject({ code: 'bad-ome', message: 'short.ome.tif: OME TiffData gives no IFD for plane z=1, c=0, t=0' });
  });
});

describe('readStackInfo: plain TIFF', () => {
  it('reads IFDs as Z with pixel size from resolution tags', async () => {
    const s = await info(writePlainTiff(planes(3), { pixelSizeUm: 0.65 }));
    expect(s).toMatchObject({ isOme: false, sizeZ: 3, sizeC: 1, sizeT: 1, dimensionOrder: 'XYZCT', channelNames: ['C0'], warnings: [] });
    expect(s.pixelSize.xUm).toBeCloseTo(0.65, 12);
    expect(s.pixelSize.source).toBe('tiff-resolution');
    expect(Array.from(s.planeIfd)).toEqual([0, 1, 2]);
  });

  it('warns when the pixel size is unknown', async () => {
    const s = await info(writePlainTiff(planes(1)));
    expect(s.pixelSize.source).toBe('unknown');
    expect(s.warnings).toEqual(['pixel size unknown (no usable resolution tags)']);
  });

  // Source: ImageJ hyperstack description (channels/slices/frames; channel fastest) — from memory.
  it('honours ImageJ channels/slices/frames and unit=micron with ResolutionUnit none', async () => {
    const bytes = writePlainTiff(planes(12), { pixelSizeUm: 0.5, description: 'ImageJ=1.54f\nimages=12\nchannels=2\nslices=3\nframes=2\nunit=micron\nspacing=1.5\n' });
    const unitNone = patchInlineValue(bytes, 296, 1); // ImageJ writes XResolution in pixels per µm with unit "none"
    const s = await info(unitNone);
    expect(s).toMatchObject({ sizeZ: 3, sizeC: 2, sizeT: 2, dimensionOrder: 'XYCZT' });
    expect(Array.from(s.planeIfd)).toEqual([0, 2, 4, 1, 3, 5, 6, 8, 10, 7, 9, 11]);
    // 20000 px per "micron" unit → 1/20000 µm: we trust the description's unit.
    expect(s.pixelSize).toEqual({ xUm: 1 / 20000, yUm: 1 / 20000, zUm: 1.5, source: 'tiff-resolution' });
  });

  // Source: TIFF 6.0 §3 (PhotometricInterpretation 0 = WhiteIsZero).
  it('warns about WhiteIsZero images', async () => {
    const s = await info(patchInlineValue(writePlainTiff(planes(1), { pixelSizeUm: 1 }), 262, 0));
    expect(s.warnings).toEqual(['image is WhiteIsZero: values are used as stored (high = dark)']);
  });

  it('reads extra samples as channels', async () => {
    const s = await info(writePlainTiff([{ width: 2, height: 2, data: new Uint8Array(12), samplesPerPixel: 3 }]));
    expect(s).toMatchObject({ sizeZ: 1, sizeC: 3, samplesPerPixel: 3, channelNames: ['C0', 'C1', 'C2'] });
    expect(Array.from(s.planeIfd)).toEqual([0, 0, 0]);
  });

  // Source: TIFF 6.0 §8 NewSubfileType bit 0 (reduced-resolution version of another image).
  it('skips reduced-resolution IFDs', async () => {
    const s = await info(patchInlineValue(writePlainTiff(planes(3)), 254, 1, 2));
    expect(s.sizeZ).toBe(2);
    expect(s.warnings[0]).toBe('1 IFDs of another size or reduced resolution ignored');
  });
});

describe('readStackInfo: bad input fails fast with a code and a message naming the file', () => {
  const good = writePlainTiff(planes(2));
  const ifd0 = findEntry(good, 256).ifdOffset;
  const ifd1 = findEntry(good, 256, 1).ifdOffset;
  const cases: [string, Uint8Array, string, RegExp | string][] = [
    ['not a TIFF (PNG signature)', new Uint8Array([0x89, 0x50, 0x4e, 0x47, 13, 10, 26, 10, 0, 0]), 'not-tiff', 'bad.tif: not a TIFF file (first bytes are 89 50 4E 47)'],
    ['zero bytes', new Uint8Array(0), 'empty', 'bad.tif: empty file (0 bytes)'],
    ['header only', good.slice(0, 8), 'truncated', 'bad.tif: file ends after the TIFF header (8 bytes)'],
    ['cut mid-IFD', good.slice(0, ifd0 + 40), 'truncated', `bad.tif: file ends inside IFD 0 (offset ${ifd0})`],
    ['IFD offset past the end', patchUint32(good, 4, 10_000_000), 'bad-offset', `bad.tif: first IFD offset 10000000 is outside the file (${good.length} bytes)`],
    ['IFD loop', patchUint32(good, ifd1 + 2 + new DataView(good.buffer).getUint16(ifd1, true) * 12, ifd0), 'ifd-loop', `bad.tif: IFD chain loops back to offset ${ifd0} after 2 IFDs`],
    ['dimensions far beyond the file size', patchInlineValue(patchInlineValue(good, 256, 100000), 257, 100000), 'truncated',
      /^bad\.tif: declares 100000×100000 uint16 pixels per plane \(18\.6 GB\) but the file has only 404 bytes$/],
    ['complex SampleFormat', patchInlineValue(good, 339, 6), 'unsupported', 'bad.tif: complex samples (16-bit) not supported'],
    ['1-bit samples', patchInlineValue(good, 258, 1), 'unsupported', 'bad.tif: 1-bit (bilevel) images are not supported'],
    ['RGB colour image', patchInlineValue(good, 262, 2), 'unsupported', 'bad.tif: RGB colour images are not supported for analysis (export the raw grey-level channels)'],
    ['palette image', patchInlineValue(good, 262, 3), 'unsupported', 'bad.tif: palette colour images are not supported for analysis (export the raw grey-level channels)'],
    ['malformed OME-XML', writePlainTiff(planes(1), { description: '<OME><Image>' }), 'bad-ome', /^bad\.tif: OME-XML is not well-formed/],
  ];
  for (const [what, bytes, code, message] of cases) {
    it(what, async () => {
      const err = await info(bytes, 'bad.tif').catch((e: unknown) => e);
      expect(err).toMatchObject({ name: 'TiffError', code });
      const text = (err as Error).message;
      if (typeof message === 'string') expect(text).toBe(message); else expect(text).toMatch(message);
      expect(text).not.toContain('\n');
    }, 1000);
  }

  it('over the memory budget', async () => {
    await expect(info(good, 'bad.tif', { maxPlaneBytes: 10 })).rejects.toMatchObject({
      code: 'too-large', message: 'bad.tif: one plane of 6×4 uint16 pixels needs 48 bytes, over the 10 bytes limit',
    });
  }, 1000);
});

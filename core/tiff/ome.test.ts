import { describe, expect, it } from 'vitest';
import { looksLikeOmeXml, parseOmeXml } from './ome';
import { micrometresPerUnit } from './units';

/** Demo data: a minimal OME-XML with the given Pixels attributes and inner elements. */
function ome(attrs: string, inner = '<TiffData/>'): string {
  return `<?xml version="1.0" encoding="UTF-8"?><OME xmlns="http://www.openmicroscopy.org/Schemas/OME/2016-06"><Image ID="Image:0">` +
    `<Pixels ID="Pixels:0" DimensionOrder="XYZCT" Type="uint16" SizeX="4" SizeY="3" SizeZ="2" SizeC="1" SizeT="1" ${attrs}>` +
    `<Channel ID="Channel:0:0" Name="stain"/>${inner}</Pixels></Image></OME>`;
}

describe('micrometresPerUnit', () => {
  // Source: ome.xsd UnitsLength enumeration (SI prefixes, Å, inch) — conversions from memory (SI definitions).
  it('converts the common length units to µm', () => {
    expect(micrometresPerUnit('\u00B5m')).toBe(1);
    expect(micrometresPerUnit('\u03BCm')).toBe(1);
    expect(micrometresPerUnit('um')).toBe(1);
    expect(micrometresPerUnit('nm')).toBe(1e-3);
    expect(micrometresPerUnit('mm')).toBe(1e3);
    expect(micrometresPerUnit('cm')).toBe(1e4);
    expect(micrometresPerUnit('m')).toBe(1e6);
    expect(micrometresPerUnit('\u00C5')).toBe(1e-4);
    expect(micrometresPerUnit('\u212B')).toBe(1e-4);
    expect(micrometresPerUnit('pixel')).toBeNull();
    expect(micrometresPerUnit('reference frame')).toBeNull();
  });
});

describe('parseOmeXml', () => {
  it('reads sizes, order, type, channels and TiffData', () => {
    const img = parseOmeXml(ome('PhysicalSizeX="0.5"', '<TiffData IFD="3" PlaneCount="2" FirstZ="1"/>'), 'a.ome.tif');
    expect(img).toMatchObject({ dimensionOrder: 'XYZCT', type: 'uint16', sizeX: 4, sizeY: 3, sizeZ: 2, sizeC: 1, sizeT: 1, channelNames: ['stain'] });
    expect(img.tiffData).toEqual([{ ifd: 3, firstZ: 1, firstC: 0, firstT: 0, planeCount: 2, fileName: null }]);
  });

  // Source: ome.xsd Pixels@PhysicalSizeXUnit (default µm, U+00B5).
  it('converts physical sizes: default µm, nm, mm, um, Å', () => {
    expect(parseOmeXml(ome('PhysicalSizeX="0.5"'), 'a').physicalSizeXUm).toBe(0.5);
    expect(parseOmeXml(ome('PhysicalSizeX="325" PhysicalSizeXUnit="nm"'), 'a').physicalSizeXUm).toBeCloseTo(0.325, 12);
    expect(parseOmeXml(ome('PhysicalSizeY="0.0013" PhysicalSizeYUnit="mm"'), 'a').physicalSizeYUm).toBeCloseTo(1.3, 12);
    expect(parseOmeXml(ome('PhysicalSizeZ="2" PhysicalSizeZUnit="um"'), 'a').physicalSizeZUm).toBe(2);
    expect(parseOmeXml(ome('PhysicalSizeX="5000" PhysicalSizeXUnit="\u00C5"'), 'a').physicalSizeXUm).toBeCloseTo(0.5, 12);
  });

  it("ignores a 'pixel' unit with a warning", () => {
    const img = parseOmeXml(ome('PhysicalSizeX="1" PhysicalSizeXUnit="pixel"'), 'a');
    expect(img.physicalSizeXUm).toBeNull();
    expect(img.warnings).toEqual(['OME PhysicalSizeX unit "pixel" is not a length; ignored']);
  });

  it('reads an empty <TiffData/> and a multi-file UUID', () => {
    expect(parseOmeXml(ome(''), 'a').tiffData).toEqual([{ ifd: undefined, firstZ: 0, firstC: 0, firstT: 0, planeCount: undefined, fileName: null }]);
    const multi = parseOmeXml(ome('', '<TiffData IFD="0" PlaneCount="1"><UUID FileName="other.ome.tif">urn:uuid:1</UUID></TiffData>'), 'a');
    expect(multi.tiffData[0].fileName).toBe('other.ome.tif');
  });

  it('rejects malformed XML, a bad order and a missing size with exact messages', () => {
    expect(() => parseOmeXml('<OME><Image>', 'x.ome.tif')).toThrow(/^x\.ome\.tif: OME-XML is not well-formed \(line 1: /);
    expect(() => parseOmeXml(ome('').replace('XYZCT', 'XYQCT'), 'x.ome.tif')).toThrow('x.ome.tif: OME-XML DimensionOrder "XYQCT" is not one of the six orders');
    expect(() => parseOmeXml(ome('').replace(' SizeZ="2"', ''), 'x.ome.tif')).toThrow('x.ome.tif: OME-XML Pixels SizeZ is missing');
    expect(() => parseOmeXml('<OME xmlns="x"></OME>', 'x.ome.tif')).toThrow('x.ome.tif: OME-XML has no Image/Pixels element');
  });

  it('recognises OME-XML text', () => {
    expect(looksLikeOmeXml(ome(''))).toBe(true);
    expect(looksLikeOmeXml('<ome:OME xmlns:ome="x">')).toBe(true);
    expect(looksLikeOmeXml('ImageJ=1.54f\nimages=3')).toBe(false);
  });
});

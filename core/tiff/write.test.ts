import { describe, expect, it } from 'vitest';
import { memoryByteSource } from './byte-source';
import { createGeotiffPlaneSource } from './geotiff-source';
import { readTiffHeader } from './header';
import { readIfdChain } from './ifd';
import { parseOmeXml } from './ome';
import { readStackInfo } from './stack-info';
import { readNumbers, readTag } from './tag-value';
import { writeOmeTiff, writeOmeTiffPieces, writePlainTiff } from './write';

/** Demo data: a 5×3 plane whose value encodes (plane, x, y). */
const plane = (n: number) => ({ width: 5, height: 3, data: Uint16Array.from({ length: 15 }, (_, i) => n * 100 + i * 7 + 60000 * (i % 2)) });
const meta = { sizeZ: 2, sizeC: 1, sizeT: 1, dimensionOrder: 'XYZCT' as const, channelNames: ['stain'], physicalSizeXUm: 0.5 };

describe('writeOmeTiff', () => {
  it('checks its options first with exact messages', () => {
    const two = [plane(0), plane(1)];
    expect(() => writeOmeTiff([], meta)).toThrow('at least one plane is required');
    expect(() => writeOmeTiff([plane(0)], meta)).toThrow('expected 2 planes (sizeZ × sizeC × sizeT) but got 1');
    expect(() => writeOmeTiff(two, { ...meta, sizeZ: 0 })).toThrow('sizeZ must be a positive integer');
    expect(() => writeOmeTiff(two, { ...meta, dimensionOrder: 'XYZ' as never })).toThrow('dimensionOrder must be one of XYZCT, XYZTC, XYCTZ, XYCZT, XYTCZ, XYTZC');
    expect(() => writeOmeTiff(two, { ...meta, channelNames: [] })).toThrow('channelNames must have sizeC (1) entries');
    expect(() => writeOmeTiff(two, { ...meta, physicalSizeXUm: -1 })).toThrow('physicalSizeXUm must be a positive number');
    expect(() => writeOmeTiff([plane(0), { width: 4, height: 3, data: new Uint16Array(12) }], meta)).toThrow('plane 1 is 4×3 but plane 0 is 5×3');
    expect(() => writeOmeTiff([plane(0), { width: 5, height: 3, data: new Uint8Array(15) }], meta)).toThrow('plane 1 sample type differs from plane 0');
    expect(() => writeOmeTiff([plane(0), { width: 5, height: 3, data: new Uint16Array(14) }], meta)).toThrow('plane 1 data has 14 values, expected 15');
  });

  // Source: TIFF 6.0 §2 (header, entries sorted by tag); OME-TIFF specification (OME-XML in IFD 0 ImageDescription).
  it('writes a valid little-endian TIFF with OME-XML in IFD 0 and sorted tags', async () => {
    const bytes = writeOmeTiff([plane(0), plane(1)], { ...meta, physicalSizeZUm: 2, channelNames: ['a&b'] });
    expect(Array.from(bytes.subarray(0, 4))).toEqual([0x49, 0x49, 42, 0]);
    const source = memoryByteSource(bytes);
    const header = await readTiffHeader(source, 'w');
    const ifds = await readIfdChain(source, header, 'w');
    expect(ifds).toHaveLength(2);
    const tags = [...ifds[0].entries.keys()];
    expect(tags).toEqual([...tags].sort((a, b) => a - b));
    const desc = await readTag(source, header, ifds[0], 270, 'w');
    const ome = parseOmeXml(desc?.kind === 'ascii' ? desc.text : '', 'w');
    expect(ome).toMatchObject({ sizeX: 5, sizeY: 3, sizeZ: 2, type: 'uint16', physicalSizeXUm: 0.5, physicalSizeZUm: 2, channelNames: ['a&b'] });
    expect(await readTag(source, header, ifds[1], 270, 'w')).toBeNull();
    // Source: TIFF 6.0 §8 (ResolutionUnit 3 = cm): 0.5 µm → 20000 px/cm.
    expect(await readNumbers(source, header, ifds[0], 282, 'w')).toEqual([20000]);
    expect(await readNumbers(source, header, ifds[0], 296, 'w')).toEqual([3]);
  });

  it('round-trips exact pixels with and without Deflate (geotiff as reference decoder)', async () => {
    for (const compression of ['none', 'deflate'] as const) {
      for (const data of [new Uint8Array([0, 1, 255, 7, 9, 200]), new Float32Array([-1.5, 0, 3.25, 1e-7, -1e9, 42]), new Uint16Array([0, 65535, 1, 256, 4095, 12345])]) {
        const bytes = writeOmeTiff([{ width: 3, height: 2, data }], { ...meta, sizeZ: 1, compression });
        const info = await readStackInfo(memoryByteSource(bytes), 'r.ome.tif');
        expect(info.compression).toBe(compression === 'none' ? 'none' : 'Deflate');
        const plane0 = await createGeotiffPlaneSource(bytes, info, 'r.ome.tif').readPlane(0, 0, 0);
        expect(plane0.data).toEqual(data);
      }
    }
  });
});

describe('writeOmeTiffPieces', () => {
  /** The pieces laid out at their positions, and the order planes were asked for. */
  function assemble(count: number, planeAt: (n: number) => ReturnType<typeof plane>, m: Parameters<typeof writeOmeTiff>[1]) {
    const asked: number[] = [];
    const pieces: { bytes: Uint8Array; position: number }[] = [];
    const length = writeOmeTiffPieces(count, (n) => { asked.push(n); return planeAt(n); }, m, (bytes, position) => pieces.push({ bytes: bytes.slice(), position }));
    const out = new Uint8Array(length);
    for (const { bytes, position } of pieces) out.set(bytes, position);
    return { out, asked, pieces };
  }

  it('writes the bytes writeOmeTiff writes, asking for each plane once in order, with and without Deflate', () => {
    // Demo data: 2 z × 2 c × 3 t planes of the pattern above.
    const movie = { ...meta, sizeC: 2, sizeT: 3, channelNames: ['a', 'b'], timeIncrementS: 30 };
    for (const compression of ['none', 'deflate'] as const) {
      const planes = Array.from({ length: 12 }, (_, n) => plane(n));
      const { out, asked, pieces } = assemble(12, (n) => plane(n), { ...movie, compression });
      expect(out).toEqual(writeOmeTiff(planes, { ...movie, compression }));
      expect(asked).toEqual(Array.from({ length: 12 }, (_, n) => n));
      // The header is the last piece (the first IFD's offset is known only then); no piece overlaps another.
      expect(pieces[pieces.length - 1].position).toBe(0);
      const covered = pieces.reduce((n, p) => n + p.bytes.length, 0);
      expect(covered).toBe(out.length);
    }
  });

  it('checks each plane as it is made, with writeOmeTiff\'s messages', () => {
    expect(() => assemble(0, plane, meta)).toThrow('at least one plane is required');
    expect(() => assemble(1, plane, meta)).toThrow('expected 2 planes (sizeZ × sizeC × sizeT) but got 1');
    expect(() => assemble(2, (n) => (n === 0 ? plane(0) : { width: 4, height: 3, data: new Uint16Array(12) }), meta)).toThrow('plane 1 is 4×3 but plane 0 is 5×3');
    expect(() => assemble(2, (n) => (n === 0 ? plane(0) : { width: 5, height: 3, data: new Uint16Array(15), samplesPerPixel: 2 } as never), meta)).toThrow();
  });
});

describe('writePlainTiff', () => {
  it('writes resolution tags per inch and a description; checks options', async () => {
    const bytes = writePlainTiff([plane(0)], { pixelSizeUm: 0.5, resolutionUnit: 'inch', description: 'demo data' });
    const info = await readStackInfo(memoryByteSource(bytes), 'p.tif');
    expect(info.pixelSize).toEqual({ xUm: 0.5, yUm: 0.5, zUm: null, source: 'tiff-resolution' });
    expect(info.description).toBe('demo data');
    expect(() => writePlainTiff([plane(0)], { pixelSizeUm: 0 })).toThrow('pixelSizeUm must be a positive number');
    expect(() => writePlainTiff([plane(0)], { compression: 'lzw' as never })).toThrow("compression must be 'none' or 'deflate'");
  });
});

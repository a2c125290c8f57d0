// Cross-checks on files made by our writer and by libtiff's tiffcp: both decoders must return the known pattern,
// and the tags we read must agree with libtiff's tiffinfo/tiffdump.
import { spawnSync } from 'node:child_process';
import { beforeAll, describe, expect, it } from 'vitest';
import { createSharpPlaneSource, openStackForAnalysis, sharpDecodesExactly } from '../../app/decode';
import { openStackFile, readStackInfoFromFile } from '../../core/io';
import { planeNumber } from '../../core/tiff';
import { hasTiffcp, makeTiffFixtures, type TiffFixture } from '../../scripts/make-tiff-fixtures';

const TIFFCP = hasTiffcp();
if (!TIFFCP) console.warn('test/tiff: tiffcp (libtiff-tools) is missing; tiffcp variants and tiffinfo checks are skipped. CI installs it.');

let fixtures: TiffFixture[] = [];
beforeAll(() => {
  fixtures = makeTiffFixtures();
});

/** Every (z, c, t) of a fixture. */
function* planesOf(f: TiffFixture) {
  for (let t = 0; t < f.sizeT; t++) for (let c = 0; c < f.sizeC; c++) for (let z = 0; z < f.sizeZ; z++) yield [z, c, t] as const;
}

describe('TIFF fixtures decode pixel-identical to the known pattern', () => {
  it('makes the expected set of files', () => {
    expect(fixtures.length).toBe(TIFFCP ? 43 : 15);
  });

  // Source: TIFF 6.0 §9 PackBits, §13 LZW, §14 Predictor, §15 tiles, §19 SampleFormat; Adobe TN3 float predictor;
  // BigTIFF design; byte order §2 — each variant made by libtiff's tiffcp (an independent implementation).
  it('with geotiff (pure JS) and the StackInfo sizes/types match', async () => {
    for (const f of fixtures) {
      const { info, source } = await openStackFile(f.path, f.name);
      expect({ name: f.name, z: info.sizeZ, c: info.sizeC, t: info.sizeT, type: info.sampleType, spp: info.samplesPerPixel })
        .toEqual({ name: f.name, z: f.sizeZ, c: f.sizeC, t: f.sizeT, type: f.sampleType, spp: f.samplesPerPixel });
      for (const [z, c, t] of planesOf(f)) {
        const plane = await source.readPlane(z, c, t);
        expect(plane.data.constructor, f.name).toBe(f.expected(z, c, t).constructor);
        expect(plane.data, `${f.name} z${z} c${c} t${t}`).toEqual(f.expected(z, c, t));
      }
      await source.close();
    }
  });

  it('with sharp (libvips) directly, for the sample types it decodes exactly', async () => {
    let checked = 0;
    for (const f of fixtures) {
      const info = await readStackInfoFromFile(f.path, f.name);
      if (!sharpDecodesExactly(info)) continue;
      const source = createSharpPlaneSource(f.path, info, f.name);
      for (const [z, c, t] of planesOf(f)) expect((await source.readPlane(z, c, t)).data, `${f.name} z${z} c${c} t${t}`).toEqual(f.expected(z, c, t));
      checked++;
    }
    expect(checked).toBe(TIFFCP ? 35 : 12);
  });

  it('through openStackForAnalysis (sharp, geotiff for the rest) with no fallback warnings', async () => {
    for (const f of fixtures) {
      const { source, warnings } = await openStackForAnalysis(f.path, f.name);
      for (const [z, c, t] of planesOf(f)) expect((await source.readPlane(z, c, t)).data, `${f.name} z${z} c${c} t${t}`).toEqual(f.expected(z, c, t));
      expect(warnings, f.name).toEqual([]);
      await source.close();
    }
  });
});

describe('known decoder faults stay routed around', () => {
  // Source: TIFF 6.0 §14 + Adobe TN3 (floating-point predictor): the file written by libtiff holds the pattern
  // (geotiff recovers it exactly above), but sharp 0.35 returns the floats byte-swapped for big-endian files.
  it('sharp is not used for big-endian files with the floating-point predictor', async () => {
    const f = fixtures.find((x) => x.name === 'float32-zip3-be.tif');
    if (!f) return;
    const info = await readStackInfoFromFile(f.path, f.name);
    expect(sharpDecodesExactly(info)).toBe(false);
    const raw = await createSharpPlaneSource(f.path, { ...info, byteOrder: 'II' }, f.name).readPlane(0, 0, 0);
    const bytes = new Uint8Array(raw.data.buffer.slice(0));
    for (let i = 0; i < bytes.length; i += 4) bytes.subarray(i, i + 4).reverse();
    // If this starts failing, sharp has been fixed and the routing rule can go.
    expect(new Float32Array(bytes.buffer)).toEqual(f.expected(0, 0, 0));
  });
});

describe('OME-TIFF plane mapping for every DimensionOrder', () => {
  // Source: OME-TIFF specification / ome.xsd DimensionOrder and TiffData (IFD n holds plane n of the order).
  it('maps (z, c, t) to the IFD given by the order and reads channel names and physical sizes', async () => {
    const omeFixtures = fixtures.filter((f) => f.dimensionOrder !== null);
    expect(omeFixtures.length).toBe(TIFFCP ? 8 : 6);
    for (const f of omeFixtures) {
      const info = await readStackInfoFromFile(f.path, f.name);
      const order = f.dimensionOrder!;
      expect(info.dimensionOrder).toBe(order);
      expect(info.channelNames).toEqual(['dye-a', 'dye-b']);
      expect(info.pixelSize).toEqual({ xUm: 0.4, yUm: 0.4, zUm: 2, source: 'ome' });
      for (const [z, c, t] of planesOf(f)) expect(info.planeIfd[(t * 2 + c) * 3 + z]).toBe(planeNumber(order, info, z, c, t));
    }
  });
});

/** Directory 0 fields of `tiffinfo` output. */
function tiffinfo(path: string): { width: number; height: number; compression: string; predictor: string | null; resolution: string | null } {
  const out = spawnSync('tiffinfo', [path], { encoding: 'utf8' }).stdout.split('=== TIFF directory 1 ===')[0];
  const size = /Image Width: (\d+) Image Length: (\d+)/.exec(out)!;
  return {
    width: Number(size[1]), height: Number(size[2]),
    compression: /Compression Scheme: (.+)/.exec(out)![1].trim(),
    predictor: /Predictor: (.+)/.exec(out)?.[1].trim() ?? null,
    resolution: /Resolution: (.+)/.exec(out)?.[1].trim() ?? null,
  };
}

describe.runIf(TIFFCP)('tags agree with libtiff (tiffinfo / tiffdump)', () => {
  // Source: libtiff 4.5 tiffinfo names for TIFF 6.0 Compression codes 1, 5, 8, 32773 and Predictor 2/3.
  const names: Record<string, string> = { None: 'none', LZW: 'LZW', AdobeDeflate: 'Deflate', PackBits: 'PackBits' };
  const predictors: Record<string, string> = { 'horizontal differencing 2 (0x2)': ' + horizontal predictor', 'floating point predictor 3 (0x3)': ' + floating-point predictor' };

  it('width, height, compression and predictor', async () => {
    for (const f of fixtures) {
      const info = await readStackInfoFromFile(f.path, f.name);
      const ref = tiffinfo(f.path);
      expect({ f: f.name, w: info.sizeX, h: info.sizeY }).toEqual({ f: f.name, w: ref.width, h: ref.height });
      expect(info.compression, f.name).toBe(`${names[ref.compression]}${ref.predictor ? predictors[ref.predictor] : ''}`);
    }
  });

  // Source: TIFF 6.0 §2 byte order; BigTIFF design (version 43) — as printed by tiffdump.
  it('byte order and BigTIFF flag', async () => {
    for (const f of fixtures) {
      const info = await readStackInfoFromFile(f.path, f.name);
      const head = spawnSync('tiffdump', [f.path], { encoding: 'utf8' }).stdout;
      expect(info.byteOrder, f.name).toBe(head.includes('<big-endian>') ? 'MM' : 'II');
      expect(info.bigTiff, f.name).toBe(head.includes('<BigTIFF>'));
    }
    expect(fixtures.some((f) => f.tiffcpArgs.includes('-B'))).toBe(true);
  });

  // Source: TIFF 6.0 §8 (pixels per cm); tiffinfo prints the resolution our writer stored (20000 px/cm = 0.5 µm).
  it('pixel size from resolution tags survives tiffcp', async () => {
    for (const f of fixtures.filter((x) => x.dimensionOrder === null && !x.name.includes('3samples'))) {
      const info = await readStackInfoFromFile(f.path, f.name);
      expect(tiffinfo(f.path).resolution, f.name).toBe('20000, 20000 pixels/cm');
      expect(info.pixelSize, f.name).toEqual({ xUm: 0.5, yUm: 0.5, zUm: null, source: 'tiff-resolution' });
    }
  });
});

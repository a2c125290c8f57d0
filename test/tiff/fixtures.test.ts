// Cross-checks on files made by our writer, libtiff's tiffcp, GDAL's gdal_translate and Python's tifffile: every
// decoder must return the known pattern, and the tags we read must agree with libtiff's tiffinfo/tiffdump.
import { spawnSync } from 'node:child_process';
import { beforeAll, describe, expect, it } from 'vitest';
import { APP_CHUNK_CODECS, createSharpPlaneSource, openStackForAnalysis, sharpDecodesExactly } from '../../app/decode';
import { openFileByteSource, openStackFile, readStackInfoFromFile } from '../../core/io';
import { createDirectPlaneSource, planeNumber } from '../../core/tiff';
import { hasGdal, hasTiffcp, hasTifffile, makeTiffFixtures, type TiffFixture } from '../../scripts/make-tiff-fixtures';

const TIFFCP = hasTiffcp();
const GDAL = hasGdal();
const TIFFFILE = hasTifffile();
if (!TIFFCP) console.warn('test/tiff: tiffcp (libtiff-tools) is missing; tiffcp variants and tiffinfo checks are skipped. CI installs it.');
if (!GDAL) console.warn('test/tiff: gdal_translate (gdal-bin) is missing; GDAL fixtures are skipped. CI installs it.');
if (!TIFFFILE) console.warn('test/tiff: /usr/bin/python3 with tifffile is missing; tifffile fixtures are skipped. CI installs it.');

/** geotiff 3.0.5 has no LZMA decoder (compression 34925). */
const geotiffReads = (f: TiffFixture) => !f.name.includes('lzma');

let fixtures: TiffFixture[] = [];
beforeAll(() => {
  fixtures = makeTiffFixtures();
});

/** LZMA and Zstandard, which the sharp check leaves out (the direct path reads them). */
function isNewCodec(f: TiffFixture): boolean {
  return /lzma|zstd/.test(f.name);
}

/** Every (z, c, t) of a fixture. */
function* planesOf(f: TiffFixture) {
  for (let t = 0; t < f.sizeT; t++) for (let c = 0; c < f.sizeC; c++) for (let z = 0; z < f.sizeZ; z++) yield [z, c, t] as const;
}

describe('TIFF fixtures decode pixel-identical to the known pattern', () => {
  it('makes the expected set of files', () => {
    expect(fixtures.length).toBe(15 + (TIFFCP ? 32 : 0) + (GDAL ? 6 : 0) + (TIFFFILE ? 5 : 0));
  });

  // Source: TIFF 6.0 §9 PackBits, §13 LZW, §14 Predictor, §15 tiles, §19 SampleFormat; Adobe TN3 float predictor;
  // BigTIFF design; byte order §2 — each variant made by libtiff's tiffcp, GDAL's gdal_translate or Python's
  // tifffile (independent implementations); the writer is in each fixture's `writer` and in its name.
  it('with geotiff (pure JS, the reference) and the StackInfo sizes/types match', async () => {
    for (const f of fixtures.filter(geotiffReads)) {
      const { info, source } = await openStackFile(f.path, f.name, { decoder: 'geotiff' });
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

  // Source: as above; LZMA fixtures are checked against the pattern that tiffcp/gdal_translate/tifffile were given,
  // and against libtiff's own decoding (tiffcp -c none) below.
  it('on the direct path with every codec, identical to geotiff where geotiff reads the file', async () => {
    for (const f of fixtures) {
      const file = await openFileByteSource(f.path, f.name);
      const info = await readStackInfoFromFile(f.path, f.name);
      expect({ name: f.name, z: info.sizeZ, c: info.sizeC, spp: info.samplesPerPixel }).toEqual({ name: f.name, z: f.sizeZ, c: f.sizeC, spp: f.samplesPerPixel });
      const direct = createDirectPlaneSource(file, info, APP_CHUNK_CODECS, f.name);
      const reference = geotiffReads(f) ? (await openStackFile(f.path, f.name, { decoder: 'geotiff' })).source : null;
      for (const [z, c, t] of planesOf(f)) {
        const plane = await direct.readPlane(z, c, t);
        expect(plane.data, `${f.name} (${f.writer}) z${z} c${c} t${t}`).toEqual(f.expected(z, c, t));
        if (reference) expect(plane.data, `${f.name} vs geotiff`).toEqual((await reference.readPlane(z, c, t)).data);
      }
      await direct.close();
      await reference?.close();
    }
  });

  // Source: as above (files by tiffcp — uncompressed and Deflate, little- and big-endian (-B), strips and tiles —,
  // gdal_translate, tifffile and our writer). One array per fixture is lent to every plane in turn, as a movie does.
  it('on the direct path into a lent array: the same planes, in that array, whatever it held before', async () => {
    for (const f of fixtures) {
      const file = await openFileByteSource(f.path, f.name);
      const info = await readStackInfoFromFile(f.path, f.name);
      const direct = createDirectPlaneSource(file, info, APP_CHUNK_CODECS, f.name);
      const expected0 = f.expected(0, 0, 0);
      // A view 8 bytes into a larger buffer, so the decoder must respect the array's own offset.
      const View = expected0.constructor as new (buffer: ArrayBuffer, byteOffset: number, length: number) => typeof expected0;
      const lent = new View(new ArrayBuffer(8 + expected0.byteLength + 8), 8, expected0.length).fill(7);
      for (const [z, c, t] of planesOf(f)) {
        const plane = await direct.readPlane(z, c, t, lent);
        expect(plane.data, `${f.name} z${z} c${c} t${t} decoded into the lent array`).toBe(lent);
        expect(plane.data, `${f.name} (${f.writer}) z${z} c${c} t${t}`).toEqual(f.expected(z, c, t));
      }
      // An array of another type or length is not used: the plane comes in a new array, the lent one is untouched.
      const other = expected0 instanceof Float64Array ? new Float32Array(expected0.length) : new Float64Array(expected0.length);
      const short = new (expected0.constructor as new (n: number) => typeof expected0)(expected0.length - 1);
      for (const wrong of [other, short]) {
        const plane = await direct.readPlane(0, 0, 0, wrong);
        expect(plane.data).not.toBe(wrong);
        expect(plane.data, `${f.name} with a lent array that does not fit`).toEqual(f.expected(0, 0, 0));
        expect(wrong.every((v) => v === 0), `${f.name}: the unfit array is left as it was`).toBe(true);
      }
      await direct.close();
    }
  });

  // Source: libtiff's LZMA decoder (tif_lzma.c, liblzma), run through tiffcp -c none.
  it.runIf(TIFFCP)('LZMA files decode as libtiff decodes them', async () => {
    const lzma = fixtures.filter((f) => f.name.includes('lzma'));
    expect(lzma.length).toBe(2 + (GDAL ? 1 : 0) + (TIFFFILE ? 1 : 0));
    for (const f of lzma) {
      const plainPath = `${f.path}.none.tif`;
      const r = spawnSync('tiffcp', ['-c', 'none', f.path, plainPath], { encoding: 'utf8' });
      expect(r.status, r.stderr).toBe(0);
      const libtiff = await openStackFile(plainPath, f.name, { decoder: 'geotiff' });
      const { source } = await openStackForAnalysis(f.path, f.name);
      for (const [z, c, t] of planesOf(f)) expect((await source.readPlane(z, c, t)).data, `${f.name} z${z} c${c}`).toEqual((await libtiff.source.readPlane(z, c, t)).data);
      await source.close();
      await libtiff.source.close();
    }
  });

  it('with sharp (libvips) directly, for the sample types it decodes exactly', async () => {
    let checked = 0;
    for (const f of fixtures.filter((x) => x.writer === 'eggline' || x.writer === 'tiffcp')) {
      if (isNewCodec(f)) continue;
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
  // Source: libtiff 4.5 tiffinfo names for TIFF 6.0 Compression codes 1, 5, 8, 32773, 34925, 50000 and Predictor 2/3.
  const names: Record<string, string> = { None: 'none', LZW: 'LZW', AdobeDeflate: 'Deflate', PackBits: 'PackBits', LZMA: 'LZMA', ZSTD: 'Zstandard' };
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
    for (const f of fixtures.filter((x) => x.dimensionOrder === null && !x.name.includes('3samples') && (x.writer === 'eggline' || x.writer === 'tiffcp'))) {
      const info = await readStackInfoFromFile(f.path, f.name);
      expect(tiffinfo(f.path).resolution, f.name).toBe('20000, 20000 pixels/cm');
      expect(info.pixelSize, f.name).toEqual({ xUm: 0.5, yUm: 0.5, zUm: null, source: 'tiff-resolution' });
    }
  });
});

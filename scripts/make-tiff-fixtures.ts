// Writes TIFF test fixtures with known pixel patterns into test/fixtures/generated/tiff/ (gitignored):
// base files from our own writer, then variants made by libtiff's tiffcp. Run: npx tsx scripts/make-tiff-fixtures.ts
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, renameSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { DimensionOrder, PixelArray, SampleType } from '../core/model';
import { DIMENSION_ORDERS, planeCoordinates, writeOmeTiff, writePlainTiff, type WritePlane } from '../core/tiff';

/** Fixture image size: odd on purpose so rows, strips and tiles never divide evenly. */
export const FIXTURE_WIDTH = 33;
export const FIXTURE_HEIGHT = 17;

/** Default output folder. */
export const FIXTURE_DIR = resolve(dirname(fileURLToPath(import.meta.url)), '../test/fixtures/generated/tiff');

/** One generated file and what it must decode to. */
export interface TiffFixture {
  readonly name: string;
  readonly path: string;
  readonly sampleType: SampleType;
  readonly sizeZ: number;
  readonly sizeC: number;
  readonly sizeT: number;
  readonly samplesPerPixel: number;
  readonly dimensionOrder: DimensionOrder | null;
  /** tiffcp arguments used to make it from its base, or [] for a base file. */
  readonly tiffcpArgs: readonly string[];
  /** Which program wrote it: our writer, libtiff's tiffcp, GDAL's gdal_translate or Python's tifffile. */
  readonly writer: 'eggline' | 'tiffcp' | 'gdal_translate' | 'tifffile';
  /** The exact pixel values of plane (z, c, t). */
  expected(z: number, c: number, t: number): PixelArray;
}

const ARRAY: Record<SampleType, (n: number) => PixelArray> = {
  uint8: (n) => new Uint8Array(n), int8: (n) => new Int8Array(n), uint16: (n) => new Uint16Array(n), int16: (n) => new Int16Array(n),
  uint32: (n) => new Uint32Array(n), int32: (n) => new Int32Array(n), float32: (n) => new Float32Array(n), float64: (n) => new Float64Array(n),
};

/** Pattern value of plane `n` at (x, y) for a sample type: spans the full range, so byte order and sign show. */
export function patternValue(type: SampleType, n: number, x: number, y: number): number {
  const k = x * 1031 + y * 257 + n * 4099 + 17;
  switch (type) {
    case 'uint8': return (x * 7 + y * 13 + n * 29) & 255;
    case 'int8': return ((x * 7 + y * 13 + n * 29) & 255) - 128;
    case 'uint16': return k & 0xffff;
    case 'int16': return (k & 0xffff) - 32768;
    case 'uint32': return (x * 2654435761 + y * 40503 + n * 97) >>> 0;
    case 'int32': return (x * 2654435761 + y * 40503 + n * 97) | 0;
    default: return Math.fround(Math.sin(x * 0.3 + n) * 1000 + y * 0.125 - 200);
  }
}

/** The whole plane `n` of the pattern (samples interleaved when spp > 1; sample s uses n·spp + s). */
export function patternPlane(type: SampleType, n: number, spp = 1): PixelArray {
  const data = ARRAY[type](FIXTURE_WIDTH * FIXTURE_HEIGHT * spp);
  for (let y = 0; y < FIXTURE_HEIGHT; y++) {
    for (let x = 0; x < FIXTURE_WIDTH; x++) {
      for (let s = 0; s < spp; s++) data[(y * FIXTURE_WIDTH + x) * spp + s] = patternValue(type, n * spp + s, x, y);
    }
  }
  return data;
}

/** OME fixture value: unique per (z, c, t) so a wrong plane map shows at once. */
export function omeValue(z: number, c: number, t: number, x: number, y: number): number {
  return t * 3000 + c * 1000 + z * 100 + x + y * 3;
}

/** The OME plane (z, c, t) as uint16. */
export function omePlane(z: number, c: number, t: number): Uint16Array {
  const data = new Uint16Array(FIXTURE_WIDTH * FIXTURE_HEIGHT);
  for (let y = 0; y < FIXTURE_HEIGHT; y++) for (let x = 0; x < FIXTURE_WIDTH; x++) data[y * FIXTURE_WIDTH + x] = omeValue(z, c, t, x, y);
  return data;
}

/** True when a program can be run (it exists on PATH or at the path given). */
function canRun(program: string, args: readonly string[] = []): boolean {
  const r = spawnSync(program, args, { encoding: 'utf8' });
  return !(r.error && (r.error as NodeJS.ErrnoException).code === 'ENOENT');
}

/** True when libtiff's tiffcp can be run. */
export function hasTiffcp(): boolean {
  return canRun('tiffcp');
}

/** True when GDAL's gdal_translate can be run (Debian package gdal-bin). */
export function hasGdal(): boolean {
  return canRun('gdal_translate', ['--version']);
}

/** Debian's Python with numpy and tifffile (the pyenv python3 on PATH may lack them). */
export const PYTHON = '/usr/bin/python3';

/** True when Debian's Python can import tifffile. */
export function hasTifffile(): boolean {
  return spawnSync(PYTHON, ['-c', 'import tifffile, numpy'], { encoding: 'utf8' }).status === 0;
}

/** Writes bytes via a temporary name and a rename, so parallel test workers never see half a file. */
function writeAtomic(path: string, bytes: Uint8Array): void {
  const tmp = `${path}.${process.pid}.tmp`;
  writeFileSync(tmp, bytes);
  renameSync(tmp, path);
}

/** Runs tiffcp on `from`, writing `to` atomically; throws with tiffcp's message on failure. */
function tiffcp(args: readonly string[], from: string, to: string): void {
  const tmp = `${to}.${process.pid}.tmp.tif`;
  const r = spawnSync('tiffcp', [...args, from, tmp], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`tiffcp ${args.join(' ')} failed: ${r.stderr || r.error?.message}`);
  renameSync(tmp, to);
}

const PLAIN_TYPES: readonly SampleType[] = ['uint8', 'int8', 'uint16', 'int16', 'uint32', 'int32', 'float32', 'float64'];
const PLAIN_PLANES = 3;

/** Base plain TIFFs: 3 planes of each sample type, plus a 3-sample (chunky) uint8 image (tiffcp splits planes only for 8-bit). */
function writeBases(dir: string): TiffFixture[] {
  const out: TiffFixture[] = [];
  for (const type of PLAIN_TYPES) {
    const planes: WritePlane[] = Array.from({ length: PLAIN_PLANES }, (_, n) => ({ width: FIXTURE_WIDTH, height: FIXTURE_HEIGHT, data: patternPlane(type, n) }));
    const path = join(dir, `${type}.tif`);
    writeAtomic(path, writePlainTiff(planes, { pixelSizeUm: 0.5 }));
    out.push(plainFixture(`${type}.tif`, path, type, []));
  }
  const rgbPath = join(dir, 'uint8-3samples.tif');
  writeAtomic(rgbPath, writePlainTiff([{ width: FIXTURE_WIDTH, height: FIXTURE_HEIGHT, data: patternPlane('uint8', 0, 3), samplesPerPixel: 3 }]));
  out.push(samplesFixture('uint8-3samples.tif', rgbPath, []));
  return out;
}

/** A plain fixture: PLAIN_PLANES planes as Z. */
function plainFixture(name: string, path: string, type: SampleType, args: readonly string[]): TiffFixture {
  return {
    name, path, sampleType: type, sizeZ: PLAIN_PLANES, sizeC: 1, sizeT: 1, samplesPerPixel: 1, dimensionOrder: null, tiffcpArgs: args,
    writer: args.length > 0 ? 'tiffcp' : 'eggline',
    expected: (z) => patternPlane(type, z),
  };
}

/** The 3-sample fixture: one IFD, samples read as channels. */
function samplesFixture(name: string, path: string, args: readonly string[]): TiffFixture {
  return {
    name, path, sampleType: 'uint8', sizeZ: 1, sizeC: 3, sizeT: 1, samplesPerPixel: 3, dimensionOrder: null, tiffcpArgs: args,
    writer: args.length > 0 ? 'tiffcp' : 'eggline',
    expected: (_z, c) => patternPlane('uint8', c),
  };
}

/** Variants made with tiffcp: [name, base type, tiffcp args]. */
const VARIANTS: readonly [string, SampleType, readonly string[]][] = [
  ['uint16-lzw2.tif', 'uint16', ['-c', 'lzw:2']],
  ['uint16-zip2.tif', 'uint16', ['-c', 'zip:2']],
  ['uint16-packbits.tif', 'uint16', ['-c', 'packbits']],
  ['uint16-tiles.tif', 'uint16', ['-t', '-w', '32', '-l', '32']],
  ['uint16-tiles-lzw2.tif', 'uint16', ['-t', '-w', '16', '-l', '16', '-c', 'lzw:2']],
  ['uint16-bigtiff.tif', 'uint16', ['-8']],
  ['uint16-bigtiff-be-zip2.tif', 'uint16', ['-8', '-B', '-c', 'zip:2']],
  ['uint16-rows8.tif', 'uint16', ['-r', '8']],
  ['uint16-be.tif', 'uint16', ['-B']],
  ['uint16-be-lzw2.tif', 'uint16', ['-B', '-c', 'lzw:2']],
  ['uint32-be-lzw2.tif', 'uint32', ['-B', '-c', 'lzw:2']],
  ['float32-be-lzw2.tif', 'float32', ['-B', '-c', 'lzw:2']],
  ['uint16-tiles-be-lzw2.tif', 'uint16', ['-B', '-t', '-w', '16', '-l', '16', '-c', 'lzw:2']],
  ['uint8-lzw2.tif', 'uint8', ['-c', 'lzw:2']],
  ['int8-packbits.tif', 'int8', ['-c', 'packbits']],
  ['int16-be.tif', 'int16', ['-B']],
  ['int16-lzw2.tif', 'int16', ['-c', 'lzw:2']],
  ['uint32-lzw2.tif', 'uint32', ['-c', 'lzw:2']],
  ['uint32-be.tif', 'uint32', ['-B']],
  ['int32-zip2.tif', 'int32', ['-c', 'zip:2']],
  ['float32-lzw3.tif', 'float32', ['-c', 'lzw:3']],
  ['float32-zip3-be.tif', 'float32', ['-c', 'zip:3', '-B']],
  ['float32-be.tif', 'float32', ['-B']],
  ['float32-tiles-lzw3.tif', 'float32', ['-t', '-w', '16', '-l', '16', '-c', 'lzw:3']],
  ['uint16-zstd2.tif', 'uint16', ['-c', 'zstd:2']],
  ['uint16-lzma2.tif', 'uint16', ['-c', 'lzma:2']],
  ['float32-be-zstd3.tif', 'float32', ['-B', '-c', 'zstd:3']],
  ['uint16-tiles-be-lzma.tif', 'uint16', ['-B', '-t', '-w', '16', '-l', '16', '-c', 'lzma']],
];

/** GDAL variants of IFD 0 of a base (GDAL reads the first page only): [name, base type, gdal_translate args]. */
const GDAL_VARIANTS: readonly [string, SampleType, readonly string[]][] = [
  ['gdal-uint16-zstd2.tif', 'uint16', ['-co', 'COMPRESS=ZSTD', '-co', 'PREDICTOR=2']],
  ['gdal-uint16-lzma-tiled.tif', 'uint16', ['-co', 'COMPRESS=LZMA', '-co', 'TILED=YES', '-co', 'BLOCKXSIZE=16', '-co', 'BLOCKYSIZE=16']],
  ['gdal-float32-deflate3-bigtiff.tif', 'float32', ['-co', 'COMPRESS=DEFLATE', '-co', 'PREDICTOR=3', '-co', 'BIGTIFF=YES']],
  ['gdal-int16-lzw2-tiled.tif', 'int16', ['-co', 'COMPRESS=LZW', '-co', 'PREDICTOR=2', '-co', 'TILED=YES', '-co', 'BLOCKXSIZE=16', '-co', 'BLOCKYSIZE=16']],
  ['gdal-uint8-packbits-rows5.tif', 'uint8', ['-co', 'COMPRESS=PACKBITS', '-co', 'BLOCKYSIZE=5']],
  ['gdal-float64-zstd3.tif', 'float64', ['-co', 'COMPRESS=ZSTD', '-co', 'PREDICTOR=3']],
];

/** Runs gdal_translate on `from`, writing `to` atomically (no .aux.xml side files). */
function gdalTranslate(args: readonly string[], from: string, to: string): void {
  const tmp = `${to}.${process.pid}.tmp.tif`;
  const r = spawnSync('gdal_translate', ['-q', '-of', 'GTiff', ...args, from, tmp], { encoding: 'utf8', env: { ...process.env, GDAL_PAM_ENABLED: 'NO' } });
  if (r.status !== 0) throw new Error(`gdal_translate ${args.join(' ')} failed: ${r.stderr || r.error?.message}`);
  renameSync(tmp, to);
}

/** Files written by GDAL: one plane (pattern plane 0). */
function writeGdalFixtures(dir: string): TiffFixture[] {
  return GDAL_VARIANTS.map(([name, type, args]) => {
    const path = join(dir, name);
    gdalTranslate(args, join(dir, `${type}.tif`), path);
    return {
      name, path, sampleType: type, sizeZ: 1, sizeC: 1, sizeT: 1, samplesPerPixel: 1, dimensionOrder: null, tiffcpArgs: [],
      writer: 'gdal_translate' as const, expected: () => patternPlane(type, 0),
    };
  });
}

/** Files written by Python's tifffile (scripts/tifffile-fixtures.py): Z=3 × C=2 of uint16, plane (z, c) = pattern z·2+c. */
function writeTifffileFixtures(dir: string): TiffFixture[] {
  const script = join(dirname(fileURLToPath(import.meta.url)), 'tifffile-fixtures.py');
  const r = spawnSync(PYTHON, [script, dir], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`tifffile-fixtures.py failed: ${r.stderr || r.error?.message}`);
  const names: [string, number][] = [
    ['tifffile-zcyx.tif', 1], ['tifffile-zcyx-zlib.tif', 1], ['tifffile-2samples.tif', 2],
    ['tifffile-2samples-planar-lzma.tif', 2], ['tifffile-zcyx-tiled-bigtiff.tif', 1],
  ];
  return names.map(([name, spp]) => ({
    name, path: join(dir, name), sampleType: 'uint16' as const, sizeZ: 3, sizeC: 2, sizeT: 1, samplesPerPixel: spp,
    dimensionOrder: null, tiffcpArgs: [], writer: 'tifffile' as const, expected: (z: number, c: number) => patternPlane('uint16', z * 2 + c),
  }));
}

/** OME-TIFFs for each DimensionOrder: 2 channels × 3 z × 2 t, uint16, planes stored in that order. */
function writeOmeFixtures(dir: string): TiffFixture[] {
  const counts = { sizeZ: 3, sizeC: 2, sizeT: 2 };
  return DIMENSION_ORDERS.map((order) => {
    const planes = Array.from({ length: 12 }, (_, n) => {
      const { z, c, t } = planeCoordinates(order, counts, n);
      return { width: FIXTURE_WIDTH, height: FIXTURE_HEIGHT, data: omePlane(z, c, t) };
    });
    const name = `ome-${order}.ome.tif`;
    const path = join(dir, name);
    writeAtomic(path, writeOmeTiff(planes, { ...counts, dimensionOrder: order, channelNames: ['dye-a', 'dye-b'], physicalSizeXUm: 0.4, physicalSizeZUm: 2, compression: order === 'XYCZT' ? 'deflate' : 'none' }));
    return omeFixture(name, path, order, []);
  });
}

/** An OME fixture with its expected planes. */
function omeFixture(name: string, path: string, order: DimensionOrder, args: readonly string[]): TiffFixture {
  return {
    name, path, sampleType: 'uint16', sizeZ: 3, sizeC: 2, sizeT: 2, samplesPerPixel: 1, dimensionOrder: order, tiffcpArgs: args,
    writer: args.length > 0 ? 'tiffcp' : 'eggline', expected: omePlane,
  };
}

/** Writes every fixture (bases always; tiffcp variants when tiffcp exists) and returns the list. */
export function makeTiffFixtures(dir: string = FIXTURE_DIR): TiffFixture[] {
  mkdirSync(dir, { recursive: true });
  const fixtures = [...writeBases(dir), ...writeOmeFixtures(dir)];
  if (!hasTiffcp()) return fixtures;
  for (const [name, type, args] of VARIANTS) {
    const path = join(dir, name);
    tiffcp(args, join(dir, `${type}.tif`), path);
    fixtures.push(plainFixture(name, path, type, args));
  }
  const separate = join(dir, 'uint8-3samples-separate.tif');
  tiffcp(['-p', 'separate'], join(dir, 'uint8-3samples.tif'), separate);
  fixtures.push(samplesFixture('uint8-3samples-separate.tif', separate, ['-p', 'separate']));
  const separateLzw = join(dir, 'uint8-3samples-separate-lzw2.tif');
  tiffcp(['-p', 'separate', '-c', 'lzw:2'], join(dir, 'uint8-3samples.tif'), separateLzw);
  fixtures.push(samplesFixture('uint8-3samples-separate-lzw2.tif', separateLzw, ['-p', 'separate', '-c', 'lzw:2']));
  if (hasGdal()) fixtures.push(...writeGdalFixtures(dir));
  if (hasTifffile()) fixtures.push(...writeTifffileFixtures(dir));
  for (const [order, args] of [['XYTZC', ['-8', '-c', 'lzw:2']], ['XYCZT', ['-B', '-t', '-w', '16', '-l', '16']]] as const) {
    const name = `ome-${order}-${args.join('').replace(/[^a-z0-9]/gi, '')}.ome.tif`;
    tiffcp(args, join(dir, `ome-${order}.ome.tif`), join(dir, name));
    fixtures.push(omeFixture(name, join(dir, name), order, args));
  }
  return fixtures;
}

if (process.argv[1] && import.meta.url === pathToFileURL(resolve(process.argv[1])).href) {
  const list = makeTiffFixtures();
  console.log(`wrote ${list.length} TIFF fixtures to ${FIXTURE_DIR}${hasTiffcp() ? '' : ' (tiffcp missing: base files only)'}`);
  if (!existsSync(FIXTURE_DIR)) process.exitCode = 1;
}

// Writing simple TIFF and OME-TIFF files (used for demo data, benchmarks and test fixtures).
import type { DimensionOrder, PixelArray } from '../model';
import { isDimensionOrder, DIMENSION_ORDERS } from './dimension-order';
import { encodeTiff, encodeTiffPieces, sampleFormatOf, type EncodeImage } from './encode';
import { buildOmeXml } from './ome-xml';
import { toRational } from './rational';

/** One plane to write: row-major, data.length === width·height·(samplesPerPixel ?? 1), samples interleaved. */
export interface WritePlane {
  readonly width: number;
  readonly height: number;
  readonly data: PixelArray;
  readonly samplesPerPixel?: number;
}

/** Metadata of an OME-TIFF; planes are given in file order for `dimensionOrder`. Sizes in µm. */
export interface OmeTiffMeta {
  readonly sizeZ: number;
  readonly sizeC: number;
  readonly sizeT: number;
  readonly dimensionOrder: DimensionOrder;
  readonly channelNames: readonly string[];
  readonly physicalSizeXUm: number;
  readonly physicalSizeYUm?: number;
  readonly physicalSizeZUm?: number;
  readonly compression?: 'none' | 'deflate';
  /** Seconds between time points, written as Pixels/@TimeIncrement (unit s). */
  readonly timeIncrementS?: number;
}

/** Options of a plain TIFF: resolution tags from a pixel size in µm, free-text description. */
export interface PlainTiffOptions {
  readonly pixelSizeUm?: number;
  readonly pixelSizeYUm?: number;
  /** Unit of the written resolution tags; default 'cm'. */
  readonly resolutionUnit?: 'cm' | 'inch';
  readonly compression?: 'none' | 'deflate';
  readonly description?: string;
}

/** Throws with an exact message unless every plane has the size, type and sample count of plane 0. */
function checkPlanes(planes: readonly WritePlane[]): void {
  if (planes.length === 0) throw new Error('at least one plane is required');
  planes.forEach((p, i) => checkPlane(p, i, planes[0]));
}

/** Throws with an exact message unless plane i has the size, type and sample count of plane 0. */
function checkPlane(p: WritePlane, i: number, p0: WritePlane): void {
  const spp = p.samplesPerPixel ?? 1;
  if (!Number.isInteger(p.width) || !Number.isInteger(p.height) || p.width < 1 || p.height < 1) {
    throw new Error(`plane ${i} width and height must be positive integers`);
  }
  if (p.width !== p0.width || p.height !== p0.height) throw new Error(`plane ${i} is ${p.width}×${p.height} but plane 0 is ${p0.width}×${p0.height}`);
  if (p.data.constructor !== p0.data.constructor || spp !== (p0.samplesPerPixel ?? 1)) throw new Error(`plane ${i} sample type differs from plane 0`);
  if (p.data.length !== p.width * p.height * spp) throw new Error(`plane ${i} data has ${p.data.length} values, expected ${p.width * p.height * spp}`);
}

/** Checks a value is a positive finite number (µm). */
function checkPositive(value: number | undefined, name: string): void {
  if (value !== undefined && !(Number.isFinite(value) && value > 0)) throw new Error(`${name} must be a positive number`);
}

/** Resolution tags (pixels per cm or inch) for a pixel size in µm. */
function resolutionTags(xUm: number, yUm: number, unit: 'cm' | 'inch'): EncodeImage['resolution'] {
  const perUnitUm = unit === 'cm' ? 10000 : 25400;
  return { x: toRational(perUnitUm / xUm), y: toRational(perUnitUm / yUm), unit: unit === 'cm' ? 3 : 2 };
}

/** OME Pixels@Type of a typed array. */
function omeType(data: PixelArray): string {
  const { bits, format } = sampleFormatOf(data);
  if (format === 3) return bits === 32 ? 'float' : 'double';
  return `${format === 2 ? 'int' : 'uint'}${bits}`;
}

/** Checks OME-TIFF metadata against the planes; exact messages. */
function checkOmeMeta(planeCount: number, meta: OmeTiffMeta): void {
  for (const key of ['sizeZ', 'sizeC', 'sizeT'] as const) {
    if (!Number.isInteger(meta[key]) || meta[key] < 1) throw new Error(`${key} must be a positive integer`);
  }
  if (!isDimensionOrder(meta.dimensionOrder)) throw new Error(`dimensionOrder must be one of ${DIMENSION_ORDERS.join(', ')}`);
  const expected = meta.sizeZ * meta.sizeC * meta.sizeT;
  if (planeCount !== expected) throw new Error(`expected ${expected} planes (sizeZ × sizeC × sizeT) but got ${planeCount}`);
  if (meta.channelNames.length !== meta.sizeC) throw new Error(`channelNames must have sizeC (${meta.sizeC}) entries`);
  if (meta.physicalSizeXUm === undefined) throw new Error('physicalSizeXUm must be a positive number');
  checkPositive(meta.physicalSizeXUm, 'physicalSizeXUm');
  checkPositive(meta.physicalSizeYUm, 'physicalSizeYUm');
  checkPositive(meta.physicalSizeZUm, 'physicalSizeZUm');
  checkPositive(meta.timeIncrementS, 'timeIncrementS');
}

/** The same message for a plane of more than one sample, whether the planes come as an array or one by one. */
function checkOneSample(p: WritePlane): void {
  if ((p.samplesPerPixel ?? 1) !== 1) throw new Error('OME-TIFF planes must have one sample per pixel');
}

/** The IFDs of an OME-TIFF: plane n from planeAt(n), taken one at a time; OME-XML from plane 0 and meta in IFD 0. */
function* omeImages(planeCount: number, planeAt: (n: number) => WritePlane, meta: OmeTiffMeta, first: WritePlane): Generator<EncodeImage> {
  const yUm = meta.physicalSizeYUm ?? meta.physicalSizeXUm;
  const description = buildOmeXml({
    sizeX: first.width, sizeY: first.height, sizeZ: meta.sizeZ, sizeC: meta.sizeC, sizeT: meta.sizeT,
    dimensionOrder: meta.dimensionOrder, type: omeType(first.data), channelNames: meta.channelNames,
    physicalSizeXUm: meta.physicalSizeXUm, physicalSizeYUm: yUm, physicalSizeZUm: meta.physicalSizeZUm ?? null,
    timeIncrementS: meta.timeIncrementS ?? null,
  });
  const resolution = resolutionTags(meta.physicalSizeXUm, yUm, 'cm');
  const compression = meta.compression === 'deflate' ? 8 : 1;
  for (let i = 0; i < planeCount; i++) {
    const p = i === 0 ? first : planeAt(i);
    yield { widthPx: p.width, heightPx: p.height, samplesPerPixel: 1, data: p.data, compression, resolution, ...(i === 0 ? { description } : {}) };
  }
}

/** A single-file OME-TIFF (classic, little-endian); OME-XML in IFD 0, plane n of `dimensionOrder` in IFD n. */
export function writeOmeTiff(planes: readonly WritePlane[], meta: OmeTiffMeta): Uint8Array {
  checkPlanes(planes);
  checkOmeMeta(planes.length, meta);
  planes.forEach(checkOneSample);
  return encodeTiff([...omeImages(planes.length, (n) => planes[n], meta, planes[0])]);
}

/**
 * writeOmeTiff for planes made one at a time (planeAt(n), n = 0 … planeCount − 1, in file order) and written piece
 * by piece through `write(bytes, position)` (see encodeTiffPieces), so only one plane is held at a time: a movie
 * larger than memory can be written to disk. The same bytes as writeOmeTiff on the same planes; the same checks and
 * messages, each plane's when it is made. Returns the file's length.
 */
export function writeOmeTiffPieces(planeCount: number, planeAt: (n: number) => WritePlane, meta: OmeTiffMeta,
  write: (bytes: Uint8Array, position: number) => void): number {
  if (planeCount === 0) throw new Error('at least one plane is required');
  const first = planeAt(0);
  checkPlane(first, 0, first);
  checkOmeMeta(planeCount, meta);
  checkOneSample(first);
  const checked = (n: number): WritePlane => {
    const p = planeAt(n);
    checkPlane(p, n, first);
    checkOneSample(p);
    return p;
  };
  return encodeTiffPieces(omeImages(planeCount, checked, meta, first), write);
}

/** A plain multi-page TIFF (classic, little-endian), one IFD per plane, optional resolution tags. */
export function writePlainTiff(planes: readonly WritePlane[], options: PlainTiffOptions = {}): Uint8Array {
  checkPlanes(planes);
  checkPositive(options.pixelSizeUm, 'pixelSizeUm');
  checkPositive(options.pixelSizeYUm, 'pixelSizeYUm');
  if (options.compression !== undefined && options.compression !== 'none' && options.compression !== 'deflate') {
    throw new Error("compression must be 'none' or 'deflate'");
  }
  const resolution = options.pixelSizeUm !== undefined
    ? resolutionTags(options.pixelSizeUm, options.pixelSizeYUm ?? options.pixelSizeUm, options.resolutionUnit ?? 'cm')
    : undefined;
  const compression = options.compression === 'deflate' ? 8 : 1;
  return encodeTiff(planes.map((p, i) => ({
    widthPx: p.width, heightPx: p.height, samplesPerPixel: p.samplesPerPixel ?? 1, data: p.data, compression,
    ...(resolution ? { resolution } : {}),
    ...(i === 0 && options.description !== undefined ? { description: options.description } : {}),
  })));
}

// Open an OME-Zarr image (NGFF 0.4 on Zarr v2, NGFF 0.5 on Zarr v3) from a store: StackInfo plus a lazy PlaneSource.
import * as zarr from 'zarrita';
import type { DimensionOrder, PixelSize, PlaneSource, SampleType, StackInfo } from '../model';
import { arrayStorage, type ArrayStorage } from './array-meta';
import { assignAxisRoles, impliedAxes, type AxisRoles } from './axes';
import { guardZarrCodecs, type BoundedInflate } from './decode-guard';
import { ZarrError } from './errors';
import { parseNgffGroup, type NgffAxis, type NgffImage } from './ngff';
import { chunksPerPlane, createChunkPlaneSource, roleSize, type ChunkedArray } from './plane-reader';
import { shardedStore, shardIndexLocation } from './shards';
import { readJson, trackMissingChunks, type ZarrStore } from './store';
import { micrometresPerSpaceUnit, secondsPerTimeUnit } from './units';

/** Limits checked before any chunk is read, so a damaged or absurd store fails one file with a clear line. */
export interface OpenZarrOptions {
  /** Largest plane (bytes) accepted; default 1 GiB, as for TIFF. */
  readonly maxPlaneBytes?: number;
  /** Largest decoded chunk (bytes) accepted; default 1 GiB. */
  readonly maxChunkBytes?: number;
  /** Most decoded chunk bytes kept for reuse between planes; default 2 GiB (at least one plane's chunks are kept). */
  readonly maxCacheBytes?: number;
  /** zlib/gzip decoder that stops at a chunk's size (node:zlib, from core/io); without it zarrita's own is used. */
  readonly inflate?: BoundedInflate;
  /**
   * Resolution level to open (0, the default, is full resolution; analysis always uses it). A lower level's pixel
   * size is the full-resolution one times the ratio of the two levels' widths and heights.
   */
  readonly level?: number;
}

/** Facts about the store beyond StackInfo, for `inspect`. */
export interface ZarrDetails {
  readonly zarrFormat: 2 | 3;
  readonly ngffVersion: string;
  /** Path of the full-resolution array inside the store. */
  readonly arrayPath: string;
  readonly levels: number;
  readonly axes: readonly NgffAxis[];
  readonly shape: readonly number[];
  readonly chunks: readonly number[];
  readonly dataType: string;
  readonly codecs: string;
  readonly separator: string;
  /** Time between time points in seconds, when the time axis has a scale and a time unit. */
  readonly timeStepS: number | null;
}

/** An opened OME-Zarr image. `warnings` grows while planes are read (missing chunks). */
export interface OpenedZarr {
  readonly info: StackInfo;
  readonly source: PlaneSource;
  readonly details: ZarrDetails;
  readonly warnings: string[];
}

const SAMPLE_TYPES: readonly string[] = ['uint8', 'int8', 'uint16', 'int16', 'uint32', 'int32', 'float32', 'float64'];
const BYTES: Record<SampleType, number> = { uint8: 1, int8: 1, uint16: 2, int16: 2, uint32: 4, int32: 4, float32: 4, float64: 8 };
/** More planes than this per time point is a damaged or mislabelled store, not an embryo. */
const MAX_PLANES_PER_TIME = 100_000;

/** The group at `prefix`: its Zarr version and attributes; ZarrError when it is not an NGFF group. */
async function readGroup(store: ZarrStore, prefix: string, label: string): Promise<{ zarrFormat: 2 | 3; attrs: Record<string, unknown> }> {
  const v3 = await readJson(store, `/${prefix}zarr.json`, label);
  if (v3) {
    if (v3.zarr_format !== 3) throw new ZarrError('bad-metadata', label, `${prefix}zarr.json does not say zarr_format 3`);
    if (v3.node_type === 'array') throw new ZarrError('not-ome', label, 'is a single Zarr array without NGFF metadata: not an OME-Zarr image');
    return { zarrFormat: 3, attrs: (v3.attributes ?? {}) as Record<string, unknown> };
  }
  const attrs = await readJson(store, `/${prefix}.zattrs`, label);
  if (attrs) return { zarrFormat: 2, attrs };
  if (await readJson(store, `/${prefix}.zarray`, label)) throw new ZarrError('not-ome', label, 'is a single Zarr array without NGFF metadata: not an OME-Zarr image');
  if (await readJson(store, `/${prefix}.zgroup`, label)) throw new ZarrError('not-ome', label, 'has no .zattrs (no NGFF metadata): not an OME-Zarr image');
  throw new ZarrError('not-zarr', label, 'has no zarr.json, .zattrs or .zgroup: not a Zarr store');
}

/** True when a group or array exists at `prefix`. */
async function exists(store: ZarrStore, prefix: string): Promise<boolean> {
  for (const name of ['zarr.json', '.zattrs', '.zgroup', '.zarray']) if (await store.get(`/${prefix}${name}`)) return true;
  return false;
}

/** The NGFF image of the store; a bioformats2raw collection is opened when it holds exactly one image ("0"). */
async function findImage(store: ZarrStore, label: string): Promise<{ image: NgffImage; prefix: string; zarrFormat: 2 | 3 }> {
  const root = await readGroup(store, '', label);
  const group = parseNgffGroup(root.attrs, label);
  if (group.kind === 'image') return { image: group.image, prefix: '', zarrFormat: root.zarrFormat };
  if (await exists(store, '1/')) throw new ZarrError('unsupported', label, 'holds several images (bioformats2raw collection); collections are not read yet');
  const inner = await readGroup(store, '0/', label);
  const innerGroup = parseNgffGroup(inner.attrs, label);
  if (innerGroup.kind !== 'image') throw new ZarrError('not-ome', label, 'image "0" of the collection has no NGFF multiscales');
  return { image: innerGroup.image, prefix: '0/', zarrFormat: inner.zarrFormat };
}

/** Opens the full-resolution array with zarrita; ZarrError when it is missing or its metadata is malformed. */
async function openArray(store: ZarrStore, path: string, zarrFormat: 2 | 3, label: string): Promise<{ array: zarr.Array<zarr.DataType, ZarrStore>; storage: ArrayStorage }> {
  const metaKey = zarrFormat === 3 ? 'zarr.json' : '.zarray';
  const raw = await readJson(store, `/${path}/${metaKey}`, label);
  if (!raw) throw new ZarrError('bad-metadata', label, `the full-resolution array "${path}" is missing (no ${path}/${metaKey})`);
  const storage = arrayStorage(raw, zarrFormat);
  const unknown = storage.codecNames.filter((n) => !zarr.registry.has(n));
  if (unknown.length > 0) throw new ZarrError('unsupported', label, `array "${path}" uses codec ${unknown.map((n) => n.replace(/^numcodecs\./, '')).join(', ')}, which Eggline cannot decode`);
  try {
    const indexLocation = zarrFormat === 3 ? shardIndexLocation(raw) : null;
    const location = new zarr.Location(indexLocation ? shardedStore(store, indexLocation) : store, `/${path}`);
    const array = zarrFormat === 3
      ? await zarr.open.v3(location, { kind: 'array' })
      : await zarr.open.v2(location, { kind: 'array', attrs: false });
    return { array, storage };
  } catch (err) {
    const cause = err instanceof Error && err.cause instanceof Error ? `: ${err.cause.message}` : '';
    throw new ZarrError('bad-metadata', label, `array "${path}" cannot be opened (${err instanceof Error ? err.message : String(err)}${cause})`);
  }
}

/** Positive integers only: a shape or chunk shape with anything else is damaged metadata. */
function checkShape(values: readonly number[], what: string, label: string): void {
  if (values.length === 0 || !values.every((v) => Number.isSafeInteger(v) && v > 0)) {
    throw new ZarrError('bad-metadata', label, `${what} [${values.join(', ')}] must be positive whole numbers`);
  }
}

/** Checks the declared sizes against the limits; returns how many decoded chunks to keep between planes. */
function checkSizes(shape: readonly number[], chunks: readonly number[], roles: AxisRoles, type: SampleType, label: string, options: OpenZarrOptions): number {
  checkShape(shape, 'shape', label);
  checkShape(chunks, 'chunk shape', label);
  if (chunks.length !== shape.length) throw new ZarrError('bad-metadata', label, `chunk shape has ${chunks.length} dimensions, the array ${shape.length}`);
  const planeBytes = shape[roles.x] * shape[roles.y] * BYTES[type];
  const maxPlane = options.maxPlaneBytes ?? 2 ** 30;
  if (planeBytes > maxPlane) throw new ZarrError('too-large', label, `one plane of ${shape[roles.x]}×${shape[roles.y]} ${type} pixels needs ${planeBytes} bytes, over the ${maxPlane}-byte limit`);
  const chunkBytes = chunks.reduce((a, b) => a * b, 1) * BYTES[type];
  const maxChunk = options.maxChunkBytes ?? 2 ** 30;
  if (chunkBytes > maxChunk) throw new ZarrError('too-large', label, `one chunk (${chunks.join('×')} ${type}) needs ${chunkBytes} bytes decoded, over the ${maxChunk}-byte limit`);
  const planes = roleSize(shape, roles.z) * roleSize(shape, roles.c);
  if (planes > MAX_PLANES_PER_TIME) throw new ZarrError('too-large', label, `declares ${planes} planes per time point, over the limit of ${MAX_PLANES_PER_TIME}`);
  // Planes are read z by z with every channel, so keep one layer of chunks across the channels, plus one plane ahead.
  const perPlane = chunksPerPlane(shape, chunks, roles);
  const channelChunks = roles.c < 0 ? 1 : Math.ceil(shape[roles.c] / chunks[roles.c]);
  const wanted = perPlane * (channelChunks + 1);
  const affordable = Math.floor((options.maxCacheBytes ?? 2 ** 31) / chunkBytes);
  return Math.max(perPlane, Math.min(wanted, affordable));
}

/** OME DimensionOrder naming the same plane order as the array's z, c, t axes (fastest first), for display. */
function dimensionOrderOf(roles: AxisRoles): DimensionOrder {
  const present = (['z', 'c', 't'] as const).filter((r) => roles[r] >= 0).sort((a, b) => roles[b] - roles[a]);
  const missing = (['z', 'c', 't'] as const).filter((r) => roles[r] < 0);
  return `XY${[...present, ...missing].join('').toUpperCase()}` as DimensionOrder;
}

/** Pixel size from the NGFF scale and axis units; unknown (with a warning saying why) when either is missing. */
function pixelSizeOf(image: NgffImage, axes: readonly NgffAxis[], roles: AxisRoles, label: string, warnings: string[]): PixelSize {
  const unknown: PixelSize = { xUm: null, yUm: null, zUm: null, source: 'unknown' };
  if (!image.scale) return unknown;
  const um = (dim: number): number | null => {
    const f = micrometresPerSpaceUnit(axes[dim].unit);
    return f === null ? null : image.scale![dim] * f;
  };
  const [xUm, yUm] = [um(roles.x), um(roles.y)];
  if (xUm === null || yUm === null) {
    const unit = axes[roles.x].unit ?? axes[roles.y].unit;
    warnings.push(`${label}: NGFF scale given ${unit === null ? 'without a unit' : `in unknown unit "${unit}"`} on the x/y axes; pixel size unknown`);
    return unknown;
  }
  return { xUm, yUm, zUm: roles.z >= 0 ? um(roles.z) : null, source: 'ome-zarr' };
}

/** Time between time points in seconds from the NGFF scale and time unit, or null. */
function timeStepOf(image: NgffImage, axes: readonly NgffAxis[], roles: AxisRoles): number | null {
  if (roles.t < 0 || !image.scale) return null;
  const f = secondsPerTimeUnit(axes[roles.t].unit);
  return f === null ? null : image.scale[roles.t] * f;
}

/** Channel names: omero labels when there is one per channel, else C1, C2, …. */
function channelNamesOf(image: NgffImage, sizeC: number, label: string, warnings: string[]): string[] {
  const labels = image.channelNames;
  if (labels.length > 0 && labels.length !== sizeC) warnings.push(`${label}: omero lists ${labels.length} channels for ${sizeC}; channel labels ignored`);
  return Array.from({ length: sizeC }, (_, c) => (labels.length === sizeC && labels[c] ? labels[c] : `C${c + 1}`));
}

/** The shape of the array at `path` from its metadata (no chunk is read); ZarrError when it is missing or malformed. */
async function levelShape(store: ZarrStore, path: string, zarrFormat: 2 | 3, label: string): Promise<number[]> {
  const meta = await readJson(store, `/${path}/${zarrFormat === 3 ? 'zarr.json' : '.zarray'}`, label);
  const shape = meta?.shape;
  if (!Array.isArray(shape) || !shape.every((v) => Number.isSafeInteger(v) && v > 0)) {
    throw new ZarrError('bad-metadata', label, `resolution level "${path}" has no valid shape`);
  }
  return shape as number[];
}

/** Pixel size of a lower level: the full-resolution one times the ratio of the levels' sizes along x and y. */
function scaledPixelSize(full: PixelSize, fullShape: readonly number[], shape: readonly number[], roles: AxisRoles): PixelSize {
  if (full.xUm === null || full.yUm === null) return full;
  return { ...full, xUm: full.xUm * (fullShape[roles.x] / shape[roles.x]), yUm: full.yUm * (fullShape[roles.y] / shape[roles.y]) };
}

/**
 * The resolution level for a window's first picture: the coarsest level whose planes are at least `viewWidthPx` ×
 * `viewHeightPx` (so it still fills the view), 0 when no lower level does or the store has one level. Reads only
 * metadata. Throws ZarrError like openOmeZarr.
 */
export async function firstPictureLevel(store: ZarrStore, label: string, viewWidthPx: number, viewHeightPx: number): Promise<number> {
  const { image, prefix, zarrFormat } = await findImage(store, label);
  const full = await levelShape(store, `${prefix}${image.levelPaths[0]}`, zarrFormat, label);
  const roles = assignAxisRoles(image.axes ?? impliedAxes(full.length), full, label);
  let best = 0;
  for (let level = 1; level < image.levelPaths.length; level++) {
    const shape = await levelShape(store, `${prefix}${image.levelPaths[level]}`, zarrFormat, label).catch(() => null);
    if (!shape || shape.length !== full.length) break;
    if (shape[roles.x] < viewWidthPx || shape[roles.y] < viewHeightPx) break;
    best = level;
  }
  return best;
}

/**
 * Chunk reading past zarrita for arrays whose chunks are each one Blosc stream (the common OME-Zarr layout), when the
 * store can decode such streams itself (in another thread): undefined otherwise.
 */
function directBlosc(store: ZarrStore, arrayPath: string, storage: ArrayStorage, chunkBytes: number): ((coords: readonly number[]) => Promise<Uint8Array | undefined | null>) | undefined {
  const read = store.readBloscChunk;
  const prefix = storage.bloscKeyPrefix;
  if (!read || prefix === null) return undefined;
  return (coords) => read(`/${arrayPath}/${prefix}${coords.join(storage.separator)}`, chunkBytes);
}

/**
 * Opens the OME-Zarr image in `store`: NGFF metadata, the full-resolution array, and a PlaneSource that decodes only
 * the chunks each plane needs. Throws ZarrError with a one-line message for everything it refuses.
 */
export async function openOmeZarr(store: ZarrStore, label: string, options: OpenZarrOptions = {}): Promise<OpenedZarr> {
  guardZarrCodecs(options.inflate);
  const warnings: string[] = [];
  const { image, prefix, zarrFormat } = await findImage(store, label);
  warnings.push(...image.warnings);
  let missing = 0;
  let missingAt = -1;
  const tracked = trackMissingChunks(store, (key) => {
    missing++;
    const text = `${label}: ${missing} chunk(s) missing (first ${key.slice(1)}); read as the fill value`;
    if (missingAt < 0) { missingAt = warnings.length; warnings.push(text); } else warnings[missingAt] = text;
  });
  const level = options.level ?? 0;
  if (!(Number.isInteger(level) && level >= 0 && level < image.levelPaths.length)) {
    throw new ZarrError('bad-metadata', label, `has no resolution level ${level} (${image.levelPaths.length} readable)`);
  }
  const arrayPath = `${prefix}${image.levelPaths[level]}`;
  const { array, storage } = await openArray(tracked, arrayPath, zarrFormat, label);
  if (!SAMPLE_TYPES.includes(array.dtype)) throw new ZarrError('unsupported', label, `sample type ${array.dtype} is not supported (8, 16 or 32-bit integers, 32 or 64-bit floats)`);
  const type = array.dtype as SampleType;
  const axes = image.axes ?? impliedAxes(array.shape.length);
  if (!image.axes) warnings.push(`${label}: NGFF ${image.version} has no axes; assumed ${axes.map((a) => a.name).join(', ')}`);
  const roles = assignAxisRoles(axes, array.shape, label);
  const cacheChunks = checkSizes(array.shape, array.chunks, roles, type, label, options);
  const sizeC = roleSize(array.shape, roles.c);
  const sizeT = roleSize(array.shape, roles.t);
  const timeStepS = timeStepOf(image, axes, roles);
  const info: StackInfo = {
    byteOrder: 'II', bigTiff: false, isOme: true,
    sizeX: array.shape[roles.x], sizeY: array.shape[roles.y], sizeZ: roleSize(array.shape, roles.z), sizeC, sizeT,
    dimensionOrder: dimensionOrderOf(roles), sampleType: type, samplesPerPixel: 1,
    channelNames: channelNamesOf(image, sizeC, label, warnings),
    pixelSize: level === 0 ? pixelSizeOf(image, axes, roles, label, warnings)
      : scaledPixelSize(pixelSizeOf(image, axes, roles, label, warnings), await levelShape(store, `${prefix}${image.levelPaths[0]}`, zarrFormat, label), array.shape, roles),
    compression: storage.codecs, planeIfd: new Int32Array(0), ifdCount: 0, description: null, warnings: [...warnings],
    ...(timeStepS !== null ? { time: { timesS: Float64Array.from({ length: sizeT }, (_, i) => i * timeStepS), source: 'ome-zarr' as const } } : {}),
  };
  const source = createChunkPlaneSource(array as unknown as ChunkedArray, roles, type, label, {
    cacheChunks, onClose: async () => { await store.close?.(); }, readDecoded: directBlosc(tracked, arrayPath, storage, array.chunks.reduce((a, b) => a * b, 1) * BYTES[type]),
  });
  const details: ZarrDetails = {
    zarrFormat, ngffVersion: image.version, arrayPath, levels: image.levels, axes, shape: array.shape, chunks: array.chunks,
    dataType: type, codecs: storage.codecs, separator: storage.separator, timeStepS,
  };
  return { info, source, details, warnings };
}

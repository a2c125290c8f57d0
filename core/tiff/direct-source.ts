// The direct decode path: strips and tiles read by byte range and decompressed straight into the plane's typed
// array (TIFF 6.0 §8 strips, §14 predictors, §15 tiles, PlanarConfiguration 1 and 2; BigTIFF offsets).
import type { PixelArray, PlaneSource, RawPlane, SampleType, StackInfo } from '../model';
import { cachedByteSource } from './block-cache';
import type { ByteSource } from './byte-source';
import type { ChunkCodecs, ChunkDecoder } from './chunk-codecs';
import { swapBytesInPlace, undoFloatingPointPredictor, undoHorizontalDifferencing } from './chunk-predictors';
import { describeCompression } from './compression';
import { planeSlot } from './dimension-order';
import { TiffError } from './errors';
import type { TiffHeader } from './header';
import { lazyIfdChain, type Ifd } from './ifd';
import type { TiffChain } from './stack-info';
import { readImageLayout } from './layout';
import { sampleTypeOf, bytesPerSample } from './sample-type';
import { readNumber, readNumbers } from './tag-value';
import { Tag } from './tags';
import { checkPlaneIndex } from './geotiff-source';

const ARRAYS: Record<SampleType, new (buffer: ArrayBuffer, byteOffset?: number, length?: number) => PixelArray> = {
  uint8: Uint8Array, int8: Int8Array, uint16: Uint16Array, int16: Int16Array,
  uint32: Uint32Array, int32: Int32Array, float32: Float32Array, float64: Float64Array,
};

/** True on a little-endian host (the typed-array views below assume it; elsewhere the path is not used). */
const HOST_LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

/** Where one IFD keeps its pixels and how they are packed. */
export interface ChunkPlan {
  readonly ifd: number;
  readonly compression: number;
  readonly predictor: number;
  readonly planar: boolean;
  readonly samplesPerPixel: number;
  readonly bytesPerSample: number;
  readonly sampleType: SampleType;
  readonly tiled: boolean;
  /** Width and rows of one chunk (strips: the image width and RowsPerStrip). */
  readonly chunkWidthPx: number;
  readonly chunkHeightPx: number;
  readonly chunksAcross: number;
  readonly chunksDown: number;
  readonly offsets: readonly number[];
  readonly byteCounts: readonly number[];
}

/** Why the direct path cannot decode a stack, or null when it can (the caller then uses another decoder). */
export function directPathRefusal(info: StackInfo, codecs: ChunkCodecs): string | null {
  if (!HOST_LITTLE_ENDIAN) return 'big-endian host';
  if (info.compressionCode === undefined) return 'not a TIFF file';
  if (!codecs[info.compressionCode]) return `no decoder for ${describeCompression(info.compressionCode, 1)}`;
  return null;
}

/** Reads the chunk plan of one IFD; throws TiffError naming what is missing or inconsistent. */
export async function readChunkPlan(source: ByteSource, header: TiffHeader, ifd: Ifd, fileLabel: string): Promise<ChunkPlan> {
  const layout = await readImageLayout(source, header, ifd, fileLabel);
  const sampleType = sampleTypeOf(layout, fileLabel);
  const tiled = layout.tiled;
  const offsets = await readNumbers(source, header, ifd, tiled ? Tag.TileOffsets : Tag.StripOffsets, fileLabel);
  const byteCounts = await readNumbers(source, header, ifd, tiled ? Tag.TileByteCounts : Tag.StripByteCounts, fileLabel);
  const kind = tiled ? 'tile' : 'strip';
  if (!offsets || !byteCounts) throw new TiffError('unsupported', fileLabel, `IFD ${ifd.index} lacks ${kind} offsets or byte counts`);
  let chunkWidthPx = layout.widthPx;
  let chunkHeightPx: number;
  if (tiled) {
    chunkWidthPx = await readNumber(source, header, ifd, Tag.TileWidth, fileLabel, 0);
    chunkHeightPx = await readNumber(source, header, ifd, Tag.TileLength, fileLabel, 0);
    if (chunkWidthPx <= 0 || chunkHeightPx <= 0) throw new TiffError('unsupported', fileLabel, `IFD ${ifd.index} has tiles of ${chunkWidthPx}×${chunkHeightPx}`);
  } else {
    const rows = await readNumber(source, header, ifd, Tag.RowsPerStrip, fileLabel, layout.heightPx);
    chunkHeightPx = Math.min(Math.max(1, rows), layout.heightPx);
  }
  const chunksAcross = Math.ceil(layout.widthPx / chunkWidthPx);
  const chunksDown = Math.ceil(layout.heightPx / chunkHeightPx);
  const planar = layout.planarConfiguration === 2 && layout.samplesPerPixel > 1;
  const needed = chunksAcross * chunksDown * (planar ? layout.samplesPerPixel : 1);
  if (offsets.length < needed || byteCounts.length < needed) {
    throw new TiffError('unsupported', fileLabel, `IFD ${ifd.index} has ${Math.min(offsets.length, byteCounts.length)} ${kind} offsets and byte counts, needs ${needed}`);
  }
  return {
    ifd: ifd.index, compression: layout.compression, predictor: layout.predictor, planar, samplesPerPixel: layout.samplesPerPixel,
    bytesPerSample: bytesPerSample(sampleType), sampleType, tiled, chunkWidthPx, chunkHeightPx, chunksAcross, chunksDown,
    offsets, byteCounts,
  };
}

/** The tags that fix a chunk plan's shape (all but where the chunks are); TileOffsets only by its presence. */
const PLAN_SHAPE_TAGS = [Tag.ImageWidth, Tag.ImageLength, Tag.BitsPerSample, Tag.Compression, Tag.SamplesPerPixel,
  Tag.RowsPerStrip, Tag.PlanarConfiguration, Tag.Predictor, Tag.TileWidth, Tag.TileLength, Tag.SampleFormat];

/** A key equal for two IFDs whose shape tags hold the same entries (inline bytes, or the same value offset). */
function planShapeKey(ifd: Ifd): string {
  let key = ifd.entries.has(Tag.TileOffsets) ? 't' : 's';
  for (const tag of PLAN_SHAPE_TAGS) {
    const e = ifd.entries.get(tag);
    if (!e) { key += '|'; continue; }
    key += `|${e.type},${e.count},${e.inline ? e.inline.join(',') : `@${e.valueOffset}`}`;
  }
  return key;
}

/**
 * readChunkPlan with the shape of the last plan kept: an IFD whose shape tags match it only has its chunk offsets
 * and byte counts read. Why: a file of 65,535 planes read the same dozen tags 65,535 times, asynchronously.
 */
export function chunkPlanReader(source: ByteSource, header: TiffHeader, fileLabel: string): (ifd: Ifd) => Promise<ChunkPlan> {
  let last: { key: string; plan: ChunkPlan } | null = null;
  return async (ifd) => {
    const key = planShapeKey(ifd);
    if (last === null || last.key !== key) {
      const plan = await readChunkPlan(source, header, ifd, fileLabel);
      last = { key, plan };
      return plan;
    }
    const shape = last.plan;
    const kind = shape.tiled ? 'tile' : 'strip';
    const offsets = await readNumbers(source, header, ifd, shape.tiled ? Tag.TileOffsets : Tag.StripOffsets, fileLabel);
    const byteCounts = await readNumbers(source, header, ifd, shape.tiled ? Tag.TileByteCounts : Tag.StripByteCounts, fileLabel);
    if (!offsets || !byteCounts) throw new TiffError('unsupported', fileLabel, `IFD ${ifd.index} lacks ${kind} offsets or byte counts`);
    const needed = shape.chunksAcross * shape.chunksDown * (shape.planar ? shape.samplesPerPixel : 1);
    if (offsets.length < needed || byteCounts.length < needed) {
      throw new TiffError('unsupported', fileLabel, `IFD ${ifd.index} has ${Math.min(offsets.length, byteCounts.length)} ${kind} offsets and byte counts, needs ${needed}`);
    }
    return { ...shape, ifd: ifd.index, offsets, byteCounts };
  };
}

/** Reusable scratch space for one decode: chunk output, one row for the floating-point predictor, and the plane's
 *  compressed bytes when they are read in one piece. */
interface Scratch { chunk: Uint8Array; row: Uint8Array; span: Uint8Array }

function newScratch(): Scratch {
  return { chunk: new Uint8Array(0), row: new Uint8Array(0), span: new Uint8Array(0) };
}

function scratchBytes(scratch: Scratch, key: 'chunk' | 'row' | 'span', n: number): Uint8Array {
  if (scratch[key].length < n) scratch[key] = new Uint8Array(n);
  return scratch[key].subarray(0, n);
}

/** Scratch spaces of one source not in use: planes are read ahead, so two decodes may overlap, each with its own. */
export type ScratchPool = Scratch[];

/** The plane's array: `into` when it has the plan's sample type and the plane's length, else a new one. */
function planeArray(plan: ChunkPlan, length: number, into: PixelArray | undefined): PixelArray {
  if (into !== undefined && into.constructor === ARRAYS[plan.sampleType] && into.length === length) return into;
  return new ARRAYS[plan.sampleType](new ArrayBuffer(length * plan.bytesPerSample));
}

/** Decoded size in bytes of chunk i (strips: a short last strip; tiles: always whole). */
function chunkRows(plan: ChunkPlan, heightPx: number, row: number): number {
  return plan.tiled ? plan.chunkHeightPx : Math.min(plan.chunkHeightPx, heightPx - row * plan.chunkHeightPx);
}

/**
 * Decodes sample `sample` of IFD `plan.ifd` into a typed array of widthPx × heightPx: `into` when it is an array of
 * the plan's sample type and that length (no new array; its old values are overwritten), else a new one. Reads all
 * of the plane's chunks with one byte-range read when they lie close together (uncompressed strips straight into
 * the plane). Scratch space comes from `pool` and goes back to it, so a source decoding plane after plane allocates
 * nothing once its scratch has grown. Throws Error with "strip 3: reason" on bad data (`into` is then partly written).
 */
export async function decodePlaneDirect(
  source: ByteSource, plan: ChunkPlan, widthPx: number, heightPx: number, sample: number, littleEndian: boolean,
  codecs: ChunkCodecs, pool: ScratchPool = [], into?: PixelArray,
): Promise<PixelArray> {
  const scratch = pool.pop() ?? newScratch();
  try {
    return await decodeInto(source, plan, widthPx, heightPx, sample, littleEndian, codecs, scratch, planeArray(plan, widthPx * heightPx, into));
  } finally {
    pool.push(scratch);
  }
}

async function decodeInto(
  source: ByteSource, plan: ChunkPlan, widthPx: number, heightPx: number, sample: number, littleEndian: boolean,
  codecs: ChunkCodecs, scratch: Scratch, out: PixelArray,
): Promise<PixelArray> {
  const decode = codecs[plan.compression];
  if (!decode) throw new Error(`no decoder for ${describeCompression(plan.compression, 1)}`);
  const bps = plan.bytesPerSample;
  const perPlane = plan.chunksAcross * plan.chunksDown;
  const first = plan.planar ? sample * perPlane : 0;
  const kind = plan.tiled ? 'tile' : 'strip';
  const samplesInChunk = plan.planar ? 1 : plan.samplesPerPixel;
  const simpleCopy = plan.compression === 1 && plan.predictor === 1 && samplesInChunk === 1 && !plan.tiled;
  // One read for the whole plane when its chunks are stored back to back (the common case), else one per chunk.
  let lo = Infinity;
  let hi = 0;
  let total = 0;
  for (let i = first; i < first + perPlane; i++) {
    lo = Math.min(lo, plan.offsets[i]);
    hi = Math.max(hi, plan.offsets[i] + plan.byteCounts[i]);
    total += plan.byteCounts[i];
  }
  if (hi > source.size) {
    for (let i = first; i < first + perPlane; i++) {
      if (plan.offsets[i] + plan.byteCounts[i] > source.size) {
        throw new Error(`${kind} ${i} runs past the end of the file (${plan.offsets[i] + plan.byteCounts[i]} > ${source.size} bytes)`);
      }
    }
  }
  if (simpleCopy && hi - lo === total && isPackedPlane(plan, heightPx, first, perPlane)) {
    // Uncompressed strips back to back: the file's bytes go straight into the plane.
    const target = new Uint8Array(out.buffer, out.byteOffset, out.byteLength);
    const got = source.readInto ? await source.readInto(lo, target) : copyChunk(await source.read(lo, target.length), target);
    if (got < target.length) throw new Error(`strips hold ${got} bytes, the plane needs ${target.length}`);
    if (!littleEndian && bps > 1) swapBytesInPlace(target, bps);
    return out;
  }
  const span = hi - lo <= 2 * total + 65536 ? await readSpan(source, lo, hi - lo, scratch) : null;
  const outBytes = new Uint8Array(out.buffer, out.byteOffset, out.byteLength);
  const chunkInput = async (i: number): Promise<Uint8Array> => {
    const input = span ? span.subarray(plan.offsets[i] - lo, plan.offsets[i] - lo + plan.byteCounts[i]) : await source.read(plan.offsets[i], plan.byteCounts[i]);
    if (input.length < plan.byteCounts[i]) throw new Error(`${kind} ${i} has ${input.length} of its ${plan.byteCounts[i]} bytes`);
    return input;
  };
  const rowValues = plan.chunkWidthPx * samplesInChunk;
  if (!plan.tiled && samplesInChunk === 1) {
    // Strips of one sample: each decodes straight into its rows of the plane, all at once (asynchronous decoders,
    // such as node:zlib's, then work in parallel off the JS thread); predictors and byte order are undone in place.
    const rowBytes = widthPx * bps;
    await Promise.all(Array.from({ length: plan.chunksDown }, async (_, down) => {
      const i = first + down;
      const target = outBytes.subarray(down * plan.chunkHeightPx * rowBytes, (down * plan.chunkHeightPx + chunkRows(plan, heightPx, down)) * rowBytes);
      const written = await decodeChunk(decode, await chunkInput(i), target, plan.compression, kind, i);
      if (written < target.length) throw new Error(`${kind} ${i} decodes to ${written} bytes, expected ${target.length}`);
      undoPredictorInPlace(target, plan, rowValues, samplesInChunk, littleEndian, scratch);
    }));
    return out;
  }
  for (let down = 0; down < plan.chunksDown; down++) {
    const rows = chunkRows(plan, heightPx, down);
    for (let across = 0; across < plan.chunksAcross; across++) {
      const i = first + down * plan.chunksAcross + across;
      const chunkBytes = rowValues * rows * bps;
      const chunk = scratchBytes(scratch, 'chunk', chunkBytes);
      const written = await decodeChunk(decode, await chunkInput(i), chunk, plan.compression, kind, i);
      if (written < chunkBytes) throw new Error(`${kind} ${i} decodes to ${written} bytes, expected ${chunkBytes}`);
      undoPredictorInPlace(chunk, plan, rowValues, samplesInChunk, littleEndian, scratch);
      placeChunk(chunk, outBytes, plan, widthPx, heightPx, across, down, rows, sample);
    }
  }
  return out;
}

/** length bytes from offset, read into the scratch's span array when the source can (no new array per plane). */
async function readSpan(source: ByteSource, offset: number, length: number, scratch: Scratch): Promise<Uint8Array> {
  if (!source.readInto) return source.read(offset, length);
  const span = scratchBytes(scratch, 'span', length);
  return span.subarray(0, await source.readInto(offset, span));
}

/** Runs one chunk's decoder; a failure becomes "strip 3: corrupt LZW stream (…)". */
async function decodeChunk(decode: ChunkDecoder, input: Uint8Array, target: Uint8Array, compression: number, kind: string, i: number): Promise<number> {
  try {
    return await decode(input, target);
  } catch (err) {
    throw new Error(`${kind} ${i}: ${describeCodecError(compression, err)}`);
  }
}

/** Undoes the predictor and the file's byte order on decoded bytes, in place (synchronous, so scratch is safe). */
function undoPredictorInPlace(bytes: Uint8Array, plan: ChunkPlan, rowValues: number, stride: number, littleEndian: boolean, scratch: Scratch): void {
  const bps = plan.bytesPerSample;
  if (plan.predictor === 3) {
    undoFloatingPointPredictor(bytes, bps, rowValues, stride, scratchBytes(scratch, 'row', rowValues * bps));
    // Big-endian files come out of the regrouping byte-swapped (checked on files written by libtiff's tiffcp -B,
    // which geotiff also reads this way), so they are swapped like any other big-endian data.
    if (!littleEndian) swapBytesInPlace(bytes, bps);
    return;
  }
  if (!littleEndian && bps > 1) swapBytesInPlace(bytes, bps);
  if (plan.predictor === 2) undoHorizontalDifferencing(bytes, bps, rowValues, stride);
}

/** True when strips first … first+n-1 follow one another in the file, each exactly its rows long (the last may be longer). */
function isPackedPlane(plan: ChunkPlan, heightPx: number, first: number, n: number): boolean {
  const rowBytes = plan.chunkWidthPx * plan.bytesPerSample;
  for (let k = 0; k < n; k++) {
    const i = first + k;
    const expected = chunkRows(plan, heightPx, k) * rowBytes;
    if (k < n - 1 ? plan.byteCounts[i] !== expected : plan.byteCounts[i] < expected) return false;
    if (k > 0 && plan.offsets[i] !== plan.offsets[i - 1] + plan.byteCounts[i - 1]) return false;
  }
  return true;
}

function copyChunk(input: Uint8Array, out: Uint8Array): number {
  out.set(input.subarray(0, Math.min(input.length, out.length)));
  return Math.min(input.length, out.length);
}

/** "corrupt LZW stream (code 600 …)" and the like, one line. */
function describeCodecError(compression: number, err: unknown): string {
  const name = describeCompression(compression, 1);
  const text = (err instanceof Error ? err.message : String(err)).split(/\r?\n/)[0];
  return `corrupt ${name} stream (${text})`;
}

/** Copies the decoded chunk's rows (cropped at the image edge; one sample when chunky) into the plane. */
function placeChunk(chunk: Uint8Array, out: Uint8Array, plan: ChunkPlan, widthPx: number, heightPx: number, across: number, down: number, rows: number, sample: number): void {
  const bps = plan.bytesPerSample;
  const x0 = across * plan.chunkWidthPx;
  const y0 = down * plan.chunkHeightPx;
  const copyW = Math.min(plan.chunkWidthPx, widthPx - x0);
  const copyH = Math.min(rows, heightPx - y0);
  const spp = plan.planar ? 1 : plan.samplesPerPixel;
  const chunkRowBytes = plan.chunkWidthPx * spp * bps;
  if (spp === 1) {
    for (let r = 0; r < copyH; r++) {
      const from = r * chunkRowBytes;
      out.set(chunk.subarray(from, from + copyW * bps), ((y0 + r) * widthPx + x0) * bps);
    }
    return;
  }
  for (let r = 0; r < copyH; r++) {
    let from = r * chunkRowBytes + sample * bps;
    let to = ((y0 + r) * widthPx + x0) * bps;
    for (let x = 0; x < copyW; x++, from += spp * bps, to += bps) {
      for (let b = 0; b < bps; b++) out[to + b] = chunk[from + b];
    }
  }
}

/** Largest read served from the block cache rather than the file itself (one cache block). */
const SMALL_READ_BYTES = 65536;

/** A ByteSource that sends reads of up to SMALL_READ_BYTES to `cached` and larger ones (and readInto) to `file`. */
function smallReadsThrough(file: ByteSource, cached: ByteSource): ByteSource {
  return {
    size: file.size,
    read: (offset, length) => (length <= SMALL_READ_BYTES ? cached.read(offset, length) : file.read(offset, length)),
    ...(file.readInto ? { readInto: (offset: number, target: Uint8Array) => readIntoVia(file, cached, offset, target) } : {}),
  };
}

async function readIntoVia(file: ByteSource, cached: ByteSource, offset: number, target: Uint8Array): Promise<number> {
  if (target.length > SMALL_READ_BYTES) return file.readInto!(offset, target);
  const bytes = await cached.read(offset, target.length);
  target.set(bytes);
  return bytes.length;
}

/**
 * A PlaneSource on the direct path. Each plane's IFD plan is read when first needed (tags through a block cache);
 * a plane that cannot be decoded rejects with a one-line TiffError('decode') naming the file, plane and chunk.
 */
export function createDirectPlaneSource(source: ByteSource, info: StackInfo, codecs: ChunkCodecs, fileLabel: string, chain?: TiffChain): PlaneSource {
  const tags = cachedByteSource(source);
  const openChain = chain ? () => Promise.resolve(chain) : lazyIfdChain(tags, fileLabel);
  // Planes whose chunks span at most one cache block are read through the block cache, so a file of many small
  // planes costs one file read per block, not one per plane.
  const small = smallReadsThrough(source, tags);
  let planOf: ((ifd: Ifd) => Promise<ChunkPlan>) | null = null;
  const scratch: ScratchPool = [];
  return {
    async readPlane(z: number, c: number, t: number, into?: PixelArray): Promise<RawPlane> {
      checkPlaneIndex(info, z, c, t);
      const ifd = info.planeIfd[planeSlot(info, z, c, t)];
      const what = `plane z=${z} c=${c} t=${t}`;
      const { header, ifds } = await openChain();
      planOf ??= chunkPlanReader(tags, header, fileLabel);
      const plan = await planOf(ifds[ifd]);
      if (plan.sampleType !== info.sampleType || plan.samplesPerPixel !== info.samplesPerPixel) {
        throw new TiffError('decode', fileLabel, `cannot decode ${what}: IFD ${ifd} holds ${plan.samplesPerPixel} ${plan.sampleType} samples per pixel, IFD 0 ${info.samplesPerPixel} ${info.sampleType}`);
      }
      try {
        const data = await decodePlaneDirect(small, plan, info.sizeX, info.sizeY, info.samplesPerPixel > 1 ? c : 0, header.littleEndian, codecs, scratch, into);
        return { width: info.sizeX, height: info.sizeY, data };
      } catch (err) {
        if (err instanceof TiffError) throw err;
        const text = (err instanceof Error ? err.message : String(err)).split(/\r?\n/)[0];
        throw new TiffError('decode', fileLabel, `cannot decode ${what} (IFD ${ifd}): ${text}`);
      }
    },
    async close(): Promise<void> {
      const closable = source as ByteSource & { close?: () => Promise<void> };
      if (typeof closable.close === 'function') await closable.close();
    },
  };
}

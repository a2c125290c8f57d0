// A PlaneSource over a chunked array: each plane is assembled from the chunks it crosses, decoded on demand.
import type { PixelArray, PlaneSource, RawPlane, SampleType } from '../model';
import type { AxisRoles } from './axes';
import { ZarrError } from './errors';

/** A decoded chunk as zarrita returns it: values with the chunk's shape and element strides. */
export interface DecodedChunk {
  readonly data: PixelArray;
  readonly shape: readonly number[];
  readonly stride: readonly number[];
}

/** The part of a zarr array the reader needs (zarrita's Array has it; tests give small fakes). */
export interface ChunkedArray {
  readonly shape: readonly number[];
  readonly chunks: readonly number[];
  getChunk(coords: number[]): Promise<DecodedChunk>;
}

const ARRAYS: Record<SampleType, new (n: number) => PixelArray> = {
  uint8: Uint8Array, int8: Int8Array, uint16: Uint16Array, int16: Int16Array,
  uint32: Uint32Array, int32: Int32Array, float32: Float32Array, float64: Float64Array,
};

/** Size of a role's dimension (1 when the array has no such axis). */
export function roleSize(shape: readonly number[], dim: number): number {
  return dim < 0 ? 1 : shape[dim];
}

/** Number of chunks of one plane (its chunks along y times along x). */
export function chunksPerPlane(shape: readonly number[], chunks: readonly number[], roles: AxisRoles): number {
  return Math.ceil(shape[roles.y] / chunks[roles.y]) * Math.ceil(shape[roles.x] / chunks[roles.x]);
}

/** A small least-recently-used map of chunk promises, so the planes that share a chunk decode it once. */
function chunkCache(capacity: number) {
  const entries = new Map<string, Promise<DecodedChunk>>();
  return (key: string, load: () => Promise<DecodedChunk>): Promise<DecodedChunk> => {
    let hit = entries.get(key);
    if (hit) entries.delete(key);
    else hit = load();
    entries.set(key, hit);
    while (entries.size > capacity) entries.delete(entries.keys().next().value as string);
    return hit;
  };
}

/** Copies the (rows × cols) block of `chunk` starting at element `base` into `out` at (y0, x0) of a plane `width` wide. */
function copyBlock(out: PixelArray, width: number, chunk: DecodedChunk, base: number, strideY: number, strideX: number,
  y0: number, x0: number, rows: number, cols: number): void {
  const src = chunk.data;
  for (let r = 0; r < rows; r++) {
    const from = base + r * strideY;
    const to = (y0 + r) * width + x0;
    if (strideX === 1) {
      (out as Uint8Array).set((src as Uint8Array).subarray(from, from + cols), to);
    } else {
      for (let k = 0; k < cols; k++) out[to + k] = src[from + k * strideX];
    }
  }
}

/** Offset of element `index` inside the chunk at `coords`, along the dimensions other than x and y. */
function planeBase(chunk: DecodedChunk, shape: readonly number[], chunks: readonly number[], roles: AxisRoles, index: readonly number[], coords: readonly number[]): number {
  let base = 0;
  for (let d = 0; d < shape.length; d++) if (d !== roles.x && d !== roles.y) base += (index[d] - coords[d] * chunks[d]) * chunk.stride[d];
  return base;
}

/**
 * The plane as a view of the chunk when one chunk holds it with its rows contiguous (the usual one-plane chunks):
 * no copy. Planes are read, never written, by the analysis. Null when the plane must be copied out.
 */
function contiguousPlane(chunk: DecodedChunk, shape: readonly number[], chunks: readonly number[], roles: AxisRoles, index: readonly number[], coords: readonly number[]): PixelArray | null {
  if (chunk.stride[roles.x] !== 1 || chunk.stride[roles.y] !== chunks[roles.x]) return null;
  const base = planeBase(chunk, shape, chunks, roles, index, coords);
  return chunk.data.subarray(base, base + chunks[roles.x] * chunks[roles.y]) as PixelArray;
}

/** Options of createChunkPlaneSource. */
export interface ChunkPlaneOptions {
  /** Decoded chunks kept for reuse by later planes (at least one plane's worth is always kept). */
  readonly cacheChunks: number;
  /** Called once when the source is closed. */
  readonly onClose?: () => Promise<void>;
  /**
   * The chunk's bytes decoded outside zarrita (C order, native byte order), undefined when it is missing, null when
   * this path cannot decode it; either of the latter sends the chunk through array.getChunk.
   */
  readonly readDecoded?: (coords: readonly number[]) => Promise<Uint8Array | undefined | null>;
}

/** Element strides of a C-order chunk of shape `chunks`. */
function cOrderStrides(chunks: readonly number[]): number[] {
  const stride = new Array<number>(chunks.length).fill(1);
  for (let d = chunks.length - 2; d >= 0; d--) stride[d] = stride[d + 1] * chunks[d + 1];
  return stride;
}

/**
 * PlaneSource reading plane (z, c, t) of a chunked array: only the chunks that plane crosses are decoded. readPlane
 * rejects with RangeError outside the stack and with ZarrError('decode') naming the chunk when one cannot be decoded.
 */
export function createChunkPlaneSource(array: ChunkedArray, roles: AxisRoles, type: SampleType, label: string,
  options: ChunkPlaneOptions): PlaneSource {
  const { shape, chunks } = array;
  const width = shape[roles.x];
  const height = shape[roles.y];
  const expected = chunks.reduce((a, b) => a * b, 1);
  const cached = chunkCache(Math.max(options.cacheChunks, chunksPerPlane(shape, chunks, roles)));
  const sizes = { z: roleSize(shape, roles.z), c: roleSize(shape, roles.c), t: roleSize(shape, roles.t) };

  const strides = cOrderStrides(chunks);
  const bytesPer = new ARRAYS[type](0).BYTES_PER_ELEMENT;
  /** The chunk through options.readDecoded, or null when it has to go through zarrita. */
  const readDirect = async (coords: number[]): Promise<DecodedChunk | null> => {
    const bytes = await options.readDecoded!(coords);
    if (!bytes) return null;
    if (bytes.byteLength !== expected * bytesPer || bytes.byteOffset % bytesPer !== 0) {
      throw new Error(`decodes to ${bytes.byteLength} bytes, expected ${expected * bytesPer}`);
    }
    const Ctor = ARRAYS[type] as unknown as new (b: ArrayBufferLike, o: number, n: number) => PixelArray;
    return { data: new Ctor(bytes.buffer, bytes.byteOffset, expected), shape: chunks, stride: strides };
  };

  const load = async (coords: number[]): Promise<DecodedChunk> => {
    let chunk: DecodedChunk;
    try {
      chunk = (options.readDecoded ? await readDirect(coords) : null) ?? await array.getChunk(coords);
    } catch (err) {
      const cause = err instanceof Error ? ((err.cause instanceof Error ? err.cause.message : '') || err.message) : String(err);
      throw new ZarrError('decode', label, `chunk (${coords.join(', ')}) cannot be decoded: ${cause.split(/\r?\n/)[0]}`);
    }
    if (chunk.data.length !== expected) {
      throw new ZarrError('decode', label, `chunk (${coords.join(', ')}) decodes to ${chunk.data.length} values, expected ${expected} (chunk shape ${chunks.join('×')})`);
    }
    return chunk;
  };

  return {
    async readPlane(z: number, c: number, t: number): Promise<RawPlane> {
      const ok = (v: number, n: number) => Number.isInteger(v) && v >= 0 && v < n;
      if (!ok(z, sizes.z) || !ok(c, sizes.c) || !ok(t, sizes.t)) {
        throw new RangeError(`plane (z=${z}, c=${c}, t=${t}) is outside the stack (Z ${sizes.z}, C ${sizes.c}, T ${sizes.t})`);
      }
      const index = shape.map((_, d) => (d === roles.z ? z : d === roles.c ? c : d === roles.t ? t : 0));
      if (chunks[roles.x] === width && chunks[roles.y] === height) {
        const coords = index.map((i, d) => (d === roles.y || d === roles.x ? 0 : Math.floor(i / chunks[d])));
        const chunk = await cached(coords.join(','), () => load(coords));
        const view = contiguousPlane(chunk, shape, chunks, roles, index, coords);
        if (view) return { width, height, data: view };
      }
      const out = new ARRAYS[type](width * height);
      const jobs: Promise<void>[] = [];
      for (let cy = 0; cy * chunks[roles.y] < height; cy++) {
        for (let cx = 0; cx * chunks[roles.x] < width; cx++) {
          const coords = index.map((i, d) => (d === roles.y ? cy : d === roles.x ? cx : Math.floor(i / chunks[d])));
          jobs.push(cached(coords.join(','), () => load(coords)).then((chunk) => {
            const base = planeBase(chunk, shape, chunks, roles, index, coords);
            const y0 = cy * chunks[roles.y];
            const x0 = cx * chunks[roles.x];
            copyBlock(out, width, chunk, base, chunk.stride[roles.y], chunk.stride[roles.x], y0, x0,
              Math.min(chunks[roles.y], height - y0), Math.min(chunks[roles.x], width - x0));
          }));
        }
      }
      await Promise.all(jobs);
      return { width, height, data: out };
    },
    async close(): Promise<void> {
      await options.onClose?.();
    },
  };
}

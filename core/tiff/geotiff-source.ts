// PlaneSource backed by geotiff (pure JS): the fallback decoder and the reference in tests.
import type { GeoTIFF, getDecoder as GetDecoder } from 'geotiff';

/** geotiff, loaded when a plane first falls back to it (it is the fallback decoder, not needed at start). */
const loadGeotiff = () => import('geotiff');
import type { PixelArray, PlaneSource, RawPlane, SampleType, StackInfo } from '../model';
import { cachedByteSource } from './block-cache';
import { memoryByteSource, type ByteSource } from './byte-source';
import { checkChunkExtents } from './chunk-extent';
import { planeSlot } from './dimension-order';
import { TiffError } from './errors';
import { lazyIfdChain } from './ifd';
import { undoHorizontalPredictor } from './predictor';

type GeotiffSource = Parameters<typeof GeoTIFF.fromSource>[0];

/** Adapts a ByteSource to geotiff's source interface; reads past the end come back zero-padded, as geotiff expects. */
function toGeotiffSource(source: ByteSource): GeotiffSource {
  const fetchOne = async (slice: { offset: number; length: number }) => {
    const out = new Uint8Array(slice.length);
    out.set(await source.read(slice.offset, slice.length));
    return out.buffer;
  };
  const adapter = {
    fetch: (slices: { offset: number; length: number }[]) => Promise.all(slices.map(fetchOne)),
    fetchSlice: async (slice: { offset: number; length: number }) => ({ ...slice, data: await fetchOne(slice) }),
    get fileSize() { return source.size; },
    close: async () => undefined,
  };
  return adapter as unknown as GeotiffSource;
}

/** geotiff's decoder parameters (see its compression/index.js). */
interface DecoderParameters {
  tileWidth: number;
  tileHeight: number;
  planarConfiguration: number;
  bitsPerSample: number | number[] | ArrayLike<number>;
  predictor: number;
}

/**
 * A decoder "pool" for geotiff that decompresses with geotiff but undoes Predictor 2 itself: geotiff sums
 * 16/32-bit differences in host byte order, which is wrong for big-endian files (found with tiffcp -B -c lzw:2).
 */
function predictorFixingPool(littleEndian: boolean) {
  return {
    bindParameters(compression: number, params: DecoderParameters) {
      return {
        async decode(buffer: ArrayBuffer): Promise<ArrayBuffer> {
          const asGeotiff = (p: DecoderParameters) => p as unknown as Parameters<typeof GetDecoder>[1];
          const { getDecoder } = await loadGeotiff();
          if (params.predictor !== 2) return (await getDecoder(compression, asGeotiff(params))).decode(buffer) as Promise<ArrayBuffer>;
          const raw = (await (await getDecoder(compression, asGeotiff({ ...params, predictor: 1 }))).decode(buffer)) as ArrayBuffer;
          const bits = typeof params.bitsPerSample === 'number' ? [params.bitsPerSample] : Array.from(params.bitsPerSample);
          const stride = params.planarConfiguration === 2 ? 1 : bits.length;
          return undoHorizontalPredictor(raw, { widthPx: params.tileWidth, bitsPerSample: bits[0], stride, littleEndian });
        },
      };
    },
  };
}

/** Typed array constructors by sample type. */
const ARRAYS: Record<SampleType, { new (n: number): PixelArray; from(a: ArrayLike<number>): PixelArray }> = {
  uint8: Uint8Array, int8: Int8Array, uint16: Uint16Array, int16: Int16Array,
  uint32: Uint32Array, int32: Int32Array, float32: Float32Array, float64: Float64Array,
};

/** Returns `data` as the array type of `type` (geotiff already picks it; converted only if it did not). */
function asSampleType(data: ArrayLike<number>, type: SampleType): PixelArray {
  const ctor = ARRAYS[type];
  return data instanceof (ctor as unknown as typeof Uint8Array) ? (data as PixelArray) : ctor.from(data);
}

/** Throws unless (z, c, t) lies inside the stack. */
export function checkPlaneIndex(info: StackInfo, z: number, c: number, t: number): void {
  const ok = (v: number, n: number) => Number.isInteger(v) && v >= 0 && v < n;
  if (!ok(z, info.sizeZ) || !ok(c, info.sizeC) || !ok(t, info.sizeT)) {
    throw new RangeError(`plane (z=${z}, c=${c}, t=${t}) is outside the stack (Z ${info.sizeZ}, C ${info.sizeC}, T ${info.sizeT})`);
  }
}

/**
 * Decodes planes with geotiff. When samplesPerPixel > 1 the channel index selects the sample.
 * close() also closes the ByteSource if it has a close method.
 */
export function createGeotiffPlaneSource(bytesOrSource: Uint8Array | ByteSource, info: StackInfo, fileLabel = 'file'): PlaneSource {
  const source = bytesOrSource instanceof Uint8Array ? memoryByteSource(bytesOrSource) : bytesOrSource;
  let tiff: Promise<GeoTIFF> | null = null;
  const openTiff = () => (tiff ??= loadGeotiff().then((m) => m.GeoTIFF.fromSource(toGeotiffSource(source))));
  const tags = cachedByteSource(source);
  const openChain = lazyIfdChain(tags, fileLabel);
  return {
    async readPlane(z: number, c: number, t: number): Promise<RawPlane> {
      checkPlaneIndex(info, z, c, t);
      const ifd = info.planeIfd[planeSlot(info, z, c, t)];
      const what = `plane z=${z} c=${c} t=${t}`;
      const { header, ifds } = await openChain();
      await checkChunkExtents(tags, header, ifds[ifd], fileLabel, what);
      try {
        const image = await (await openTiff()).getImage(ifd);
        const sample = info.samplesPerPixel > 1 ? c : 0;
        const pool = predictorFixingPool(header.littleEndian) as unknown as NonNullable<Parameters<typeof image.readRasters>[0]>['pool'];
        const rasters = (await image.readRasters({ samples: [sample], interleave: false, pool })) as unknown as ArrayLike<number>[];
        const data = asSampleType(rasters[0], info.sampleType);
        if (data.length !== info.sizeX * info.sizeY) throw new Error(`decoded ${data.length} pixels, expected ${info.sizeX * info.sizeY}`);
        return { width: info.sizeX, height: info.sizeY, data };
      } catch (err) {
        throw new TiffError('decode', fileLabel, `cannot decode ${what} (IFD ${ifd}): ${err instanceof Error ? err.message : String(err)}`);
      }
    },
    async close(): Promise<void> {
      const closable = source as ByteSource & { close?: () => Promise<void> };
      if (typeof closable.close === 'function') await closable.close();
    },
  };
}

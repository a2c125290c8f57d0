// PlaneSource backed by sharp (libvips/libtiff): the fast decoder for the sample types it returns exactly.
import type SharpModule from 'sharp';
import type { PixelArray, PlaneSource, RawPlane, SampleType, StackInfo } from '../../core/model';
import { checkPlaneIndex, planeSlot, TiffError } from '../../core/tiff';

/** libvips threads to set when sharp is loaded (null: sharp's default). */
let decoderThreads: number | null = null;
let sharpLoaded: Promise<typeof SharpModule> | null = null;

/**
 * sharp, loaded on first use. Why lazily: the direct decode path reads almost every stack without it, and loading
 * sharp (libvips) cost each batch worker about 0.1 s of CPU and 30 MiB of memory at start.
 */
export function loadSharp(): Promise<typeof SharpModule> {
  sharpLoaded ??= import('sharp').then((m) => {
    const sharp = m.default;
    if (decoderThreads !== null) {
      sharp.concurrency(decoderThreads);
      sharp.cache(false);
    }
    return sharp;
  });
  return sharpLoaded;
}

/**
 * libvips (inside sharp) keeps its own thread pool per process; with several batch workers it is shrunk so the
 * workers do not fight over the cores, and its cache is turned off because every plane is read once. Applied when
 * sharp is loaded (at once when it already is).
 */
export function limitDecoderThreads(threads: number): void {
  decoderThreads = Math.max(1, Math.floor(threads));
  if (sharpLoaded !== null) {
    void sharpLoaded.then((sharp) => { sharp.concurrency(decoderThreads!); sharp.cache(false); });
  }
}

type RawDepth = 'uchar' | 'char' | 'ushort' | 'uint' | 'int' | 'float';

/** sharp raw depth and typed-array constructor for each sample type sharp decodes exactly. */
const EXACT: Partial<Record<SampleType, { depth: RawDepth; array: new (b: ArrayBuffer) => PixelArray }>> = {
  uint8: { depth: 'uchar', array: Uint8Array },
  int8: { depth: 'char', array: Int8Array },
  uint16: { depth: 'ushort', array: Uint16Array },
  uint32: { depth: 'uint', array: Uint32Array },
  int32: { depth: 'int', array: Int32Array },
  float32: { depth: 'float', array: Float32Array },
};

/**
 * True when sharp returns exact values for this stack. Checked against known patterns (test/tiff): int16 loses
 * negative values, float64 is refused, extra samples get expanded to sRGB bands, and big-endian files with the
 * floating-point predictor come back byte-swapped, so those go to the geotiff decoder.
 */
export function sharpDecodesExactly(info: StackInfo): boolean {
  if (info.byteOrder === 'MM' && info.compression.endsWith('floating-point predictor')) return false;
  return info.samplesPerPixel === 1 && EXACT[info.sampleType] !== undefined;
}

/** Decodes IFD `page` to raw bytes: grey16 for 16-bit (else it comes back 8-bit), extractChannel(0) otherwise. */
async function decodePage(path: string, page: number, type: SampleType): Promise<{ data: Buffer; width: number; height: number; channels: number }> {
  const spec = EXACT[type];
  if (!spec) throw new Error(`sharp cannot decode ${type} samples exactly`);
  const sharp = await loadSharp();
  const image = sharp(path, { page, limitInputPixels: false });
  const pipeline = type === 'uint16' ? image.toColourspace('grey16') : image.extractChannel(0);
  const { data, info } = await pipeline.raw({ depth: spec.depth }).toBuffer({ resolveWithObject: true });
  return { data, width: info.width, height: info.height, channels: info.channels };
}

/**
 * Copies a Buffer into a fresh, aligned typed array of the sample type. Why not a view: sharp's Buffers are native
 * memory freed only at GC; viewing them saved ~70 ms per 96 MiB stack but raised peak RSS by ~20 MiB (bench).
 */
function toTypedArray(data: Buffer, type: SampleType): PixelArray {
  const copy = new ArrayBuffer(data.length);
  new Uint8Array(copy).set(data);
  return new EXACT[type]!.array(copy);
}

/** PlaneSource decoding with sharp; readPlane rejects with a TiffError('decode') naming the file and plane. */
export function createSharpPlaneSource(path: string, info: StackInfo, fileLabel: string = path): PlaneSource {
  return {
    async readPlane(z: number, c: number, t: number): Promise<RawPlane> {
      checkPlaneIndex(info, z, c, t);
      const ifd = info.planeIfd[planeSlot(info, z, c, t)];
      try {
        if (!sharpDecodesExactly(info)) throw new Error(`sharp cannot decode ${info.sampleType} with ${info.samplesPerPixel} samples per pixel exactly`);
        const out = await decodePage(path, ifd, info.sampleType);
        if (out.width !== info.sizeX || out.height !== info.sizeY || out.channels !== 1) {
          throw new Error(`decoded ${out.width}×${out.height}×${out.channels}, expected ${info.sizeX}×${info.sizeY}×1`);
        }
        return { width: info.sizeX, height: info.sizeY, data: toTypedArray(out.data, info.sampleType) };
      } catch (err) {
        throw new TiffError('decode', fileLabel, `cannot decode plane z=${z} c=${c} t=${t} (IFD ${ifd}): ${err instanceof Error ? err.message : String(err)}`);
      }
    },
    async close(): Promise<void> {
      // sharp opens the file per call; nothing stays open.
    },
  };
}

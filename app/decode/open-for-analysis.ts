// Open a stack for analysis: tags from core/tiff; pixels on the direct path where it reaches, else sharp; geotiff
// when neither can or when a plane fails.
import type { PixelArray, PlaneSource, RawPlane, StackInfo } from '../../core/model';
import { openFileByteSource } from '../../core/io';
import { createDirectPlaneSource, createGeotiffPlaneSource, directPathRefusal, readStackInfoWithChain, type ByteSource, type StackInfoOptions, type TiffChain } from '../../core/tiff';
import { APP_CHUNK_CODECS } from './lzma-codec';
import { isZarrPath, openZarrStack } from './open-zarr-stack';
import { createSharpPlaneSource, sharpDecodesExactly } from './sharp-decoder';

/** What openStackForAnalysis returns; `warnings` grows when a plane falls back to the geotiff decoder. */
export interface OpenedStack {
  readonly info: StackInfo;
  readonly source: PlaneSource;
  readonly warnings: string[];
}

/** After this many planes fail in `primary`, the rest go straight to `fallback` (one more warning says so). */
const FAILURES_BEFORE_SWITCH = 3;

/** A PlaneSource that tries `primary` first and, when it rejects a plane, decodes it with `fallback` and warns. */
export function withDecoderFallback(primary: PlaneSource, fallback: PlaneSource, warnings: string[], fileLabel: string): PlaneSource {
  let failures = 0;
  return {
    async readPlane(z: number, c: number, t: number, into?: PixelArray): Promise<RawPlane> {
      if (failures >= FAILURES_BEFORE_SWITCH) return fallback.readPlane(z, c, t, into);
      try {
        return await primary.readPlane(z, c, t, into);
      } catch (err) {
        if (err instanceof RangeError) throw err;
        const plane = await fallback.readPlane(z, c, t, into);
        const reason = err instanceof Error ? err.message.replace(`${fileLabel}: `, '') : String(err);
        warnings.push(`${fileLabel}: plane z=${z} c=${c} t=${t} decoded with the pure-JS decoder (${reason})`);
        failures++;
        if (failures === FAILURES_BEFORE_SWITCH) warnings.push(`${fileLabel}: remaining planes decoded with the pure-JS decoder`);
        return plane;
      }
    },
    async close(): Promise<void> {
      await Promise.all([primary.close(), fallback.close()]);
    },
  };
}

/** Options for openStackForAnalysis. */
export interface OpenForAnalysisOptions extends StackInfoOptions {
  /** Wraps the opened file before anything reads it (the batch hashes the bytes the decoder reads this way). */
  readonly wrapSource?: (source: ByteSource) => ByteSource;
}

/**
 * Reads tags with core and returns a PlaneSource: the direct path for every layout it reaches (none, LZW, PackBits,
 * Deflate, LZMA, Zstandard; strips and tiles; chunky and planar), sharp for other compressions it decodes exactly,
 * geotiff for the rest and for any plane the first choice fails on. Throws TiffError. A folder is read as an
 * OME-Zarr store (core/zarr; throws ZarrError).
 */
export async function openStackForAnalysis(path: string, fileLabel: string, options: OpenForAnalysisOptions = {}): Promise<OpenedStack> {
  if (await isZarrPath(path)) return openZarrStack(path, fileLabel, options);
  const file = await openFileByteSource(path, fileLabel);
  const bytes = options.wrapSource ? Object.assign(options.wrapSource(file), { close: () => file.close() }) : file;
  let info: StackInfo;
  let chain: TiffChain;
  try {
    ({ info, chain } = await readStackInfoWithChain(bytes, fileLabel, options));
  } catch (err) {
    await file.close();
    throw err;
  }
  const geotiff = createGeotiffPlaneSource(bytes, info, fileLabel);
  const warnings: string[] = [];
  if (directPathRefusal(info, APP_CHUNK_CODECS) === null) {
    return { info, source: withDecoderFallback(createDirectPlaneSource(bytes, info, APP_CHUNK_CODECS, fileLabel, chain), geotiff, warnings, fileLabel), warnings };
  }
  if (!sharpDecodesExactly(info)) return { info, source: geotiff, warnings };
  return { info, source: withDecoderFallback(createSharpPlaneSource(path, info, fileLabel), geotiff, warnings, fileLabel), warnings };
}

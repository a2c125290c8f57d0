// Open a stack for analysis: tags from core/tiff, pixels from sharp, geotiff when sharp cannot or fails.
import type { PlaneSource, RawPlane, StackInfo } from '../../core/model';
import { openFileByteSource } from '../../core/io';
import { createGeotiffPlaneSource, readStackInfo, type StackInfoOptions } from '../../core/tiff';
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
    async readPlane(z: number, c: number, t: number): Promise<RawPlane> {
      if (failures >= FAILURES_BEFORE_SWITCH) return fallback.readPlane(z, c, t);
      try {
        return await primary.readPlane(z, c, t);
      } catch (err) {
        if (err instanceof RangeError) throw err;
        const plane = await fallback.readPlane(z, c, t);
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

/**
 * Reads tags with core and returns a PlaneSource: sharp for the sample types it decodes exactly, geotiff for
 * the rest (int16, float64, several samples per pixel) and for any plane sharp fails on. Throws TiffError.
 * A folder is read as an OME-Zarr store (core/zarr; throws ZarrError).
 */
export async function openStackForAnalysis(path: string, fileLabel: string, options: StackInfoOptions = {}): Promise<OpenedStack> {
  if (await isZarrPath(path)) return openZarrStack(path, fileLabel, options);
  const bytes = await openFileByteSource(path, fileLabel);
  let info: StackInfo;
  try {
    info = await readStackInfo(bytes, fileLabel, options);
  } catch (err) {
    await bytes.close();
    throw err;
  }
  const geotiff = createGeotiffPlaneSource(bytes, info, fileLabel);
  const warnings: string[] = [];
  if (!sharpDecodesExactly(info)) return { info, source: geotiff, warnings };
  return { info, source: withDecoderFallback(createSharpPlaneSource(path, info, fileLabel), geotiff, warnings, fileLabel), warnings };
}

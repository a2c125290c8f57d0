// The shown embryo's live measurement as an EmbryoResult, so exports use the same tables as the batch.
import type { ApAxis, EmbryoResult, PixelSizeSource } from '../../core/model';
import type { LiveMeasurement } from '../live';

/** EmbryoResult for file `file` from a live measurement along `axis` (status ok; warnings carried over). */
export function liveToResult(file: string, m: LiveMeasurement, axis: ApAxis, pixelSizeUm: number | null, pixelSizeSource: PixelSizeSource, eggWidthUm: number | null): EmbryoResult {
  return {
    file, status: 'ok', error: null, warnings: m.warnings, pixelSizeUm, pixelSizeSource,
    eggLengthUm: m.eggLengthUm, eggWidthUm, axis,
    gradientChannel: m.profile?.channel ?? null, gradientProfile: m.profile, gradientFit: m.fit,
    boundaryProfiles: m.boundaryProfiles, boundaries: m.boundaries, landmarks: m.landmarks,
    backgrounds: [],
  };
}

/** A file-name-safe stem of a relative path ("a/b c.tif" → "a-b-c"). */
export function fileStem(relPath: string): string {
  return relPath.replace(/\.[^.]*$/, '').replace(/[^A-Za-z0-9_-]+/g, '-').replace(/^-|-$/g, '') || 'embryo';
}

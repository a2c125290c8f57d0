// Live measurement of the shown embryo with the same core functions the batch uses (prepareSampling, i.e. the
// mode's sampler, once per file and settings; measureEmbryo per edit), plus the straightened strip for the view.
import type { LoadedStack } from '../../core/contract';
import type { ApAxis, Boundary, ExponentialFit, ImagePoint, Landmark, LandmarkPosition, Plane, Profile, SidesMeasurement } from '../../core/model';
import { axisLengthPx, measureEmbryo, prepareSampling, sampleBandOutline, straightenPlane, straightViewHalfWidthPx } from '../../core/pipeline';
import type { PreparedSampling } from '../../core/pipeline';
import type { AnalysisSettings } from '../../core/settings';
import { distanceOutsideMaskPx } from '../../core/geometry';
import { poleSlackPx } from '../../core/profile';

/** Per-file values that do not change while the axis, landmarks or fit range are edited. */
export interface LivePrepared {
  readonly stack: LoadedStack;
  readonly sampling: PreparedSampling;
  /** The sampler's region (the edge band, or the whole mask for the axis strip) as a 0/1 float plane, for the strip overlay. */
  readonly bandPlane: Plane;
}

/** Everything the views draw for one axis. */
export interface LiveMeasurement {
  /** Egg length along the axis, µm (px when the pixel size is unknown). */
  readonly eggLengthUm: number;
  /** Straightened channels (anterior left; row 0 = left of A→P), same size. */
  readonly strips: readonly Plane[];
  /** Straightened 0/1 plane of the pixels the profile samples (same size as the strips). */
  readonly bandStrip: Plane;
  readonly profile: Profile | null;
  readonly fit: ExponentialFit | null;
  readonly boundaryProfiles: readonly Profile[];
  readonly boundaries: readonly Boundary[];
  readonly landmarks: readonly LandmarkPosition[];
  readonly warnings: readonly string[];
  /** Poles that lie outside the embryo's mask (by more than the slack the warning allows); drawn marked. */
  readonly polesOutside: readonly ('anterior' | 'posterior')[];
  /** Each side's profile and fit and their paired difference, when the sampler measures the sides apart; else null. */
  readonly sides: SidesMeasurement | null;
}

/** Per-file preparation (re-run when the stack or the settings change). */
export function prepareLive(stack: LoadedStack, settings: AnalysisSettings): LivePrepared {
  const sampling = prepareSampling(stack.projected, stack.detection, settings);
  const src = sampling.region.mask;
  return { stack, sampling, bandPlane: { width: src.width, height: src.height, data: Float32Array.from(src.data) } };
}

/** Longest strip side in samples, so a drag on a large image still updates within a frame. */
export const MAX_STRIP_SAMPLES = 512;
/** Most rows across the strip. */
export const MAX_STRIP_ROWS = 128;

/** Keep only the straightened rows the sampler samples (its side rule, its strip width). */
function sampledRows(band: Plane, sampling: PreparedSampling, settings: AnalysisSettings, rowStepUm: number): Plane {
  const rows = sampling.sampler.stripRows(band.height, rowStepUm, settings);
  const data = band.data.map((v, k) => (rows[Math.floor(k / band.width)] === 1 && v >= 0.5 ? 1 : 0));
  return { ...band, data };
}

/** Measure along `axis` with the current settings, landmarks and fit range (x/EL). */
export function measureLive(prep: LivePrepared, axis: ApAxis, settings: AnalysisSettings, landmarks: readonly Landmark[], fitRangeEl: readonly [number, number]): LiveMeasurement {
  const s = { ...settings, fitRangeEl };
  const m = measureEmbryo(prep.sampling, axis, s, landmarks);
  const lengthPx = Math.max(1, axisLengthPx(axis));
  const pxUm = prep.sampling.pixelSizeUm ?? 1;
  const samplesAlong = Math.max(2, Math.min(MAX_STRIP_SAMPLES, Math.round(lengthPx)));
  const halfWidthPx = straightViewHalfWidthPx(prep.stack.detection.eggWidthUm, prep.sampling.pixelSizeUm);
  // The strip is shown about 130 px tall, so more than MAX_STRIP_ROWS rows would only cost time.
  const rowStepPx = Math.max(lengthPx / (samplesAlong - 1), (2 * halfWidthPx) / MAX_STRIP_ROWS);
  const halfRows = Math.max(1, Math.round(halfWidthPx / rowStepPx));
  const strips = prep.stack.projected.channels.map((p) => straightenPlane(p, axis, halfRows, samplesAlong, rowStepPx));
  const bandStrip = sampledRows(straightenPlane(prep.bandPlane, axis, halfRows, samplesAlong, rowStepPx), prep.sampling, s, rowStepPx * pxUm);
  return {
    eggLengthUm: m.eggLengthUm ?? lengthPx, strips, bandStrip,
    profile: m.gradientProfile, fit: m.gradientFit, boundaryProfiles: m.boundaryProfiles, boundaries: m.boundaries,
    landmarks: m.landmarks, warnings: m.warnings,
    polesOutside: (['anterior', 'posterior'] as const).filter((end) => distanceOutsideMaskPx(prep.sampling.mask, axis[end], lengthPx) > poleSlackPx(lengthPx)),
    sides: m.sides ?? null,
  };
}

/**
 * Outlines (image px) of the region the profile samples along `axis`. Kept apart from measureLive because tracing
 * contours over the whole image is slow on large images; the window redraws it when a drag pauses.
 */
export function bandOutlinesLive(prep: LivePrepared, axis: ApAxis, settings: AnalysisSettings): ImagePoint[][] {
  return sampleBandOutline(prep.sampling, axis, settings);
}

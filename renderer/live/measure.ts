// Live measurement of the shown embryo: straighten along the axis, sample the band, fit, find boundaries.
// Runs in the renderer on every edit, so it only does per-edit work; per-file work is in prepareLive.
import type { LoadedStack } from '../../core/contract';
import type { ApAxis, Boundary, ExponentialFit, ImagePoint, Landmark, LandmarkPosition, Plane, Profile } from '../../core/model';
import type { AnalysisSettings } from '../../core/settings';
import { axisLeftNormal, distancePx } from '../geometry';
import { backgroundLevel } from './background';
import { bandRows, bandSelection } from './bandSelect';
import type { ColumnBand } from './bandSelect';
import { resolveChannel } from './channels';
import { fitProfileExponential } from './expFit';
import { halfMaxBoundary } from './halfMax';
import { landmarkPositions } from './landmarks';
import { profileFromStrip } from './stripProfile';
import { straightenPlane } from './straighten';

/** Per-file values that do not change while the axis or landmarks are edited. */
export interface LivePrepared {
  readonly stack: LoadedStack;
  readonly maskPlane: Plane;
  readonly gradientIndex: number | null;
  readonly boundaryIndices: readonly number[];
  /** Background per channel, image intensity units. */
  readonly backgrounds: readonly number[];
  readonly pixelSizeUm: number;
  readonly warnings: readonly string[];
}

/** Everything the views draw for one axis. */
export interface LiveMeasurement {
  readonly eggLengthUm: number;
  /** Straightened channels (anterior left; row 0 = left of A→P) and mask, same size. */
  readonly strips: readonly Plane[];
  readonly maskStrip: Plane;
  /** Strip row spacing in image px. */
  readonly rowStepPx: number;
  readonly bands: readonly ColumnBand[];
  /** Sampled band outlines in image coordinates (one closed polygon per sampled side). */
  readonly bandOutlines: readonly (readonly ImagePoint[])[];
  readonly profile: Profile | null;
  readonly fit: ExponentialFit | null;
  readonly boundaryProfiles: readonly Profile[];
  readonly boundaries: readonly Boundary[];
  readonly landmarks: readonly LandmarkPosition[];
  readonly warnings: readonly string[];
}

/** Per-file preparation: channel choice, backgrounds, the mask as a float plane. */
export function prepareLive(stack: LoadedStack, settings: AnalysisSettings): LivePrepared {
  const names = stack.projected.channelNames;
  const warnings = [...stack.projected.warnings, ...stack.detection.warnings];
  const gradientIndex = resolveChannel(settings.gradientChannel, names);
  if (gradientIndex === null) warnings.push(`gradient channel ${settings.gradientChannel} is not in this file (channels: ${names.join(', ')})`);
  const boundaryIndices = settings.boundaryChannels.map((c) => resolveChannel(c, names)).filter((i): i is number => i !== null);
  const { mask } = stack.detection;
  const maskPlane = { width: mask.width, height: mask.height, data: Float32Array.from(mask.data) };
  const backgrounds = stack.projected.channels.map((p) => backgroundLevel(p, mask, settings.background));
  const known = stack.projected.pixelSizeUm !== null && stack.projected.pixelSizeUm > 0;
  if (!known) warnings.push('pixel size unknown: lengths are in pixels (set a pixel size in the settings)');
  return { stack, maskPlane, gradientIndex, boundaryIndices, backgrounds, pixelSizeUm: known ? stack.projected.pixelSizeUm as number : (settings.pixelSizeUm ?? 1), warnings };
}

/** Longest strip side in samples, so a drag on a large image still updates within a frame. */
export const MAX_STRIP_SAMPLES = 640;

/** Measure along `axis` with the current settings, landmarks and fit range (x/EL). */
export function measureLive(prep: LivePrepared, axis: ApAxis, settings: AnalysisSettings, landmarks: readonly Landmark[], fitRangeEl: readonly [number, number]): LiveMeasurement {
  const lengthPx = Math.max(1, distancePx(axis.anterior, axis.posterior));
  const eggLengthUm = lengthPx * prep.pixelSizeUm;
  const samplesAlong = Math.max(2, Math.min(MAX_STRIP_SAMPLES, Math.round(lengthPx)));
  const rowStepPx = lengthPx / (samplesAlong - 1);
  const halfWidthImgPx = Math.max(4, (prep.stack.detection.eggWidthUm / prep.pixelSizeUm) * 0.6);
  const halfRows = Math.max(1, Math.round(halfWidthImgPx / rowStepPx));
  const strips = prep.stack.projected.channels.map((p) => straightenPlane(p, axis, halfRows, samplesAlong, rowStepPx));
  const maskStrip = straightenPlane(prep.maskPlane, axis, halfRows, samplesAlong, rowStepPx);
  const bands = bandRows(maskStrip, settings.profile, rowStepPx * prep.pixelSizeUm);
  const select = bandSelection(samplesAlong, 2 * halfRows + 1, bands);
  const names = prep.stack.projected.channelNames;
  const profileOf = (c: number) => profileFromStrip(strips[c], eggLengthUm, settings.profile.binCount, prep.backgrounds[c], names[c], select);
  const warnings = [...prep.warnings];
  const profile = prep.gradientIndex === null ? null : profileOf(prep.gradientIndex);
  let fit: ExponentialFit | null = null;
  if (profile !== null) {
    const f = fitProfileExponential(profile, fitRangeEl, eggLengthUm);
    if (typeof f === 'string') warnings.push(f); else fit = f;
  }
  const boundaryProfiles = prep.boundaryIndices.map(profileOf);
  const boundaries = boundaryProfiles.map((p) => halfMaxBoundary(p, eggLengthUm));
  const bandOutlines = outlinesOf(axis, bands, halfRows, samplesAlong, rowStepPx);
  return { eggLengthUm, strips, maskStrip, rowStepPx, bands, bandOutlines, profile, fit, boundaryProfiles, boundaries, landmarks: landmarkPositions(landmarks, axis, prep.pixelSizeUm), warnings };
}

/** Closed image-space polygons around the sampled rows, one per side, for drawing where the band samples. */
function outlinesOf(axis: ApAxis, bands: readonly ColumnBand[], halfRows: number, samplesAlong: number, rowStepPx: number): ImagePoint[][] {
  const n = axisLeftNormal(axis.anterior, axis.posterior);
  const at = (i: number, row: number): ImagePoint => {
    const t = i / (samplesAlong - 1);
    const off = (halfRows - row) * rowStepPx;
    return { x: axis.anterior.x + t * (axis.posterior.x - axis.anterior.x) + off * n.x, y: axis.anterior.y + t * (axis.posterior.y - axis.anterior.y) + off * n.y };
  };
  const polys: ImagePoint[][] = [];
  for (const side of ['top', 'bottom'] as const) {
    const outer: ImagePoint[] = [], inner: ImagePoint[] = [];
    const step = Math.max(1, Math.floor(samplesAlong / 160));
    bands.forEach((b, i) => {
      const r = b[side];
      if (r === null || i % step !== 0) return;
      outer.push(at(i, r[0] - 0.5)); inner.push(at(i, r[1] + 0.5));
    });
    if (outer.length > 1) polys.push([...outer, ...inner.reverse()]);
  }
  return polys;
}

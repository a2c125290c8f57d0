// One embryo end to end: project → detect → (hand axis) → sampler (prepare, sample) → fit, as an EmbryoResult that never throws.
import { errorResult, withTimePoint, type EmbryoResult, type HandEdits, type PlaneSource, type ProjectedStack, type StackInfo } from '../model';
import type { AnalysisSettings } from '../settings';
import { applyImageCorrections, projectStack, type ImageCorrections, type PlaneArrays } from '../image';
import { detectEmbryo, type EmbryoDetection } from '../geometry';
import { fitSampledProfiles, prepareSampling, sampleProfiles, type PreparedSampling } from '../profile';

/** Per-file options of analyseStack. */
export interface AnalyseOptions {
  /** File name or path relative to the input folder; starts every error message. */
  readonly fileLabel: string;
  /** Hand axis and landmarks from the project; the hand axis replaces the automatic one. */
  readonly handEdits?: HandEdits | null;
  /** The embryo (mask and axis) found beforehand, used instead of segmenting this stack: a movie's, found once. */
  readonly detection?: EmbryoDetection | null;
  /** Told the Z projection once it is made (the window keeps a small copy of each time point of a movie). */
  readonly onProjected?: (projected: ProjectedStack) => void;
  /** Time of the analysed time point in s, when the caller knows it better than the file (--time-step); else the file's. */
  readonly timeS?: number | null;
  /** This time point's projection when the caller already has it (a movie's sampled time points); else it is read. */
  readonly projected?: ProjectedStack;
  /** Prepares sampling within `detection` (samplingWithin: a movie reuses what depends on the mask alone). */
  readonly prepare?: (projected: ProjectedStack, settings: AnalysisSettings) => PreparedSampling;
  /** Flat field and background image applied to the projection it reads (see core/image/corrections.ts); a
   *  `projected` given by the caller is taken as already corrected. Absent = none. */
  readonly corrections?: ImageCorrections | null;
  /** Arrays the projection it reads is written into (one per channel, sizeX·sizeY values), when the caller reuses
   *  them (a movie, for every time point): the projection, and what onProjected was told, then last only until the
   *  caller's next use of them. Absent = new arrays. */
  readonly projectionBuffers?: readonly Float32Array[] | null;
  /** Arrays the planes it reads are decoded into (reusedPlaneArrays; a movie, for every time point), so that no plane
   *  is a new array and a one-plane projection keeps its decoded samples for the background. Absent = new arrays. */
  readonly planeArrays?: PlaneArrays | null;
  /** With planeArrays: a one-plane channel's floats are made only if something reads them (projectStack's `lazy`);
   *  a movie's time point within its known embryo reads the decoded samples alone. */
  readonly lazyProjection?: boolean;
}

/**
 * The Z projection with the flat field and background image applied (when given); written into `into` (one array
 * of sizeX·sizeY values per channel) when given, corrections included, else into new arrays.
 */
export async function correctedProjection(info: StackInfo, source: PlaneSource, settings: AnalysisSettings, corrections: ImageCorrections | null | undefined,
  into: readonly Float32Array[] | null = null, planes: PlaneArrays | null = null, lazy = false): Promise<ProjectedStack> {
  const raw = await projectStack(info, source, settings, corrections ?? null, into, planes, lazy);
  return corrections ? applyImageCorrections(raw, corrections, settings.projection === 'sum' ? info.sizeZ : 1, into !== null) : raw;
}

/** Check that the stack has something to analyse (exact messages). */
function checkInfo(info: StackInfo): string | null {
  if (!(info.sizeX > 0 && info.sizeY > 0)) return `image size ${info.sizeX}×${info.sizeY} has no pixels`;
  if (!(info.sizeZ > 0 && info.sizeC > 0 && info.sizeT > 0)) return `stack has ${info.sizeZ} slice(s), ${info.sizeC} channel(s), ${info.sizeT} time point(s); nothing to analyse`;
  return null;
}

/**
 * Analyse one stack at time point settings.timeIndex; the result carries that time point (tIndex) and its time (tS).
 * Pixel size: the file's, else settings.pixelSizeUm ('user'), else
 * unknown (lengths in px, µm values null, with a warning). Bad data gives status 'error' with a one-line message
 * naming the file; this function does not throw for bad data.
 */
export async function analyseStack(info: StackInfo, source: PlaneSource, settings: AnalysisSettings, options: AnalyseOptions): Promise<EmbryoResult> {
  const t = settings.timeIndex;
  return withTimePoint(await analyseOneTimePoint(info, source, settings, options), t, options.timeS ?? info.time?.timesS?.[t] ?? null);
}

async function analyseOneTimePoint(info: StackInfo, source: PlaneSource, settings: AnalysisSettings, options: AnalyseOptions): Promise<EmbryoResult> {
  const file = options.fileLabel;
  const bad = checkInfo(info);
  if (bad) return errorResult(file, bad);
  try {
    const projected = options.projected ?? await correctedProjection(info, source, settings, options.corrections, options.projectionBuffers ?? null, options.planeArrays ?? null, options.lazyProjection === true);
    options.onProjected?.(projected);
    const detection = options.detection ?? detectEmbryo(projected, settings);
    const hand = options.handEdits?.axis ?? null;
    const axis = hand ? { ...hand, source: 'hand' as const } : detection.axis;
    // The sampler of settings.profile.mode prepares its pixels and bins them along the axis; then the fitter.
    const prepared = options.prepare && options.detection ? options.prepare(projected, settings) : prepareSampling(projected, detection, settings);
    const sampled = sampleProfiles(prepared, axis, settings);
    const m = fitSampledProfiles(sampled, prepared, settings, options.handEdits?.landmarks ?? []);
    const px = projected.pixelSizeUm;
    const warnings = [...new Set([...info.warnings, ...projected.warnings, ...detection.warnings, ...m.warnings])];
    return {
      file, status: 'ok', error: null, warnings, pixelSizeUm: px, pixelSizeSource: projected.pixelSizeSource,
      eggLengthUm: m.eggLengthUm, eggWidthUm: px !== null ? detection.eggWidthUm : null, axis,
      gradientChannel: m.gradientChannel, gradientProfile: m.gradientProfile, gradientFit: m.gradientFit,
      boundaryProfiles: m.boundaryProfiles, boundaries: m.boundaries, landmarks: m.landmarks, backgrounds: m.backgrounds,
      ...(m.sides ? { sides: m.sides } : {}),
    };
  } catch (e) {
    return errorResult(file, e instanceof Error ? e.message : String(e));
  }
}

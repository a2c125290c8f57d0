// The one interface every profile mode implements, and the data it prepares from and into.
import type { ApAxis, BackgroundEstimate, ImagePoint, Mask } from '../../model';
import type { AnalysisSettings } from '../../settings';
import type { BinGroups } from '../bin';

/** Pixel positions (px, pixel centres) and background-subtracted values of every channel at those pixels. */
export interface PixelSet {
  readonly xs: Float32Array;
  readonly ys: Float32Array;
  /** values[c][k] = channel c at pixel k, background subtracted. */
  readonly values: readonly Float32Array[];
}

/** Half-open bounding box of a mask's pixels (px). */
export interface MaskBox { readonly x0: number; readonly y0: number; readonly x1: number; readonly y1: number }

/** What every sampler prepares from: the embryo's mask, the backgrounds, and a way to gather pixels (once per file). */
export interface SamplingBase {
  readonly width: number;
  readonly height: number;
  /** µm per pixel, or null when unknown (then µm settings are taken as px). */
  readonly pixelSizeUm: number | null;
  readonly channelNames: readonly string[];
  readonly mask: Mask;
  /** Bounding box of the mask, null when the mask is empty. */
  readonly box: MaskBox | null;
  readonly backgrounds: readonly BackgroundEstimate[];
  readonly warnings: readonly string[];
  /** Positions and background-subtracted values of the pixels where keep[i] is 1 (only the box is scanned). */
  gather(keep: Uint8Array): PixelSet;
}

/** The pixels a sampler may draw from, whatever the axis: found once per file and settings. */
export interface SampledRegion {
  /** 0/1 mask of those pixels (drawn straightened beside the image). */
  readonly mask: Mask;
  /** Their positions and values: base.gather(mask.data), which a movie repeats for each time point (samplingWithin). */
  readonly pixels: PixelSet;
}

/**
 * The last bins of a series of preparations whose region pixels lie at the same positions (samplingWithin: a movie's
 * time points), with the axis and settings they were made for (key), so a time point measured along the same axis
 * with the same settings is not binned again.
 */
export interface BinningMemo {
  last: { readonly key: string; readonly groups: BinGroups } | null;
}

/** A sampler's preparation together with the base it was made from: what measuring along an axis needs. */
export interface PreparedSampling extends SamplingBase {
  readonly sampler: ProfileSampler;
  readonly region: SampledRegion;
  /** Shared by the preparations of one samplingWithin (same region pixel positions); absent = bin every time. */
  readonly binning?: BinningMemo;
}

/**
 * One way of sampling the profile (a value of settings.profile.mode). The pipeline prepares the region once per file,
 * bins its pixels along the axis for every measurement, and the window draws the outline and the straightened rows.
 */
export interface ProfileSampler {
  /** The value of settings.profile.mode that selects it. */
  readonly mode: string;
  /** Its name in the window ("edge band"). */
  readonly label: string;
  /** The settings of its own (keys of the settings table), shown in the settings panel while it is chosen. */
  readonly settingKeys: readonly string[];
  /** One line saying how a run sampled, from a run record's profile settings (any shape: `get` may return anything). */
  describe(get: (key: string) => unknown): string;
  /** The pixels it draws from (the part that does not depend on the axis). */
  prepare(base: SamplingBase, settings: AnalysisSettings): SampledRegion;
  /** Bin index (0..binCount−1) of each region pixel along `axis`, −1 for pixels not sampled. */
  bins(prepared: PreparedSampling, axis: ApAxis, settings: AnalysisSettings): Int32Array;
  /** Closed polygons (px) around the pixels sampled along `axis` (fill even-odd), for the overlay. */
  outline(prepared: PreparedSampling, axis: ApAxis, settings: AnalysisSettings): ImagePoint[][];
  /**
   * Which rows of a straightened view are sampled: 1 or 0 per row, row 0 farthest left of A→P, rows `rowStepUm` apart
   * and centred on the axis (the centre row counts as left).
   */
  stripRows(rowCount: number, rowStepUm: number, settings: AnalysisSettings): Uint8Array;
  /**
   * Bin index of each region pixel on each side on its own (−1 elsewhere), when the settings ask for the two sides
   * measured apart (the edge band's --edge-side each); null otherwise. Samplers without sides leave it out.
   */
  sideBins?(prepared: PreparedSampling, axis: ApAxis, settings: AnalysisSettings): SideBins | null;
}

/** Bins of the dorsal and the ventral side of a sampled region, each on its own. */
export interface SideBins {
  readonly dorsal: Int32Array;
  readonly ventral: Int32Array;
  /** The same bins with only the pixels of the outer half of the band's depth (−1 elsewhere), for the depth term. */
  readonly outerHalf?: { readonly dorsal: Int32Array; readonly ventral: Int32Array };
}

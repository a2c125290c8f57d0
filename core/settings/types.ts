// Analysis settings: everything the batch command and the desktop app can set. Units are in the names.
import type { BoundaryMethod, ProjectionMethod } from '../model';

/** A channel chosen by 1-based index or by the name stored in the file. */
export type ChannelRef = number | string;

/** A boundary channel's own x/EL search window, [start, end]. */
export interface ChannelWindow {
  readonly channel: ChannelRef;
  readonly rangeEl: readonly [number, number];
}

/** Which edge of the embryo the edge band follows, seen with anterior left and dorsal up: one side, both pooled, or
 *  'each' = both pooled for the main profile and, besides, each side measured on its own with their paired difference. */
export type EdgeSide = 'dorsal' | 'ventral' | 'both' | 'each';

/** How the profile is sampled. */
export interface ProfileSettings {
  /** 'edge' = band just inside the outline (the nuclear layer); 'axis' = strip centred on the AP axis. */
  readonly mode: 'edge' | 'axis';
  readonly edgeSide: EdgeSide;
  /** Which side of the A→P line is dorsal: 'left' means left of the direction anterior→posterior in image coordinates. */
  readonly dorsalSide: 'left' | 'right';
  /** Depth of the edge band inward from the outline, µm. */
  readonly edgeDepthUm: number;
  /** Full width of the axis strip, µm. */
  readonly axisWidthUm: number;
  /** Number of bins from x/EL 0 to 1. */
  readonly binCount: number;
}

/** Background subtraction. */
export interface BackgroundSettings {
  /** 'outside' = robust estimate from pixels outside the embryo; 'region' = mean of a given rectangle; 'none'. */
  readonly mode: 'outside' | 'region' | 'none';
  /** Rectangle in pixels (x, y = top-left, 0-based) when mode is 'region'. */
  readonly regionPx: { readonly x: number; readonly y: number; readonly width: number; readonly height: number } | null;
}

/** Every setting of one analysis. */
export interface AnalysisSettings {
  readonly gradientChannel: ChannelRef;
  readonly boundaryChannels: readonly ChannelRef[];
  /** Fallback pixel size when the file has none, µm per pixel. */
  readonly pixelSizeUm: number | null;
  readonly projection: ProjectionMethod;
  /** 0-based slice for projection 'slice'; null = pick automatically (see README). */
  readonly sliceIndex: number | null;
  readonly profile: ProfileSettings;
  readonly background: BackgroundSettings;
  /** Flat-field image (path; relative paths from the current folder on the command line, from the project's folder in
   *  the window): one plane per channel, normalised to mean 1, dividing every plane. null = none. */
  readonly flatFieldFile: string | null;
  /** Background image (path, as flatFieldFile): one plane per channel subtracted from every plane. null = none. */
  readonly backgroundImageFile: string | null;
  /** x/EL range of the exponential fit, [start, end]. */
  readonly fitRangeEl: readonly [number, number];
  /** 'auto' = anterior is the high end of the gradient channel; 'high'/'low' force it. */
  readonly anterior: 'auto' | 'high' | 'low';
  readonly boundaryMethods: readonly BoundaryMethod[];
  /** Threshold for the 'threshold' boundary method, as a fraction of the profile's range (0..1). */
  readonly boundaryThresholdFraction: number;
  /** x/EL range searched for boundaries, [start, end]: keeps pole artefacts and other domains out. */
  readonly boundarySearchEl: readonly [number, number];
  /** Boundary search windows of single channels, each overriding boundarySearchEl for its channel. */
  readonly boundaryWindows: readonly ChannelWindow[];
  /** Time point to analyse (0-based). */
  readonly timeIndex: number;
}

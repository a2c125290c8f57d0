// Default analysis settings (each choice is explained in the README's methods section).
import type { AnalysisSettings } from './types';

/** The defaults used when neither a config file nor a flag sets a value. */
export const DEFAULT_SETTINGS: AnalysisSettings = Object.freeze({
  gradientChannel: 1,
  boundaryChannels: [],
  pixelSizeUm: null,
  projection: 'mean',
  sliceIndex: null,
  profile: Object.freeze({ mode: 'edge', edgeSide: 'both', dorsalSide: 'left', edgeDepthUm: 20, axisWidthUm: 20, binCount: 100 }),
  background: Object.freeze({ mode: 'outside', regionPx: null }),
  flatFieldFile: null,
  backgroundImageFile: null,
  fitRangeEl: [0.1, 0.6] as const,
  anterior: 'auto',
  boundaryMethods: ['logistic', 'half-max'],
  boundaryThresholdFraction: 0.5,
  boundarySearchEl: [0, 1] as const,
  boundaryWindows: [],
  timeIndex: 0,
}) as AnalysisSettings;

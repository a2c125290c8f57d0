// Public surface of core/profile: prepare once per detection, then measure along any axis (fast, for live use).
export { prepareSampling } from './prepare';
export type { PreparedSampling, PixelSet } from './prepare';
export { measureEmbryo, sideFilter, filledBins, fitProfile, binWeights, polesOutsideWarnings, poleSlackPx } from './measure';
export type { Measurement } from './measure';
export { binIndices, binProfile } from './bin';
export type { SideFilter } from './bin';
export { estimateBackgrounds, outsideBackground, regionMean } from './background';
export { sampleBandOutline } from './band-outline';
export { checkSamplingSettings } from './check-settings';

// Public surface of core/profile: a sampler per profile mode (samplers/), prepared once per detection; then per axis
// the sampler's profiles and the fit (fast, for live use).
export { prepareSampling, samplingBase, samplingWithin } from './prepare';
export {
  PROFILE_SAMPLERS, samplerFor, EDGE_BAND, AXIS_STRIP, edgeSideFilter, edgeDepthPx, stripHalfWidthPx, rowsWhere, straightViewHalfWidthPx,
} from './samplers';
export type { PreparedSampling, PixelSet, ProfileSampler, SampledRegion, SamplingBase, MaskBox, SideBins } from './samplers';
export {
  measureEmbryo, sampleProfiles, fitSampledProfiles, filledBins, binsWithin, fitProfile, binWeights, polesOutsideWarnings, poleSlackPx, boundaryWindowOf,
} from './measure';
export type { Measurement, SampledProfiles } from './measure';
export { measureSides } from './sides';
export type { SideProfiles } from './sides';
export { binIndices, binProfile } from './bin';
export type { SideFilter } from './bin';
export { estimateBackgrounds, outsideBackground, regionMean } from './background';
export { sampleBandOutline } from './band-outline';
export { checkSamplingSettings } from './check-settings';

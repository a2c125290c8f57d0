// Public surface of core/image: projection, smoothing, thresholds, components, morphology, distances, sampling.
// Coordinate convention: x = column, y = row, 0-based, pixel centres at integers; images are row-major.
export { createProjector } from './projector';
export type { Projector } from './projector';
export { projectStack, chooseSliceScore, readAhead } from './project-stack';
export { toFloatPlane } from './plane-convert';
export { reusedPlaneArrays } from './plane-arrays';
export type { PlaneArrays } from './plane-arrays';
export { gaussianKernel, gaussianSmooth } from './gaussian';
export { fastGaussianSmooth, boxWidthsForSigma } from './box-blur';
export { otsuThreshold, otsuBin } from './threshold';
export { labelComponents, largestComponent } from './components';
export { fillHoles } from './fill-holes';
export { squaredDistanceToFeatures, distanceInside, distanceOutside, foregroundBox } from './distance';
export { dilate, erode, open, close, squareDilate, squareErode } from './morphology';
export { maxFilter } from './max-filter';
export { sampleBilinear } from './bilinear';
export { estimateBackgroundLevel, sortedSample, sortedQuantile } from './background-level';
export type { BackgroundLevel } from './background-level';
export { segmentEmbryo, combinedSnr, channelSnr, checkSegmentOptions, downsample2, binMean, upsampleMask } from './segment';
export type { SegmentOptions } from './segment';
export { resolveChannel, describeChannelRef } from './channel-ref';
export { selectKth, medianInPlace, maskedMedian } from './select';
export { SAMPLE_COUNTS, sampleMedian, wholeNumberMedian } from './median-whole';
export { maskRuns } from './runs';
export type { MaskRuns } from './runs';
export { applyImageCorrections, backgroundImage, correctionMismatch, normaliseFlatField } from './corrections';
export type { CorrectionImage, ImageCorrections } from './corrections';

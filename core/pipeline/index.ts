// Public surface of core/pipeline: the app, the workers and the command line import analysis only from here.
export { analyseStack } from './analyse';
export type { AnalyseOptions } from './analyse';
export { projectStack, createProjector, applyImageCorrections, backgroundImage, correctionMismatch, normaliseFlatField } from '../image';
export type { Projector, CorrectionImage, ImageCorrections } from '../image';
export { detectEmbryo, straightenPlane, projectPointOntoAxis, pointOnAxis, axisLengthPx } from '../geometry';
export type { AxisPosition, EmbryoDetection } from '../geometry';
export { prepareSampling, measureEmbryo, sampleProfiles, fitSampledProfiles, sampleBandOutline, straightViewHalfWidthPx, samplerFor, PROFILE_SAMPLERS } from '../profile';
export type { Measurement, PreparedSampling, ProfileSampler, SampledProfiles } from '../profile';
export { analyseMovie, projectOverTime, axisSampleTimes } from './movie';
export type { MovieOptions, MovieAnalysis } from './movie';

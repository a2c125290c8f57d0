// Public surface of core/timelapse: gradients over time — the synthesis–diffusion–degradation model solved
// numerically, local accumulation time τ(x) from a movie with its uncertainty, the τ(x) model fit, and λ(t).
export { solveSdd, sddSteadyState, sddLambdaUm, defaultSddGrid, sddValueAt } from './sdd-solver';
export type { SddModel, SddGrid, SddSolution } from './sdd-solver';
export {
  localAccumulationTime, accumulationOfSeries, frameNoiseSd, trapezoidWeights, accumulationTruncationBias, lateRiseOf,
} from './accumulation';
export type { AccumulationOptions, AccumulationResult } from './accumulation';
export { sddAccumulationTimeS, fitAccumulationModel } from './accumulation-model';
export type { AccumulationModelFit, AccumulationModelOptions, Estimate, SteadyLambda } from './accumulation-model';
export { fitLambdaSeries, shapeFormedAtS } from './lambda-series';
export type { LambdaAtTime, TimePointProfile } from './lambda-series';
export { coarsenProfiles } from './coarsen';
export type { CoarseProfiles } from './coarsen';
export { summarizeMovie } from './summary';
export type { MovieSummary, MovieSummaryOptions, MovieAccumulation } from './summary';
export { ACCUMULATION_COLUMNS, MODEL_FIT_COLUMNS, accumulationRows, modelFitRow } from './tables';
export type { Cell } from './tables';
export { parseTimeSelection, selectTimeIndices } from './time-selection';
export type { TimeSelection } from './time-selection';

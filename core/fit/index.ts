// Public surface of core/fit: nonlinear least squares, the exponential gradient fit and boundary finders.
export { FitError } from './fit-error';
export type { FitErrorCode } from './fit-error';
export { fitNonlinear } from './levenberg-marquardt';
export type { NonlinearFit } from './levenberg-marquardt';
export type { NonlinearOptions } from './nonlinear-options';
export type { JacobianFunction, ModelFunction } from './problem';
export { fitExponentialDecay, fitExponentialDecayWeighted } from './exponential';
export type { ExponentialOptions, WeightedExponentialFit } from './exponential';
export { fitLogisticBoundary } from './logistic-boundary';
export type { LogisticBoundary, LogisticOptions } from './logistic-boundary';
export { halfMaxCrossing, thresholdCrossing } from './crossing';
export type { CrossingOptions, CrossingResult, Threshold } from './crossing';
export { findBoundaries } from './boundary';
export { decayLengthDifference } from './paired-difference';
export type { SideFit } from './paired-difference';

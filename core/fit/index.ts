// Public surface of core/fit: nonlinear least squares, the exponential gradient fit and boundary finders.
export { FitError } from './fit-error';
export type { FitErrorCode } from './fit-error';
export { fitNonlinear } from './levenberg-marquardt';
export type { NonlinearFit } from './levenberg-marquardt';
export type { NonlinearOptions } from './nonlinear-options';
export type { JacobianFunction, ModelFunction } from './problem';
export { fitExponentialDecay } from './exponential';
export type { ExponentialOptions } from './exponential';

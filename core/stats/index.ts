// Public surface of core/stats: descriptive statistics, t intervals, straight-line regression, seeded RNG.
export { mean, sd, sem, median, quantile, mad, robustSigma, MAD_TO_SIGMA } from './descriptive';
export { tQuantile, tConfidenceInterval } from './t-distribution';
export type { MeanInterval } from './t-distribution';
export { linearRegression, weightedLinearRegression } from './regression';
export type { LinearRegression } from './regression';
export { createRng } from './rng';
export type { Rng } from './rng';
export { logGamma } from './log-gamma';
export { tTwoSidedP, fUpperP, holmAdjust } from './p-values';
export { olsHc3, lackOfFitTest, randomInterceptLine, yorkFit } from './line-fits';
export type { SlopeEstimate, LackOfFit, RandomInterceptLine, YorkFit } from './line-fits';
export { notDecayingReasons, notDecayingWarning } from './decay-check';
export { sdConfidenceInterval } from './sd-interval';
export { fiellerInterval } from './fieller';
export type { FiellerInterval } from './fieller';
export { withinGroupFit, covariateAdjustedLine, WithinFitError } from './within';
export type { WithinFit, AdjustedLine } from './within';

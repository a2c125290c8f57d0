// The whole batch as one group (no sample sheet): the same mean profile and statistics as the report's, from
// core/cohort (min–max scaled profiles on the report's x/EL grid, SD across embryos with n − 1).
import { checkCohortOptions, conditionProfile, describeSample, type ConditionProfile, type SampleSummary } from '../../core/cohort';
import type { EmbryoResult } from '../../core/model';

/** Mean ± SD (sample, n − 1) across embryos of min–max-scaled gradient profiles, or null without profiles. */
export function meanScaledProfile(results: readonly EmbryoResult[]): ConditionProfile | null {
  return conditionProfile(results, { name: 'this batch', dosage: null, factor: null }, checkCohortOptions({ normalisation: 'minmax' })).profile;
}

/** λ (x/EL) of every embryo with a fit. */
export function lambdaValuesEl(results: readonly EmbryoResult[]): number[] {
  return results.map((r) => r.gradientFit?.lambdaEl ?? Number.NaN).filter(Number.isFinite);
}

/** n, mean and sample SD (n − 1) of λ (x/EL), as the report's per-condition table. */
export function lambdaSummaryEl(results: readonly EmbryoResult[]): SampleSummary {
  return describeSample(lambdaValuesEl(results));
}

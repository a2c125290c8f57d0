// Summary of one sample: n, mean, SD, SEM and the t-based confidence interval of the mean.
import type { SampleSummary } from '../model';
import { meanOf, sdOf, tQuantileOf } from './stats-local';

/** Summarise values (units unchanged). */
export function describeSample(values: readonly number[], level = 0.95): SampleSummary {
  const n = values.length;
  const mean = meanOf(values);
  const sd = sdOf(values);
  const sem = sd / Math.sqrt(n);
  const t = tQuantileOf(1 - (1 - level) / 2, n - 1);
  return { n, mean, sd, sem, ciLow: mean - t * sem, ciHigh: mean + t * sem };
}

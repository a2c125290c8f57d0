// Summary of one sample: n, mean, median, SD with its chi-square interval, SEM and the t interval of the mean.
import type { SampleSummary } from '../model';
import { median, sdConfidenceInterval } from '../stats';
import { meanOf, sdOf, tQuantileOf } from './stats-local';

/** Summarise values (units unchanged). */
export function describeSample(values: readonly number[], level = 0.95): SampleSummary {
  const n = values.length;
  const mean = meanOf(values);
  const sd = sdOf(values);
  const sem = sd / Math.sqrt(n);
  const t = tQuantileOf(1 - (1 - level) / 2, n - 1);
  const [sdCiLow, sdCiHigh] = sdConfidenceInterval(sd, n, level);
  return { n, mean, sd, sem, ciLow: mean - t * sem, ciHigh: mean + t * sem, sdCiLow, sdCiHigh, median: n > 0 ? median(values) : NaN };
}

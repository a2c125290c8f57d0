// The window's results keyed by (file, time point): a batch's results as a map, and the lookups the panels use.
import { resultKey, resultKeyOf, resultTimeIndex, type EmbryoResult } from '../../core/model';

/** Results by resultKey(file, tIndex); a file with one time point has the one key (file, 0). */
export type ResultIndex = ReadonlyMap<string, EmbryoResult>;

/** The empty index (no batch yet). */
export const NO_RESULTS: ResultIndex = new Map();

/** Index a batch's results by (file, time point); when a key comes twice, the later result wins. */
export function indexResults(results: readonly EmbryoResult[]): ResultIndex {
  const index = new Map<string, EmbryoResult>();
  for (const r of results) index.set(resultKeyOf(r), r);
  return index;
}

/** The result of `file` at time point `tIndex`, or undefined when the batch has none there. */
export function resultAt(index: ResultIndex, file: string, tIndex = 0): EmbryoResult | undefined {
  return index.get(resultKey(file, tIndex));
}

/** The time points of `file` that have a result, ascending (empty when the file has none). */
export function timePointsOf(index: ResultIndex, file: string): number[] {
  const out: number[] = [];
  for (const r of index.values()) if (r.file === file) out.push(resultTimeIndex(r));
  return out.sort((a, b) => a - b);
}

/**
 * The result that stands for the whole file (its state in the file list): the one at the shown time point when there
 * is one, else the file's earliest time point (a movie whose batch analysed from a later time point on).
 */
export function fileResult(index: ResultIndex, file: string, shownTimeIndex = 0): EmbryoResult | undefined {
  const exact = resultAt(index, file, shownTimeIndex);
  if (exact !== undefined) return exact;
  const times = timePointsOf(index, file);
  return times.length === 0 ? undefined : resultAt(index, file, times[0]);
}

// The key of a result: (file, time point). A file with one time point has the single key (file, 0).
import type { EmbryoResult } from './index';

/** A result's key: the file (path relative to the input folder) and the 0-based time point. */
export interface ResultKey {
  readonly file: string;
  readonly tIndex: number;
}

/** The time point of a result (0 when it does not say: a file with one time point, or a result from before keys). */
export function resultTimeIndex(r: Pick<EmbryoResult, 'tIndex'>): number {
  return r.tIndex ?? 0;
}

/** One string per (file, time point), for maps and React keys; NUL cannot occur in a path, so keys never collide. */
export function resultKey(file: string, tIndex = 0): string {
  return `${file}\u0000${tIndex}`;
}

/** resultKey of a result. */
export function resultKeyOf(r: Pick<EmbryoResult, 'file' | 'tIndex'>): string {
  return resultKey(r.file, resultTimeIndex(r));
}

/** The (file, time point) back from resultKey's text; null for text resultKey did not make. */
export function parseResultKey(key: string): ResultKey | null {
  const cut = key.lastIndexOf('\u0000');
  if (cut < 0) return null;
  const t = Number(key.slice(cut + 1));
  return Number.isInteger(t) && t >= 0 ? { file: key.slice(0, cut), tIndex: t } : null;
}

/** The result marked with its time point and time in seconds (null when unknown); other fields unchanged. */
export function withTimePoint(r: EmbryoResult, tIndex: number, tS: number | null): EmbryoResult {
  const { file, tIndex: _t, tS: _s, ...rest } = r;
  return { file, tIndex, tS: tS !== null && Number.isFinite(tS) ? tS : null, ...rest };
}

/**
 * One result per file, for the tables and statistics that count embryos (embryos.csv, landmarks.csv, the cohort):
 * a file's result with the highest time point — for a movie analysed over time its last analysed time point (the
 * gradient nearest steady state; with --time K, time point K), for any other file its only result. Files keep the
 * order of their first result.
 */
export function embryoResults(results: readonly EmbryoResult[]): EmbryoResult[] {
  const chosen = new Map<string, EmbryoResult>();
  for (const r of results) {
    const before = chosen.get(r.file);
    if (before === undefined || resultTimeIndex(r) > resultTimeIndex(before)) chosen.set(r.file, r);
  }
  return [...chosen.values()];
}

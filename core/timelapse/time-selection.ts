// The time points a batch analyses: `all`, one index K, or a range A:B (0-based, both ends included).

/** A parsed --time value. */
export type TimeSelection =
  | { readonly kind: 'all' }
  | { readonly kind: 'one'; readonly index: number }
  | { readonly kind: 'range'; readonly first: number; readonly last: number };

/** Parses "all", "K" or "A:B" (0-based, A ≤ B); throws RangeError with a one-line message naming the flag. */
export function parseTimeSelection(text: string, flag = '--time'): TimeSelection {
  const t = text.trim();
  if (t === 'all') return { kind: 'all' };
  if (/^\d+$/.test(t)) return { kind: 'one', index: Number(t) };
  const m = /^(\d+):(\d+)$/.exec(t);
  if (m && Number(m[1]) <= Number(m[2])) return { kind: 'range', first: Number(m[1]), last: Number(m[2]) };
  throw new RangeError(`${flag} must be all, a time point K or a range A:B (0-based, A ≤ B), got "${text}"`);
}

/** The time indices of a movie with sizeT time points that a selection picks; an error message when it picks none. */
export function selectTimeIndices(selection: TimeSelection, sizeT: number): number[] | string {
  const { first, last } = selection.kind === 'all' ? { first: 0, last: sizeT - 1 }
    : selection.kind === 'one' ? { first: selection.index, last: selection.index } : selection;
  if (first >= sizeT) return `time point ${first} is outside the movie (T = ${sizeT}, time points 0 to ${sizeT - 1})`;
  return Array.from({ length: Math.min(last, sizeT - 1) - first + 1 }, (_, i) => first + i);
}

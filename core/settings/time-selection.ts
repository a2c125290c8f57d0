// The time points a movie's analysis covers: `all`, one index K, or a range A:B (0-based, both ends included), and
// the time step for files that give no times. One reading and one wording for the --time and --time-step flags,
// the project file's per-file values and the window's fields.

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

/** The text of a selection as --time takes it ("all", "K", "A:B"). */
export function timeSelectionText(s: TimeSelection): string {
  return s.kind === 'all' ? 'all' : s.kind === 'one' ? String(s.index) : `${s.first}:${s.last}`;
}

/**
 * The time indices a selection analyses in a movie with sizeT time points (0-based, ascending): a range is cut at the
 * movie's last time point, a single time point past the end is the last one, and a range that starts past the end
 * picks none (empty). The batch applies one --time to movies of unequal length, each over what it has.
 */
export function selectTimeIndices(selection: TimeSelection, sizeT: number): number[] {
  if (!(sizeT >= 1)) return [];
  if (selection.kind === 'one') return [Math.min(selection.index, sizeT - 1)];
  const { first, last } = selection.kind === 'all' ? { first: 0, last: sizeT - 1 } : selection;
  const end = Math.min(last, sizeT - 1);
  return first > end ? [] : Array.from({ length: end - first + 1 }, (_, i) => first + i);
}

/** The time points of a movie a selection analyses, and a one-line warning when the movie is too short for it. */
export interface MovieTimePoints {
  /** The analysed time points (0-based, ascending; empty when the selection lies wholly past the movie's end). */
  readonly tIndices: readonly number[];
  /** Names the file, what was asked and what was analysed; null when the movie has every asked time point. */
  readonly warning: string | null;
}

/** "time point 3" or "time points 2 to 5" for ascending indices (at least one). */
function pointsText(t: readonly number[]): string {
  return t.length === 1 ? `time point ${t[0]} was analysed` : `time points ${t[0]} to ${t[t.length - 1]} were analysed`;
}

/**
 * The time points of `file` (a movie with sizeT time points) that `selection` analyses, as selectTimeIndices picks
 * them, with a warning naming the file, the asked and the analysed time points when the movie ends before the
 * selection does. `askedBy` says where the selection came from (the flag, or the file's own value in the project).
 */
export function timePointsForMovie(selection: TimeSelection, sizeT: number, file: string, askedBy = '--time'): MovieTimePoints {
  const tIndices = selectTimeIndices(selection, sizeT);
  const lastAsked = selection.kind === 'one' ? selection.index : selection.kind === 'range' ? selection.last : -1;
  if (lastAsked < sizeT || !(sizeT >= 1)) return { tIndices, warning: null };
  const asked = selection.kind === 'one' ? `time point ${selection.index}` : `time points ${timeSelectionText(selection)}`;
  const has = sizeT === 1 ? 'has one time point' : `has ${sizeT} time points (0 to ${sizeT - 1})`;
  const done = tIndices.length === 0 ? 'no time point was analysed over time' : pointsText(tIndices);
  return { tIndices, warning: `${file}: ${asked} asked for (${askedBy}, 0-based), but the movie ${has}; ${done}` };
}

/** Checks a time step in seconds (a positive finite number); throws RangeError with a one-line message naming the flag. */
export function checkTimeStepS(value: unknown, flag = '--time-step'): number {
  if (typeof value === 'number' && Number.isFinite(value) && value > 0) return value;
  throw new RangeError(`${flag} must be a positive number of seconds (got "${String(value)}")`);
}

/** Reads a time step in seconds from text ("30", "2.5"); throws RangeError with the message of checkTimeStepS. */
export function parseTimeStepS(text: string, flag = '--time-step'): number {
  const v = text.trim() === '' ? NaN : Number(text);
  if (!(Number.isFinite(v) && v > 0)) throw new RangeError(`${flag} must be a positive number of seconds (got "${text}")`);
  return v;
}

/** The time point a single-time-point analysis uses in a file with `sizeT` time points when `askedIndex` (the shared
 *  --time-index) is asked for: the asked one when the file has it, else the file's last (its only one for a single
 *  stack), with a one-line warning naming the file, the asked and the used time point (null when the asked one is used). */
export function timePointForFile(askedIndex: number, sizeT: number, file: string): { readonly tIndex: number; readonly warning: string | null } {
  if (!(sizeT >= 1) || askedIndex < sizeT) return { tIndex: askedIndex, warning: null };
  const tIndex = sizeT - 1;
  const has = sizeT === 1 ? 'has one time point' : `has ${sizeT} time points (0 to ${tIndex})`;
  return { tIndex, warning: `${file}: time point ${askedIndex} asked for (--time-index, 0-based), but the file ${has}; time point ${tIndex} was analysed` };
}

// The hand edits in force at one time point of a file: the file's, with that time point's own edits over them.
import type { FileEdits } from './project-types';

/** The edits of `edits` in force at time point `tIndex` (0-based): a field the time point sets replaces the file's;
 *  tIndex null gives the file's own. The result has no timePoints; null stays null (no edits). */
export function fileEditsAt(edits: FileEdits | null | undefined, tIndex: number | null): FileEdits | null {
  if (!edits) return null;
  const { timePoints, ...own } = edits;
  const at = tIndex === null ? undefined : timePoints?.[String(tIndex)];
  if (at === undefined) return own;
  return {
    ...own,
    ...(at.axis !== undefined ? { axis: at.axis } : {}),
    ...(at.landmarks !== undefined ? { landmarks: at.landmarks } : {}),
    ...(at.fitRangeEl !== undefined ? { fitRangeEl: at.fitRangeEl } : {}),
  };
}

// What the file list says about each file: new (not analysed yet), analysed (the last batch analysed it with the
// hand edits it has now), edited (hand edits changed since that batch), or error (with the reason).
import type { FileEdits, FolderEntry } from '../../core/contract';
import type { ApAxis, EmbryoResult, ImagePoint } from '../../core/model';

/** A file's state in the list. */
export type FileState = 'new' | 'analysed' | 'edited' | 'error';

/** The state, the text label shown beside the colour, and why (for the tooltip and the file's panel). */
export interface FileStatus {
  readonly state: FileState;
  readonly label: string;
  readonly reason: string;
}

/** Coordinates of hand edits and results are the same numbers written through JSON; allow rounding in the last digits. */
const samePoint = (a: ImagePoint, b: ImagePoint): boolean => Math.abs(a.x - b.x) < 1e-6 && Math.abs(a.y - b.y) < 1e-6;

function sameAxis(hand: ApAxis | null, used: ApAxis | null): boolean {
  if (hand === null) return used === null || used.source === 'auto';
  return used !== null && used.source === 'hand' && samePoint(hand.anterior, used.anterior) && samePoint(hand.posterior, used.posterior);
}

/** True when a batch result was made with these hand edits (axis, landmarks and the file's own fit range). */
export function editsMatchResult(edits: FileEdits | undefined, r: EmbryoResult): boolean {
  const e = edits ?? { axis: null, landmarks: [], fitRangeEl: null };
  if (!sameAxis(e.axis, r.axis)) return false;
  if (e.landmarks.length !== r.landmarks.length) return false;
  if (e.landmarks.some((l, i) => l.name !== r.landmarks[i].name || !samePoint(l.point, r.landmarks[i].point))) return false;
  const used = r.gradientFit?.fitRangeEl;
  if (e.fitRangeEl !== null && used !== undefined && (Math.abs(e.fitRangeEl[0] - used[0]) > 1e-9 || Math.abs(e.fitRangeEl[1] - used[1]) > 1e-9)) return false;
  return true;
}

/** The status of one file from its listing, its hand edits, its last batch result and a load error seen this session. */
export function fileStatus(entry: FolderEntry, edits: FileEdits | undefined, result: EmbryoResult | undefined, loadError: string | null): FileStatus {
  if (entry.status === 'error') return { state: 'error', label: 'error', reason: entry.message ?? 'cannot be read' };
  if (loadError !== null) return { state: 'error', label: 'error', reason: loadError };
  if (result?.status === 'error') return { state: 'error', label: 'error', reason: `last batch: ${result.error ?? 'failed'}` };
  if (result === undefined) return { state: 'new', label: 'new', reason: 'not analysed by a batch yet' };
  if (!editsMatchResult(edits, result)) return { state: 'edited', label: 'edited', reason: 'hand edits changed after the last batch; run it again to update the tables' };
  const warned = result.warnings.length > 0 ? ` (${result.warnings.length} warning${result.warnings.length === 1 ? '' : 's'})` : '';
  return { state: 'analysed', label: 'analysed', reason: `analysed by the last batch${warned}` };
}

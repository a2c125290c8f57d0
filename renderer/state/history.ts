// Scoped undo history: each entry restores the project settings, the comparison options or ONE file's hand edits,
// so undo and redo on the shown file never silently change a file that is not shown. Settings and comparison options
// apply to every file (they are visible whichever file is shown), so their entries are reachable from any file.
import type { DocState, HistoryEntry } from './types';

/** Whether an entry may be undone/redone while `current` is shown: settings and comparison options always, file edits
 *  only for that file. */
export function entryApplies(entry: HistoryEntry, current: string | null): boolean {
  return entry.kind !== 'file' || entry.key === current;
}

/** The entry that would put back what `doc` holds now in the same scope as `entry` (used to build the reverse step). */
export function snapshotLike(doc: DocState, entry: HistoryEntry): HistoryEntry {
  if (entry.kind === 'settings') return { kind: 'settings', settings: doc.settings };
  if (entry.kind === 'cohort') return { kind: 'cohort', cohort: doc.cohort };
  return { kind: 'file', key: entry.key, edits: doc.files[entry.key] };
}

/** `doc` with the entry's value put back (only the entry's scope changes). */
export function restoreEntry(doc: DocState, entry: HistoryEntry): DocState {
  if (entry.kind === 'settings') return { ...doc, settings: entry.settings };
  if (entry.kind === 'cohort') {
    const { cohort: _now, ...rest } = doc;
    return entry.cohort === undefined ? rest : { ...rest, cohort: entry.cohort };
  }
  const files = { ...doc.files };
  if (entry.edits === undefined) delete files[entry.key];
  else files[entry.key] = entry.edits;
  return { ...doc, files };
}

/** Entries that undo the change from `before` to `after`: one for the settings, one for the comparison options, one
 *  per changed file. */
export function entriesForChange(before: DocState, after: DocState): HistoryEntry[] {
  const out: HistoryEntry[] = [];
  if (before.settings !== after.settings) out.push({ kind: 'settings', settings: before.settings });
  if (before.cohort !== after.cohort) out.push({ kind: 'cohort', cohort: before.cohort });
  const keys = new Set([...Object.keys(before.files), ...Object.keys(after.files)]);
  for (const key of keys) {
    if (before.files[key] !== after.files[key]) out.push({ kind: 'file', key, edits: before.files[key] });
  }
  return out;
}

/** Whether two entries act on the same thing (the settings, the comparison options, or the same file). */
export function sameScope(a: HistoryEntry, b: HistoryEntry): boolean {
  return a.kind === 'file' ? b.kind === 'file' && a.key === b.key : a.kind === b.kind;
}

// Scoped undo history: each entry restores either the project settings or ONE file's hand edits, so undo and
// redo on the shown file never silently change a file that is not shown. Settings apply to every file (they
// are visible whichever file is shown), so their entries are reachable from any file.
import type { DocState, HistoryEntry } from './types';

/** Whether an entry may be undone/redone while `current` is shown: settings always, file edits only for that file. */
export function entryApplies(entry: HistoryEntry, current: string | null): boolean {
  return entry.kind === 'settings' || entry.key === current;
}

/** The entry that would put back what `doc` holds now in the same scope as `entry` (used to build the reverse step). */
export function snapshotLike(doc: DocState, entry: HistoryEntry): HistoryEntry {
  if (entry.kind === 'settings') return { kind: 'settings', settings: doc.settings };
  return { kind: 'file', key: entry.key, edits: doc.files[entry.key] };
}

/** `doc` with the entry's value put back (only the entry's scope changes). */
export function restoreEntry(doc: DocState, entry: HistoryEntry): DocState {
  if (entry.kind === 'settings') return { ...doc, settings: entry.settings };
  const files = { ...doc.files };
  if (entry.edits === undefined) delete files[entry.key];
  else files[entry.key] = entry.edits;
  return { ...doc, files };
}

/** Entries that undo the change from `before` to `after`: one for the settings, one per changed file. */
export function entriesForChange(before: DocState, after: DocState): HistoryEntry[] {
  const out: HistoryEntry[] = [];
  if (before.settings !== after.settings) out.push({ kind: 'settings', settings: before.settings });
  const keys = new Set([...Object.keys(before.files), ...Object.keys(after.files)]);
  for (const key of keys) {
    if (before.files[key] !== after.files[key]) out.push({ kind: 'file', key, edits: before.files[key] });
  }
  return out;
}

/** Whether two entries act on the same thing (the settings, or the same file). */
export function sameScope(a: HistoryEntry, b: HistoryEntry): boolean {
  return a.kind === 'settings' ? b.kind === 'settings' : b.kind === 'file' && a.key === b.key;
}

// The open folder and project: opening the demo, a folder or a project file, and which file is shown.
import { useState } from 'react';
import type { Dispatch } from 'react';
import type { EgglineApi, FolderEntry, ProjectDoc } from '../../core/contract';
import type { EditorAction } from '../state';

/** Folder, its files and where the project is saved. */
export interface Session {
  readonly folder: string | null;
  readonly entries: readonly FolderEntry[];
  readonly projectPath: string | null;
  /** Last error from opening things, one line. */
  readonly message: string | null;
  readonly opening: boolean;
  /** Output folder of the project's last batch (its results reopen with the project). */
  readonly batchOutDir: string | null;
}

type Opened = { folder: string | null; entries: FolderEntry[]; project: ProjectDoc; projectPath: string; warning?: string | null };

/** Session state and the commands that open things. */
export function useSession(api: EgglineApi | null, dispatch: Dispatch<EditorAction>, onOpened: (firstFile: string | null) => void,
  beforeOpen: () => Promise<void> = async () => undefined) {
  const [session, setSession] = useState<Session>({ folder: null, entries: [], projectPath: null, message: null, opening: false, batchOutDir: null });
  const adopt = (o: Opened) => {
    setSession({ folder: o.folder, entries: o.entries, projectPath: o.projectPath, message: o.warning ?? null, opening: false, batchOutDir: o.project.batchOutDir ?? null });
    dispatch({ type: 'openDoc', doc: { settings: o.project.settings, files: o.project.files, ...(o.project.cohort ? { cohort: o.project.cohort } : {}) } });
    onOpened(o.entries[0]?.name ?? null);
  };
  /** Files without a project folder (chosen, dropped or recent): hand edits stay in this window. */
  const adoptLoose = (entries: FolderEntry[], message: string | null) => {
    setSession({ folder: null, entries, projectPath: null, message, opening: false, batchOutDir: null });
    onOpened(entries[0]?.name ?? null);
  };
  const fail = (message: string) => setSession((s) => ({ ...s, message, opening: false }));
  const wrap = async (call: () => Promise<void>) => {
    setSession((s) => ({ ...s, opening: true, message: null }));
    // Save a pending autosave of the open project first, so opening something else never drops the last edit.
    try { await beforeOpen(); await call(); } catch (e) { fail(String(e)); }
  };
  const openDemo = () => wrap(async () => {
    if (api === null) return;
    const r = await api.openDemo();
    if (r.ok) adopt(r.value); else fail(r.error.message);
  });
  const openFolder = () => wrap(async () => {
    if (api === null) return;
    const r = await api.chooseFolder();
    if (!r.ok) fail(r.error.message); else if (r.value !== null) adopt(r.value); else setSession((s) => ({ ...s, opening: false }));
  });
  const openProject = () => wrap(async () => {
    if (api === null) return;
    const r = await api.openProject();
    if (!r.ok) fail(r.error.message);
    else if (r.value !== null) adopt({ ...r.value, folder: r.value.project.folder });
    else setSession((s) => ({ ...s, opening: false }));
  });
  const openFiles = () => wrap(async () => {
    if (api === null) return;
    const r = await api.chooseFiles();
    if (!r.ok) { fail(r.error.message); return; }
    if (r.value === null) { setSession((s) => ({ ...s, opening: false })); return; }
    adoptLoose(r.value, 'Loose files: hand edits are not saved (open their folder to keep them in a project).');
  });
  /** Files or folders dropped on the window: their paths come from the preload; a dropped folder lists its stacks. */
  const openDroppedFiles = (files: readonly File[]) => wrap(async () => {
    if (api === null) return;
    const paths = files.map((f) => api.pathForDroppedFile?.(f) ?? '').filter((p) => p !== '');
    if (paths.length === 0) { fail('Dropped items have no file path (drop files from the file manager).'); return; }
    const r = await api.openDropped(paths);
    if (!r.ok) { fail(r.error.message); return; }
    adoptLoose(r.value, 'Dropped files: hand edits are not saved (open their folder to keep them in a project).');
  });
  /** Reopen a recent folder or files (File ▸ Recent); false when it could not be opened. */
  const openRecent = async (path: string): Promise<boolean> => {
    if (api === null || api.openRecent === undefined) return false;
    const r = await api.openRecent(path);
    if (!r.ok) { fail(r.error.message); return false; }
    if (r.value.kind === 'folder') adopt(r.value);
    else adoptLoose(r.value.entries, null);
    return true;
  };
  /** At start: the most recent folder (so yesterday's work is where it was left), else the demo data. */
  const openAtStart = () => wrap(async () => {
    if (api === null) return;
    const recent = await api.recent();
    const last = recent.ok ? recent.value[0] : undefined;
    if (last !== undefined && (await openRecent(last))) return;
    await openDemo();
  });
  return { session, openDemo, openFolder, openProject, openFiles, openRecent, openAtStart, openDroppedFiles, setMessage: (m: string | null) => setSession((s) => ({ ...s, message: m })),
    setBatchOutDir: (d: string | null) => setSession((s) => ({ ...s, batchOutDir: d })) };
}

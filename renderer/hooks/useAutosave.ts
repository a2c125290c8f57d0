// Saves the project a moment after every document change (debounced), so no edit is lost.
import { useEffect, useRef, useState } from 'react';
import type { EgglineApi, ProjectDoc } from '../../core/contract';
import { PROJECT_VERSION } from '../../core/settings';
import type { DocState } from '../state';

/** Delay between the last edit and the save, ms. */
export const AUTOSAVE_DELAY_MS = 400;

/** Save status for the status bar. */
export type SaveStatus = { kind: 'idle' } | { kind: 'pending' } | { kind: 'saved'; at: string } | { kind: 'error'; message: string };

/** The project file content for a document. */
export function toProjectDoc(doc: DocState, folder: string | null, batchOutDir: string | null = null): ProjectDoc {
  const base: ProjectDoc = {
    schema: 'eggline-project', version: PROJECT_VERSION, folder, settings: doc.settings, files: doc.files, ...(doc.cohort ? { cohort: doc.cohort } : {}),
  };
  return batchOutDir === null ? base : { ...base, batchOutDir };
}

/** Debounced autosave keyed on the state revision; also returns a function to save at once. */
export function useAutosave(api: EgglineApi | null, projectPath: string | null, folder: string | null, doc: DocState, revision: number,
  batchOutDir: string | null = null): [SaveStatus, () => Promise<void>] {
  const [status, setStatus] = useState<SaveStatus>({ kind: 'idle' });
  const latest = useRef({ doc, folder, projectPath, batchOutDir });
  latest.current = { doc, folder, projectPath, batchOutDir };
  const saveNow = async () => {
    const { doc: d, folder: f, projectPath: p, batchOutDir: o } = latest.current;
    if (api === null || p === null) return;
    const r = await api.saveProject(p, toProjectDoc(d, f, o));
    setStatus(r.ok ? { kind: 'saved', at: r.value.savedAt } : { kind: 'error', message: r.error.message });
  };
  useEffect(() => {
    // Loose files have no project to save into: nothing pending, nothing to show.
    if (projectPath === null) { setStatus({ kind: 'idle' }); return; }
    if (revision === 0) return;
    setStatus({ kind: 'pending' });
    const t = setTimeout(() => { void saveNow(); }, AUTOSAVE_DELAY_MS);
    return () => clearTimeout(t);
    // saveNow reads the latest values through the ref.
  }, [revision, projectPath]);
  return [status, saveNow];
}

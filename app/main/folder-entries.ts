// FolderEntry lists: the files of a folder or a set of loose files, with their status in the project.
import { basename } from 'node:path';
import type { FileEdits, FolderEntry, ProjectDoc } from '../../core/contract';
import { pathForProjectKey } from '../project';
import { listStackFiles } from '../batch/list-stacks';

/** Most files listed; a folder beyond this is surely a mistake (a whole disk) and would stall the window. */
export const MAX_LISTED_FILES = 50_000;

/** True when the user has changed anything for this file. */
export function hasEdits(edits: FileEdits | undefined): boolean {
  return edits !== undefined && (edits.axis !== null || edits.landmarks.length > 0 || edits.fitRangeEl !== null);
}

/** Entries for every stack in `folder`, plus project files that are missing from it (status 'error'). */
export async function folderEntries(folder: string, project: ProjectDoc): Promise<FolderEntry[]> {
  const keys = (await listStackFiles(folder, [], [], MAX_LISTED_FILES)).map((f) => f.file);
  const present = new Set(keys);
  const entries: FolderEntry[] = keys.map((key) => ({
    path: pathForProjectKey(folder, key), name: key,
    status: hasEdits(project.files[key]) ? 'edited' : 'new', message: null,
  }));
  for (const key of Object.keys(project.files)) {
    if (present.has(key) || !hasEdits(project.files[key])) continue;
    entries.push({ path: pathForProjectKey(folder, key), name: key, status: 'error', message: `${key}: in the project but missing from the folder` });
  }
  return entries;
}

/** Entries for loose files (name = file name); `problems` maps a path to the reason it cannot be analysed. */
export function fileEntries(paths: readonly string[], problems: ReadonlyMap<string, string> = new Map()): FolderEntry[] {
  return paths.map((path) => {
    const problem = problems.get(path);
    return { path, name: basename(path), status: problem === undefined ? 'new' : 'error', message: problem ?? null };
  });
}

// Opening things: folders, loose files, drops, projects, the demo and the recent list.
import { promises as fs } from 'node:fs';
import { join } from 'node:path';
import type { FolderEntry, OpenedFolder, OpenedRecent, ProjectDoc } from '../../core/contract';
import { isStackFileName, isStackFolderName } from '../../core/batch';
import { cleanInterruptedSaves, loadProjectOrBackup, newProject, PROJECT_FILE_NAME } from '../project';
import { requirePath } from './args';
import type { ShellContext } from './context';
import { fileEntries, folderEntries } from './folder-entries';
import { allowRecordedOutput } from './batch-results';
import { readRecent } from './recent';
import { ApiFailure, labelOf } from './result';

/** Most paths accepted from one drop. */
export const MAX_DROPPED_PATHS = 10_000;

/** Open a folder the user chose: allow it, load (or start) its project, list its stacks. */
export async function openFolder(ctx: ShellContext, folder: string): Promise<OpenedFolder> {
  const stat = await fs.stat(folder);
  if (!stat.isDirectory()) throw new ApiFailure('bad-argument', `${labelOf(folder)}: is not a folder`);
  const projectPath = join(folder, PROJECT_FILE_NAME);
  const exists = await fs.stat(projectPath).then((s) => s.isFile(), () => false);
  // A damaged project is reported, never replaced: the user's hand work is in it. When its backup loads, that is
  // opened with a warning, and the damaged file is kept aside (the next save replaces it and its .bak).
  const loaded = exists ? await openSafely(projectPath) : { doc: newProject(folder), warning: null };
  const project = { ...loaded.doc, folder };
  ctx.allow.allowTree('read', folder);
  ctx.allow.allowFile('project', projectPath);
  await allowRecordedOutput(ctx, project.batchOutDir);
  const entries = await folderEntries(folder, project);
  await ctx.noteRecent(folder);
  return { folder, entries, project, projectPath, warning: loaded.warning };
}

/** Clean up after interrupted saves, then load the project or, when it is unreadable, its backup (keeping a copy of
 *  the unreadable file as `<name>.unreadable`, since the next save replaces both the file and its .bak). */
async function openSafely(projectPath: string): Promise<{ doc: ProjectDoc; warning: string | null }> {
  await cleanInterruptedSaves(projectPath);
  const loaded = await loadProjectOrBackup(projectPath);
  if (loaded.warning === null) return loaded;
  const aside = `${projectPath}.unreadable`;
  await fs.copyFile(projectPath, aside).catch(() => undefined);
  return { doc: loaded.doc, warning: `${loaded.warning}; the unreadable file is kept as ${labelOf(aside)}` };
}

/** Allow loose stack files (and OME-Zarr folders) and list them; files that are not stacks or not readable come back with status 'error'. */
export async function openFiles(ctx: ShellContext, paths: readonly string[]): Promise<FolderEntry[]> {
  const problems = new Map<string, string>();
  for (const path of paths) {
    const stat = await fs.stat(path).catch(() => null);
    if (stat === null) problems.set(path, `${labelOf(path)}: not found`);
    else if (stat.isDirectory() && isStackFolderName(labelOf(path))) ctx.allow.allowTree('read', path);
    else if (!stat.isFile()) problems.set(path, `${labelOf(path)}: is not a file`);
    else if (!isStackFileName(labelOf(path))) problems.set(path, `${labelOf(path)}: not a stack (.tif, .tiff, .ome.tif, .btf, or an .ome.zarr folder)`);
    else ctx.allow.allowFile('read', path);
  }
  return fileEntries(paths, problems);
}

/** Dropped paths: folders are listed (their stacks allowed), files and OME-Zarr folders opened as loose stacks. */
export async function openDropped(ctx: ShellContext, value: unknown): Promise<FolderEntry[]> {
  if (!Array.isArray(value) || value.length === 0 || value.length > MAX_DROPPED_PATHS) {
    throw new ApiFailure('bad-argument', `paths must be a list of 1 to ${MAX_DROPPED_PATHS} absolute paths`);
  }
  const paths = value.map((p, i) => requirePath(p, `paths[${i}]`));
  const entries: FolderEntry[] = [];
  for (const path of paths) {
    const isDir = await fs.stat(path).then((s) => s.isDirectory(), () => false);
    if (!isDir || isStackFolderName(labelOf(path))) { entries.push(...await openFiles(ctx, [path])); continue; }
    ctx.allow.allowTree('read', path);
    entries.push(...await folderEntries(path, newProject(path)));
  }
  return entries;
}

/** Open a project file: allow it and its folder, list the folder (or the project's own files when it has none). */
export async function openProjectFile(
  ctx: ShellContext, projectPath: string,
): Promise<{ project: ProjectDoc; projectPath: string; entries: FolderEntry[]; warning: string | null }> {
  const { doc: project, warning } = await openSafely(projectPath);
  ctx.allow.allowFile('project', projectPath);
  if (project.folder === null) {
    return { project, projectPath, entries: await openFiles(ctx, Object.keys(project.files)), warning };
  }
  const isDir = await fs.stat(project.folder).then((s) => s.isDirectory(), () => false);
  if (!isDir) throw new ApiFailure('not-found', `${labelOf(projectPath)}: its image folder ${project.folder} is missing`);
  ctx.allow.allowTree('read', project.folder);
  await allowRecordedOutput(ctx, project.batchOutDir);
  await ctx.noteRecent(project.folder);
  return { project, projectPath, entries: await folderEntries(project.folder, project), warning };
}

/** Reopen a path from the recent list; any other path is refused. */
export async function openRecent(ctx: ShellContext, value: unknown): Promise<OpenedRecent> {
  const path = requirePath(value, 'path');
  if (!(await readRecent(ctx.deps.dataDir)).includes(path)) {
    throw new ApiFailure('not-allowed', `${labelOf(path)}: not in the recent list`);
  }
  const isDir = await fs.stat(path).then((s) => s.isDirectory());
  if (isDir) return { kind: 'folder', ...await openFolder(ctx, path) };
  const entries = await openFiles(ctx, [path]);
  await ctx.noteRecent(path);
  return { kind: 'files', entries };
}

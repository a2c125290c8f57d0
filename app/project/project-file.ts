// Reading and writing project files. On disk the folder is stored relative to the project file, and file keys
// relative to the folder, so a project moved together with its images still opens.
import { promises as fs } from 'node:fs';
import { basename, dirname, isAbsolute, join, relative, resolve, sep } from 'node:path';
import { checkProjectDoc, parseProjectText, ProjectFormatError, type ProjectDoc } from '../../core/settings';
import { writeFileAtomic } from './atomic-write';

/** Largest project file we read, bytes; a larger file is surely not ours and would stall the app. */
export const MAX_PROJECT_BYTES = 64 * 1024 * 1024;

/** Turn a path into the forward-slash form stored in project files. */
export function toPortablePath(p: string): string {
  return sep === '\\' ? p.split('\\').join('/') : p;
}

/** The key a file has in ProjectDoc.files: its path relative to the folder (forward slashes), or absolute when outside. */
export function projectKeyFor(folder: string | null, filePath: string): string {
  if (folder === null) return toPortablePath(resolve(filePath));
  const rel = relative(folder, filePath);
  const outside = rel === '' || rel.startsWith('..') || isAbsolute(rel);
  return toPortablePath(outside ? resolve(filePath) : rel);
}

/** The absolute path of a ProjectDoc.files key. */
export function pathForProjectKey(folder: string | null, key: string): string {
  return isAbsolute(key) || folder === null ? resolve(key) : resolve(folder, key);
}

/** Load, parse and validate a project file; folder comes back absolute. Throws ProjectFormatError or a node error. */
export async function loadProject(projectPath: string): Promise<ProjectDoc> {
  const name = basename(projectPath);
  const stat = await fs.stat(projectPath);
  if (!stat.isFile()) throw new ProjectFormatError(`${name}: is not a file`);
  if (stat.size > MAX_PROJECT_BYTES) throw new ProjectFormatError(`${name}: too large for a project file (${stat.size} bytes)`);
  const doc = parseProjectText(await fs.readFile(projectPath, 'utf8'), name);
  const base = dirname(resolve(projectPath));
  const folder = doc.folder === null ? null : resolve(base, doc.folder);
  // The folder grants reading every file under it in the window: only the project's own folder may be named.
  if (folder !== null && folder !== base) {
    throw new ProjectFormatError(`${name}: its folder must be the folder the project file is in (".") but is ${JSON.stringify(doc.folder)}`);
  }
  return doc.batchOutDir === null || doc.batchOutDir === undefined ? { ...doc, folder } : { ...doc, folder, batchOutDir: resolve(base, doc.batchOutDir) };
}

/** A folder as stored in the project file: relative to the project file's folder (absolute on another drive). */
function relativeToProject(projectPath: string, dir: string | null): string | null {
  if (dir === null) return null;
  const rel = toPortablePath(relative(dirname(resolve(projectPath)), resolve(dir)) || '.');
  return isAbsolute(rel) ? resolve(dir) : rel;
}

/** Temporary files an interrupted save of `name` leaves beside it (the atomic writer's `.<name>.<pid>.<hex>.tmp`,
 *  and the same for its `.bak`). */
function interruptedSaveName(file: string, name: string): number | null {
  const m = /^\.(.+)\.(\d+)\.[0-9a-f]{8}\.tmp$/.exec(file);
  return m && (m[1] === name || m[1] === `${name}.bak`) ? Number(m[2]) : null;
}

/** True when process `pid` is running (on this machine). */
function isRunning(pid: number): boolean {
  try { process.kill(pid, 0); return true; } catch (e) { return (e as NodeJS.ErrnoException).code === 'EPERM'; }
}

/** Remove the temporary files that saves of `projectPath` interrupted by a crash or kill left in its folder (those of
 *  a process still running are its saves in progress, and are left alone). Returns the names removed. */
export async function cleanInterruptedSaves(projectPath: string): Promise<string[]> {
  const dir = dirname(resolve(projectPath));
  const name = basename(projectPath);
  const removed: string[] = [];
  for (const file of await fs.readdir(dir).catch(() => [] as string[])) {
    const pid = interruptedSaveName(file, name);
    if (pid === null || pid === process.pid || isRunning(pid)) continue;
    await fs.rm(join(dir, file), { force: true }).then(() => removed.push(file), () => undefined);
  }
  return removed;
}

/** A loaded project, and a warning when it came from the backup because the project file itself was unreadable. */
export interface LoadedProject {
  readonly doc: ProjectDoc;
  readonly path: string;
  readonly warning: string | null;
}

/** Load a project; when the file is unreadable (damaged JSON, invalid content) and `<path>.bak` loads, use the backup
 *  and say so in `warning`. When both fail, throws the project file's own error. */
export async function loadProjectOrBackup(projectPath: string): Promise<LoadedProject> {
  try {
    return { doc: await loadProject(projectPath), path: projectPath, warning: null };
  } catch (e) {
    if (!(e instanceof ProjectFormatError)) throw e;
    const backup = await loadBackup(`${projectPath}.bak`, projectPath);
    if (backup === null) throw e;
    const why = e.message.startsWith(`${basename(projectPath)}: `) ? e.message.slice(basename(projectPath).length + 2) : e.message;
    return { doc: backup, path: projectPath, warning: `${basename(projectPath)} is unreadable (${why}); opened its backup ${basename(projectPath)}.bak instead, so the latest edits may be missing` };
  }
}

/** The backup as a project of the main file's folder, or null when it is missing or unreadable too. */
async function loadBackup(bakPath: string, projectPath: string): Promise<ProjectDoc | null> {
  const doc = await loadProject(bakPath).catch(() => null);
  return doc === null ? null : { ...doc, folder: doc.folder === null ? null : dirname(resolve(projectPath)) };
}

/** The JSON text stored for a document: folder relative to the project file, file keys relative to the folder. */
export function serializeProject(projectPath: string, doc: ProjectDoc): string {
  const checked = checkProjectDoc(doc);
  const folderAbs = checked.folder === null ? null : resolve(checked.folder);
  const files: Record<string, unknown> = {};
  for (const [key, edits] of Object.entries(checked.files)) {
    files[projectKeyFor(folderAbs, pathForProjectKey(folderAbs, key))] = edits;
  }
  const folderRel = folderAbs === null ? null : toPortablePath(relative(dirname(resolve(projectPath)), folderAbs) || '.');
  const folder = folderRel !== null && isAbsolute(folderRel) ? folderAbs : folderRel;
  return `${JSON.stringify({ ...checked, folder, files, batchOutDir: relativeToProject(projectPath, checked.batchOutDir ?? null) ?? undefined }, null, 2)}\n`;
}

/** Validate and save a project atomically, keeping the previous version as `<path>.bak`. */
export async function saveProject(projectPath: string, doc: ProjectDoc): Promise<void> {
  await writeFileAtomic(projectPath, serializeProject(projectPath, doc), { backup: true });
}

// Find the stacks of a folder: every TIFF-family file and OME-Zarr folder in it and its subfolders, in a stable order.
// The one walker: the batch and the window's file list both use it, so they always list the same files.
import { promises as fs, type Dirent } from 'node:fs';
import { specialFileKind } from '../../core/io';
import { join, relative, resolve, sep } from 'node:path';
import { isStackFileName, isStackFolderName, sortStackPaths } from '../../core/batch';

/** A stack found in the input folder. */
export interface StackFile {
  readonly path: string;
  /** Relative to the folder, forward slashes. */
  readonly file: string;
}

/** True when `child` is `parent` or inside it (both resolved). */
export function isInside(parent: string, child: string): boolean {
  const rel = relative(resolve(parent), resolve(child));
  return rel === '' || (!rel.startsWith('..') && !rel.startsWith(sep) && !/^[a-zA-Z]:/.test(rel));
}

/** A stack-named entry that is not a plain file: a symlink to a file is taken (with a warning when it leads out of
 *  the input folder); FIFOs, devices, sockets and broken links are skipped with a warning. */
async function acceptOther(e: Dirent, full: string, rel: string, realRoot: string, warnings: string[]): Promise<boolean> {
  const target = await fs.stat(full).catch(() => null);
  if (target === null) {
    warnings.push(`${rel}: skipped, a symbolic link to nothing (${e.isSymbolicLink() ? await fs.readlink(full).catch(() => '?') : 'cannot be read'})`);
    return false;
  }
  const kind = specialFileKind(target);
  if (kind !== null) { warnings.push(`${rel}: skipped, is ${kind}, not a file`); return false; }
  if (!target.isFile()) return false;
  if (e.isSymbolicLink()) {
    const real = await fs.realpath(full).catch(() => full);
    if (!isInside(realRoot, real)) warnings.push(`${rel}: a symbolic link to ${real}, outside the input folder (analysed)`);
  }
  return true;
}

/** Every stack file and *.zarr folder (an OME-Zarr store, never walked into) under `folder` (hidden entries and the
 *  `skipDirs` skipped; symlinked folders not followed, as they can loop), sorted; at most `maxFiles` (a folder beyond
 *  a cap is surely a mistake, such as a whole disk).
 *  A subfolder that cannot be read, and a stack-named FIFO, device, socket or broken link, is skipped with a line in
 *  `warnings`; a symlinked file that leads out of the folder is listed with a line there; an unreadable top folder rejects. */
export async function listStackFiles(
  folder: string, skipDirs: readonly string[] = [], warnings: string[] = [], maxFiles = Number.POSITIVE_INFINITY,
): Promise<StackFile[]> {
  const root = resolve(folder);
  const found: string[] = [];
  const walk = async (dir: string): Promise<void> => {
    const entries = await fs.readdir(dir, { withFileTypes: true }).catch((e: NodeJS.ErrnoException) => {
      if (dir === root) throw e;
      warnings.push(`${relative(root, dir).split(sep).join('/')}: subfolder skipped, cannot be read (${e.code ?? e.message})`);
      return [];
    });
    for (const e of entries) {
      if (e.name.startsWith('.') || found.length >= maxFiles) continue;
      const full = join(dir, e.name);
      if (e.isDirectory()) {
        // An OME-Zarr store is one stack: listed, never walked into.
        if (isStackFolderName(e.name)) found.push(relative(root, full).split(sep).join('/'));
        else if (!skipDirs.some((s) => isInside(s, full))) await walk(full);
      } else if (isStackFileName(e.name)) {
        const rel = relative(root, full).split(sep).join('/');
        if (e.isFile()) found.push(rel);
        else if (await acceptOther(e, full, rel, realRoot, warnings)) found.push(rel);
      }
    }
  };
  const realRoot = await fs.realpath(root).catch(() => root);
  await walk(root);
  return sortStackPaths(found).map((file) => ({ file, path: join(root, ...file.split('/')) }));
}

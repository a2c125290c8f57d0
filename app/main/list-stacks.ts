// Stack files of a folder, found the same way the batch finds them (same names, same order).
import { promises as fs } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { isStackFileName, isStackFolderName, sortStackPaths } from '../../core/batch';

/** Most files listed; a folder beyond this is surely a mistake (a whole disk) and would stall the window. */
export const MAX_LISTED_FILES = 50_000;

/** Paths of every stack file and *.zarr folder under `folder` relative to it (forward slashes, sorted); hidden entries skipped. */
export async function listFolderStacks(folder: string): Promise<string[]> {
  const found: string[] = [];
  const walk = async (dir: string): Promise<void> => {
    for (const e of await fs.readdir(dir, { withFileTypes: true })) {
      if (e.name.startsWith('.') || found.length >= MAX_LISTED_FILES) continue;
      const full = join(dir, e.name);
      // Symlinked folders are not followed: they can loop.
      // An OME-Zarr store (*.zarr folder) is one stack, never walked into.
      if (e.isDirectory() && isStackFolderName(e.name)) found.push(relative(folder, full).split(sep).join('/'));
      else if (e.isDirectory()) await walk(full);
      else if ((e.isFile() || e.isSymbolicLink()) && isStackFileName(e.name)) found.push(relative(folder, full).split(sep).join('/'));
    }
  };
  await walk(folder);
  return sortStackPaths(found);
}

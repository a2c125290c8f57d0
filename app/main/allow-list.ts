// Which paths the renderer may name. A path is usable only when the user handed it to us: through a dialog, a drop,
// a project file or the demo folder. A compromised page can then read or write nothing else.
import { isAbsolute, relative, resolve } from 'node:path';

/** What a path may be used for. */
export type PathUse = 'read' | 'output' | 'project' | 'results';

/** A set of allowed files and folder trees per use. */
export interface PathAllowList {
  /** Allow one file. */
  allowFile(use: PathUse, path: string): void;
  /** Allow a folder and everything below it. */
  allowTree(use: PathUse, folder: string): void;
  /** True when `path` (absolute) is an allowed file or inside an allowed tree for `use`. */
  isAllowed(use: PathUse, path: string): boolean;
}

/** Normalise for comparison: resolved, and case-folded where the file system usually ignores case. */
function normalise(path: string): string {
  const p = resolve(path);
  return process.platform === 'win32' || process.platform === 'darwin' ? p.toLowerCase() : p;
}

/** True when `child` is `parent` or below it. */
export function isInsideFolder(parent: string, child: string): boolean {
  const rel = relative(normalise(parent), normalise(child));
  return rel === '' || (!rel.startsWith('..') && !isAbsolute(rel));
}

/** A new, empty allow-list. */
export function createPathAllowList(): PathAllowList {
  const files = { read: new Set<string>(), output: new Set<string>(), project: new Set<string>(), results: new Set<string>() };
  const trees = { read: [] as string[], output: [] as string[], project: [] as string[], results: [] as string[] };
  return {
    allowFile: (use, path) => { files[use].add(normalise(path)); },
    allowTree: (use, folder) => { if (!trees[use].includes(normalise(folder))) trees[use].push(normalise(folder)); },
    isAllowed: (use, path) => isAbsolute(path) && !path.includes('\0')
      && (files[use].has(normalise(path)) || trees[use].some((t) => isInsideFolder(t, path))),
  };
}

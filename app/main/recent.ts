// The recent list: folders and files the user opened, newest first, kept in <dataDir>/recent.json.
import { promises as fs } from 'node:fs';
import { join, resolve } from 'node:path';
import { writeFileAtomic } from '../project';

/** How many recent paths are kept. */
export const MAX_RECENT = 10;

/** Where the list lives. */
export function recentFilePath(dataDir: string): string {
  return join(dataDir, 'recent.json');
}

/** The stored list; a missing or damaged file gives an empty list (the list is a convenience, never a blocker). */
export async function readRecent(dataDir: string): Promise<string[]> {
  try {
    const raw: unknown = JSON.parse(await fs.readFile(recentFilePath(dataDir), 'utf8'));
    const paths = (raw as { paths?: unknown } | null)?.paths;
    if (!Array.isArray(paths)) return [];
    return paths.filter((p): p is string => typeof p === 'string' && p !== '').slice(0, MAX_RECENT);
  } catch {
    return [];
  }
}

/** Put `path` first (once), keep at most MAX_RECENT, save, and return the new list. */
export async function addRecent(dataDir: string, path: string): Promise<string[]> {
  const p = resolve(path);
  const list = [p, ...(await readRecent(dataDir)).filter((q) => q !== p)].slice(0, MAX_RECENT);
  await fs.mkdir(dataDir, { recursive: true });
  await writeFileAtomic(recentFilePath(dataDir), `${JSON.stringify({ schema: 'eggline-recent', version: 1, paths: list }, null, 2)}\n`);
  return list;
}

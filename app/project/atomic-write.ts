// Crash-safe file replacement: a reader sees either the old file or the new one, never half of one.
import { promises as fs } from 'node:fs';
import { dirname, basename, join } from 'node:path';
import { randomBytes } from 'node:crypto';

/** Options for writeFileAtomic. */
export interface AtomicWriteOptions {
  /** Copy the file being replaced to `<path>.bak` first (kept when the new write fails). */
  readonly backup?: boolean;
}

/** Flush a directory entry to disk; not possible on Windows, where rename is already durable enough. */
async function syncDirectory(dir: string): Promise<void> {
  if (process.platform === 'win32') return;
  const handle = await fs.open(dir, 'r').catch(() => null);
  if (handle === null) return;
  try { await handle.sync(); } catch { /* some file systems refuse fsync on directories */ } finally { await handle.close(); }
}

/** Write `data` to `path` via a temp file in the same folder: write, fsync, (backup), rename. */
export async function writeFileAtomic(path: string, data: string | Uint8Array, options: AtomicWriteOptions = {}): Promise<void> {
  // Same folder so the rename never crosses file systems (a cross-device rename is a copy, not atomic).
  const tmp = join(dirname(path), `.${basename(path)}.${process.pid}.${randomBytes(4).toString('hex')}.tmp`);
  const handle = await fs.open(tmp, 'wx', 0o644);
  try {
    await handle.writeFile(data);
    await handle.sync();
  } catch (e) {
    await handle.close().catch(() => undefined);
    await fs.rm(tmp, { force: true });
    throw e;
  }
  await handle.close();
  try {
    if (options.backup === true) await backupExisting(path);
    await fs.rename(tmp, path);
  } catch (e) {
    await fs.rm(tmp, { force: true });
    throw e;
  }
  await syncDirectory(dirname(path));
}

/** Flush a file's contents to disk. */
async function syncFile(path: string): Promise<void> {
  const handle = await fs.open(path, 'r+');
  try { await handle.sync(); } finally { await handle.close(); }
}

/** Copy the current file (if any) to `<path>.bak`, itself atomically (copy, fsync, rename) so a crash never leaves a
 *  torn or empty backup. */
async function backupExisting(path: string): Promise<void> {
  const bak = `${path}.bak`;
  const tmpBak = join(dirname(path), `.${basename(bak)}.${process.pid}.${randomBytes(4).toString('hex')}.tmp`);
  try {
    await fs.copyFile(path, tmpBak);
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code === 'ENOENT') return;
    throw e;
  }
  try {
    await syncFile(tmpBak);
    await fs.rename(tmpBak, bak);
  } catch (e) {
    await fs.rm(tmpBak, { force: true });
    throw e;
  }
}

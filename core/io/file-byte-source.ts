// A ByteSource over a file on disk using positional reads (a large stack is never read whole).
import type { FileHandle } from 'node:fs/promises';
import { openRegularFile } from './open-regular';
import { TiffError, type ByteSource } from '../tiff';

/** A ByteSource that owns an open file handle. */
export type FileByteSource = ByteSource & { close(): Promise<void> };

/** Short reason for a file-system error ("no such file", "permission denied"…). */
function describeFsError(err: unknown): string {
  const code = (err as { code?: string }).code;
  if (code === 'ENOENT') return 'no such file';
  if (code === 'EACCES' || code === 'EPERM') return 'permission denied';
  if (code === 'EISDIR') return 'is a folder, not a file';
  if (code === 'ESPECIAL') return (err as Error).message;
  return err instanceof Error ? err.message : String(err);
}

/** Opens `path` for reading by ranges; throws TiffError('io') with the label when it cannot be opened. */
export async function openFileByteSource(path: string, fileLabel: string = path): Promise<FileByteSource> {
  let handle: FileHandle | undefined;
  try {
    const opened = await openRegularFile(path);
    handle = opened.handle;
    const stats = opened.stats;
    if (stats.isDirectory()) throw Object.assign(new Error('is a folder'), { code: 'EISDIR' });
    return fileSource(handle, stats.size);
  } catch (err) {
    await handle?.close().catch(() => undefined);
    throw new TiffError('io', fileLabel, `cannot open file (${describeFsError(err)})`);
  }
}

/** Wraps an open handle: reads loop until the range is filled or the file ends. */
function fileSource(handle: FileHandle, size: number): FileByteSource {
  let closed = false;
  return {
    size,
    async read(offset: number, length: number): Promise<Uint8Array> {
      const start = Math.min(Math.max(0, offset), size);
      const want = Math.max(0, Math.min(length, size - start));
      const out = new Uint8Array(want);
      let filled = 0;
      while (filled < want) {
        const { bytesRead } = await handle.read(out, filled, want - filled, start + filled);
        if (bytesRead === 0) break; // the file shrank while open
        filled += bytesRead;
      }
      return filled === want ? out : out.subarray(0, filled);
    },
    async readInto(offset: number, target: Uint8Array): Promise<number> {
      const start = Math.min(Math.max(0, offset), size);
      const want = Math.max(0, Math.min(target.length, size - start));
      let filled = 0;
      while (filled < want) {
        const { bytesRead } = await handle.read(target, filled, want - filled, start + filled);
        if (bytesRead === 0) break;
        filled += bytesRead;
      }
      return filled;
    },
    async close(): Promise<void> {
      if (closed) return;
      closed = true;
      await handle.close();
    },
  };
}

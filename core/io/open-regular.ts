// Open a file for reading only when it is a regular file. Opening a FIFO (named pipe) for reading waits for a writer,
// possibly forever, and a device can be endless; so the open never blocks (O_NONBLOCK, which does nothing to regular
// files), and anything but a regular file or a folder is closed again and refused by kind.
import { constants, type Stats } from 'node:fs';
import { open, type FileHandle } from 'node:fs/promises';

/** What kind of special file `stats` describes ("a FIFO (named pipe)", "a device", "a socket"), or null for a regular
 *  file or a folder. */
export function specialFileKind(stats: Stats): string | null {
  if (stats.isFIFO()) return 'a FIFO (named pipe)';
  if (stats.isCharacterDevice() || stats.isBlockDevice()) return 'a device';
  if (stats.isSocket()) return 'a socket';
  return null;
}

/** Opens `path` read-only; rejects with code 'ESPECIAL' and the message "is a FIFO (named pipe), not a file" (etc.)
 *  for special files. Folders are returned open, as before, for the caller to refuse. */
export async function openRegularFile(path: string): Promise<{ handle: FileHandle; stats: Stats }> {
  const handle = await open(path, constants.O_RDONLY | (constants.O_NONBLOCK ?? 0));
  try {
    const stats = await handle.stat();
    const kind = specialFileKind(stats);
    if (kind !== null) throw Object.assign(new Error(`is ${kind}, not a file`), { code: 'ESPECIAL' });
    return { handle, stats };
  } catch (err) {
    await handle.close().catch(() => undefined);
    throw err;
  }
}

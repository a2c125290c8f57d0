// A read-only Zarr store over a folder on disk (one file per key), for the OME-Zarr reader in core/zarr.
import { stat } from 'node:fs/promises';
import { join, sep } from 'node:path';
import { ZarrError, type ZarrStore } from '../zarr';
import { openRegularFile } from './open-regular';

/** Largest single file (chunk or metadata) read from a store; a bigger one is damaged or not a chunk. */
const MAX_FILE_BYTES = 2 ** 31 - 1;

/** The path of `key` under `root`, or null when the key would leave the folder. */
function keyPath(root: string, key: string): string | null {
  const parts = key.split('/').filter((p) => p !== '');
  if (parts.some((p) => p === '..' || p === '.' || p.includes(sep))) return null;
  return join(root, ...parts);
}

/** True for errors that mean "no value at this key" (missing file, or a folder where a file would be). */
function isMissing(err: unknown): boolean {
  const code = (err as { code?: string }).code;
  return code === 'ENOENT' || code === 'ENOTDIR' || code === 'EISDIR';
}

/** Reads a whole file in one read, refusing one larger than MAX_FILE_BYTES before reading it. */
async function readWhole(path: string, key: string): Promise<Uint8Array | undefined> {
  let handle;
  try {
    const opened = await openRegularFile(path);
    handle = opened.handle;
    const stats = opened.stats;
    if (stats.isDirectory()) return undefined;
    if (stats.size > MAX_FILE_BYTES) throw new Error(`${key.slice(1)} is ${stats.size} bytes, larger than any chunk Eggline reads`);
    // One read of the size fstat gave (readFile would stat again and read in pieces); loop only if it comes short.
    const out = new Uint8Array(stats.size);
    let filled = 0;
    while (filled < out.length) {
      const { bytesRead } = await handle.read(out, filled, out.length - filled, filled);
      if (bytesRead === 0) break;
      filled += bytesRead;
    }
    return filled === out.length ? out : out.subarray(0, filled);
  } catch (err) {
    if (isMissing(err)) return undefined;
    throw err;
  } finally {
    await handle?.close().catch(() => undefined);
  }
}

/** Reads `length` bytes at `offset` (or the last `suffixLength` bytes) of a file. */
async function readRange(path: string, range: { offset: number; length: number } | { suffixLength: number }): Promise<Uint8Array | undefined> {
  let handle;
  try {
    const opened = await openRegularFile(path);
    handle = opened.handle;
    const size = opened.stats.size;
    const [offset, length] = 'suffixLength' in range ? [Math.max(0, size - range.suffixLength), Math.min(range.suffixLength, size)] : [range.offset, range.length];
    const out = new Uint8Array(Math.max(0, Math.min(length, size - offset)));
    const { bytesRead } = await handle.read(out, 0, out.length, offset);
    return out.subarray(0, bytesRead);
  } catch (err) {
    if (isMissing(err)) return undefined;
    throw err;
  } finally {
    await handle?.close().catch(() => undefined);
  }
}

/** True when `path` is a folder (an OME-Zarr store is one). */
export async function isFolder(path: string): Promise<boolean> {
  return (await stat(path).catch(() => null))?.isDirectory() ?? false;
}

/** Options of openZarrFolderStore. */
export interface ZarrFolderStoreOptions {
  /** Reads and decodes a Blosc chunk file elsewhere (a thread; see readBloscChunkFile); the store then offers readBloscChunk. */
  readonly readBloscFile?: (path: string, maxBytes: number) => Promise<Uint8Array | undefined | null>;
}

/** A ZarrStore over the folder `root`; throws ZarrError('io') naming the store when it is not a readable folder. */
export async function openZarrFolderStore(root: string, label: string = root, options: ZarrFolderStoreOptions = {}): Promise<ZarrStore> {
  const info = await stat(root).catch((err: NodeJS.ErrnoException) => {
    throw new ZarrError('io', label, `cannot open (${err.code === 'ENOENT' ? 'no such folder' : err.code === 'EACCES' ? 'permission denied' : err.message})`);
  });
  if (!info.isDirectory()) throw new ZarrError('not-zarr', label, 'is a file, but an OME-Zarr store is a folder');
  return {
    async get(key) {
      const path = keyPath(root, key);
      return path === null ? undefined : readWhole(path, key);
    },
    async getRange(key, range) {
      const path = keyPath(root, key);
      return path === null ? undefined : readRange(path, range);
    },
    ...(options.readBloscFile ? {
      readBloscChunk: async (key: string, maxBytes: number) => {
        const path = keyPath(root, key);
        return path === null ? undefined : options.readBloscFile!(path, maxBytes);
      },
    } : {}),
  };
}

// One Blosc chunk file read and decoded synchronously: what the chunk thread (app/workers/zarr-chunk-worker.ts) does
// per request, off the analysis thread.
import { closeSync, constants, fstatSync, openSync, readSync } from 'node:fs';
import { declaredBloscBytes, decodeBloscLz4 } from '../zarr';

/** Largest chunk file read (as for the folder store). */
const MAX_FILE_BYTES = 2 ** 31 - 1;

/**
 * Reads the file at `path` and decodes it as a Blosc-LZ4 stream of at most `maxBytes`: the bytes, undefined when
 * there is no such file, null when the stream is Blosc with another inner compressor (or bit shuffle). Throws a
 * one-line Error for a special file, an oversized file or a damaged stream.
 */
export function readBloscChunkFile(path: string, maxBytes: number): Uint8Array | undefined | null {
  let fd: number;
  try {
    // Never blocks on a FIFO (O_NONBLOCK does nothing to regular files); anything but a regular file is refused below.
    fd = openSync(path, constants.O_RDONLY | (constants.O_NONBLOCK ?? 0));
  } catch (err) {
    const code = (err as { code?: string }).code;
    if (code === 'ENOENT' || code === 'ENOTDIR') return undefined;
    throw err;
  }
  try {
    const stats = fstatSync(fd);
    if (stats.isDirectory()) return undefined;
    if (!stats.isFile()) throw new Error('is not a regular file');
    if (stats.size > MAX_FILE_BYTES) throw new Error(`is ${stats.size} bytes, larger than any chunk Eggline reads`);
    const bytes = new Uint8Array(stats.size);
    let filled = 0;
    while (filled < bytes.length) {
      const n = readSync(fd, bytes, filled, bytes.length - filled, filled);
      if (n === 0) break;
      filled += n;
    }
    const stream = bytes.subarray(0, filled);
    const declared = declaredBloscBytes(stream);
    if (declared !== null && declared > maxBytes) throw new Error(`Blosc stream declares ${declared} bytes, more than the chunk's ${maxBytes}`);
    return decodeBloscLz4(stream);
  } finally {
    closeSync(fd);
  }
}

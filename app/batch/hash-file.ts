// SHA-256 of a stack, streamed so a multi-GB stack is never held in memory; an OME-Zarr folder is hashed file by file.
import { createHash, type Hash } from 'node:crypto';
import { createReadStream, promises as fs } from 'node:fs';
import { join } from 'node:path';

/** Streams one file into `hash`; resolves with its size in bytes. */
function hashInto(hash: Hash, path: string): Promise<number> {
  return new Promise((resolvePromise, reject) => {
    let bytes = 0;
    const stream = createReadStream(path, { highWaterMark: 1 << 20 });
    stream.on('data', (chunk) => { bytes += chunk.length; hash.update(chunk); });
    stream.on('error', reject);
    stream.on('end', () => resolvePromise(bytes));
  });
}

/** Relative paths (forward slashes) of every file under `root`, sorted by code unit; symlinks are not followed. */
async function filesUnder(root: string, rel = ''): Promise<string[]> {
  const out: string[] = [];
  for (const e of await fs.readdir(join(root, rel), { withFileTypes: true })) {
    const path = rel === '' ? e.name : `${rel}/${e.name}`;
    if (e.isDirectory()) out.push(...await filesUnder(root, path));
    else if (e.isFile()) out.push(path);
  }
  return out.sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
}

/**
 * Hex SHA-256 and size in bytes of a file, or of a folder (an OME-Zarr store): there the hash covers each file's
 * relative path, size and bytes in sorted path order, so a changed, added or removed chunk changes it.
 * Rejects with the node error when it cannot be read.
 */
export async function sha256File(path: string): Promise<{ sha256: string; bytes: number }> {
  const hash = createHash('sha256');
  if (!(await fs.stat(path)).isDirectory()) return { bytes: await hashInto(hash, path), sha256: hash.digest('hex') };
  let bytes = 0;
  for (const rel of await filesUnder(path)) {
    const size = (await fs.stat(join(path, ...rel.split('/')))).size;
    hash.update(`${rel}\0${size}\0`);
    bytes += await hashInto(hash, join(path, ...rel.split('/')));
  }
  return { sha256: hash.digest('hex'), bytes };
}

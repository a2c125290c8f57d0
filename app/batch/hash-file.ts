// SHA-256 of a file, streamed so a multi-GB stack is never held in memory.
import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';

/** Hex SHA-256 and size in bytes of a file; rejects with the node error when it cannot be read. */
export function sha256File(path: string): Promise<{ sha256: string; bytes: number }> {
  return new Promise((resolvePromise, reject) => {
    const hash = createHash('sha256');
    let bytes = 0;
    const stream = createReadStream(path, { highWaterMark: 1 << 20 });
    stream.on('data', (chunk) => { bytes += chunk.length; hash.update(chunk); });
    stream.on('error', reject);
    stream.on('end', () => resolvePromise({ sha256: hash.digest('hex'), bytes }));
  });
}

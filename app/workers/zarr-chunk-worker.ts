// Chunk thread: reads and decodes Blosc-LZ4 OME-Zarr chunk files while the analysis thread works on the previous
// plane (as libvips decodes TIFF planes on its own threads). One request at a time, in order; the decoded bytes are
// transferred, not copied.
import { parentPort } from 'node:worker_threads';
// Imported from its own file, not core/io's index: that brings geotiff, which fails on import in a worker thread.
import { readBloscChunkFile } from '../../core/io/blosc-chunk-file';
import type { ChunkReply, ChunkRequest } from '../decode/zarr-chunk-thread';

const port = parentPort;
if (!port) throw new Error('zarr-chunk-worker must run as a worker thread');
port.on('message', (req: ChunkRequest) => {
  let reply: ChunkReply;
  try {
    const bytes = readBloscChunkFile(req.path, req.maxBytes);
    if (bytes === undefined || bytes === null) reply = { id: req.id, kind: bytes === undefined ? 'missing' : 'other' };
    else {
      // A decoded chunk owns its whole buffer unless the stream was stored uncompressed in a larger file.
      const own = bytes.byteOffset === 0 && bytes.byteLength === bytes.buffer.byteLength ? bytes : bytes.slice();
      reply = { id: req.id, kind: 'bytes', buffer: own.buffer as ArrayBuffer };
    }
  } catch (err) {
    reply = { id: req.id, kind: 'error', message: (err instanceof Error ? err.message : String(err)).split(/\r?\n/)[0] };
  }
  port.postMessage(reply, reply.kind === 'bytes' ? [reply.buffer] : []);
});

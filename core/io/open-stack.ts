// Open a stack file: tags with the core reader, pixels on the direct path (geotiff where it does not reach).
import type { PlaneSource, StackInfo } from '../model';
import { createDirectPlaneSource, createGeotiffPlaneSource, directPathRefusal, readStackInfo, readStackInfoWithChain, type ChunkCodecs, type StackInfoOptions } from '../tiff';
import { openFileByteSource } from './file-byte-source';
import { NODE_CHUNK_CODECS } from './node-codecs';

/** Options for openStackFile. */
export interface OpenStackOptions extends StackInfoOptions {
  /** 'direct' (default): the direct path where it reaches, else geotiff; 'geotiff': always geotiff (the reference). */
  readonly decoder?: 'direct' | 'geotiff';
  /** Decoders for the direct path; default the pure ones plus node:zlib's Deflate. */
  readonly codecs?: ChunkCodecs;
}

/** Reads the StackInfo of `path` and returns a PlaneSource over it; close the source when done. */
export async function openStackFile(path: string, fileLabel: string, options: OpenStackOptions = {}): Promise<{ info: StackInfo; source: PlaneSource }> {
  const bytes = await openFileByteSource(path, fileLabel);
  try {
    const { info, chain } = await readStackInfoWithChain(bytes, fileLabel, options);
    const codecs = options.codecs ?? NODE_CHUNK_CODECS;
    const direct = options.decoder !== 'geotiff' && directPathRefusal(info, codecs) === null;
    return { info, source: direct ? createDirectPlaneSource(bytes, info, codecs, fileLabel, chain) : createGeotiffPlaneSource(bytes, info, fileLabel) };
  } catch (err) {
    await bytes.close();
    throw err;
  }
}

/** Reads only the StackInfo of `path` (the file is closed before returning). */
export async function readStackInfoFromFile(path: string, fileLabel: string, options: StackInfoOptions = {}): Promise<StackInfo> {
  const bytes = await openFileByteSource(path, fileLabel);
  try {
    return await readStackInfo(bytes, fileLabel, options);
  } finally {
    await bytes.close();
  }
}

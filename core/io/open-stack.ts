// Open a stack file: tags with the core reader, pixels with the pure-JS geotiff decoder.
import type { PlaneSource, StackInfo } from '../model';
import { createGeotiffPlaneSource, readStackInfo, type StackInfoOptions } from '../tiff';
import { openFileByteSource } from './file-byte-source';

/** Reads the StackInfo of `path` and returns a geotiff PlaneSource over it; close the source when done. */
export async function openStackFile(path: string, fileLabel: string, options: StackInfoOptions = {}): Promise<{ info: StackInfo; source: PlaneSource }> {
  const bytes = await openFileByteSource(path, fileLabel);
  try {
    const info = await readStackInfo(bytes, fileLabel, options);
    return { info, source: createGeotiffPlaneSource(bytes, info, fileLabel) };
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

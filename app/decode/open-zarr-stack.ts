// Open an OME-Zarr folder for analysis: the folder store from core/io, NGFF metadata and chunk reading from core/zarr.
import { inflateZarrChunk, isFolder, openZarrFolderStore } from '../../core/io';
import { openOmeZarr, type OpenedZarr, type OpenZarrOptions } from '../../core/zarr';
import { sharedBloscChunkThread } from './zarr-chunk-thread';

/** True when `path` is a folder, which the stack openers read as an OME-Zarr store. */
export function isZarrPath(path: string): Promise<boolean> {
  return isFolder(path);
}

/** Opens the OME-Zarr store at `path`; throws ZarrError with a one-line message naming `fileLabel`. */
export async function openZarrStack(path: string, fileLabel: string, options: OpenZarrOptions = {}): Promise<OpenedZarr> {
  // Blosc-LZ4 chunks are read and decoded on the chunk thread while the analysis works on the previous plane.
  const thread = sharedBloscChunkThread();
  const store = await openZarrFolderStore(path, fileLabel, thread ? { readBloscFile: thread } : {});
  return openOmeZarr(store, fileLabel, { inflate: inflateZarrChunk, ...options });
}

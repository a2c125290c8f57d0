// Open an OME-Zarr folder for analysis: the folder store from core/io, NGFF metadata and chunk reading from core/zarr.
import { inflateZarrChunk, isFolder, openZarrFolderStore } from '../../core/io';
import { firstPictureLevel, openOmeZarr, type OpenedZarr, type OpenZarrOptions } from '../../core/zarr';
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

/**
 * For the window's first picture: the store's coarsest resolution level that still fills a view of `viewWidthPx` ×
 * `viewHeightPx`, opened (its `details.arrayPath` names the level), or null when the full resolution is the only one
 * that does (then show the full resolution directly). Analysis always reads level 0 (openZarrStack).
 */
export async function openZarrFirstPicture(path: string, fileLabel: string, viewWidthPx: number, viewHeightPx: number): Promise<OpenedZarr | null> {
  const store = await openZarrFolderStore(path, fileLabel);
  const level = await firstPictureLevel(store, fileLabel, viewWidthPx, viewHeightPx);
  if (level === 0) return null;
  return openOmeZarr(store, fileLabel, { inflate: inflateZarrChunk, level });
}

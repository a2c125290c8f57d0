// Reading the flat-field and background images named by the settings (one plane per channel: the mean over Z of
// the first time point), once per process and path.
import { stat } from 'node:fs/promises';
import { dirname, isAbsolute, resolve } from 'node:path';
import { backgroundImage, normaliseFlatField, projectStack, type ImageCorrections } from '../../core/pipeline';
import { DEFAULT_SETTINGS, type AnalysisSettings } from '../../core/settings';
import type { Plane } from '../../core/model';
import { openStackForAnalysis } from '../decode';
import { sha256File } from './hash-file';
import { hashingByteSource, type HashingByteSource } from './hashing-source';

/** A settings path made absolute: relative paths are taken from `baseDir` (the input folder). */
export function correctionPath(path: string, baseDir: string): string {
  return isAbsolute(path) ? path : resolve(baseDir, path);
}

/** The input folder of a file at `path` whose project key is `file` (the path minus the key, so relative correction
 *  paths are taken from the folder the batch or project names, not the file's own subfolder); else its folder. */
export function inputFolderOf(path: string, file: string): string {
  return path.endsWith(file) ? path.slice(0, path.length - file.length) || '.' : dirname(path);
}

/** An image's planes and the SHA-256 of its file (for run.json). */
interface ReadImage {
  readonly planes: Plane[];
  readonly sha256: string;
}

/**
 * Every channel of an image file as one plane (the mean over Z at the first time point) and the file's SHA-256, from
 * one read: the hash is taken from the bytes the decoder reads, and only the bytes it skipped are read for it before
 * the file is closed. An OME-Zarr folder (read chunk file by chunk file) is hashed as run.json hashes it.
 */
async function readChannelPlanes(path: string, label: string): Promise<ReadImage> {
  let hashing: HashingByteSource | null = null;
  const opened = await openStackForAnalysis(path, label, { wrapSource: (s) => (hashing = hashingByteSource(s)) });
  try {
    const p = await projectStack(opened.info, opened.source, { ...DEFAULT_SETTINGS, projection: 'mean', sliceIndex: null, timeIndex: 0 });
    const h = hashing as HashingByteSource | null;
    const sha256 = h ? (await h.finish()).sha256 : (await sha256File(path)).sha256;
    return { planes: [...p.channels], sha256 };
  } finally {
    await opened.source.close().catch(() => undefined);
  }
}

/** The corrections and the SHA-256 of each image they came from (null for an image the settings do not name). */
interface LoadedCorrections {
  readonly corrections: ImageCorrections;
  readonly flatSha256: string | null;
  readonly backgroundSha256: string | null;
}

const cache = new Map<string, Promise<LoadedCorrections>>();

/** A file's identity for the cache: its path with its size and modification time ('' when it cannot be read: the
 *  read then fails with its own message), so an image replaced under the same name is read again. */
async function fileStamp(path: string | null): Promise<string> {
  if (path === null) return '';
  const s = await stat(path).catch(() => null);
  return `${path}\t${s ? `${s.size}:${s.mtimeMs}` : ''}`;
}

/** The corrections the settings name with their images' digests, read once per process for each image's path, size
 *  and modification time; null when the settings name none. */
function loadCorrections(settings: AnalysisSettings, baseDir: string): Promise<LoadedCorrections> | null {
  const { flatFieldFile: flat, backgroundImageFile: bg } = settings;
  if (flat === null && bg === null) return null;
  const flatPath = flat === null ? null : correctionPath(flat, baseDir);
  const bgPath = bg === null ? null : correctionPath(bg, baseDir);
  return (async () => {
    const key = `${await fileStamp(flatPath)}\n${await fileStamp(bgPath)}`;
    let loaded = cache.get(key);
    if (!loaded) {
      loaded = (async () => {
        const flatImage = flat !== null && flatPath !== null ? await readImage(flatPath, flat, 'flat-field image') : null;
        const bgImage = bg !== null && bgPath !== null ? await readImage(bgPath, bg, 'background image') : null;
        return {
          corrections: {
            flat: flat !== null && flatImage ? normaliseFlatField(flat, flatImage.planes) : null,
            background: bg !== null && bgImage ? backgroundImage(bg, bgImage.planes) : null,
          },
          flatSha256: flatImage?.sha256 ?? null,
          backgroundSha256: bgImage?.sha256 ?? null,
        };
      })();
      loaded.catch(() => undefined);
      cache.set(key, loaded);
    }
    return loaded;
  })();
}

/**
 * The corrections the settings name, read once per process for each image's path, size and modification time (a
 * long-lived process, such as the window's, reads an image again when it is replaced), or null when they name none.
 * Rejects with one line naming the image file when it cannot be read or is not usable.
 */
export function loadImageCorrections(settings: AnalysisSettings, baseDir: string): Promise<ImageCorrections> | null {
  return loadCorrections(settings, baseDir)?.then((l) => l.corrections) ?? null;
}

/** Read an image's planes and digest; failures name the role and file. */
async function readImage(path: string, label: string, role: string): Promise<ReadImage> {
  try {
    return await readChannelPlanes(path, label);
  } catch (e) {
    const text = e instanceof Error ? e.message : String(e);
    throw new Error(text.startsWith(label) ? `${role} ${text}` : `${role} ${label}: ${text}`);
  }
}

/** The file and SHA-256 of each correction image, for run.json (null entries when not used), from the same one read
 *  of each image as loadImageCorrections (no second read when that has read them). Rejects as it does. */
export async function correctionRecord(settings: AnalysisSettings, baseDir: string): Promise<{
  readonly flatField: { readonly file: string; readonly sha256: string } | null;
  readonly backgroundImage: { readonly file: string; readonly sha256: string } | null;
}> {
  const loaded = await loadCorrections(settings, baseDir);
  const entry = (p: string | null, sha256: string | null | undefined): { file: string; sha256: string } | null =>
    p === null || !sha256 ? null : { file: correctionPath(p, baseDir), sha256 };
  return { flatField: entry(settings.flatFieldFile, loaded?.flatSha256), backgroundImage: entry(settings.backgroundImageFile, loaded?.backgroundSha256) };
}

// Reading the flat-field and background images named by the settings (one plane per channel: the mean over Z of
// the first time point), once per process and path.
import { stat } from 'node:fs/promises';
import { dirname, isAbsolute, resolve } from 'node:path';
import { backgroundImage, normaliseFlatField, projectStack, type ImageCorrections } from '../../core/pipeline';
import { DEFAULT_SETTINGS, type AnalysisSettings } from '../../core/settings';
import type { Plane } from '../../core/model';
import { openStackForAnalysis } from '../decode';
import { sha256File } from './hash-file';

/** A settings path made absolute: relative paths are taken from `baseDir` (the input folder). */
export function correctionPath(path: string, baseDir: string): string {
  return isAbsolute(path) ? path : resolve(baseDir, path);
}

/** The input folder of a file at `path` whose project key is `file` (the path minus the key, so relative correction
 *  paths are taken from the folder the batch or project names, not the file's own subfolder); else its folder. */
export function inputFolderOf(path: string, file: string): string {
  return path.endsWith(file) ? path.slice(0, path.length - file.length) || '.' : dirname(path);
}

/** Every channel of an image file as one plane: the mean over Z at the first time point. */
async function readChannelPlanes(path: string, label: string): Promise<Plane[]> {
  const opened = await openStackForAnalysis(path, label);
  try {
    const p = await projectStack(opened.info, opened.source, { ...DEFAULT_SETTINGS, projection: 'mean', sliceIndex: null, timeIndex: 0 });
    return [...p.channels];
  } finally {
    await opened.source.close().catch(() => undefined);
  }
}

const cache = new Map<string, Promise<ImageCorrections>>();

/** A file's identity for the cache: its path with its size and modification time ('' when it cannot be read: the
 *  read then fails with its own message), so an image replaced under the same name is read again. */
async function fileStamp(path: string | null): Promise<string> {
  if (path === null) return '';
  const s = await stat(path).catch(() => null);
  return `${path}\t${s ? `${s.size}:${s.mtimeMs}` : ''}`;
}

/**
 * The corrections the settings name, read once per process for each image's path, size and modification time (a
 * long-lived process, such as the window's, reads an image again when it is replaced), or null when they name none.
 * Rejects with one line naming the image file when it cannot be read or is not usable.
 */
export function loadImageCorrections(settings: AnalysisSettings, baseDir: string): Promise<ImageCorrections> | null {
  const { flatFieldFile: flat, backgroundImageFile: bg } = settings;
  if (flat === null && bg === null) return null;
  const flatPath = flat === null ? null : correctionPath(flat, baseDir);
  const bgPath = bg === null ? null : correctionPath(bg, baseDir);
  return (async () => {
    const key = `${await fileStamp(flatPath)}\n${await fileStamp(bgPath)}`;
    let loaded = cache.get(key);
    if (!loaded) {
      loaded = (async () => ({
        flat: flat !== null && flatPath !== null ? normaliseFlatField(flat, await readImage(flatPath, flat, 'flat-field image')) : null,
        background: bg !== null && bgPath !== null ? backgroundImage(bg, await readImage(bgPath, bg, 'background image')) : null,
      }))();
      loaded.catch(() => undefined);
      cache.set(key, loaded);
    }
    return loaded;
  })();
}

/** Read an image's planes; failures name the role and file. */
async function readImage(path: string, label: string, role: string): Promise<Plane[]> {
  try {
    return await readChannelPlanes(path, label);
  } catch (e) {
    const text = e instanceof Error ? e.message : String(e);
    throw new Error(text.startsWith(label) ? `${role} ${text}` : `${role} ${label}: ${text}`);
  }
}

/** The file and SHA-256 of each correction image, for run.json (null entries when not used). */
export async function correctionRecord(settings: AnalysisSettings, baseDir: string): Promise<{
  readonly flatField: { readonly file: string; readonly sha256: string } | null;
  readonly backgroundImage: { readonly file: string; readonly sha256: string } | null;
}> {
  const one = async (p: string | null): Promise<{ file: string; sha256: string } | null> => {
    if (p === null) return null;
    const file = correctionPath(p, baseDir);
    return { file, sha256: (await sha256File(file)).sha256 };
  };
  return { flatField: await one(settings.flatFieldFile), backgroundImage: await one(settings.backgroundImageFile) };
}

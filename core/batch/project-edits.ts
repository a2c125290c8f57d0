// Hand edits from a project file (axis, landmarks per file), as the batch applies them; the fit range in force for a
// file is core/settings' settingsInForce, and project files are read by core/settings' parseProjectText.
import type { FileEdits, ProjectDoc } from '../contract';
import { fileEditsAt } from '../settings';
import type { HandEdits } from '../model';

/** Default project file name looked for inside an input folder. */
export const PROJECT_FILE_NAME = 'eggline-project.json';

/** Normalise a relative path to forward slashes so project keys match on every platform. */
export function projectKey(relPath: string): string {
  return relPath.replace(/\\/g, '/').replace(/^\.\//, '');
}

/** The edits in force for one file at time point `tIndex` (default 0; the time point's own edits over the file's;
 *  null: the file's own alone): looked up by relative path, then by absolute path; null when none. */
export function editsForFile(doc: ProjectDoc | null, relPath: string, absPath?: string, tIndex: number | null = 0): FileEdits | null {
  return fileEditsAt(storedFileEdits(doc, relPath, absPath), tIndex);
}

/** A file's stored entry in the project, with its edits of single time points (`timePoints`): looked up by relative
 *  path, then by absolute path; undefined when none. */
export function storedFileEdits(doc: ProjectDoc | null, relPath: string, absPath?: string): FileEdits | undefined {
  if (!doc) return undefined;
  const files = doc.files;
  const key = projectKey(relPath);
  return Object.prototype.hasOwnProperty.call(files, key) ? files[key]
    : absPath !== undefined && Object.prototype.hasOwnProperty.call(files, absPath) ? files[absPath] : undefined;
}

/** The pipeline's hand edits from stored file edits (axis marked 'hand'); null when there is nothing to apply. */
export function toHandEdits(edits: FileEdits | null): HandEdits | null {
  if (!edits || (!edits.axis && (edits.landmarks?.length ?? 0) === 0)) return null;
  const axis = edits.axis ? { anterior: edits.axis.anterior, posterior: edits.axis.posterior, source: 'hand' as const } : null;
  return { axis, landmarks: edits.landmarks ?? [] };
}

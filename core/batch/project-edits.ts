// Hand edits from a project file (axis, landmarks, fit range per file), as the batch applies them.
import type { FileEdits, ProjectDoc } from '../contract';
import type { HandEdits } from '../model';
import type { AnalysisSettings } from '../settings';
import { BatchOptionError } from './option-error';

/** Default project file name looked for inside an input folder. */
export const PROJECT_FILE_NAME = 'eggline-project.json';

const isPoint = (p: unknown): boolean =>
  typeof p === 'object' && p !== null && Number.isFinite((p as { x: unknown }).x) && Number.isFinite((p as { y: unknown }).y);

function checkEdits(key: string, e: unknown, label: string): void {
  const at = `${label}: edits for "${key}"`;
  if (typeof e !== 'object' || e === null) throw new BatchOptionError(`${at} must be an object`);
  const { axis, landmarks, fitRangeEl } = e as Partial<FileEdits>;
  if (axis != null && !(isPoint(axis.anterior) && isPoint(axis.posterior))) throw new BatchOptionError(`${at}: axis needs anterior and posterior points {x, y}`);
  if (landmarks != null && !(Array.isArray(landmarks) && landmarks.every((l) => typeof l?.name === 'string' && isPoint(l.point)))) {
    throw new BatchOptionError(`${at}: landmarks must be a list of { name, point: {x, y} }`);
  }
  if (fitRangeEl != null && !(Array.isArray(fitRangeEl) && fitRangeEl.length === 2 && fitRangeEl[0] >= 0 && fitRangeEl[0] < fitRangeEl[1] && fitRangeEl[1] <= 1)) {
    throw new BatchOptionError(`${at}: fitRangeEl must be two numbers [a, b] with 0 ≤ a < b ≤ 1`);
  }
}

/** Parse and check project JSON text; `label` (the file name) starts every error message. */
export function parseProjectDoc(text: string, label: string): ProjectDoc {
  let doc: Partial<ProjectDoc>;
  try {
    doc = JSON.parse(text) as Partial<ProjectDoc>;
  } catch (e) {
    throw new BatchOptionError(`${label}: not valid JSON (${(e as Error).message.split('\n')[0]})`);
  }
  if (typeof doc !== 'object' || doc === null || doc.schema !== 'eggline-project') {
    throw new BatchOptionError(`${label}: not an Eggline project file (schema must be "eggline-project")`);
  }
  if (doc.version !== 1) throw new BatchOptionError(`${label}: unsupported project version ${String(doc.version)} (expected 1)`);
  if (typeof doc.files !== 'object' || doc.files === null) throw new BatchOptionError(`${label}: "files" must be an object`);
  for (const [key, edits] of Object.entries(doc.files)) checkEdits(key, edits, label);
  return doc as ProjectDoc;
}

/** Normalise a relative path to forward slashes so project keys match on every platform. */
export function projectKey(relPath: string): string {
  return relPath.replace(/\\/g, '/').replace(/^\.\//, '');
}

/** The edits stored for one file: looked up by relative path, then by absolute path; null when none. */
export function editsForFile(doc: ProjectDoc | null, relPath: string, absPath?: string): FileEdits | null {
  if (!doc) return null;
  const files = doc.files;
  const key = projectKey(relPath);
  const hit = Object.prototype.hasOwnProperty.call(files, key) ? files[key]
    : absPath !== undefined && Object.prototype.hasOwnProperty.call(files, absPath) ? files[absPath] : undefined;
  return hit ?? null;
}

/** The pipeline's hand edits from stored file edits (axis marked 'hand'); null when there is nothing to apply. */
export function toHandEdits(edits: FileEdits | null): HandEdits | null {
  if (!edits || (!edits.axis && (edits.landmarks?.length ?? 0) === 0)) return null;
  const axis = edits.axis ? { anterior: edits.axis.anterior, posterior: edits.axis.posterior, source: 'hand' as const } : null;
  return { axis, landmarks: edits.landmarks ?? [] };
}

/** Settings for one file: the batch settings with the file's own fit range when the project sets one. */
export function settingsForFile(settings: AnalysisSettings, edits: FileEdits | null): AnalysisSettings {
  return edits?.fitRangeEl ? { ...settings, fitRangeEl: [edits.fitRangeEl[0], edits.fitRangeEl[1]] } : settings;
}

// Validation of a project document (schema 'eggline-project', version 2, or version 1 migrated to 2) from disk or from
// the renderer: the one reader of project files (the command line and the desktop app both load through it).
import type { ApAxis, ImagePoint, Landmark } from '../model';
import { badField, ProjectFormatError } from './project-error';
import { checkFiniteNumber, checkOneOf, isRecord } from './check-values';
import { settingsFromStored } from './check';
import { settingSpec } from './schema';
import { checkProjectCohort } from './project-cohort';
import { SettingsError } from './settings-error';
import { checkTimeStepS, parseTimeSelection, timeSelectionText } from './time-selection';
import type { FileEdits, ProjectDoc, TimePointEdits } from './project-types';
import type { AnalysisSettings } from './types';

/** Check an x/EL range with the fit range's rule from the settings table. */
export function checkRangeEl(value: unknown, where: string): readonly [number, number] {
  const spec = settingSpec('fitRangeEl');
  if (!spec.isValid(value)) badField(where, `must be ${spec.rule}`);
  const [a, b] = value as [number, number];
  return [a, b] as const;
}

/** Validate stored settings through the settings table; fields missing from an older file take the defaults. */
export function checkSettings(value: unknown, where = 'settings'): AnalysisSettings {
  try {
    return settingsFromStored(value, where);
  } catch (e) {
    if (e instanceof SettingsError) throw new ProjectFormatError(e.message);
    throw e;
  }
}

/** The schema name and the newest version this build reads and writes. */
export const PROJECT_SCHEMA = 'eggline-project';
export const PROJECT_VERSION = 2;
/** Oldest version read (and migrated to PROJECT_VERSION on reading). */
export const PROJECT_OLDEST_VERSION = 1;

/** Check an image point {x, y} in pixels. */
function checkPoint(value: unknown, where: string): ImagePoint {
  if (!isRecord(value)) return badField(where, 'must be a point {x, y}');
  return { x: checkFiniteNumber(value.x, `${where}.x`), y: checkFiniteNumber(value.y, `${where}.y`) };
}

/** Check an AP axis or null. */
function checkAxis(value: unknown, where: string): ApAxis | null {
  if (value === null || value === undefined) return null;
  if (!isRecord(value)) return badField(where, 'must be null or an axis {anterior, posterior, source}');
  return {
    anterior: checkPoint(value.anterior, `${where}.anterior`),
    posterior: checkPoint(value.posterior, `${where}.posterior`),
    source: checkOneOf(value.source, ['auto', 'hand'], `${where}.source`),
  };
}

/** Check one landmark {name, point}. */
function checkLandmark(value: unknown, where: string): Landmark {
  if (!isRecord(value)) return badField(where, 'must be a landmark {name, point}');
  if (typeof value.name !== 'string' || value.name.trim() === '') badField(`${where}.name`, 'must be a non-empty text');
  return { name: value.name as string, point: checkPoint(value.point, `${where}.point`) };
}

/** Check a list of landmarks. */
function checkLandmarks(value: unknown, where: string): Landmark[] {
  if (!Array.isArray(value)) return badField(where, 'must be a list');
  return value.map((l, i) => checkLandmark(l, `${where}[${i}]`));
}

/** Check the edits of one time point: only the fields given. */
function checkTimePointEdits(value: unknown, where: string): TimePointEdits {
  if (!isRecord(value)) return badField(where, 'must be an object');
  return {
    ...(value.axis === undefined ? {} : { axis: checkAxis(value.axis, `${where}.axis`) }),
    ...(value.landmarks === undefined ? {} : { landmarks: checkLandmarks(value.landmarks, `${where}.landmarks`) }),
    ...(value.fitRangeEl === undefined ? {} : { fitRangeEl: value.fitRangeEl === null ? null : checkRangeEl(value.fitRangeEl, `${where}.fitRangeEl`) }),
  };
}

/** Check the per-time-point edits of a file: keys are time points ("0", "12"), values their edits. */
function checkTimePoints(value: unknown, where: string): Record<string, TimePointEdits> {
  if (!isRecord(value)) return badField(where, 'must be an object keyed by time point ("0", "1", …)');
  const out: Record<string, TimePointEdits> = {};
  for (const [key, edits] of Object.entries(value)) {
    if (!/^(0|[1-9]\d{0,8})$/.test(key)) badField(where, `has the key ${JSON.stringify(key)}; keys must be time points (0-based whole numbers: "0", "1", …)`);
    out[key] = checkTimePointEdits(edits, `${where}[${JSON.stringify(key)}]`);
  }
  return out;
}

/** Check the hand edits of one file; per-time-point edits are read from version 2 on. */
export function checkFileEdits(value: unknown, where: string, version: number = PROJECT_VERSION): FileEdits {
  if (!isRecord(value)) return badField(where, 'must be an object');
  const landmarks = value.landmarks ?? [];
  if (!Array.isArray(landmarks)) return badField(`${where}.landmarks`, 'must be a list');
  const timePoints = version >= 2 && value.timePoints !== undefined && value.timePoints !== null ? checkTimePoints(value.timePoints, `${where}.timePoints`) : {};
  return {
    axis: checkAxis(value.axis, `${where}.axis`),
    landmarks: landmarks.map((l, i) => checkLandmark(l, `${where}.landmarks[${i}]`)),
    fitRangeEl: value.fitRangeEl === null || value.fitRangeEl === undefined ? null
      : checkRangeEl(value.fitRangeEl, `${where}.fitRangeEl`),
    ...(value.dorsalSide === undefined || value.dorsalSide === null ? {} : { dorsalSide: checkDorsalSide(value.dorsalSide, `${where}.dorsalSide`) }),
    ...(Object.keys(timePoints).length > 0 ? { timePoints } : {}),
    ...(value.time === undefined || value.time === null ? {} : { time: checkTimeText(value.time, `${where}.time`) }),
    ...(value.timeStepS === undefined || value.timeStepS === null ? {} : { timeStepS: checkStep(value.timeStepS, `${where}.timeStepS`) }),
  };
}

/** Check a file's time points to analyse: the --time flag's text and rule. */
function checkTimeText(value: unknown, where: string): string {
  if (typeof value !== 'string') return badField(where, 'must be all, a time point K or a range A:B (0-based, A ≤ B)');
  try { return timeSelectionText(parseTimeSelection(value, where)); } catch (e) { throw new ProjectFormatError((e as Error).message); }
}

/** Check a file's time step in seconds: the --time-step flag's rule. */
function checkStep(value: unknown, where: string): number {
  try { return checkTimeStepS(value, where); } catch (e) { throw new ProjectFormatError((e as Error).message); }
}

/** Check a per-file dorsal side: 'left' or 'right'. */
function checkDorsalSide(value: unknown, where: string): 'left' | 'right' {
  if (value !== 'left' && value !== 'right') return badField(where, "must be 'left' or 'right'");
  return value;
}

/** Check schema and version; a newer version is refused rather than half-read. */
function checkHeader(value: Record<string, unknown>): void {
  if (value.schema !== PROJECT_SCHEMA) {
    badField('schema', `must be '${PROJECT_SCHEMA}' (found ${JSON.stringify(value.schema) ?? 'nothing'}); this is not an Eggline project`);
  }
  const v = value.version;
  if (!Number.isInteger(v) || (v as number) < PROJECT_OLDEST_VERSION) badField('version', `must be a whole number ≥ ${PROJECT_OLDEST_VERSION}`);
  if ((v as number) > PROJECT_VERSION) {
    badField('version', `is ${v as number}, newer than this Eggline reads (${PROJECT_VERSION}); update Eggline to open it`);
  }
}

/** Validate a whole project document and return a clean copy (unknown fields dropped), migrated to the current
 *  version: a version 1 document becomes version 2 unchanged otherwise (its edits hold at every time point). Throws
 *  ProjectFormatError. */
export function checkProjectDoc(value: unknown): ProjectDoc {
  if (!isRecord(value)) return badField('project', 'must be a JSON object');
  checkHeader(value);
  if (value.folder !== null && value.folder !== undefined && (typeof value.folder !== 'string' || value.folder === '')) {
    badField('folder', 'must be null or a folder path');
  }
  const files = value.files ?? {};
  if (!isRecord(files)) return badField('files', 'must be an object keyed by file path');
  const cleanFiles: Record<string, FileEdits> = {};
  for (const [key, edits] of Object.entries(files)) {
    if (key === '' || key.includes('\0')) badField('files', 'has an empty or invalid file key');
    cleanFiles[key] = checkFileEdits(edits, `files[${JSON.stringify(key)}]`, value.version as number);
  }
  if (value.batchOutDir !== null && value.batchOutDir !== undefined && (typeof value.batchOutDir !== 'string' || value.batchOutDir === '' || value.batchOutDir.includes('\0'))) {
    badField('batchOutDir', 'must be null or a folder path');
  }
  return {
    schema: PROJECT_SCHEMA, version: PROJECT_VERSION,
    folder: (value.folder as string | null | undefined) ?? null,
    settings: checkSettings(value.settings ?? {}),
    files: cleanFiles,
    ...(typeof value.batchOutDir === 'string' ? { batchOutDir: value.batchOutDir } : {}),
    ...(value.cohort === undefined || value.cohort === null ? {} : { cohort: checkProjectCohort(value.cohort) }),
  };
}

/** Parse and validate project JSON text; every message starts with `label` (the file name). */
export function parseProjectText(text: string, label: string): ProjectDoc {
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (e) {
    throw new ProjectFormatError(`${label}: not valid JSON (${(e as Error).message.split('\n')[0]})`);
  }
  try {
    return checkProjectDoc(raw);
  } catch (e) {
    if (e instanceof ProjectFormatError) throw new ProjectFormatError(`${label}: ${e.message}`);
    throw e;
  }
}

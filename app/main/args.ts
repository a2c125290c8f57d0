// Argument checks for values arriving from the renderer: never trust their types, sizes or paths.
import { isAbsolute } from 'node:path';
import type { ProjectDoc } from '../../core/contract';
import type { AnalysisSettings } from '../../core/settings';
import { checkProjectDoc, checkSettings, ProjectFormatError } from '../project';
import type { PathAllowList, PathUse } from './allow-list';
import { ApiFailure, labelOf } from './result';

/** Longest path we accept, characters (longer than any real file-system limit). */
const MAX_PATH_CHARS = 4096;

/** An absolute path string, or a 'bad-argument' failure naming the argument. */
export function requirePath(value: unknown, name: string): string {
  if (typeof value !== 'string' || value === '' || value.length > MAX_PATH_CHARS || value.includes('\0') || !isAbsolute(value)) {
    throw new ApiFailure('bad-argument', `${name} must be an absolute path`);
  }
  return value;
}

/** A path that is allowed for `use`, or a 'not-allowed' failure naming the file. */
export function requireAllowed(allow: PathAllowList, use: PathUse, value: unknown, name: string): string {
  const path = requirePath(value, name);
  if (!allow.isAllowed(use, path)) {
    const how = use === 'output' ? 'chosen as an output folder' : use === 'project' ? 'opened as a project'
      : use === 'results' ? 'a batch output folder of the open project' : 'opened through a dialog, a drop, a project or the demo';
    throw new ApiFailure('not-allowed', `${labelOf(path)}: not ${how}; open it first`);
  }
  return path;
}

/** An integer in [min, max], or a 'bad-argument' failure. */
export function requireInt(value: unknown, name: string, min: number, max: number): number {
  if (!Number.isInteger(value) || (value as number) < min || (value as number) > max) {
    throw new ApiFailure('bad-argument', `${name} must be an integer from ${min} to ${max}`);
  }
  return value as number;
}

/** A string of 1..maxChars characters, or a 'bad-argument' failure. */
export function requireText(value: unknown, name: string, maxChars: number): string {
  if (typeof value !== 'string' || value === '' || value.length > maxChars) {
    throw new ApiFailure('bad-argument', `${name} must be a text of 1 to ${maxChars} characters`);
  }
  return value;
}

/** Valid analysis settings, or a 'bad-argument' failure naming the field. */
export function requireSettings(value: unknown): AnalysisSettings {
  try {
    return checkSettings(value);
  } catch (e) {
    if (e instanceof ProjectFormatError) throw new ApiFailure('bad-argument', e.message);
    throw e;
  }
}

/** A valid project document, or a 'bad-argument' failure naming the field. */
export function requireProjectDoc(value: unknown): ProjectDoc {
  try {
    return checkProjectDoc(value);
  } catch (e) {
    if (e instanceof ProjectFormatError) throw new ApiFailure('bad-argument', `project: ${e.message}`);
    throw e;
  }
}

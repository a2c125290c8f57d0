// Errors as values: every handler result is {ok, value} or {ok: false, error: {code, message}} with a one-line message.
import { basename } from 'node:path';
import type { ApiErrorCode, ApiResult } from '../../core/contract';
import { ApiFailure } from '../engine/api-failure';
import { ProjectFormatError } from '../project';

export { ApiFailure };

/** A successful result. */
export function ok<T>(value: T): ApiResult<T> {
  return { ok: true, value };
}

/** Collapse a message to one line and make sure it names the file (`label`) when there is one. */
export function oneLine(message: string, label: string | null): string {
  const line = message.replace(/\s*\n\s*/g, ' ').trim() || 'unknown error';
  // A message that already starts with a file name ("x.json: …") names its file; do not stack a second one.
  const namesFile = /^\S+\.[A-Za-z0-9]{1,5}: /.test(line);
  return clip(label === null || namesFile || line.includes(label) ? line : `${label}: ${line}`, MAX_MESSAGE_CHARS);
}

const ERRNO_CODES: Readonly<Record<string, [ApiErrorCode, string]>> = {
  ENOENT: ['not-found', 'not found'],
  ENOTDIR: ['not-found', 'not found (a parent is not a folder)'],
  EACCES: ['io', 'permission denied'],
  EPERM: ['io', 'operation not permitted'],
  ENOSPC: ['io', 'the disk is full'],
  EROFS: ['io', 'the disk is read-only'],
  EISDIR: ['io', 'is a folder, not a file'],
  EBUSY: ['io', 'the file is in use'],
};
const TIFF_CODES = new Set(['not-tiff', 'truncated', 'empty', 'bad-offset', 'ifd-loop', 'too-large', 'unsupported', 'bad-ome']);

/** Map anything thrown to a failure value. `label` names the file; `fallback` is the code for unknown errors. */
export function failureFrom(e: unknown, label: string | null, fallback: ApiErrorCode = 'internal'): ApiResult<never> {
  const fail = (code: ApiErrorCode, message: string): ApiResult<never> => ({ ok: false, error: { code, message: oneLine(message, label) } });
  if (e instanceof ApiFailure) return fail(e.code, e.message);
  if (e instanceof ProjectFormatError) return fail('bad-file', e.message);
  const err: Error & { code?: unknown } = e instanceof Error ? e : new Error(String(e));
  if (err.name === 'AbortError') return fail('cancelled', 'cancelled');
  if (err.name === 'BatchOptionError') return fail('bad-argument', err.message);
  const errno = typeof err.code === 'string' ? ERRNO_CODES[err.code] : undefined;
  if (errno !== undefined) return fail(errno[0], errno[1]);
  if (err.name === 'TiffError' || (typeof err.code === 'string' && TIFF_CODES.has(err.code))) return fail('bad-file', err.message);
  return fail(fallback, err.message);
}

/** Run `body`, turning any throw into a failure value: handlers never throw. */
export async function guard<T>(label: string | null, body: () => Promise<T>, fallback: ApiErrorCode = 'internal'): Promise<ApiResult<T>> {
  try {
    return ok(await body());
  } catch (e) {
    return failureFrom(e, label, fallback);
  }
}

/** Longest file label and message, characters: a message is one readable line, not a dump. */
const MAX_LABEL_CHARS = 120;
const MAX_MESSAGE_CHARS = 600;

/** Shorten text to `max` characters with an ellipsis. */
function clip(text: string, max: number): string {
  return text.length <= max ? text : `${text.slice(0, max - 1)}…`;
}

/** The label used in messages for a path: its file name (shortened when absurdly long). */
export function labelOf(path: string): string {
  return clip(basename(path) || path, MAX_LABEL_CHARS);
}

/** Run `body`; anything it throws becomes an ApiFailure whose message names `label` (for paths known only later). */
export async function withLabel<T>(label: string, body: () => Promise<T>, fallback: ApiErrorCode = 'internal'): Promise<T> {
  try {
    return await body();
  } catch (e) {
    const failure = failureFrom(e, label, fallback);
    if (failure.ok) throw e;
    throw new ApiFailure(failure.error.code, failure.error.message);
  }
}

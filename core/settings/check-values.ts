// Small value checks shared by the project and settings validators; each throws ProjectFormatError.
import { badField } from './project-error';

/** True for a plain (non-array, non-null) object. */
export function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** A finite number, or throw. */
export function checkFiniteNumber(value: unknown, where: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) badField(where, 'must be a finite number');
  return value;
}

/** A finite number in [min, max], or throw. */
export function checkRange(value: unknown, min: number, max: number, where: string): number {
  const v = checkFiniteNumber(value, where);
  if (v < min || v > max) badField(where, `must be between ${min} and ${max}`);
  return v;
}

/** One of the allowed strings, or throw. */
export function checkOneOf<T extends string>(value: unknown, allowed: readonly T[], where: string): T {
  if (typeof value !== 'string' || !(allowed as readonly string[]).includes(value)) {
    badField(where, `must be one of ${allowed.map((a) => `'${a}'`).join(', ')}`);
  }
  return value as T;
}

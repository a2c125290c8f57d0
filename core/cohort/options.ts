// Option checking for the cohort analysis: exact messages, defaults filled in.
import { CohortError } from './cohort-error';
import type { CohortOptions, ResolvedCohortOptions } from '../model';

const NORMALISATIONS = ['none', 'amplitude', 'minmax', 'scale-offset'] as const;

/** Validate cohort options and fill defaults; throws CohortError with an exact message. */
export function checkCohortOptions(options: CohortOptions = {}): ResolvedCohortOptions {
  const normalisation = options.normalisation ?? 'scale-offset';
  if (!(NORMALISATIONS as readonly string[]).includes(normalisation)) {
    throw new CohortError(`normalisation must be one of none, amplitude, minmax, scale-offset (got "${String(normalisation)}")`);
  }
  const lambdaPosteriorEl = options.lambdaPosteriorEl ?? null;
  if (lambdaPosteriorEl !== null && !(Number.isFinite(lambdaPosteriorEl) && lambdaPosteriorEl > 0)) {
    throw new CohortError('lambdaPosteriorEl must be a positive number (x/EL)');
  }
  const gridStepEl = options.gridStepEl ?? 0.01;
  if (!(Number.isFinite(gridStepEl) && gridStepEl > 0 && gridStepEl <= 0.5)) {
    throw new CohortError('gridStepEl must be a number in (0, 0.5]');
  }
  const slopeHalfWidthEl = options.slopeHalfWidthEl ?? 0.04;
  if (!(Number.isFinite(slopeHalfWidthEl) && slopeHalfWidthEl >= gridStepEl && slopeHalfWidthEl <= 0.25)) {
    throw new CohortError('slopeHalfWidthEl must be a number from gridStepEl to 0.25');
  }
  const level = options.level ?? 0.95;
  if (!(Number.isFinite(level) && level > 0 && level < 1)) throw new CohortError('level must be a number in (0, 1)');
  const reference = options.reference ?? null;
  if (reference !== null && reference.trim() === '') throw new CohortError('reference must be a non-empty condition name');
  const equivalenceMargin = options.equivalenceMargin ?? null;
  if (equivalenceMargin !== null && !(Number.isFinite(equivalenceMargin) && equivalenceMargin > 0 && equivalenceMargin < 1)) {
    throw new CohortError('equivalenceMargin must be a number in (0, 1)');
  }
  return { reference, normalisation, lambdaPosteriorEl, gridStepEl, slopeHalfWidthEl, level, equivalenceMargin };
}

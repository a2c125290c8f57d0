// The project's cohort options (how conditions are compared): checked with the same rules and wording as the
// `eggline cohort` flags. Every field is optional; an absent one takes the cohort step's default.
import { NO_BACKGROUND_CONDITION, type Normalisation } from '../model';
import { badField } from './project-error';
import { isRecord } from './check-values';
import type { ProjectCohortOptions } from './project-types';

/** Profile normalisations, in the order the window offers them (the first is the default). */
export const COHORT_NORMALISATIONS: readonly Normalisation[] = ['scale-offset', 'none', 'amplitude', 'minmax'];

/** A condition name: non-empty text of at most 200 characters, or throw. */
function checkConditionName(value: unknown, where: string): string {
  if (typeof value !== 'string' || value.trim() === '' || value.length > 200) badField(where, 'must be a condition name of the sample sheet (non-empty text)');
  return value;
}

/** The equivalence margin's rule (as --equivalence-margin): a number between 0 and 1, exclusive. */
export function equivalenceMarginProblem(value: number): string | null {
  return Number.isFinite(value) && value > 0 && value < 1 ? null : 'must be a number between 0 and 1';
}

/** The opposing posterior gradient's decay length rule (as --lambda-posterior-el): a positive number (x/EL). */
export function lambdaPosteriorElProblem(value: number): string | null {
  return Number.isFinite(value) && value > 0 ? null : 'must be a positive number (x/EL)';
}

/** Check a project's `cohort` entry; absent or null fields are left out (the defaults apply). Throws ProjectFormatError. */
export function checkProjectCohort(value: unknown, where = 'cohort'): ProjectCohortOptions {
  if (!isRecord(value)) return badField(where, 'must be an object {reference, backgroundCondition, normalisation, equivalenceMargin, lambdaPosteriorEl, covariates}');
  const out: { -readonly [K in keyof ProjectCohortOptions]: ProjectCohortOptions[K] } = {};
  if (value.reference !== undefined && value.reference !== null) out.reference = checkConditionName(value.reference, `${where}.reference`);
  if (value.backgroundCondition !== undefined && value.backgroundCondition !== null) out.backgroundCondition = checkConditionName(value.backgroundCondition, `${where}.backgroundCondition`);
  // `none` (no background condition) is a choice, not a condition, so it never clashes with the reference.
  if (out.reference !== undefined && out.reference === out.backgroundCondition && out.backgroundCondition !== NO_BACKGROUND_CONDITION) badField(`${where}.backgroundCondition`, `must differ from the reference ("${out.reference}")`);
  if (value.normalisation !== undefined && value.normalisation !== null) {
    if (typeof value.normalisation !== 'string' || !(COHORT_NORMALISATIONS as readonly string[]).includes(value.normalisation)) {
      badField(`${where}.normalisation`, `must be scale-offset, none, amplitude or minmax (got ${JSON.stringify(value.normalisation)})`);
    }
    out.normalisation = value.normalisation as Normalisation;
  }
  for (const [key, problem] of [['equivalenceMargin', equivalenceMarginProblem], ['lambdaPosteriorEl', lambdaPosteriorElProblem]] as const) {
    const v = value[key];
    if (v === undefined || v === null) continue;
    const p = typeof v === 'number' ? problem(v) : problem(Number.NaN);
    if (p !== null) badField(`${where}.${key}`, `${p} (got ${JSON.stringify(v)})`);
    out[key] = v as number;
  }
  if (value.covariates !== undefined && value.covariates !== null) out.covariates = checkCovariateList(value.covariates, `${where}.covariates`);
  return out;
}

/** A list of sample-sheet column names (each as `column`, `column:numeric` or `column:categorical`), no repeats. */
function checkCovariateList(value: unknown, where: string): string[] {
  if (!Array.isArray(value)) return badField(where, `must be a list of sample-sheet column names (got ${JSON.stringify(value)})`);
  const seen = new Set<string>();
  return value.map((c: unknown) => {
    if (typeof c !== 'string' || c.trim() === '' || c.trim().startsWith(':') || c.length > 200) badField(where, `must hold column names of the sample sheet, e.g. "stage:numeric" (got ${JSON.stringify(c)})`);
    const column = (c as string).replace(/:(numeric|categorical)$/i, '').trim().toLowerCase();
    if (seen.has(column)) badField(where, `names the column ${JSON.stringify(c)} twice`);
    seen.add(column);
    return c as string;
  });
}

// The cohort step's options in force: a flag given on the command line, else the project's `cohort` entry, else the
// step's default. The command line (batch, cohort) and the window resolve them here, so all three agree. Also the
// one line the command line prints about the background choice.
import type { CohortAnalysis, Normalisation } from '../../core/cohort';
import type { ProjectCohortOptions } from '../../core/settings';

/** The six options a project can keep, resolved, and who gave the background condition. */
export interface CohortChoices {
  readonly reference: string | null;
  /** A condition's name, `none` (NO_BACKGROUND_CONDITION: subtract nothing), or null (the sheet's role column). */
  readonly backgroundCondition: string | null;
  /** Who gave backgroundCondition, as the cohort's record names it (the flag, or the project's entry). */
  readonly backgroundConditionNamedBy: string;
  readonly normalisation: Normalisation;
  readonly lambdaPosteriorEl: number | null;
  readonly equivalenceMargin: number | null;
  /** Sample-sheet columns adjusting the dosage regression (`column`, `column:numeric`, `column:categorical`); [] none. */
  readonly covariates: readonly string[];
}

/** Who gave the background condition: the flag of `eggline cohort`, `batch` and `merge`, or the project's entry (where the
 *  window's comparison options are saved). */
export const BACKGROUND_FLAG = '--background-condition';
export const BACKGROUND_PROJECT_FIELD = "the project's cohort.backgroundCondition";

/** The defaults (as `eggline cohort` with no option): reference with dosage 1, the sheet's role column, scale-offset. */
export const DEFAULT_COHORT_CHOICES: CohortChoices = {
  reference: null, backgroundCondition: null, backgroundConditionNamedBy: BACKGROUND_FLAG, normalisation: 'scale-offset', lambdaPosteriorEl: null, equivalenceMargin: null, covariates: [],
};

/** Options given as flags; undefined: not given. */
export type CohortFlags = { readonly [K in Exclude<keyof CohortChoices, 'backgroundConditionNamedBy'>]?: CohortChoices[K] | undefined };

/** Flag over project over default, per option. */
export function cohortChoices(project: ProjectCohortOptions | null | undefined, flags: CohortFlags = {}): CohortChoices {
  const pick = <K extends keyof CohortFlags>(key: K): CohortChoices[K] => {
    const flag = flags[key];
    if (flag !== undefined) return flag as CohortChoices[K];
    const kept = project?.[key];
    return kept !== undefined ? kept as CohortChoices[K] : DEFAULT_COHORT_CHOICES[key];
  };
  return {
    reference: pick('reference'), backgroundCondition: pick('backgroundCondition'),
    backgroundConditionNamedBy: flags.backgroundCondition === undefined && project?.backgroundCondition !== undefined ? BACKGROUND_PROJECT_FIELD : BACKGROUND_FLAG,
    normalisation: pick('normalisation'),
    lambdaPosteriorEl: pick('lambdaPosteriorEl'), equivalenceMargin: pick('equivalenceMargin'), covariates: pick('covariates'),
  };
}

const NORMALISE: readonly Normalisation[] = ['scale-offset', 'none', 'amplitude', 'minmax'];

/** The option flags `eggline cohort`, `batch` and `merge` share (--normalise, --lambda-posterior-el,
 *  --equivalence-margin, --covariate, repeatable) as flags (undefined: not given), or the usage message of the first bad one. */
export function parseComparisonFlags(v: { normalise?: string; 'lambda-posterior-el'?: string; 'equivalence-margin'?: string; covariate?: string[] }): CohortFlags | { usage: string } {
  if (v.normalise !== undefined && !(NORMALISE as readonly string[]).includes(v.normalise)) return { usage: `--normalise must be scale-offset, none, amplitude or minmax (got "${v.normalise}")` };
  const lp = v['lambda-posterior-el'];
  const lambdaPosteriorEl = lp === undefined ? undefined : Number(lp);
  if (lambdaPosteriorEl !== undefined && !(Number.isFinite(lambdaPosteriorEl) && lambdaPosteriorEl > 0)) return { usage: `--lambda-posterior-el must be a positive number (got "${lp}")` };
  const em = v['equivalence-margin'];
  const equivalenceMargin = em === undefined ? undefined : Number(em);
  if (equivalenceMargin !== undefined && !(Number.isFinite(equivalenceMargin) && equivalenceMargin > 0 && equivalenceMargin < 1)) return { usage: `--equivalence-margin must be a number between 0 and 1 (got "${em}")` };
  const covariates = v.covariate === undefined || v.covariate.length === 0 ? undefined : v.covariate;
  const badCovariate = covariates?.find((c) => c.trim() === '' || c.trim().startsWith(':'));
  if (badCovariate !== undefined) return { usage: `--covariate needs a column of the sample sheet, e.g. stage, stage:numeric, batch:categorical (got "${badCovariate}")` };
  return { normalisation: v.normalise as Normalisation | undefined, lambdaPosteriorEl, equivalenceMargin, covariates };
}

/** One line saying what the cohort step did about a background condition (subtracted, or `none` chosen), or null
 *  when no background rule applied; `eggline cohort` and `eggline batch` print it. */
export function backgroundLine(a: CohortAnalysis): string | null {
  const bg = a.backgroundCondition;
  if (bg) return `background condition "${bg.condition}" (${bg.files.length} embryo${bg.files.length === 1 ? '' : 's'}) subtracted; λ and boundaries fitted again (background_refit.csv)`;
  const c = a.backgroundChoice;
  return c?.rule === 'none' ? `no background condition: ${c.why} (background_condition.json)` : null;
}

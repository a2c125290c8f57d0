// Adapter to the cohort step (per-condition statistics after a batch), owned by the cohort area.
import type { EmbryoResult } from '../../core/model';
import type { Normalisation } from '../../core/cohort';
import { runCohortStep, type CohortStepResult } from '../cohort/run-cohort';
import { timelapseReportSection } from './timelapse-page';
import { movieFigures, type MovieFailure, type MovieOutcome } from './timelapse-pass';

/** What the cohort step receives. */
export interface CohortStepOptions {
  readonly results: EmbryoResult[];
  readonly failures: { file: string; error: string }[];
  readonly sampleSheetPath: string | null;
  readonly reference: string | null;
  /** The condition subtracted as background (see runCohortStep); null or absent: from the sheet's role column. */
  readonly backgroundCondition?: string | null;
  /** Who gave backgroundCondition (see runCohortStep). */
  readonly backgroundConditionNamedBy?: string;
  /** Profile normalisation, opposing gradient's λ and equivalence margin (see runCohortStep); absent: the defaults. */
  readonly normalisation?: Normalisation;
  readonly lambdaPosteriorEl?: number | null;
  readonly equivalenceMargin?: number | null;
  /** Sample-sheet columns adjusting the dosage regression (see runCohortStep); absent: none. */
  readonly covariates?: readonly string[];
  readonly outDir: string;
  readonly runRecord: unknown;
  /** The batch's movies and failed movies: the report gets a time-lapse section with their figures. */
  readonly movies?: readonly MovieOutcome[];
  readonly movieFailures?: readonly MovieFailure[];
}

/** The cohort step as a batch or a merge is asked to run it (--samples and the comparison options). */
export interface CohortRequest {
  readonly sampleSheetPath: string; readonly reference: string | null; readonly backgroundCondition?: string | null;
  /** Who gave backgroundCondition (the record says it); absent: --background-condition. */
  readonly backgroundConditionNamedBy?: string;
  /** The cohort step's other options (see runCohortStep); absent: its defaults. */
  readonly normalisation?: Normalisation; readonly lambdaPosteriorEl?: number | null; readonly equivalenceMargin?: number | null;
  /** Sample-sheet columns adjusting the dosage regression (see runCohortStep); absent: none. */
  readonly covariates?: readonly string[];
}

/** What a batch or a merge hands the cohort step besides the request: its results and where to write. */
type CohortInputs = Pick<CohortStepOptions, 'results' | 'failures' | 'outDir' | 'runRecord' | 'movies' | 'movieFailures'>;

/** The step's outputs and analysis, or `error` (one line) with no analysis when it failed. */
export type CohortOutcome =
  | (CohortStepResult & { readonly error: null })
  | { readonly written: string[]; readonly warnings: string[]; readonly analysis: null; readonly figures: null; readonly error: string };

/** Run the cohort step a batch or a merge was asked for, on its results; never rejects. */
export function runRequestedCohort(request: CohortRequest, inputs: CohortInputs): Promise<CohortOutcome> {
  return runCohort({
    ...inputs, sampleSheetPath: request.sampleSheetPath, reference: request.reference, backgroundCondition: request.backgroundCondition ?? null,
    ...(request.backgroundConditionNamedBy !== undefined ? { backgroundConditionNamedBy: request.backgroundConditionNamedBy } : {}),
    normalisation: request.normalisation, lambdaPosteriorEl: request.lambdaPosteriorEl ?? null, equivalenceMargin: request.equivalenceMargin ?? null,
    ...(request.covariates !== undefined && request.covariates.length > 0 ? { covariates: request.covariates } : {}),
  });
}

/** Run the cohort step once; never rejects. */
export async function runCohort(opts: CohortStepOptions): Promise<CohortOutcome> {
  try {
    const movies = (opts.movies ?? []).map((movie) => ({ movie, figures: movieFigures(movie) }));
    const timelapseHtml = timelapseReportSection(movies, opts.movieFailures ?? []);
    return { ...(await runCohortStep({ ...opts, timelapseHtml })), error: null };
  } catch (e) {
    return { written: [], warnings: [], analysis: null, figures: null, error: (e instanceof Error ? e.message : String(e)).split(/\r?\n/)[0] };
  }
}

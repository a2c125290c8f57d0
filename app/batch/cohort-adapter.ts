// Adapter to the cohort step (per-condition statistics after a batch), owned by the cohort area.
import type { EmbryoResult } from '../../core/model';
import { runCohortStep } from '../cohort/run-cohort';

/** What the cohort step receives. */
export interface CohortStepOptions {
  readonly results: EmbryoResult[];
  readonly failures: { file: string; error: string }[];
  readonly sampleSheetPath: string | null;
  readonly reference: string | null;
  readonly outDir: string;
  readonly runRecord: unknown;
}

/** Run the cohort step; resolves with the files written and warnings, or with `error` (one line) when it failed. */
export async function runCohort(opts: CohortStepOptions): Promise<{ written: string[]; warnings: string[]; error: string | null }> {
  try {
    return { ...(await runCohortStep(opts)), error: null };
  } catch (e) {
    return { written: [], warnings: [], error: (e instanceof Error ? e.message : String(e)).split(/\r?\n/)[0] };
  }
}

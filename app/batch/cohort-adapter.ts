// Adapter to the cohort step (per-condition statistics after a batch), owned by the cohort area.
import type { EmbryoResult } from '../../core/model';

/** What the cohort step receives. */
export interface CohortStepOptions {
  readonly results: EmbryoResult[];
  readonly failures: { file: string; error: string }[];
  readonly sampleSheetPath: string | null;
  readonly reference: string | null;
  readonly outDir: string;
  readonly runRecord: unknown;
}

/** Run the cohort step; resolves with the files written and warnings. */
export async function runCohort(opts: CohortStepOptions): Promise<{ written: string[]; warnings: string[] }> {
  void opts;
  return { written: [], warnings: ['the cohort step is not part of this build yet; per-condition tables were not written'] };
}

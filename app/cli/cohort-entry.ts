// Adapter to `eggline cohort`, which the cohort area implements.
import type { CliIo } from './usage-error';

/** Run `eggline cohort <results-dir> --samples sheet.csv`; returns the exit code. */
export async function runCohortCommand(argv: readonly string[], io: CliIo): Promise<number> {
  void argv;
  io.stderr.write('eggline cohort: not part of this build yet\n');
  return 2;
}

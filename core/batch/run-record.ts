// run.json: what is needed to reproduce a batch (settings, software versions, inputs and their hashes).
import type { AnalysisSettings } from '../settings';

/** Software versions recorded with a run. */
export interface SoftwareVersions {
  readonly eggline: string;
  readonly node: string;
  readonly sharp: string | null;
  readonly libvips: string | null;
}

/** One input file of a run: relative path, size in bytes, SHA-256 (hex) and outcome. */
export interface RunInput {
  readonly file: string;
  readonly bytes: number | null;
  readonly sha256: string | null;
  readonly status: 'ok' | 'error' | 'not-run';
  readonly error: string | null;
}

/** Which part of a split batch a run analysed (`eggline batch --shard K/N`). */
export interface ShardInfo {
  /** Part K (1-based) of N parts. */
  readonly part: number;
  readonly parts: number;
  /** The whole input list (every part's files): number of files, total bytes, SHA-256 of its canonical text. */
  readonly inputCount: number;
  readonly inputBytes: number;
  readonly inputListSha256: string;
  /** SHA-256 of the project file used (hand edits), null when none. */
  readonly projectSha256: string | null;
}

/** What `eggline merge` combined: the parts found and what was missing (only with --allow-missing). */
export interface MergeInfo {
  readonly parts: number;
  readonly partsMerged: readonly number[];
  readonly missingParts: readonly number[];
  /** Files of missing or unfinished parts that have no row; null when they cannot be known (input folder unreadable). */
  readonly missingFiles: readonly string[] | null;
  readonly inputListSha256: string;
}

/** Why a run did not finish: stopped by Ctrl+C / SIGTERM / the app, killed (its launching process went away, or it
 *  never got to write its final record), or failed (an error stopped it). */
export type RunEndReason = 'cancelled' | 'killed' | 'failed';

/** The run record written as run.json next to every batch output. */
export interface RunRecord {
  readonly schema: 'eggline-run';
  readonly version: 2;
  readonly runId: string;
  readonly software: SoftwareVersions;
  /** ISO 8601 UTC times. */
  readonly startedAt: string;
  readonly endedAt: string;
  readonly commandLine: readonly string[] | null;
  readonly folder: string;
  readonly outDir: string;
  readonly projectFile: string | null;
  readonly configFile: string | null;
  readonly settings: AnalysisSettings;
  readonly jobs: number;
  readonly timeoutPerFileS: number;
  /** Memory allowed per file, bytes (--max-memory); null = no limit. */
  readonly maxMemoryBytes?: number | null;
  readonly cancelled: boolean;
  /** True only when every input file has its row in the tables. */
  readonly complete: boolean;
  /** Why the run is not complete; null when it is. */
  readonly reason: RunEndReason | null;
  /** What `reason` means for the files in this folder, one line; null when complete. */
  readonly note: string | null;
  /** Files whose results were taken from the journal of an earlier run (--resume) instead of analysed again. */
  readonly reused: number;
  readonly ok: number;
  readonly failed: number;
  readonly inputs: readonly RunInput[];
  /** Problems that did not stop the run (e.g. an unreadable subfolder), one line each. */
  readonly warnings: readonly string[];
  /** The flat-field and background images used (absolute path and SHA-256), when the settings name any. */
  readonly corrections?: {
    readonly flatField: { readonly file: string; readonly sha256: string } | null;
    readonly backgroundImage: { readonly file: string; readonly sha256: string } | null;
  };
  /** Present when the cohort step ran with options from the project's cohort entry: the options in force (flag >
   *  project > default) and who gave the background condition, as the cohort step used them. */
  readonly cohortOptions?: {
    readonly reference: string | null;
    readonly backgroundCondition: string | null;
    readonly backgroundConditionNamedBy: string;
    readonly normalisation: string;
    readonly lambdaPosteriorEl: number | null;
    readonly equivalenceMargin: number | null;
    readonly covariates: readonly string[];
  };
  /** Present when the run analysed one part of a split batch. */
  readonly shard?: ShardInfo;
  /** Present when the record was made by merging parts. */
  readonly merge?: MergeInfo;
}

/** run.json text (pretty-printed, ends with a newline). */
export function runRecordToJson(record: RunRecord): string {
  return `${JSON.stringify(record, null, 2)}\n`;
}

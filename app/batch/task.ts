// One unit of batch work, as sent to a worker thread (plain data only: it is structured-cloned).
import type { EmbryoResult, HandEdits } from '../../core/model';
import type { AnalysisSettings } from '../../core/settings';

/** One file to analyse. */
export interface BatchTask {
  /** Index in the batch's sorted file list. */
  readonly index: number;
  /** Absolute path. */
  readonly path: string;
  /** Path relative to the input folder (forward slashes): the file's name in every table. */
  readonly file: string;
  readonly settings: AnalysisSettings;
  readonly handEdits: HandEdits | null;
}

/** Messages a batch worker sends back. */
export type WorkerReply =
  | { readonly type: 'result'; readonly index: number; readonly result: EmbryoResult }
  | { readonly type: 'memory'; readonly rssBytes: number; readonly heapUsedBytes: number; readonly externalBytes: number };

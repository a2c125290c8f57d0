// One unit of batch work, as sent to a worker thread (plain data only: it is structured-cloned).
import type { EmbryoResult, HandEdits, ImagePoint } from '../../core/model';
import type { DemoItem } from '../../core/synth';
import type { AnalysisSettings } from '../../core/settings';
import type { TimeShape } from './timelapse-options';

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
  /** When the file has edits of single time points in the project: the settings and hand edits in force at each of
   *  them (`at`, keyed by time point) and at any other (`own`), for a file analysed at another time point than
   *  settings.timeIndex (one past its last; see timePointForFile). Absent = settings and handEdits hold at every one. */
  readonly timePointEdits?: { readonly own: TaskEdits; readonly at: Readonly<Record<string, TaskEdits>> };
  /** Memory one file's analysis may use, bytes (the worker's resident size); absent = no limit. */
  readonly maxMemoryBytes?: number;
}

/** The settings and hand edits in force at one time point of a file. */
export interface TaskEdits {
  readonly settings: AnalysisSettings;
  readonly handEdits: HandEdits | null;
}

/** A request to generate one demo file (sent with `kind: 'demo'`; analysis tasks carry no `kind`). */
export interface DemoRequest {
  readonly kind: 'demo';
  readonly index: number;
  readonly item: DemoItem;
}

/** SHA-256 (hex) and size of an input file, as recorded in run.json and the journal. */
export interface InputDigest {
  readonly sha256: string;
  readonly bytes: number;
}

/** Messages a batch worker sends back; `input` is the digest of the bytes the decoder read (null if none). */
export type WorkerReply =
  | {
    readonly type: 'result'; readonly index: number; readonly result: EmbryoResult; readonly input?: InputDigest | null;
    /** The file's time shape as opened (null: it did not open), so the time pass opens only possible movies. */
    readonly shape?: TimeShape | null;
  }
  | { readonly type: 'demo'; readonly index: number; readonly bytes: Uint8Array; readonly furrow: ImagePoint }
  | { readonly type: 'memory'; readonly rssBytes: number; readonly heapUsedBytes: number; readonly externalBytes: number };

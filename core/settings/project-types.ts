// What a project file holds: the shared settings and every file's hand edits (axis, landmarks, fit range).
import type { ApAxis, Landmark } from '../model';
import type { AnalysisSettings } from './types';

/** Per-file hand work kept in the project. */
export interface FileEdits {
  readonly axis: ApAxis | null;
  readonly landmarks: readonly Landmark[];
  /** Per-file fit range override, x/EL. */
  readonly fitRangeEl: readonly [number, number] | null;
  /** Per-file dorsal side of the A→P line (which side the edge band's "dorsal" and "ventral" mean); absent or null:
   *  the shared setting. A flipped or mirrored embryo needs its own. */
  readonly dorsalSide?: 'left' | 'right' | null;
}

/** The project file's content (JSON, versioned). */
export interface ProjectDoc {
  readonly schema: 'eggline-project';
  readonly version: 1;
  /** Folder the project's files are in (absolute). */
  readonly folder: string | null;
  readonly settings: AnalysisSettings;
  /** Keyed by path relative to `folder` (or absolute when there is no folder). */
  readonly files: Readonly<Record<string, FileEdits>>;
  /** Output folder of the last batch run from the window (absolute), so its results reopen with the project;
   *  null or absent when there is none. */
  readonly batchOutDir?: string | null;
}

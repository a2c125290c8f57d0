// Adapters to the modules of other areas that the batch uses (decoder, pipeline), kept in one place.
import type { EmbryoResult, HandEdits, PlaneSource, StackInfo } from '../../core/model';
import type { AnalysisSettings } from '../../core/settings';

/** Open a stack for analysis: its tag info and a plane source (sharp decoding). */
export async function openStack(path: string, label: string): Promise<{ info: StackInfo; source: PlaneSource }> {
  void path;
  throw new Error(`${label}: the stack decoder is not part of this build yet`);
}

/** Analyse one opened stack (never throws for bad data: returns status 'error'). */
export async function analyze(
  info: StackInfo, source: PlaneSource, settings: AnalysisSettings, opts: { fileLabel: string; handEdits?: HandEdits },
): Promise<EmbryoResult> {
  void info; void source; void settings;
  throw new Error(`${opts.fileLabel}: the analysis pipeline is not part of this build yet`);
}

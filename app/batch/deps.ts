// Adapters to the modules of other areas that the batch uses (decoder, pipeline), kept in one place.
import type { EmbryoResult, HandEdits, PlaneSource, StackInfo } from '../../core/model';
import type { AnalysisSettings } from '../../core/settings';
import { analyseStack, type ImageCorrections } from '../../core/pipeline';
import { openStackForAnalysis, type OpenForAnalysisOptions } from '../decode';
import type { WorkerBuffers } from './worker-buffers';

export { openFileByteSource as openByteSource } from '../../core/io';

/** Open a stack for analysis: tag info, a plane source (sharp, geotiff fallback) and decoder warnings that grow as planes are read. */
export function openStack(path: string, label: string, options: OpenForAnalysisOptions = {}): Promise<{ info: StackInfo; source: PlaneSource; warnings: string[] }> {
  return openStackForAnalysis(path, label, options);
}

/** Analyse one opened stack (never throws for bad data: returns status 'error'). */
export function analyse(
  info: StackInfo, source: PlaneSource, settings: AnalysisSettings,
  opts: { fileLabel: string; handEdits?: HandEdits; corrections?: ImageCorrections | null; buffers?: WorkerBuffers | null },
): Promise<EmbryoResult> {
  const { buffers, ...rest } = opts;
  // A worker's lent arrays: the planes are decoded into them and the projection written into them.
  return analyseStack(info, source, settings, buffers
    ? { ...rest, planeArrays: buffers.planeArrays, projectionBuffers: buffers.projection(info.sizeC, info.sizeX * info.sizeY) }
    : rest);
}

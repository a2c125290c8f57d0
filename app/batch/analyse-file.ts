// Analyse one batch file end to end (open, decode, analyse), turning every failure into an error row.
import { basename } from 'node:path';
import { errorResult, oneLine, type EmbryoResult, type StackInfo } from '../../core/model';
import { analysisBytesEstimate, WORKER_BASE_BYTES } from '../../core/tiff';
import { formatByteSize as formatBytes } from '../../core/batch';
import { analyse, openStack } from './deps';
import { inputFolderOf, loadImageCorrections } from './correction-images';
import { hashingByteSource, type HashingByteSource } from './hashing-source';
import { timePointForFile } from '../../core/settings';
import type { BatchTask, InputDigest, TaskEdits } from './task';
import type { TimeShape } from './timelapse-options';
import type { WorkerBuffers } from './worker-buffers';

/** One line naming the file: the message as is when it already names it, else "file: message". */
export function fileMessage(file: string, e: unknown): string {
  const text = oneLine(e instanceof Error ? e.message : String(e));
  return text.startsWith(file) || text.startsWith(basename(file)) ? text : `${file}: ${text}`;
}

/** "22000×22000 px planes, 2 channels": what makes a stack big, for the memory message. */
function stackSize(info: StackInfo): string {
  return `${info.sizeX}×${info.sizeY} px planes, ${info.sizeC} channel${info.sizeC === 1 ? '' : 's'}`;
}

/** The one-line refusal when the analysis of `info` would need more than `maxBytes`, else null. */
export function memoryRefusal(info: StackInfo, maxBytes: number): string | null {
  const need = analysisBytesEstimate(info.sizeX, info.sizeY, info.sizeC, info.sampleType, info.samplesPerPixel) + WORKER_BASE_BYTES;
  if (need <= maxBytes) return null;
  return `needs about ${formatBytes(need)} of memory to analyse (${stackSize(info)}), more than the ${formatBytes(maxBytes)} allowed per file; raise the limit with --max-memory`;
}

/** Analyse the task's file; never rejects. The result's `file` is the task's relative path. */
export async function analyseFile(task: BatchTask): Promise<EmbryoResult> {
  return (await analyseFileWithDigest(task, false)).result;
}

/**
 * Analyse the task's file and, when `digest` is set, hash the bytes the decoder reads on the way (SHA-256 for
 * run.json and the journal), so the file is read once; `input` is null when the file could not be opened. `buffers`
 * (a batch worker's, lent to one file at a time) receive the decoded planes and the projection.
 */
export async function analyseFileWithDigest(
  task: BatchTask, digest = true, buffers: WorkerBuffers | null = null,
): Promise<{ result: EmbryoResult; input: InputDigest | null; shape: TimeShape | null }> {
  let hashing: HashingByteSource | null = null;
  const wrapSource = digest ? (s: Parameters<typeof hashingByteSource>[0]) => (hashing = hashingByteSource(s)) : undefined;
  let shape: TimeShape | null = null;
  let input: InputDigest | null = null;
  // The hash is completed before the file is closed: it reads the bytes the decoder skipped (tags read through
  // their own cache, padding). Completed after the close, that read failed, and the batch hashed every file again.
  const finishHash = async (): Promise<void> => {
    const h = hashing as HashingByteSource | null;
    input = h ? await h.finish().then(({ sha256, bytes }) => ({ sha256, bytes }), () => null) : null;
  };
  const result = await analyseOpened(task, wrapSource, (info) => { shape = { sizeT: info.sizeT, sizeZ: info.sizeZ, isOme: info.isOme }; }, finishHash, buffers);
  return { result, input, shape };
}

/** The settings (at time point `tIndex`) and hand edits a task's file is analysed with at time point `tIndex`. */
function editsAtTimePoint(task: BatchTask, tIndex: number): TaskEdits {
  if (tIndex === task.settings.timeIndex) return task;
  const e = task.timePointEdits ? task.timePointEdits.at[String(tIndex)] ?? task.timePointEdits.own : task;
  return { settings: { ...e.settings, timeIndex: tIndex }, handEdits: e.handEdits };
}

async function analyseOpened(
  task: BatchTask, wrapSource: ((s: Parameters<typeof hashingByteSource>[0]) => HashingByteSource) | undefined, onInfo: (info: StackInfo) => void,
  beforeClose: () => Promise<void> = async () => undefined, buffers: WorkerBuffers | null = null,
): Promise<EmbryoResult> {
  let opened: Awaited<ReturnType<typeof openStack>> | null = null;
  try {
    opened = await openStack(task.path, task.file, wrapSource ? { wrapSource } : {});
    onInfo(opened.info);
    const refusal = task.maxMemoryBytes === undefined ? null : memoryRefusal(opened.info, task.maxMemoryBytes);
    if (refusal !== null) return errorResult(task.file, `${task.file}: ${refusal}`, opened.info.warnings);
    // Relative paths of the correction images are taken from the input folder (the task's path minus its file).
    // The shared time point, or the file's last when it has fewer (a single stack beside movies), with a warning.
    const at = timePointForFile(task.settings.timeIndex, opened.info.sizeT, task.file);
    const { settings, handEdits } = editsAtTimePoint(task, at.tIndex);
    const corrections = await loadImageCorrections(settings, inputFolderOf(task.path, task.file));
    const result = await analyse(opened.info, opened.source, settings,
      { fileLabel: task.file, ...(handEdits ? { handEdits } : {}), corrections, buffers });
    const warnings = [...result.warnings, ...opened.warnings.filter((w) => !result.warnings.includes(w)), ...(at.warning === null ? [] : [at.warning])];
    const error = result.status === 'error' && result.error ? fileMessage(task.file, result.error) : result.error;
    return { ...result, file: task.file, error, warnings };
  } catch (e) {
    return errorResult(task.file, fileMessage(task.file, e));
  } finally {
    await beforeClose();
    await opened?.source.close().catch(() => undefined);
  }
}

// Analyse one batch file end to end (open, decode, analyse), turning every failure into an error row.
import { basename } from 'node:path';
import { errorResult, oneLine, type EmbryoResult } from '../../core/model';
import { analyse, openStack } from './deps';
import type { BatchTask } from './task';

/** One line naming the file: the message as is when it already names it, else "file: message". */
export function fileMessage(file: string, e: unknown): string {
  const text = oneLine(e instanceof Error ? e.message : String(e));
  return text.startsWith(file) || text.startsWith(basename(file)) ? text : `${file}: ${text}`;
}

/** Analyse the task's file; never rejects. The result's `file` is the task's relative path. */
export async function analyseFile(task: BatchTask): Promise<EmbryoResult> {
  let opened: Awaited<ReturnType<typeof openStack>> | null = null;
  try {
    opened = await openStack(task.path, task.file);
    const result = await analyse(opened.info, opened.source, task.settings,
      task.handEdits ? { fileLabel: task.file, handEdits: task.handEdits } : { fileLabel: task.file });
    const warnings = [...result.warnings, ...opened.warnings.filter((w) => !result.warnings.includes(w))];
    const error = result.status === 'error' && result.error ? fileMessage(task.file, result.error) : result.error;
    return { ...result, file: task.file, error, warnings };
  } catch (e) {
    return errorResult(task.file, fileMessage(task.file, e));
  } finally {
    await opened?.source.close().catch(() => undefined);
  }
}

// The journal on disk (format: core/batch/journal.ts): a new one per run, or appended to with --resume. Each line is
// written with one append and flushed (fdatasync) before the next, so a kill leaves every earlier line whole.
import { createHash } from 'node:crypto';
import { promises as fs } from 'node:fs';
import type { FileHandle } from 'node:fs/promises';
import { join } from 'node:path';
import {
  JOURNAL_FILE_NAME, journalFileLine, journalRunLine, parseJournal, settingsKeyText, type JournalEntry, type ParsedJournal,
} from '../../core/batch';
import type { HandEdits } from '../../core/model';
import type { AnalysisSettings } from '../../core/settings';

/** An open journal: append finished files in any order; appends are written one after another. */
export interface JournalWriter {
  readonly path: string;
  append(entry: JournalEntry): Promise<void>;
  close(): Promise<void>;
}

/** SHA-256 (hex) of a file's settings key text. */
export function settingsKey(settings: AnalysisSettings, handEdits: HandEdits | null, eggline: string): string {
  return createHash('sha256').update(settingsKeyText(settings, handEdits, eggline)).digest('hex');
}

/** The journal of an earlier run in `outDir`, or null when there is none. Unreadable lines are skipped. */
export async function readJournal(outDir: string): Promise<ParsedJournal | null> {
  const text = await fs.readFile(join(outDir, JOURNAL_FILE_NAME), 'utf8').catch((e: NodeJS.ErrnoException) => {
    if (e.code === 'ENOENT') return null;
    throw e;
  });
  return text === null ? null : parseJournal(text);
}

/** Open the journal of a run: truncated for a new run, appended to when resuming. Writes the run line. */
export async function openJournal(outDir: string, run: { runId: string; startedAt: string; eggline: string; resume: boolean }): Promise<JournalWriter> {
  const path = join(outDir, JOURNAL_FILE_NAME);
  const handle: FileHandle = await fs.open(path, run.resume ? 'a' : 'w', 0o644);
  let chain: Promise<void> = Promise.resolve();
  let closed = false;
  const write = (text: string): Promise<void> => {
    chain = chain.then(async () => {
      if (closed) return;
      await handle.appendFile(text, 'utf8');
      await handle.datasync();
    });
    return chain;
  };
  // A resumed journal may end in a line cut by the kill: start on a fresh line so the next entry stays readable.
  const size = (await handle.stat()).size;
  await write(`${run.resume && size > 0 ? '\n' : ''}${journalRunLine(run.runId, run.startedAt, run.eggline, run.resume)}`);
  return {
    path,
    append: (entry) => write(journalFileLine(entry)),
    close: async () => {
      await chain.catch(() => undefined);
      if (closed) return;
      closed = true;
      await handle.close();
    },
  };
}

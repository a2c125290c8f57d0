// The batch journal: `journal.jsonl` in the output folder, one JSON object per line, appended while a batch runs,
// so a killed run loses at most the files that were being analysed and `--resume` can reuse the rest.
//
// Format (version 1), UTF-8, lines separated by "\n":
//   {"type":"run","schema":"eggline-journal","version":1,"runId":…,"startedAt":…,"eggline":…,"resumed":bool}
//       written when a run starts (a resumed run appends one more; the first line is always a run line)
//   {"type":"file","file":…,"sha256":…,"bytes":…,"settingsKey":…,"result":{…}}
//       one per finished file: its path relative to the input folder, the SHA-256 (hex) and size of the bytes that
//       were analysed, the key of the settings it was analysed with (settingsKeyText, hashed with SHA-256), and its
//       EmbryoResult in the form results.json uses (typed arrays as arrays, NaN as null)
// A line that does not parse (the last one, cut by a kill) is skipped; for a file listed twice the later line wins.
import type { EmbryoResult, HandEdits } from '../model';
import type { AnalysisSettings } from '../settings';
import { tidyMessages } from './messages';
import { jsonWithArrays, reviveResult } from './results-json';

/** File name of the journal inside the output folder. */
export const JOURNAL_FILE_NAME = 'journal.jsonl';
export const JOURNAL_SCHEMA = 'eggline-journal';
export const JOURNAL_VERSION = 1;

/** The line that opens a run. */
export interface JournalRunLine {
  readonly type: 'run';
  readonly schema: typeof JOURNAL_SCHEMA;
  readonly version: typeof JOURNAL_VERSION;
  readonly runId: string;
  /** ISO 8601 UTC. */
  readonly startedAt: string;
  readonly eggline: string;
  readonly resumed: boolean;
}

/** One finished file. */
export interface JournalEntry {
  readonly file: string;
  readonly sha256: string;
  readonly bytes: number;
  readonly settingsKey: string;
  readonly result: EmbryoResult;
}

/** What a journal holds: its run lines, the latest entry per file, and how many lines were skipped as unreadable. */
export interface ParsedJournal {
  readonly runs: readonly JournalRunLine[];
  readonly entries: ReadonlyMap<string, JournalEntry>;
  readonly skippedLines: number;
}

/** The run line's text (with its newline). */
export function journalRunLine(runId: string, startedAt: string, eggline: string, resumed: boolean): string {
  const line: JournalRunLine = { type: 'run', schema: JOURNAL_SCHEMA, version: JOURNAL_VERSION, runId, startedAt, eggline, resumed };
  return `${JSON.stringify(line)}\n`;
}

/** One file line's text (with its newline); never contains a line break inside. */
export function journalFileLine(entry: JournalEntry): string {
  return `${jsonWithArrays({ type: 'file', ...entry })}\n`;
}

/** The result with tidy messages, as it reads back from the journal (and from results.json): what every table is
 *  built from, so a reused result and a fresh one give the same bytes. */
export function normalizeResult(result: EmbryoResult): EmbryoResult {
  return reviveResult(JSON.parse(jsonWithArrays(tidyMessages(result))), `result of ${result.file}`);
}

function parseFileLine(raw: Record<string, unknown>, lineNo: number): JournalEntry | null {
  const { file, sha256, bytes, settingsKey, result } = raw;
  if (typeof file !== 'string' || typeof sha256 !== 'string' || typeof bytes !== 'number' || typeof settingsKey !== 'string') return null;
  try {
    return { file, sha256, bytes, settingsKey, result: reviveResult(result, `journal line ${lineNo}`) };
  } catch {
    return null;
  }
}

/** Parse journal text; never throws (unreadable lines are counted in skippedLines). */
export function parseJournal(text: string): ParsedJournal {
  const runs: JournalRunLine[] = [];
  const entries = new Map<string, JournalEntry>();
  let skippedLines = 0;
  const lines = text.split('\n');
  lines.forEach((line, i) => {
    if (line.trim() === '') return;
    let raw: unknown;
    try { raw = JSON.parse(line); } catch { skippedLines += 1; return; }
    const rec = raw as Record<string, unknown>;
    if (typeof raw !== 'object' || raw === null) { skippedLines += 1; return; }
    if (rec.type === 'run' && rec.schema === JOURNAL_SCHEMA && rec.version === JOURNAL_VERSION) { runs.push(rec as unknown as JournalRunLine); return; }
    const entry = rec.type === 'file' ? parseFileLine(rec, i + 1) : null;
    if (entry) entries.set(entry.file, entry); else skippedLines += 1;
  });
  return { runs, entries, skippedLines };
}

/** Sorts object keys at every level, so equal settings always give the same text. */
function canonical(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(canonical);
  if (value === null || typeof value !== 'object') return value;
  const obj = value as Record<string, unknown>;
  return Object.fromEntries(Object.keys(obj).sort().map((k) => [k, canonical(obj[k])]));
}

/** The text whose SHA-256 is a file's settings key: its effective settings, hand edits and Eggline's version. A
 *  journal entry is reused only when this matches, since any of the three can change the result. */
export function settingsKeyText(settings: AnalysisSettings, handEdits: HandEdits | null, eggline: string): string {
  return JSON.stringify(canonical({ eggline, handEdits, settings }));
}

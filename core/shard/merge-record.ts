// Combining parts: rows in the order of a one-machine run, and the merged run record.
import type { MergeInfo, RunInput, RunRecord } from '../batch';

/** Code-unit order of relative paths, the order a one-machine run lists its files in. */
function byPath(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/** Rows of every part in the order of a one-machine run: sorted by file path; the rows of one file keep their order
 *  (the sort is stable, and every file is in exactly one part). */
export function orderLikeOneRun<T extends { readonly file: string }>(rows: readonly T[]): T[] {
  return [...rows].sort((a, b) => byPath(a.file, b.file));
}

/** What the merged run.json says beyond its parts' records. */
export interface MergedRecordFacts {
  readonly runId: string;
  readonly endedAt: string;
  readonly commandLine: readonly string[] | null;
  readonly outDir: string;
  readonly merge: MergeInfo;
  readonly warnings: readonly string[];
}

/** run.json of a merge: the parts' settings and software, the earliest start, every input in one-run order, counts
 *  over all parts; `complete` is false (and `cancelled` true) when parts or files are missing, so the tables do not
 *  cover the whole input. */
export function mergeRunRecords(parts: readonly RunRecord[], facts: MergedRecordFacts): RunRecord {
  const first = parts[0];
  if (first === undefined) throw new Error('mergeRunRecords: no parts');
  const inputs: RunInput[] = orderLikeOneRun(parts.flatMap((p) => p.inputs));
  const startedAt = parts.map((p) => p.startedAt).reduce((a, b) => (b < a ? b : a));
  const missing = facts.merge.missingParts.length > 0 || (facts.merge.missingFiles?.length ?? 0) > 0 || inputs.some((i) => i.status === 'not-run');
  const rows = inputs.filter((i) => i.status !== 'not-run').length;
  const lacking = facts.merge.missingFiles === null ? 'an unknown number of files' : `${facts.merge.missingFiles.length} files`;
  const note = missing
    ? `merged without parts ${facts.merge.missingParts.join(', ')} (--allow-missing): the tables hold ${rows} files, ${lacking} have no row (listed in merge.missingFiles); rerun those parts and merge again`
    : null;
  return {
    schema: 'eggline-run', version: 2, runId: facts.runId, software: first.software, startedAt, endedAt: facts.endedAt,
    commandLine: facts.commandLine, folder: first.folder, outDir: facts.outDir, projectFile: first.projectFile, configFile: first.configFile,
    settings: first.settings, jobs: Math.max(...parts.map((p) => p.jobs)), timeoutPerFileS: first.timeoutPerFileS, cancelled: missing,
    complete: !missing, reason: missing ? (parts.find((p) => p.reason !== null)?.reason ?? 'failed') : null, note,
    reused: parts.reduce((s, p) => s + (p.reused ?? 0), 0),
    ok: parts.reduce((s, p) => s + p.ok, 0), failed: parts.reduce((s, p) => s + p.failed, 0), inputs,
    warnings: [...new Set([...parts.flatMap((p) => p.warnings), ...facts.warnings])],
    merge: facts.merge,
  };
}

// Before merging: are the parts found under <out>/parts/ the parts of one split batch, all there, each once?
import type { RunRecord } from '../batch';
import { parsePartFolderName } from './shard-spec';

/** One folder found under `<out>/parts/`. */
export interface PartEntry {
  /** Folder name under parts/ (normally "K-of-N"). */
  readonly folder: string;
  /** Its run.json, or null when there is none or it cannot be read. */
  readonly record: RunRecord | null;
  /** Why run.json could not be read (one line), when record is null. */
  readonly problem?: string | null;
}

/** What the merge may combine. */
export interface PartsPlan {
  /** N, the number of parts of the split. */
  readonly parts: number;
  /** Parts with a run.json, finished or not, sorted by part number (an unfinished one is merged only with allowMissing). */
  readonly present: readonly PartEntry[];
  /** Part numbers (1-based) with no finished run: no folder, no run.json, or a run that stopped early. */
  readonly missingParts: readonly number[];
  /** Differences that do not change results (e.g. the Node version), one line each. */
  readonly warnings: readonly string[];
}

/** The plan, or the one-line reason to refuse the merge. */
export type CheckPartsResult = { readonly ok: true; readonly plan: PartsPlan } | { readonly ok: false; readonly message: string };

/** JSON text with object keys sorted at every level, so two equal settings objects give the same text. */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) => (v !== null && typeof v === 'object' && !Array.isArray(v)
    ? Object.fromEntries(Object.keys(v as object).sort().map((k) => [k, (v as Record<string, unknown>)[k]]))
    : v));
}

/** The first top-level key whose value differs between two settings objects, with both values; null when equal. */
export function firstDifference(a: object, b: object): string | null {
  const keys = [...new Set([...Object.keys(a), ...Object.keys(b)])].sort();
  for (const k of keys) {
    const va = canonicalJson((a as Record<string, unknown>)[k]);
    const vb = canonicalJson((b as Record<string, unknown>)[k]);
    if (va !== vb) return `${k}: ${va ?? 'unset'} vs ${vb ?? 'unset'}`;
  }
  return null;
}

/** True when a part's run stopped before every file had its row (cancelled, or marked incomplete). */
export function isUnfinished(record: RunRecord): boolean {
  return record.cancelled || (record as { complete?: unknown }).complete === false;
}

function rerunHint(part: number, parts: number): string {
  return `rerun it with --shard ${part}/${parts}, or merge what is there with --allow-missing`;
}

function compare(entry: PartEntry, ref: PartEntry, warnings: string[]): string | null {
  const r = entry.record as RunRecord;
  const q = ref.record as RunRecord;
  const s = r.shard;
  const t = q.shard;
  if (!s || !t) return null;
  const at = `parts/${entry.folder}`;
  const vs = `parts/${ref.folder}`;
  if (s.inputListSha256 !== t.inputListSha256 || s.inputCount !== t.inputCount) {
    return `${at} was made from another input list than ${vs} (${s.inputCount} vs ${t.inputCount} files, or files changed in between)`;
  }
  if (r.software.eggline !== q.software.eggline) return `${at} was made by Eggline ${r.software.eggline}, ${vs} by ${q.software.eggline}`;
  const diff = firstDifference(r.settings, q.settings);
  if (diff !== null) return `${at} was made with other settings than ${vs} (${diff})`;
  if (s.projectSha256 !== t.projectSha256) return `${at} was made with other hand edits (project file) than ${vs}`;
  for (const key of ['node', 'sharp', 'libvips'] as const) {
    if (r.software[key] !== q.software[key]) {
      const line = `parts differ in ${key} version (${q.software[key] ?? 'unknown'} in ${vs}, ${r.software[key] ?? 'unknown'} in ${at})`;
      if (!warnings.includes(line)) warnings.push(line);
    }
  }
  return null;
}

/** Check the parts of a split batch; refuses mixed splits, a part present twice, parts made from different inputs,
 *  settings, hand edits or Eggline versions, and (unless allowMissing) a missing or unfinished part. */
export function checkParts(entries: readonly PartEntry[], allowMissing: boolean): CheckPartsResult {
  const refuse = (message: string): CheckPartsResult => ({ ok: false, message });
  const withRecord: PartEntry[] = [];
  const noRecord: { entry: PartEntry; part: number; parts: number }[] = [];
  for (const e of [...entries].sort((a, b) => (a.folder < b.folder ? -1 : a.folder > b.folder ? 1 : 0))) {
    const named = parsePartFolderName(e.folder);
    if (e.record === null) {
      if (named) noRecord.push({ entry: e, ...named });
      continue;
    }
    const s = e.record.shard;
    if (!s) return refuse(`parts/${e.folder}/run.json is not the record of a part (it has no "shard"; was it made with --shard?)`);
    if (named && (named.part !== s.part || named.parts !== s.parts)) {
      return refuse(`parts/${e.folder} holds part ${s.part} of ${s.parts}, not what its name says`);
    }
    withRecord.push(e);
  }
  if (withRecord.length === 0) {
    if (noRecord.length > 0) {
      const first = noRecord[0];
      return refuse(`no part has finished: parts/${first.entry.folder} has no run.json${first.entry.problem ? ` (${first.entry.problem})` : ''}`);
    }
    return refuse('no parts found (expected folders named K-of-N, made by "eggline batch --shard K/N")');
  }
  const ref = withRecord[0];
  const n = ref.record?.shard?.parts as number;
  for (const e of [...withRecord, ...noRecord.map((x) => ({ ...x.entry, parts: x.parts }))]) {
    const p = 'parts' in e ? e.parts : e.record?.shard?.parts;
    if (p !== n) return refuse(`parts of different splits: parts/${ref.folder} is one of ${n} parts, parts/${e.folder} one of ${p}`);
  }
  const byPart = new Map<number, PartEntry>();
  const warnings: string[] = [];
  for (const e of withRecord) {
    const k = e.record?.shard?.part as number;
    const seen = byPart.get(k);
    if (seen) return refuse(`part ${k} of ${n} is present twice: parts/${seen.folder} and parts/${e.folder}`);
    byPart.set(k, e);
    const problem = compare(e, ref, warnings);
    if (problem) return refuse(problem);
  }
  const missingParts: number[] = [];
  for (let k = 1; k <= n; k += 1) {
    const e = byPart.get(k);
    if (e && !isUnfinished(e.record as RunRecord)) continue;
    missingParts.push(k);
    if (allowMissing) continue;
    if (e) return refuse(`part ${k} of ${n} did not finish (parts/${e.folder}/run.json says it stopped early); ${rerunHint(k, n)}`);
    const bare = noRecord.find((x) => x.part === k);
    const why = bare ? `parts/${bare.entry.folder} has no run.json${bare.entry.problem ? ` (${bare.entry.problem})` : ''}` : `no folder parts/${k}-of-${n}`;
    return refuse(`part ${k} of ${n} is missing (${why}); ${rerunHint(k, n)}`);
  }
  const present = [...byPart.entries()].sort((a, b) => a[0] - b[0]).map(([, e]) => e);
  return { ok: true, plan: { parts: n, present, missingParts, warnings } };
}

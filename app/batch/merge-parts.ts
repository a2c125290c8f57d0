// `eggline merge`: combine the parts of a split batch (<out>/parts/K-of-N) into the tables of a one-machine run.
// Parts are read one at a time; what is kept is their rows, so memory grows with the rows, not with the parts.
import { randomUUID } from 'node:crypto';
import { promises as fs } from 'node:fs';
import { join } from 'node:path';
import { embryoResults, resultsDocFromJson, type ResultsDoc, type RunRecord } from '../../core/batch';
import type { EmbryoResult, MovieRecord } from '../../core/model';
import { checkParts, isUnfinished, mergeRunRecords, orderLikeOneRun, type PartEntry } from '../../core/shard';
import { runRequestedCohort, type CohortRequest } from './cohort-adapter';
import { filesOfMissingParts } from './shard';
import { movieOutcomes, writeTimelapseOutputs, type MovieFailure, type MovieOutcome } from './timelapse-pass';
import { writeBatchOutputs } from './write-outputs';

/** A reason to merge nothing (exit code 2), one line. */
export class MergeRefusal extends Error {
  override name = 'MergeRefusal';
}

/** What a merge needs. */
export interface MergePartsOptions {
  /** The --out folder of the split batch; the parts are in its parts/ folder, the merged tables go next to it. */
  readonly outDir: string;
  /** Merge the parts that are there; list the files of missing parts in run.json. */
  readonly allowMissing: boolean;
  readonly commandLine?: readonly string[];
  readonly cohort?: CohortRequest | null;
}

/** What a merge wrote. */
export interface MergePartsResult {
  readonly record: RunRecord;
  readonly written: readonly string[];
  readonly warnings: readonly string[];
  readonly cohortError: string | null;
  readonly parts: number;
  readonly ok: number;
  readonly failed: number;
  /** Files with no row (missing or unfinished parts); null when they cannot be known. */
  readonly missingFiles: readonly string[] | null;
  /** The movies of the parts, summarised, and those that could not be analysed. */
  readonly timelapse: { readonly movies: readonly MovieOutcome[]; readonly failures: readonly MovieFailure[] };
}

async function readPartRecord(dir: string): Promise<{ record: RunRecord | null; problem: string | null }> {
  let text: string;
  try {
    text = await fs.readFile(join(dir, 'run.json'), 'utf8');
  } catch (e) {
    return { record: null, problem: `cannot read (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})` };
  }
  let doc: unknown;
  try {
    doc = JSON.parse(text);
  } catch {
    return { record: null, problem: 'not valid JSON' };
  }
  const r = doc as RunRecord;
  if (typeof doc !== 'object' || doc === null || r.schema !== 'eggline-run' || !Array.isArray(r.inputs) || typeof r.settings !== 'object') {
    return { record: null, problem: 'not an Eggline run record' };
  }
  return { record: r, problem: null };
}

/** Every folder under `<outDir>/parts` with its run.json (hidden folders skipped). */
async function findParts(outDir: string): Promise<PartEntry[]> {
  const partsDir = join(outDir, 'parts');
  const entries = await fs.readdir(partsDir, { withFileTypes: true }).catch((e: NodeJS.ErrnoException) => {
    throw new MergeRefusal(e.code === 'ENOENT'
      ? `no folder ${partsDir} (run "eggline batch <folder> --out ${outDir} --shard K/N" for each part first)`
      : `cannot read ${partsDir} (${e.code ?? e.message})`);
  });
  const out: PartEntry[] = [];
  for (const e of entries) {
    if (!e.isDirectory() || e.name.startsWith('.')) continue;
    out.push({ folder: e.name, ...(await readPartRecord(join(partsDir, e.name))) });
  }
  return out;
}

/** Read one part's results (and movies) and check them against its run.json. */
async function readPartResults(outDir: string, entry: PartEntry): Promise<ResultsDoc> {
  const path = join(outDir, 'parts', entry.folder, 'results.json');
  const where = `parts/${entry.folder}/results.json`;
  let text: string;
  try {
    text = await fs.readFile(path, 'utf8');
  } catch (e) {
    throw new MergeRefusal(`${where}: cannot read (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
  }
  let doc: ResultsDoc;
  try {
    doc = resultsDocFromJson(text);
  } catch (e) {
    throw new MergeRefusal(`${where}: ${(e as Error).message.replace(/^results\.json: /, '')}`);
  }
  const record = entry.record as RunRecord;
  const done = new Set(record.inputs.filter((i) => i.status !== 'not-run').map((i) => i.file));
  const stray = [...doc.results, ...doc.movies].find((r) => !done.has(r.file));
  if (stray) throw new MergeRefusal(`${where} holds ${stray.file}, which parts/${entry.folder}/run.json does not list as analysed`);
  return doc;
}

/** Merge the parts under `<outDir>/parts` into `<outDir>`; rejects with MergeRefusal (one line) when it must not. */
export async function mergeParts(opts: MergePartsOptions): Promise<MergePartsResult> {
  const entries = await findParts(opts.outDir);
  const checked = checkParts(entries, opts.allowMissing);
  if (!checked.ok) throw new MergeRefusal(checked.message);
  const { plan } = checked;
  const records = plan.present.map((e) => e.record as RunRecord);
  const all: EmbryoResult[] = [];
  const movieRecords: MovieRecord[] = [];
  const owner = new Map<string, string>();
  for (const entry of plan.present) {
    const { results, movies } = await readPartResults(opts.outDir, entry);
    movieRecords.push(...movies);
    for (const r of results) {
      const before = owner.get(r.file);
      if (before !== undefined && before !== entry.folder) throw new MergeRefusal(`${r.file} has rows in both parts/${before} and parts/${entry.folder}`);
      owner.set(r.file, entry.folder);
      all.push(r);
    }
  }
  const results = orderLikeOneRun(all);
  const first = records[0];
  const shard = first.shard as NonNullable<RunRecord['shard']>;
  const listed = records.reduce((n, r) => n + r.inputs.length, 0);
  if (plan.missingParts.length === 0 && listed !== shard.inputCount) {
    throw new MergeRefusal(`the parts list ${listed} files, but the input list they were made from has ${shard.inputCount}`);
  }
  const absent = plan.missingParts.filter((k) => !plan.present.some((e) => e.record?.shard?.part === k));
  const ofAbsent = await filesOfMissingParts(first.folder, opts.outDir, plan.parts, absent, shard.inputListSha256);
  const notRun = records.filter(isUnfinished).flatMap((r) => r.inputs.filter((i) => i.status === 'not-run').map((i) => i.file));
  const missingFiles = ofAbsent === null ? null : orderLikeOneRun([...ofAbsent, ...notRun].map((file) => ({ file }))).map((f) => f.file);
  const warnings = [...plan.warnings];
  if (missingFiles === null) warnings.push(`the files of missing parts ${absent.join(', ')} cannot be listed: the input folder ${first.folder} cannot be read or has changed`);
  const record = mergeRunRecords(records, {
    runId: randomUUID(), endedAt: new Date().toISOString(), commandLine: opts.commandLine ?? null, outDir: opts.outDir, warnings,
    merge: {
      parts: plan.parts, partsMerged: records.map((r) => r.shard?.part as number), missingParts: plan.missingParts,
      missingFiles, inputListSha256: shard.inputListSha256,
    },
  });
  const movies = orderLikeOneRun(movieRecords);
  const written = await writeBatchOutputs(opts.outDir, results, record, movies);
  // The movies' summaries are made again from their records and results: the same as on one machine.
  const timelapse = movieOutcomes(movies, results);
  if (movies.length > 0) written.push(...await writeTimelapseOutputs(opts.outDir, timelapse.movies, timelapse.failures));
  let cohortError: string | null = null;
  if (opts.cohort) {
    const failures = results.filter((r) => r.status === 'error').map((r) => ({ file: r.file, error: r.error ?? 'error' }));
    const step = await runRequestedCohort(opts.cohort, {
      results: embryoResults(results), failures, outDir: opts.outDir, runRecord: record, movies: timelapse.movies, movieFailures: timelapse.failures,
    });
    written.push(...step.written);
    warnings.push(...step.warnings);
    cohortError = step.error;
  }
  return { record, written, warnings, cohortError, parts: plan.parts, ok: record.ok, failed: record.failed, missingFiles, timelapse };
}

// Write a batch's tables, results.json and run.json into the output folder (each file atomically).
import { promises as fs } from 'node:fs';
import { join } from 'node:path';
import {
  boundariesCsv, embryosCsv, landmarksCsv, profilesCsv, resultsToJson, runRecordToJson, type RunRecord,
} from '../../core/batch';
import type { EmbryoResult, MovieRecord } from '../../core/model';
import { writeFileAtomic } from '../project';

/** Names of the files every batch writes. */
export const OUTPUT_FILES = ['embryos.csv', 'boundaries.csv', 'profiles.csv', 'landmarks.csv', 'results.json', 'run.json'] as const;

/** Write all outputs (results keyed by (file, time point); the movies analysed per time point into results.json);
 *  returns the paths written. */
export async function writeBatchOutputs(outDir: string, results: readonly EmbryoResult[], record: RunRecord, movies: readonly MovieRecord[] = []): Promise<string[]> {
  await fs.mkdir(outDir, { recursive: true });
  const contents: Record<(typeof OUTPUT_FILES)[number], string> = {
    'embryos.csv': embryosCsv(results),
    'boundaries.csv': boundariesCsv(results),
    'profiles.csv': profilesCsv(results),
    'landmarks.csv': landmarksCsv(results),
    'results.json': resultsToJson(results, movies),
    'run.json': runRecordToJson(record),
  };
  // The tables at once (their flushes to disk overlap), then run.json, which says the run is finished, last.
  const tables = OUTPUT_FILES.filter((name) => name !== 'run.json');
  await Promise.all(tables.map((name) => writeFileAtomic(join(outDir, name), contents[name])));
  await writeFileAtomic(join(outDir, 'run.json'), contents['run.json']);
  return OUTPUT_FILES.map((name) => join(outDir, name));
}

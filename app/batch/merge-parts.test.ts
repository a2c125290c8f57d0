import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import {
  boundariesCsv, embryosCsv, landmarksCsv, normalizeResult, profilesCsv, resultsToJson, runRecordToJson, type RunRecord,
} from '../../core/batch';
import { makeDemoCohort } from '../../core/cohort';
import type { EmbryoResult } from '../../core/model';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { assignParts } from '../../core/shard';
import { mergeParts, MergeRefusal } from './merge-parts';

// Demo data: synthetic embryo results (no images) spread over part folders as `eggline batch --shard K/N` writes them.
const dir = mkdtempSync(join(tmpdir(), 'eggline-merge-parts-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function demoResults(count: number): EmbryoResult[] {
  const per = Math.ceil(count / 4);
  const { results } = makeDemoCohort({
    conditions: [0.5, 1, 2, 4].map((f) => ({ name: `dosage-${f}x`, dosage: f, count: per })), seed: 3,
  });
  return results.slice(0, count).map((r, i) => (i % 97 === 5 ? { ...r, status: 'error' as const, error: `${r.file}: not a TIFF file` } : r));
}

/** Write `parts` part folders holding `results` split as the batch splits them (sizes from the file index). */
function writeParts(outDir: string, results: readonly EmbryoResult[], parts: number): void {
  const bytes = results.map((_, i) => 1000 + ((i * 7919) % 5000));
  const part = assignParts(bytes, parts);
  for (let k = 1; k <= parts; k += 1) {
    const mine = results.filter((_, i) => part[i] === k - 1);
    const folder = join(outDir, 'parts', `${k}-of-${parts}`);
    mkdirSync(folder, { recursive: true });
    const record: RunRecord = {
      schema: 'eggline-run', version: 2, runId: `run-${k}`, software: { eggline: '0.1.0', node: '20.19.0', sharp: '0.35.5', libvips: '8.17.0' },
      startedAt: `2026-01-01T00:${String(k % 60).padStart(2, '0')}:00.000Z`, endedAt: '2026-01-01T01:00:00.000Z', commandLine: null,
      folder: join(dir, 'no-such-input'), outDir: folder, projectFile: null, configFile: null, settings: DEFAULT_SETTINGS, jobs: 2,
      timeoutPerFileS: 900, cancelled: false, complete: true, reason: null, note: null, reused: 0,
      ok: mine.filter((r) => r.status === 'ok').length, failed: mine.filter((r) => r.status === 'error').length,
      inputs: mine.map((r) => ({ file: r.file, bytes: 1, sha256: null, status: r.status, error: r.error })), warnings: [],
      shard: { part: k, parts, inputCount: results.length, inputBytes: 0, inputListSha256: 'f'.repeat(64), projectSha256: null },
    };
    writeFileSync(join(folder, 'run.json'), runRecordToJson(record));
    writeFileSync(join(folder, 'results.json'), resultsToJson(mine));
  }
}

describe('mergeParts', () => {
  it('merges 500 parts into the tables a one-machine run writes for the same results', async () => {
    const results = demoResults(1000);
    const outDir = join(dir, 'five-hundred');
    writeParts(outDir, results, 500);
    const heapBefore = process.memoryUsage().heapUsed;
    const t0 = performance.now();
    const merged = await mergeParts({ outDir, allowMissing: false });
    const ms = performance.now() - t0;
    console.log(`merge of 500 parts, ${results.length} embryos: ${ms.toFixed(0)} ms, heap ${((process.memoryUsage().heapUsed - heapBefore) / 2 ** 20).toFixed(0)} MiB more`);
    // Expected: the writers applied to every result in sorted-path order, as a one-machine run lists its files.
    const expected = [...results].sort((a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : 0)).map(normalizeResult);
    expect(readFileSync(join(outDir, 'embryos.csv'), 'utf8')).toBe(embryosCsv(expected));
    expect(readFileSync(join(outDir, 'boundaries.csv'), 'utf8')).toBe(boundariesCsv(expected));
    expect(readFileSync(join(outDir, 'profiles.csv'), 'utf8')).toBe(profilesCsv(expected));
    expect(readFileSync(join(outDir, 'landmarks.csv'), 'utf8')).toBe(landmarksCsv(expected));
    expect(readFileSync(join(outDir, 'results.json'), 'utf8')).toBe(resultsToJson(expected));
    expect([merged.parts, merged.ok + merged.failed, merged.failed]).toEqual([500, 1000, 11]);
    expect(merged.record.inputs.map((i) => i.file)).toEqual(expected.map((r) => r.file));
    expect(merged.record.complete).toBe(true);
    expect(merged.record.startedAt).toBe('2026-01-01T00:00:00.000Z');
  }, 120_000);

  it('holds the rows, not the parts: the same 1000 rows in 2 parts and in 500 parts take about the same memory', async () => {
    // Printed, not asserted: heap figures vary with the collector.
    const results = demoResults(1000);
    for (const parts of [2, 500]) {
      const outDir = join(dir, `rows-${parts}`);
      writeParts(outDir, results, parts);
      globalThis.gc?.();
      const before = process.memoryUsage().heapUsed;
      const t0 = performance.now();
      const merged = await mergeParts({ outDir, allowMissing: false });
      console.log(`${parts} parts, ${merged.ok + merged.failed} rows: ${(performance.now() - t0).toFixed(0)} ms, heap ${((process.memoryUsage().heapUsed - before) / 2 ** 20).toFixed(0)} MiB more`);
      expect(merged.ok + merged.failed).toBe(1000);
    }
  }, 120_000);

  it('with allowMissing says which parts are missing; their files are unknown when the input folder cannot be listed', async () => {
    const results = demoResults(40);
    const outDir = join(dir, 'missing');
    writeParts(outDir, results, 8);
    rmSync(join(outDir, 'parts', '5-of-8'), { recursive: true });
    await expect(mergeParts({ outDir, allowMissing: false })).rejects.toThrow(MergeRefusal);
    const merged = await mergeParts({ outDir, allowMissing: true });
    expect(merged.record.merge?.missingParts).toEqual([5]);
    expect(merged.missingFiles).toBeNull();
    expect(merged.record.complete).toBe(false);
    expect(merged.warnings).toContain(`the files of missing parts 5 cannot be listed: the input folder ${join(dir, 'no-such-input')} cannot be read or has changed`);
  });

  it('refuses parts that together list fewer files than their input list', async () => {
    const outDir = join(dir, 'short');
    writeParts(outDir, demoResults(8), 2);
    const path = join(outDir, 'parts', '2-of-2', 'run.json');
    const record = JSON.parse(readFileSync(path, 'utf8')) as RunRecord;
    writeFileSync(path, runRecordToJson({ ...record, inputs: record.inputs.slice(1) }));
    writeFileSync(join(outDir, 'parts', '2-of-2', 'results.json'), resultsToJson([]));
    await expect(mergeParts({ outDir, allowMissing: false })).rejects.toThrow('the parts list 7 files, but the input list they were made from has 8');
  });

  it('refuses a results.json that holds a file its run.json does not list', async () => {
    const results = demoResults(8);
    const outDir = join(dir, 'stray');
    writeParts(outDir, results, 2);
    const other = results.find((r) => !readFileSync(join(outDir, 'parts', '1-of-2', 'run.json'), 'utf8').includes(r.file)) as EmbryoResult;
    writeFileSync(join(outDir, 'parts', '1-of-2', 'results.json'), resultsToJson([other]));
    await expect(mergeParts({ outDir, allowMissing: false })).rejects.toThrow(`parts/1-of-2/results.json holds ${other.file}, which parts/1-of-2/run.json does not list as analysed`);
  });
});

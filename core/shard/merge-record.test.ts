import { describe, expect, it } from 'vitest';
import type { RunInput, RunRecord } from '../batch';
import { DEFAULT_SETTINGS } from '../settings';
import { mergeRunRecords, orderLikeOneRun } from './merge-record';

const input = (file: string, status: RunInput['status'] = 'ok'): RunInput => ({ file, bytes: 1, sha256: null, status, error: null });
const rec = (k: number, inputs: RunInput[], startedAt: string): RunRecord => ({
  schema: 'eggline-run', version: 2, runId: `r${k}`, software: { eggline: '0.1.0', node: '20', sharp: null, libvips: null },
  startedAt, endedAt: startedAt, commandLine: null, folder: '/in', outDir: `/o/parts/${k}-of-2`, projectFile: null, configFile: null,
  settings: DEFAULT_SETTINGS, jobs: k, timeoutPerFileS: 900, cancelled: false, complete: true, reason: null, note: null, reused: 0, ok: inputs.length, failed: 0, inputs, warnings: ['w'],
  shard: { part: k, parts: 2, inputCount: 4, inputBytes: 4, inputListSha256: 'x', projectSha256: null },
});
const merge = { parts: 2, partsMerged: [1, 2], missingParts: [], missingFiles: [], inputListSha256: 'x' };

describe('orderLikeOneRun', () => {
  it('sorts by path in code-unit order (upper case before lower, "/" before letters) and keeps each file\'s rows in order', () => {
    const rows = [{ file: 'b.tif', t: 0 }, { file: 'a/z.tif', t: 0 }, { file: 'B.tif', t: 0 }, { file: 'b.tif', t: 1 }, { file: 'a.tif', t: 0 }];
    expect(orderLikeOneRun(rows).map((r) => `${r.file}#${r.t}`)).toEqual(['B.tif#0', 'a.tif#0', 'a/z.tif#0', 'b.tif#0', 'b.tif#1']);
  });
});

describe('mergeRunRecords', () => {
  it('lists every input in one-run order, sums the counts, keeps the earliest start and records the merge', () => {
    const r = mergeRunRecords([rec(2, [input('b.tif'), input('d.tif')], '2026-01-01T00:05:00Z'), rec(1, [input('a.tif'), input('c.tif')], '2026-01-01T00:01:00Z')], {
      runId: 'm', endedAt: 'E', commandLine: ['eggline', 'merge', '/o'], outDir: '/o', merge, warnings: ['x'],
    });
    expect(r.inputs.map((i) => i.file)).toEqual(['a.tif', 'b.tif', 'c.tif', 'd.tif']);
    expect([r.ok, r.failed, r.jobs, r.startedAt, r.cancelled, r.outDir]).toEqual([4, 0, 2, '2026-01-01T00:01:00Z', false, '/o']);
    expect(r.warnings).toEqual(['w', 'x']);
    expect(r.merge).toEqual(merge);
    expect(r.shard).toBeUndefined();
  });

  it('says the record does not cover the whole input when parts are missing', () => {
    const r = mergeRunRecords([rec(1, [input('a.tif')], 'S')], {
      runId: 'm', endedAt: 'E', commandLine: null, outDir: '/o', merge: { ...merge, partsMerged: [1], missingParts: [2], missingFiles: ['b.tif'] }, warnings: [],
    });
    expect(r.cancelled).toBe(true);
  });
});

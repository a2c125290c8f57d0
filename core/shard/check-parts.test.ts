import { describe, expect, it } from 'vitest';
import type { RunRecord, ShardInfo } from '../batch';
import { DEFAULT_SETTINGS } from '../settings';
import { canonicalJson, checkParts, firstDifference, type PartEntry } from './check-parts';

// Demo data: minimal part records of a batch split into parts.
function part(k: number, n: number, over: { shard?: Partial<ShardInfo>; record?: Partial<RunRecord> } = {}): PartEntry {
  const shard: ShardInfo = {
    part: k, parts: n, inputCount: 10, inputBytes: 1000, inputListSha256: 'a'.repeat(64), projectSha256: null, ...over.shard,
  };
  const record: RunRecord = {
    schema: 'eggline-run', version: 2, runId: `r${k}`, software: { eggline: '0.1.0', node: '20.19.0', sharp: '0.35.5', libvips: '8.17' },
    startedAt: '2026-01-01T00:00:00.000Z', endedAt: '2026-01-01T00:01:00.000Z', commandLine: null, folder: '/in', outDir: `/out/parts/${k}-of-${n}`,
    projectFile: null, configFile: null, settings: DEFAULT_SETTINGS, jobs: 2, timeoutPerFileS: 900, cancelled: false, complete: true, reason: null, note: null, reused: 0, ok: 1, failed: 0,
    inputs: [], warnings: [], shard, ...over.record,
  };
  return { folder: `${k}-of-${n}`, record };
}

const refused = (entries: PartEntry[], allowMissing = false): string => {
  const r = checkParts(entries, allowMissing);
  return r.ok ? 'accepted' : r.message;
};

describe('checkParts', () => {
  it('accepts every part once, sorted by part number', () => {
    const r = checkParts([part(3, 3), part(1, 3), part(2, 3)], false);
    expect(r.ok && r.plan.present.map((e) => e.folder)).toEqual(['1-of-3', '2-of-3', '3-of-3']);
    expect(r.ok && r.plan.missingParts).toEqual([]);
  });

  it('refuses a missing part, naming it and how to rerun it', () => {
    expect(refused([part(1, 3), part(3, 3)])).toBe('part 2 of 3 is missing (no folder parts/2-of-3); rerun it with --shard 2/3, or merge what is there with --allow-missing');
    expect(refused([part(1, 2), { folder: '2-of-2', record: null, problem: 'cannot read (ENOENT)' }]))
      .toBe('part 2 of 2 is missing (parts/2-of-2 has no run.json (cannot read (ENOENT))); rerun it with --shard 2/2, or merge what is there with --allow-missing');
  });

  it('refuses a part that stopped early', () => {
    expect(refused([part(1, 2), part(2, 2, { record: { cancelled: true } })]))
      .toBe('part 2 of 2 did not finish (parts/2-of-2/run.json says it stopped early); rerun it with --shard 2/2, or merge what is there with --allow-missing');
  });

  it('with allowMissing lists the missing and unfinished parts instead', () => {
    const r = checkParts([part(1, 4), part(2, 4, { record: { cancelled: true } })], true);
    expect(r.ok && r.plan.missingParts).toEqual([2, 3, 4]);
    expect(r.ok && r.plan.present.map((e) => e.folder)).toEqual(['1-of-4', '2-of-4']);
  });

  it('refuses a part present twice', () => {
    expect(refused([part(1, 2), part(2, 2), { ...part(2, 2), folder: 'copy of 2' }]))
      .toBe('part 2 of 2 is present twice: parts/2-of-2 and parts/copy of 2');
  });

  it('refuses parts of different splits', () => {
    expect(refused([part(1, 2), part(2, 2), part(1, 3)])).toBe('parts of different splits: parts/1-of-2 is one of 2 parts, parts/1-of-3 one of 3');
    expect(refused([part(1, 2), part(2, 2), { folder: '3-of-3', record: null }])).toBe('parts of different splits: parts/1-of-2 is one of 2 parts, parts/3-of-3 one of 3');
  });

  it('refuses different input lists, Eggline versions, settings and hand edits', () => {
    expect(refused([part(1, 2), part(2, 2, { shard: { inputListSha256: 'b'.repeat(64) } })]))
      .toBe('parts/2-of-2 was made from another input list than parts/1-of-2 (10 vs 10 files, or files changed in between)');
    expect(refused([part(1, 2), part(2, 2, { record: { software: { eggline: '0.2.0', node: '20.19.0', sharp: '0.35.5', libvips: '8.17' } } })]))
      .toBe('parts/2-of-2 was made by Eggline 0.2.0, parts/1-of-2 by 0.1.0');
    expect(refused([part(1, 2), part(2, 2, { record: { settings: { ...DEFAULT_SETTINGS, fitRangeEl: [0.2, 0.6] } } })]))
      .toBe('parts/2-of-2 was made with other settings than parts/1-of-2 (fitRangeEl: [0.2,0.6] vs [0.1,0.6])');
    expect(refused([part(1, 2), part(2, 2, { shard: { projectSha256: 'c'.repeat(64) } })]))
      .toBe('parts/2-of-2 was made with other hand edits (project file) than parts/1-of-2');
  });

  it('only warns when Node, sharp or libvips differ', () => {
    const r = checkParts([part(1, 2), part(2, 2, { record: { software: { eggline: '0.1.0', node: '22.1.0', sharp: '0.35.5', libvips: '8.17' } } })], false);
    expect(r.ok && r.plan.warnings).toEqual(['parts differ in node version (20.19.0 in parts/1-of-2, 22.1.0 in parts/2-of-2)']);
  });

  it('refuses a folder whose record is not a part, or says another part than its name', () => {
    const whole = part(1, 2);
    expect(refused([{ folder: '1-of-2', record: { ...(whole.record as RunRecord), shard: undefined } }]))
      .toBe('parts/1-of-2/run.json is not the record of a part (it has no "shard"; was it made with --shard?)');
    expect(refused([{ ...part(1, 2), folder: '2-of-2' }])).toBe('parts/2-of-2 holds part 1 of 2, not what its name says');
  });

  it('refuses an empty parts folder', () => {
    expect(refused([])).toBe('no parts found (expected folders named K-of-N, made by "eggline batch --shard K/N")');
    expect(refused([{ folder: '1-of-2', record: null }])).toBe('no part has finished: parts/1-of-2 has no run.json');
  });
});

describe('canonicalJson and firstDifference', () => {
  it('ignore key order and name the first differing key', () => {
    expect(canonicalJson({ b: 1, a: { d: 2, c: [3, { f: 1, e: 0 }] } })).toBe('{"a":{"c":[3,{"e":0,"f":1}],"d":2},"b":1}');
    expect(firstDifference({ a: 1, b: [1, 2] }, { b: [1, 2], a: 1 })).toBeNull();
    expect(firstDifference({ a: 1, b: 2 }, { a: 1 })).toBe('b: 2 vs unset');
  });
});

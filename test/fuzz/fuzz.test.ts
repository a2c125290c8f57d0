// Seeded fuzz test: a few hundred damaged copies of small stacks through the real batch (worker processes).
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseCsv } from '../../core/csv';
import { runBatch } from '../../app/batch/run-batch';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { ensureBuilt, ROOT } from '../cli/helpers';
import { MUTATION_KINDS, mutants } from './mutants';

// Demo data: mutants of invented fixtures (seed 10); the limits (5 s a file, 300 characters a cell) are this project's.
const dir = mkdtempSync(join(tmpdir(), 'eggline-fuzz-'));
const input = join(dir, 'in');
const COUNT = 350;
beforeAll(() => {
  ensureBuilt();
  mkdirSync(input);
  for (const m of mutants(COUNT, 10)) writeFileSync(join(input, m.name), m.bytes);
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('fuzz', () => {
  it('every damaged file gets exactly one row, no worker overruns 5 s, no cell is over 300 characters', async () => {
    const summary = await runBatch({
      folder: input, outDir: join(dir, 'out'), settings: DEFAULT_SETTINGS, doc: null, jobs: 2, timeoutPerFileS: 5,
      maxMemoryBytes: 1.5 * 2 ** 30, workerPath: join(ROOT, 'dist', 'batch-worker.mjs'),
    });
    expect(summary.complete).toBe(true);
    const rows = parseCsv(readFileSync(join(dir, 'out', 'embryos.csv'), 'utf8')).slice(1);
    expect(rows.map((r) => r[0]).sort()).toEqual([...mutants(COUNT, 10)].map((m) => m.name).sort());
    expect(new Set(MUTATION_KINDS.filter((k) => rows.some((r) => r[0].endsWith(`${k}.tif`))))).toEqual(new Set(MUTATION_KINDS));
    for (const r of rows) {
      expect(r[2].length, r[0]).toBeLessThanOrEqual(300);
      expect(r[3].length, r[0]).toBeLessThanOrEqual(300);
      expect(r[2], r[0]).not.toMatch(/timed out|crashed|ran out of memory|used more than/);
    }
  }, 120_000);
});

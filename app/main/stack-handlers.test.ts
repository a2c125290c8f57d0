import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { DEMO_MOVIE_PARAMS } from '../../core/synth';
import { demoMovieFile } from '../batch/write-demo';
import { createDefaultEngine } from '../engine/default-engine';
import { createPathAllowList } from './allow-list';
import type { ShellContext } from './context';
import { loadStack, requireTimeOptions } from './stack-handlers';

// Source: demo data — a short variant of the demo movie.
describe('loading a movie\'s time point for the Embryo view', () => {
  const dir = mkdtempSync(join(tmpdir(), 'eggline-stack-handlers-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  const file = 'short.ome.tif';
  const path = join(dir, file);
  writeFileSync(path, demoMovieFile({ ...DEMO_MOVIE_PARAMS, frames: 4 }));
  const context = (): ShellContext => {
    const allow = createPathAllowList();
    allow.allowTree('read', dir);
    return {
      deps: { dataDir: dir, dialogs: null as never, emitBatchProgress: () => undefined }, engine: createDefaultEngine(), allow,
      batches: new Map(), movies: new Set(), viewLoads: new Set(), noteRecent: async () => undefined,
    };
  };
  const time = { timeStepS: null, axisPerTime: false };

  it('a newer load with time options stops the one under way, which fails as cancelled; the newer one is answered', async () => {
    const ctx = context();
    const first = loadStack(ctx, path, { ...DEFAULT_SETTINGS, timeIndex: 1 }, time);
    const second = loadStack(ctx, path, { ...DEFAULT_SETTINGS, timeIndex: 2 }, time);
    await expect(first).rejects.toMatchObject({ code: 'cancelled', message: 'short.ome.tif: loading cancelled (another view was asked for)' });
    expect((await second).info.sizeT).toBe(4);
    expect(ctx.viewLoads.size).toBe(0);
  });

  it('checks the time options with one-line messages', () => {
    expect(requireTimeOptions(undefined)).toBeNull();
    expect(requireTimeOptions({ timeStepS: 30, axisPerTime: true })).toEqual({ timeStepS: 30, axisPerTime: true });
    expect(() => requireTimeOptions({ timeStepS: 0, axisPerTime: false })).toThrow('time.timeStepS must be a positive number of seconds or null');
    expect(() => requireTimeOptions({ timeStepS: null })).toThrow('time.axisPerTime must be true or false');
    expect(() => requireTimeOptions(3)).toThrow('time must be {timeStepS, axisPerTime} or null');
  });
});

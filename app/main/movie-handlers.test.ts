import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { DEMO_MOVIE_PARAMS } from '../../core/synth';
import { demoMovieFile } from '../batch/write-demo';
import { createDefaultEngine } from '../engine/default-engine';
import { newProject } from '../project';
import { createPathAllowList } from './allow-list';
import type { ShellContext } from './context';
import { analyseMovie, cancelMovie, requireMovieOptions } from './movie-handlers';

// Source: demo data — a short variant of the demo movie, and a damaged copy of it.
describe('the movie handlers', () => {
  const dir = mkdtempSync(join(tmpdir(), 'eggline-movie-handlers-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  const file = 'short.ome.tif';
  const path = join(dir, file);
  writeFileSync(path, demoMovieFile({ ...DEMO_MOVIE_PARAMS, frames: 6 }));
  writeFileSync(join(dir, 'one.tif'), demoMovieFile({ ...DEMO_MOVIE_PARAMS, frames: 2 }).subarray(0, 10));
  const doc = { ...newProject(dir), settings: { ...DEFAULT_SETTINGS, boundaryChannels: [2] } };
  const options = { axisPerTime: false, tauRangeEl: [0.1, 0.4] as const, baselineFrames: 1, timeStepS: null };
  const context = (): ShellContext => {
    const allow = createPathAllowList();
    allow.allowTree('read', dir);
    return { deps: { dataDir: dir, dialogs: null as never, emitBatchProgress: () => undefined }, engine: createDefaultEngine(), allow, batches: new Map(), movies: new Set(), viewLoads: new Set(), noteRecent: async () => undefined };
  };

  it('refuses a second movie while one runs, stops when cancelled, and names the file when it cannot open', async () => {
    const ctx = context();
    const first = analyseMovie(ctx, path, file, doc, options);
    await expect(analyseMovie(ctx, path, file, doc, options)).rejects.toThrow('a movie is already being analysed');
    cancelMovie(ctx);
    await expect(first).rejects.toMatchObject({ code: 'cancelled', message: 'short.ome.tif: analysis over time cancelled' });
    await expect(analyseMovie(ctx, join(dir, 'one.tif'), 'one.tif', doc, options)).rejects.toThrow(/^one\.tif: /);
    expect(() => requireMovieOptions({ ...options, baselineFrames: -1 })).toThrow('options.baselineFrames must be a whole number from 0 to 1000');
    expect(() => requireMovieOptions({ ...options, tauRangeEl: [0.5, 0.2] })).toThrow(/options\.tauRangeEl/);
  });
});

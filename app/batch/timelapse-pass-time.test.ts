// The time pass over a movie shorter than the time points asked for (demo data: the demo movie's scenario cut to 4
// frames): the file's own time points in the project are cut as --time is, with a warning naming where they came
// from, and the window's analysis of a movie whose chosen time points all lie past its end rejects with that warning.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { ProjectDoc } from '../../core/contract';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { DEMO_MOVIE_PARAMS } from '../../core/synth';
import { newProject } from '../project';
import { analyseMovieAtPath, analyseMovieFile, DEFAULT_TIMELAPSE_OPTIONS } from './timelapse-pass';
import { demoMovieFile } from './write-demo';

const dir = mkdtempSync(join(tmpdir(), 'eggline-time-pass-cut-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const file = 'm.ome.tif';
writeFileSync(join(dir, file), demoMovieFile({ ...DEMO_MOVIE_PARAMS, frames: 4, frameIntervalS: 480 }));
const withTime = (time: string): ProjectDoc => ({ ...newProject(null), files: { [file]: { time } } }) as unknown as ProjectDoc;

describe('a movie\'s own time points in the project, past its end', () => {
  it('are cut as --time is, and the warning says they came from the project', async () => {
    const run = await analyseMovieFile(dir, file, DEFAULT_SETTINGS, withTime('9'), DEFAULT_TIMELAPSE_OPTIONS);
    const warning = `${file}: time point 9 asked for (this file's time points in the project, 0-based), but the movie has 4 time points (0 to 3); time point 3 was analysed`;
    expect(run!.record).toMatchObject({ timeIndices: [3], error: null });
    expect(run!.record.warnings[0]).toBe(warning);
    expect(run!.results.map((r) => [r.tIndex, r.warnings[0]])).toEqual([[3, warning]]);
  });

  it('in the window, none left: the analysis rejects with the one-line warning instead of an empty movie', async () => {
    await expect(analyseMovieAtPath(join(dir, file), file, DEFAULT_SETTINGS, withTime('5:9'), DEFAULT_TIMELAPSE_OPTIONS, {}))
      .rejects.toThrow(`${file}: time points 5:9 asked for (this file's time points in the project, 0-based), but the movie has 4 time points (0 to 3); no time point was analysed over time`);
  });
});

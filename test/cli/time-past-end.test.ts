// `eggline batch --time` over movies of unequal length (demo data): each movie is analysed over the time points it
// has. A range is cut at a movie's last time point and a single time point past the end is analysed at the last one,
// each with a warning naming the file, the asked and the analysed time points; a range wholly past a movie's end gives
// that movie no time points and a warning, and no failed row. The time points are independent of the selection (the
// movie's embryo is found on time points sampled over the whole movie), so a time point's row is the same whatever
// --time picked it.
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseCsv } from '../../core/csv';
import { DEMO_MOVIE_PARAMS } from '../../core/synth';
import { demoMovieFile } from '../../app/batch/write-demo';
import { cli, ensureBuilt } from './helpers';

const dir = mkdtempSync(join(tmpdir(), 'eggline-cli-time-past-end-'));
const input = join(dir, 'in');
const table = (path: string): Record<string, string>[] => {
  const [header, ...rows] = parseCsv(readFileSync(path, 'utf8'));
  return rows.map((r) => Object.fromEntries(header.map((h, i) => [h, r[i]])));
};
const LONG = 'long-movie.ome.tif';
const SHORT = 'short-movie.ome.tif';
const rowsOf = (out: string, name: string, file: string) => table(join(out, name)).filter((r) => r.file === file);
const without = (row: Record<string, string>, ...keys: string[]) => Object.fromEntries(Object.entries(row).filter(([k]) => !keys.includes(k)));
interface MovieJson { file: string; timeIndices: number[]; warnings: string[]; error: string | null }
const moviesJson = (out: string): MovieJson[] => (JSON.parse(readFileSync(join(out, 'results.json'), 'utf8')) as { movies: MovieJson[] }).movies;

beforeAll(() => {
  ensureBuilt();
  mkdirSync(input, { recursive: true });
  // Demo data: the demo movie's scenario shortened to 8 frames and to 4 (8 min apart), written by the synthetic movie writer.
  writeFileSync(join(input, LONG), demoMovieFile({ ...DEMO_MOVIE_PARAMS, frames: 8, frameIntervalS: 480 }));
  writeFileSync(join(input, SHORT), demoMovieFile({ ...DEMO_MOVIE_PARAMS, frames: 4, frameIntervalS: 480 }));
}, 120_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('eggline batch --time past a short movie\'s end', () => {
  const single = join(dir, 'out-6');
  const range = join(dir, 'out-2-5');

  it('analyses a single time point past the end at the movie\'s last, with a warning naming the file, the asked and the analysed time point', async () => {
    const r = await cli(['batch', input, '--out', single, '--jobs', '1', '--time', '6']);
    expect(r.code).toBe(0);
    const warning = `${SHORT}: time point 6 asked for (--time, 0-based), but the movie has 4 time points (0 to 3); time point 3 was analysed`;
    expect(r.stderr).toContain(`eggline: warning: ${warning}\n`);
    expect(r.stderr).not.toContain(`${SHORT}: ${SHORT}:`);
    expect(table(join(single, 'timecourse.csv')).map((row) => [row.file, row.t_index])).toEqual([[LONG, '6'], [SHORT, '3']]);
    const [short] = rowsOf(single, 'timecourse.csv', SHORT);
    expect([short.status, short.error]).toEqual(['ok', '']);
    expect(short.warnings).toContain(warning);
    expect(rowsOf(single, 'timecourse.csv', LONG)[0].warnings).not.toContain('asked for');
    // embryos.csv: each movie once, at its analysed time point; no failed row.
    expect(table(join(single, 'embryos.csv')).map((row) => [row.file, row.status, row.t_index])).toEqual([[LONG, 'ok', '6'], [SHORT, 'ok', '3']]);
    // results.json's movie records say what was analysed; timelapse.html shows the warning.
    expect(moviesJson(single).map((m) => [m.file, m.timeIndices, m.error])).toEqual([[LONG, [6], null], [SHORT, [3], null]]);
    expect(moviesJson(single).find((m) => m.file === SHORT)!.warnings).toContain(warning);
    expect(readFileSync(join(single, 'timelapse.html'), 'utf8')).toContain(warning);
  }, 180_000);

  it('cuts a range at the movie\'s last time point, with a warning; the time points\' rows are those any --time gives them', async () => {
    const r = await cli(['batch', input, '--out', range, '--jobs', '1', '--time', '2:5']);
    expect(r.code).toBe(0);
    const warning = `${SHORT}: time points 2:5 asked for (--time, 0-based), but the movie has 4 time points (0 to 3); time points 2 to 3 were analysed`;
    expect(r.stderr).toContain(`eggline: warning: ${warning}\n`);
    expect(table(join(range, 'timecourse.csv')).map((row) => [row.file, row.t_index]))
      .toEqual([[LONG, '2'], [LONG, '3'], [LONG, '4'], [LONG, '5'], [SHORT, '2'], [SHORT, '3']]);
    const shortRows = rowsOf(range, 'timecourse.csv', SHORT);
    for (const row of shortRows) expect(row.warnings).toContain(warning);
    expect(rowsOf(range, 'timecourse.csv', LONG).every((row) => !row.warnings.includes('asked for'))).toBe(true);
    // Time point 3 of the short movie: the same numbers as with --time 6, but for the warning.
    expect(without(shortRows[1], 'warnings')).toEqual(without(rowsOf(single, 'timecourse.csv', SHORT)[0], 'warnings'));
    expect(rowsOf(range, 'timecourse_profiles.csv', SHORT).filter((row) => row.t_index === '3'))
      .toEqual(rowsOf(single, 'timecourse_profiles.csv', SHORT));
    expect(moviesJson(range).map((m) => [m.file, m.timeIndices])).toEqual([[LONG, [2, 3, 4, 5]], [SHORT, [2, 3]]]);
    expect(readFileSync(join(range, 'timelapse.html'), 'utf8')).toContain(warning);
  }, 180_000);

  it('gives a movie that ends before a range starts no time points and a warning, fails no row, and goes on with the others', async () => {
    const out = join(dir, 'out-5-9');
    const r = await cli(['batch', input, '--out', out, '--jobs', '1', '--time', '5:9']);
    expect(r.code).toBe(0);
    const warning = `${SHORT}: time points 5:9 asked for (--time, 0-based), but the movie has 4 time points (0 to 3); no time point was analysed over time`;
    expect(r.stderr).toContain(`eggline: warning: ${warning}\n`);
    const cut = `${LONG}: time points 5:9 asked for (--time, 0-based), but the movie has 8 time points (0 to 7); time points 5 to 7 were analysed`;
    expect(r.stderr).toContain(`eggline: warning: ${cut}\n`);
    expect(r.stdout).toContain('Time analysis of 1 movie:');
    expect(table(join(out, 'timecourse.csv')).map((row) => [row.file, row.t_index])).toEqual([[LONG, '5'], [LONG, '6'], [LONG, '7']]);
    // The short movie keeps its main-pass row (time point 0, as --time-index says), with the warning, not an error.
    const embryos = table(join(out, 'embryos.csv'));
    expect(embryos.map((row) => [row.file, row.status, row.error, row.t_index])).toEqual([[LONG, 'ok', '', '7'], [SHORT, 'ok', '', '0']]);
    expect(embryos[1].warnings.startsWith(warning)).toBe(true);
    const results = (JSON.parse(readFileSync(join(out, 'results.json'), 'utf8')) as { results: { file: string; tIndex: number; warnings: string[] }[] }).results;
    expect(results.filter((x) => x.file === SHORT).map((x) => [x.tIndex, x.warnings[0]])).toEqual([[0, warning]]);
    expect(moviesJson(out).find((m) => m.file === SHORT)).toMatchObject({ timeIndices: [], error: null, warnings: [warning] });
    const page = readFileSync(join(out, 'timelapse.html'), 'utf8');
    expect(page).toContain('Movies not analysed over time');
    expect(page).toContain(warning);
  }, 180_000);
});

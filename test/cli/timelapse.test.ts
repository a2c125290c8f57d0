// `eggline batch` on a folder with a movie (demo data): the time analysis's tables, figures and page.
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseCsv } from '../../core/csv';
import { DEMO_MOVIE_PARAMS } from '../../core/synth';
import { MODEL_FIT_COLUMNS } from '../../core/timelapse';
import { demoMovieFile } from '../../app/batch/write-demo';
import { writePlainTiff } from '../../core/tiff';
import { cli, ensureBuilt } from './helpers';

const dir = mkdtempSync(join(tmpdir(), 'eggline-cli-time-'));
const input = join(dir, 'in');
const table = (path: string): Record<string, string>[] => {
  const [header, ...rows] = parseCsv(readFileSync(path, 'utf8'));
  return rows.map((r) => Object.fromEntries(header.map((h, i) => [h, r[i]])));
};

beforeAll(() => {
  ensureBuilt();
  mkdirSync(input, { recursive: true });
  // Demo data: the demo movie's scenario, shortened to 24 frames 8 min apart (about 3 h) to keep the test quick.
  writeFileSync(join(input, 'movie.ome.tif'), demoMovieFile({ ...DEMO_MOVIE_PARAMS, frames: 24, frameIntervalS: 480 }));
  // A plain single-page file is not a movie: the time pass leaves it alone.
  writeFileSync(join(input, 'single.tif'), writePlainTiff([{ width: 8, height: 8, data: new Uint16Array(64) }]));
}, 120_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('eggline batch on a movie', () => {
  it('writes timecourse, accumulation and model-fit tables, SVG figures and timelapse.html', async () => {
    const out = join(dir, 'out');
    const r = await cli(['batch', input, '--out', out, '--jobs', '1']);
    expect(r.stdout).toContain('Time analysis of 1 movie');
    const course = table(join(out, 'timecourse.csv'));
    expect(course).toHaveLength(24);
    expect(course.map((row) => row.t_index)).toEqual(Array.from({ length: 24 }, (_, t) => String(t)));
    expect(course[3].t_s).toBe('1440');
    // Where the times came from, as pixel_size_source says it for the pixel size (the file's OME TimeIncrement).
    expect(new Set(course.map((row) => row.time_source))).toEqual(new Set(['ome-increment']));
    // Demo scenario: λ = 100 µm on a 500 µm egg, so 0.2 EL once formed.
    expect(Math.abs(Number(course[23].lambda_el) / 0.2 - 1)).toBeLessThan(0.05);
    const acc = table(join(out, 'accumulation.csv'));
    expect(acc.length).toBeGreaterThan(30);
    const fit = table(join(out, 'model_fit.csv'));
    expect(Object.keys(fit[0])).toEqual([...MODEL_FIT_COLUMNS]);
    // k = 1/1200 s⁻¹ in the scenario; a 24-frame movie resolves it to within 25%.
    expect(Math.abs(Number(fit[0].k_per_s) * 1200 - 1)).toBeLessThan(0.25);
    const page = readFileSync(join(out, 'timelapse.html'), 'utf8');
    expect(page).toContain('<h2>movie.ome.tif</h2>');
    expect(page).toContain('24 time points over 11040 s (times from: ome-increment)');
    expect(page.match(/<svg /g)).toHaveLength(3);
    expect(readFileSync(join(out, 'timelapse', 'movie-lambda.svg'), 'utf8')).toMatch(/^<svg /);
    // No boundary channel is set (no project file), so only the gradient channel: 100 bins per time point.
    expect(table(join(out, 'timecourse_profiles.csv')).length).toBe(24 * 100);
  });

  it('keys the main tables by (file, time point): every time point of the movie in profiles.csv and boundaries.csv', () => {
    const out = join(dir, 'out');
    const profiles = table(join(out, 'profiles.csv'));
    const movie = profiles.filter((row) => row.file === 'movie.ome.tif');
    expect(movie).toHaveLength(24 * 100);
    // Frames 480 s apart (demo data): time point t at t·480 s, written beside its index.
    expect([...new Set(movie.map((row) => `${row.t_index}@${row.t_s}`))]).toEqual(Array.from({ length: 24 }, (_, t) => `${t}@${t * 480}`));
    // The same rows as timecourse_profiles.csv, the older table of the time pass.
    const course = table(join(out, 'timecourse_profiles.csv'));
    expect(movie.map((row) => [row.t_index, row.x_el, row.mean])).toEqual(course.map((row) => [row.t_index, row.x_el, row.mean]));
    // The single-page file has one time point: t_index 0 and no time.
    const single = table(join(out, 'embryos.csv')).find((row) => row.file === 'single.tif')!;
    expect([single.t_index, single.t_s]).toEqual(['0', '']);
    const boundaries = table(join(out, 'boundaries.csv')).filter((row) => row.file === 'movie.ome.tif');
    expect(boundaries.map((row) => row.t_index)).toEqual(table(join(out, 'timecourse_boundaries.csv')).map((row) => row.t_index));
    // embryos.csv keeps one row per file; a movie's is its last analysed time point, equal to timecourse.csv's last row.
    const embryos = table(join(out, 'embryos.csv'));
    expect(embryos.map((row) => row.file)).toEqual(['movie.ome.tif', 'single.tif']);
    // (timecourse.csv adds where the times came from at the end.)
    const { time_source: timeSource, ...last } = table(join(out, 'timecourse.csv'))[23];
    expect(timeSource).toBe('ome-increment');
    expect(embryos[0]).toEqual({ ...last, file: 'movie.ome.tif' });
    const doc = JSON.parse(readFileSync(join(out, 'results.json'), 'utf8')) as { schemaVersion: number; results: { file: string; tIndex: number }[]; movies: { file: string; timeIndices: number[] }[] };
    expect(doc.schemaVersion).toBe(2);
    expect(doc.results.filter((r) => r.file === 'movie.ome.tif').map((r) => r.tIndex)).toEqual(Array.from({ length: 24 }, (_, t) => t));
    expect(doc.movies.map((m) => [m.file, m.timeIndices.length])).toEqual([['movie.ome.tif', 24]]);
  });

  it('analyses a chosen range of time points, and refuses bad time flags with a usage error', async () => {
    const out = join(dir, 'out-range');
    const r = await cli(['batch', input, '--out', out, '--jobs', '1', '--time', '20:23', '--baseline-frames', '0']);
    expect(table(join(out, 'timecourse.csv')).map((row) => row.t_index)).toEqual(['20', '21', '22', '23']);
    expect(r.stdout).toContain('Time analysis of 1 movie');
    const bad = await cli(['batch', input, '--out', join(dir, 'x'), '--time', '5:2']);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toContain('--time must be all, a time point K or a range A:B (0-based, A ≤ B), got "5:2"');
  });
});

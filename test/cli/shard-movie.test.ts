// A split batch with a movie (demo data): each part analyses its movies per time point, and `eggline merge` makes the
// same tables, time-lapse tables and figures as a one-machine run; report.html carries the time-lapse section.
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_MOVIE_PARAMS } from '../../core/synth';
import { demoMovieFile } from '../../app/batch/write-demo';
import { cli, ensureBuilt } from './helpers';

const dir = mkdtempSync(join(tmpdir(), 'eggline-cli-shard-movie-'));
const demo = join(dir, 'demo');
const single = join(dir, 'single');
const split = join(dir, 'split');
const MOVIE = 'timelapse/movie.ome.tif';
const TABLES = [
  'embryos.csv', 'boundaries.csv', 'profiles.csv', 'landmarks.csv', 'results.json',
  'timecourse.csv', 'timecourse_profiles.csv', 'timecourse_boundaries.csv', 'timecourse_landmarks.csv', 'accumulation.csv', 'model_fit.csv',
  'timelapse/timelapse-movie-lambda.svg', 'timelapse/timelapse-movie-kymograph.svg', 'timelapse/timelapse-movie-tau.svg',
];

beforeAll(async () => {
  ensureBuilt();
  expect((await cli(['demo', demo, '--count', '3'])).code).toBe(0);
  mkdirSync(join(demo, 'timelapse'));
  // Demo data: the demo movie's scenario, shortened to 16 frames 10 min apart to keep the test quick.
  writeFileSync(join(demo, MOVIE), demoMovieFile({ ...DEMO_MOVIE_PARAMS, frames: 16, frameIntervalS: 600 }));
  const one = await cli(['batch', demo, '--out', single, '--jobs', '1', '--samples', join(demo, 'samples.csv')]);
  expect(one.stdout).toContain('Time analysis of 1 movie');
  for (const k of [1, 2]) {
    const r = await cli(['batch', demo, '--out', split, '--jobs', '1', '--shard', `${k}/2`]);
    expect(r.code, r.stderr).toBe(0);
  }
}, 300_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('a split batch with a movie', () => {
  it('analyses the movie per time point in the part that holds it', () => {
    const parts = [1, 2].map((k) => JSON.parse(readFileSync(join(split, 'parts', `${k}-of-2`, 'results.json'), 'utf8')) as { movies: { file: string }[] });
    expect(parts.flatMap((p) => p.movies.map((m) => m.file))).toEqual([MOVIE]);
  });

  it('merges into tables, time-lapse tables and figures byte for byte equal to a one-machine run', async () => {
    const r = await cli(['merge', split, '--samples', join(demo, 'samples.csv')]);
    expect(r.code, r.stderr).toBe(0);
    expect(r.stdout).toContain('Time analysis of 1 movie');
    for (const t of TABLES) expect(readFileSync(join(split, t), 'utf8'), t).toBe(readFileSync(join(single, t), 'utf8'));
    const profiles = readFileSync(join(split, 'profiles.csv'), 'utf8').split('\r\n').filter((l) => l.startsWith(`${MOVIE},`));
    // 16 time points × 2 channels (the demo folder's project sets a boundary channel) × 100 bins.
    expect(profiles).toHaveLength(16 * 2 * 100);
  });

  it('puts a time-lapse section with λ(t), the kymograph, τ(x) and the model-fit reading into report.html', () => {
    for (const out of [single, split]) {
      const html = readFileSync(join(out, 'report.html'), 'utf8');
      const section = html.slice(html.indexOf('<h2 id="timelapse">'), html.indexOf('<h2 id="failed">'));
      expect(section).toContain(`<h3>${MOVIE}</h3>`);
      expect(section.match(/<svg /g)).toHaveLength(3);
      expect(section).toContain(`λ over time — ${MOVIE}`);
      expect(section).toContain(`kymograph — ${MOVIE}`);
      expect(section).toContain(`local accumulation time τ(x) — ${MOVIE}`);
      expect(section).toContain('k = 1/(2τ₀)');
      expect(section).toContain('Method and caveats');
      // The figures are those of timelapse.html.
      expect(section).toContain(readFileSync(join(out, 'timelapse', 'timelapse-movie-tau.svg'), 'utf8').trim());
    }
  });

  it('eggline cohort on results with a movie: the movie counts once (its last time point) and the report keeps the time-lapse section', async () => {
    // Demo data: the sample sheet gains the movie as a fourth embryo of the reference condition.
    const sheet = join(dir, 'samples-with-movie.csv');
    const lines = readFileSync(join(demo, 'samples.csv'), 'utf8').trimEnd().split(/\r?\n/);
    const header = lines[0].split(',');
    const ref = lines[1].split(',');
    writeFileSync(sheet, `${[...lines, header.map((h, i) => (h === 'file' ? MOVIE : ref[i])).join(',')].join('\n')}\n`);
    const out = join(dir, 'cohort');
    const r = await cli(['cohort', single, '--samples', sheet, '--out', out]);
    expect(r.code, r.stderr).toBe(0);
    const conditions = readFileSync(join(out, 'conditions.csv'), 'utf8').split('\r\n').map((l) => l.split(','));
    const h = conditions[0];
    const refCondition = ref[header.indexOf('condition')];
    const lambdaRows = conditions.filter((c) => c[h.indexOf('condition')] === refCondition && c[h.indexOf('quantity')] === 'lambda' && c[h.indexOf('unit')] === 'EL');
    const before = readFileSync(join(single, 'conditions.csv'), 'utf8').split('\r\n').map((l) => l.split(','))
      .filter((c) => c[h.indexOf('condition')] === refCondition && c[h.indexOf('quantity')] === 'lambda' && c[h.indexOf('unit')] === 'EL');
    expect(Number(lambdaRows[0][h.indexOf('n')])).toBe(Number(before[0][h.indexOf('n')]) + 1);
    expect(readFileSync(join(out, 'report.html'), 'utf8')).toContain(`<h3>${MOVIE}</h3>`);
  });
});

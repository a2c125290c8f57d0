// `eggline batch --time-index T` on a folder mixing movies and single stacks (demo data): a file with fewer time
// points than T is analysed at its last one (a single stack at its only one) with a warning, and fails no row.
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseCsv } from '../../core/csv';
import { DEMO_MOVIE_PARAMS, demoDataSet } from '../../core/synth';
import { demoFile, demoMovieFile, demoSubset } from '../../app/batch/write-demo';
import { cli, ensureBuilt } from './helpers';

const dir = mkdtempSync(join(tmpdir(), 'eggline-cli-time-index-'));
const input = join(dir, 'in');
const table = (path: string): Record<string, string>[] => {
  const [header, ...rows] = parseCsv(readFileSync(path, 'utf8'));
  return rows.map((r) => Object.fromEntries(header.map((h, i) => [h, r[i]])));
};
const singles = demoSubset(demoDataSet(), 2).map((item) => item.fileName);

beforeAll(() => {
  ensureBuilt();
  mkdirSync(input, { recursive: true });
  // Demo data: the demo movie's scenario shortened to 10 frames (8 min apart) and to 4, and two single demo embryos.
  writeFileSync(join(input, 'movie.ome.tif'), demoMovieFile({ ...DEMO_MOVIE_PARAMS, frames: 10, frameIntervalS: 480 }));
  writeFileSync(join(input, 'short-movie.ome.tif'), demoMovieFile({ ...DEMO_MOVIE_PARAMS, frames: 4, frameIntervalS: 480 }));
  for (const item of demoSubset(demoDataSet(), 2)) writeFileSync(join(input, item.fileName), demoFile(item).bytes);
}, 120_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('eggline batch --time-index past a file\'s time points', () => {
  it('fails no row: the single stacks are analysed at their only time point with a warning, as with --time-index 0', async () => {
    const asked = join(dir, 'out5');
    const zero = join(dir, 'out0');
    const r5 = await cli(['batch', input, '--out', asked, '--jobs', '1', '--time-index', '5']);
    const r0 = await cli(['batch', input, '--out', zero, '--jobs', '1']);
    expect([r5.code, r0.code]).toEqual([0, 0]);
    const rows5 = table(join(asked, 'embryos.csv'));
    const rows0 = table(join(zero, 'embryos.csv'));
    expect(rows5.map((row) => row.file).sort()).toEqual(['movie.ome.tif', 'short-movie.ome.tif', ...singles].sort());
    expect(rows5.map((row) => [row.file, row.status, row.error])).toEqual(rows5.map((row) => [row.file, 'ok', '']));
    for (const name of singles) {
      const a = rows5.find((row) => row.file === name)!;
      const b = rows0.find((row) => row.file === name)!;
      expect(a.warnings).toContain(`${name}: time point 5 asked for (--time-index, 0-based), but the file has one time point; time point 0 was analysed`);
      expect({ ...a, warnings: '' }).toEqual({ ...b, warnings: '' });
      expect(a.t_index).toBe('0');
    }
    // The movies are analysed at every time point either way (the time pass), with no such warning.
    for (const name of ['movie.ome.tif', 'short-movie.ome.tif']) {
      const a = rows5.find((row) => row.file === name)!;
      expect(a.warnings).not.toContain('asked for');
      expect(a).toEqual(rows0.find((row) => row.file === name));
    }
    // Profiles and the time tables are the same bytes as with --time-index 0.
    for (const name of ['profiles.csv', 'boundaries.csv', 'timecourse.csv']) {
      expect(readFileSync(join(asked, name), 'utf8')).toBe(readFileSync(join(zero, name), 'utf8'));
    }
  }, 180_000);
});

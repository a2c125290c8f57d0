// The kymograph's landmark tracks in the window, in Chromium over the real handlers (see harness.ts): the demo movie
// with a landmark in the project (moved at one time point), analysed over time in the window; the kymograph's track
// follows the landmark's position at every time point, equal to what the batch's time pass writes to
// timecourse_landmarks.csv for the same project file, and the window's export of that table is the batch's bytes.
// Demo data only; the reference is the batch's own time pass (app/batch/timelapse-pass.ts, behind `eggline batch`).
import { mkdtempSync, promises as fs } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEFAULT_TIMELAPSE_OPTIONS, runTimelapsePass } from '../../app/batch/timelapse-pass';
import { saveProject } from '../../app/project';
import { DEMO_MOVIE_FILE } from '../../core/synth';
import { csvFileRows, ensureRendererBuilt, openFolderAt, startReadyHarness, writeDemoMovieFolder } from './harness';
import type { Harness } from './harness';

let h: Harness;
let scratch: string;
let batchOut: string;
let batchRows: Record<string, string>[];
const movieName = DEMO_MOVIE_FILE;
// Demo data: a landmark near the middle of the demo embryo (400×240 px), moved 30 px posterior at time point 20 alone;
// the movie analysed over time points 10 to 25.
const MARK = 'mark-1';
const TIMES = Array.from({ length: 16 }, (_, i) => 10 + i);

beforeAll(async () => {
  scratch = mkdtempSync(join(tmpdir(), 'eggline-landmark-tracks-'));
  const written = await writeDemoMovieFolder(scratch);
  const doc = {
    ...written.doc,
    files: {
      [movieName]: {
        axis: null, landmarks: [{ name: MARK, point: { x: 190, y: 118 } }], fitRangeEl: null, time: '10:25',
        timePoints: { 20: { landmarks: [{ name: MARK, point: { x: 220, y: 120 } }] } },
      },
    },
  };
  await saveProject(join(written.folder, 'eggline-project.json'), doc);
  batchOut = join(scratch, 'batch');
  await fs.mkdir(batchOut);
  const pass = await runTimelapsePass(written.folder, batchOut, [movieName], doc.settings, doc, DEFAULT_TIMELAPSE_OPTIONS);
  expect(pass?.movies).toHaveLength(1);
  batchRows = await csvFileRows(join(batchOut, 'timecourse_landmarks.csv'));
  await ensureRendererBuilt();
  h = await startReadyHarness(join(scratch, 'data'), 1, { width: 1440, height: 900 });
  await openFolderAt(h, written.folder, movieName);
}, 240_000);

afterAll(async () => {
  await h?.close();
  await fs.rm(scratch, { recursive: true, force: true });
});

describe('landmark tracks on the kymograph in the window', { timeout: 180_000 }, () => {
  it('the batch writes the landmark at every analysed time point, moved at time point 20 alone', () => {
    expect(batchRows.map((r) => [r.file, r.t_index, r.name])).toEqual(TIMES.map((t) => [movieName, String(t), MARK]));
    const x = (t: number) => Number(batchRows.find((r) => r.t_index === String(t))!.x_el);
    expect(x(20)).toBeGreaterThan(x(19) + 0.03);
    expect(x(21)).toBeCloseTo(x(19), 2);
  });

  it('the kymograph shows the landmark\'s track at the positions the batch writes', async () => {
    const { page } = h;
    await page.getByTestId('tab-time').click();
    await page.getByTestId('movie-analyse').click();
    await page.getByTestId('movie-slider').waitFor({ timeout: 120_000 });
    const track = page.locator('[data-testid=movie-kymograph] path.track.landmark');
    await expect.poll(() => track.count()).toBe(1);
    expect(await track.getAttribute('data-label')).toBe(MARK);
    const shown = (await track.getAttribute('data-x-el'))!.split(' ').map(Number);
    expect(shown).toHaveLength(TIMES.length);
    TIMES.forEach((t, k) => {
      const row = batchRows.find((r) => r.t_index === String(t))!;
      expect(Math.abs(shown[k] - Number(row.x_el))).toBeLessThan(1e-9);
    });
    // The drawn line moves where the landmark does: a different x at time point 20's vertex than at its neighbours'.
    const d = (await track.getAttribute('d'))!;
    const xs = [...d.matchAll(/[ML]([\d.]+),/g)].map((m) => Number(m[1]));
    expect(xs).toHaveLength(TIMES.length);
    expect(xs[TIMES.indexOf(20)]).toBeGreaterThan(xs[TIMES.indexOf(19)]);
  });

  it('exports the landmarks over time byte for byte as the batch writes them', async () => {
    const { page } = h;
    const saveDir = join(scratch, 'exports');
    await fs.mkdir(saveDir);
    h.dialogs.saveDir = saveDir;
    await page.getByTestId('movie-export').click();
    await page.getByTestId('movie-export-landmarks-csv').click();
    await expect.poll(() => page.getByTestId('message').textContent().catch(() => '')).toMatch(/^Saved /);
    const saved = join(saveDir, 'timelapse-forming-gradient_embryo-01-ome-timecourse_landmarks.csv');
    expect(await fs.readFile(saved, 'utf8')).toBe(await fs.readFile(join(batchOut, 'timecourse_landmarks.csv'), 'utf8'));
  });
});

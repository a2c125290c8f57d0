// The shared time point (settings' timeIndex, `--time-index`) in the window, in Chromium over the real handlers (see
// harness.ts): a folder of a movie and two single stacks with time point 5 in the project's settings. A single stack
// shows its only time point, with the batch's warning, and the window's λ equals the batch's embryos.csv row; the
// movie shows time point 5 with the λ the batch writes for it in timecourse.csv. Demo data only; the reference is the
// batch itself (app/batch/run-batch.ts, behind `eggline batch`, in this process).
import { mkdtempSync, promises as fs } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runBatch } from '../../app/batch/run-batch';
import { DEFAULT_TIMELAPSE_OPTIONS } from '../../app/batch/timelapse-options';
import { demoFile, demoMovieFile, demoSubset } from '../../app/batch/write-demo';
import { newProject, saveProject } from '../../app/project';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { DEMO_MOVIE_PARAMS, demoDataSet } from '../../core/synth';
import { csvFileRows, ensureRendererBuilt, openFolderAt, startReadyHarness, testIdText } from './harness';
import type { Harness } from './harness';

let h: Harness;
let scratch: string;
let folder: string;
let embryos: Record<string, string>[];
let course: Record<string, string>[];
const singles = demoSubset(demoDataSet(), 2);
const MOVIE = 'movie.ome.tif';

const lambdaEl = async (h: Harness) => Number(await h.page.getByTestId('lambda-el').first().getAttribute('data-value'));

/** Make `name` the shown file of the open folder. */
async function showFile(h: Harness, name: string): Promise<void> {
  await h.page.locator(`[data-testid=folder-entry][data-name="${name}"]`).click();
  await h.page.locator(`[data-testid=folder-entry].current[data-name="${name}"]`).waitFor({ timeout: 60_000 });
}

beforeAll(async () => {
  scratch = mkdtempSync(join(tmpdir(), 'eggline-time-index-'));
  folder = join(scratch, 'in');
  await fs.mkdir(folder);
  // Demo data: the demo movie's scenario shortened to 12 frames 8 min apart, and two single demo embryos.
  await fs.writeFile(join(folder, MOVIE), demoMovieFile({ ...DEMO_MOVIE_PARAMS, frames: 12, frameIntervalS: 480 }));
  for (const item of singles) await fs.writeFile(join(folder, item.fileName), demoFile(item).bytes);
  const doc = { ...newProject(folder), settings: { ...DEFAULT_SETTINGS, boundaryChannels: [2], timeIndex: 5 } };
  await saveProject(join(folder, 'eggline-project.json'), doc);
  const out = join(scratch, 'batch');
  const summary = await runBatch({ folder, outDir: out, settings: doc.settings, doc, jobs: 0, timelapse: DEFAULT_TIMELAPSE_OPTIONS });
  expect(summary.failed).toBe(0);
  embryos = await csvFileRows(join(out, 'embryos.csv'));
  course = await csvFileRows(join(out, 'timecourse.csv'));
  await ensureRendererBuilt();
  h = await startReadyHarness(join(scratch, 'data'), 1, { width: 1440, height: 900 });
}, 240_000);

afterAll(async () => {
  await h?.close();
  await fs.rm(scratch, { recursive: true, force: true });
});

describe('the shared time point past a single stack\'s only one', { timeout: 120_000 }, () => {
  it('a single stack shows its only time point with the batch\'s warning and the batch\'s λ', async () => {
    await openFolderAt(h, folder, singles[0].fileName);
    for (const { fileName } of singles) {
      await showFile(h, fileName);
      const row = embryos.find((r) => r.file === fileName)!;
      expect(row.status).toBe('ok');
      const warning = `${fileName}: time point 5 asked for (--time-index, 0-based), but the file has one time point; time point 0 was analysed`;
      expect(row.warnings).toContain(warning);
      await expect.poll(() => testIdText(h.page, 'time-point-warning'), { timeout: 60_000 }).toBe(warning);
      await expect.poll(() => lambdaEl(h), { timeout: 60_000 }).toBeCloseTo(Number(row.lambda_el), 9);
    }
  });

  it('the movie shows time point 5, with the λ the batch writes for it and no warning', async () => {
    await showFile(h, MOVIE);
    const row = course.find((r) => r.t_index === '5')!;
    await expect.poll(() => lambdaEl(h), { timeout: 90_000 }).toBeCloseTo(Number(row.lambda_el), 9);
    expect(await h.page.getByTestId('time-point-warning').count()).toBe(0);
    await expect.poll(() => h.page.locator('footer.statusbar').textContent()).toContain('time point 6 of 12');
  });
});

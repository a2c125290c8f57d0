// A movie's time points in the Embryo view before any analysis over time, in Chromium over the real handlers (see
// harness.ts): the Time point panel's slider and steps, and the settings panel's time point (one state with it), show
// each time point in the embryo found once for the movie, with the numbers `eggline batch --time K` writes there; a
// plain multi-page file given a time step is stepped through as frames with the numbers of
// `eggline batch --time-step S --time K`. Demo data only; the reference is the batch's own time pass
// (app/batch/timelapse-pass.ts with the command line's flag parser).
import { mkdtempSync, promises as fs } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { parseTimelapseFlags } from '../../app/cli/timelapse-step';
import { runTimelapsePass } from '../../app/batch/timelapse-pass';
import { demoMoviePlainPages } from '../../app/batch/write-demo';
import { newProject, saveProject } from '../../app/project';
import { DEFAULT_SETTINGS, parseProjectText, type ProjectDoc } from '../../core/settings';
import { DEMO_MOVIE_FILE, DEMO_MOVIE_PARAMS } from '../../core/synth';
import { ARTIFACTS, csvFileRows, ensureRendererBuilt, openFolderAt, startReadyHarness, testIdText, writeDemoMovieFolder } from './harness';
import type { Harness } from './harness';

let h: Harness;
let scratch: string;
let movieFolder: string;
let pagesFolder: string;
const pagesName = 'pages.tif';

const attr = (page: Page, testId: string, name: string) => page.getByTestId(testId).first().getAttribute(name);
const liveLambdaEl = async (page: Page) => Number(await attr(page, 'lambda-el', 'data-value'));
const projectOf = async (folder: string): Promise<ProjectDoc> => {
  const path = join(folder, 'eggline-project.json');
  return parseProjectText(await fs.readFile(path, 'utf8'), path);
};

/** λ (x/EL) the batch's time pass writes in timecourse.csv for `file` at time point `t`, with these flags. */
async function batchLambdaEl(folder: string, file: string, flags: { time: string; timeStep?: string }, out: string): Promise<number> {
  const doc = await projectOf(folder);
  await fs.mkdir(out, { recursive: true });
  const pass = await runTimelapsePass(folder, out, [file], doc.settings, doc, parseTimelapseFlags(flags));
  expect(pass?.movies).toHaveLength(1);
  const rows = await csvFileRows(join(out, 'timecourse.csv'));
  expect(rows.map((r) => r.t_index)).toEqual([flags.time]);
  return Number(rows[0].lambda_el);
}

/** `eggline batch --time K` on the demo movie. */
const movieLambda: Record<number, number> = {};
let pagesLambda5 = NaN;

beforeAll(async () => {
  scratch = mkdtempSync(join(tmpdir(), 'eggline-timepoints-'));
  await fs.mkdir(ARTIFACTS, { recursive: true });
  movieFolder = (await writeDemoMovieFolder(scratch)).folder;
  for (const t of [7, 20, 21]) movieLambda[t] = await batchLambdaEl(movieFolder, DEMO_MOVIE_FILE, { time: String(t) }, join(scratch, `batch-${t}`));
  // The demo movie's first 12 frames as a plain multi-page TIFF (one channel, no times).
  pagesFolder = join(scratch, 'pages');
  await fs.mkdir(pagesFolder);
  await fs.writeFile(join(pagesFolder, pagesName), demoMoviePlainPages({ ...DEMO_MOVIE_PARAMS, frames: 12 }));
  await saveProject(join(pagesFolder, 'eggline-project.json'), { ...newProject(pagesFolder), settings: DEFAULT_SETTINGS });
  pagesLambda5 = await batchLambdaEl(pagesFolder, pagesName, { time: '5', timeStep: '60' }, join(scratch, 'batch-pages'));
  expect(Number.isFinite(pagesLambda5)).toBe(true);
  await ensureRendererBuilt();
  h = await startReadyHarness(join(scratch, 'data'), 1, { width: 1280, height: 720 });
  await openFolderAt(h, movieFolder, DEMO_MOVIE_FILE);
}, 300_000);

afterAll(async () => {
  await h?.close();
  await fs.rm(scratch, { recursive: true, force: true });
});

describe('a movie\'s time points in the Embryo view before the analysis over time', { timeout: 180_000 }, () => {
  it('the slider and the steps show each time point with the numbers of `eggline batch --time K`', async () => {
    const { page } = h;
    await page.getByTestId('time-point-panel').waitFor({ timeout: 60_000 });
    expect(await page.getByTestId('movie-slider').count()).toBe(0);
    expect(await testIdText(page, 'embryo-time-label')).toBe('1 of 46 · t = 0 min');
    await page.getByTestId('embryo-time-slider').fill('20');
    await expect.poll(() => attr(page, 'embryo-time-label', 'data-t')).toBe('20');
    await expect.poll(() => liveLambdaEl(page), { timeout: 60_000 }).toBeCloseTo(movieLambda[20], 9);
    await expect.poll(() => page.locator('footer.statusbar').textContent()).toContain('time point 21 of 46');
    // The settings panel's time point is the shown one.
    expect(await page.getByTestId('time-index').inputValue()).toBe('20');
    await page.getByRole('button', { name: 'next time point' }).click();
    await expect.poll(() => liveLambdaEl(page), { timeout: 60_000 }).toBeCloseTo(movieLambda[21], 9);
    expect(await page.getByTestId('time-index').inputValue()).toBe('21');
    // A slider moved quickly ends at the last time point asked for, with its own numbers.
    for (const t of [3, 40, 9, 7]) await page.getByTestId('embryo-time-slider').fill(String(t));
    await expect.poll(() => attr(page, 'embryo-time-label', 'data-t')).toBe('7');
    await expect.poll(() => liveLambdaEl(page), { timeout: 60_000 }).toBeCloseTo(movieLambda[7], 9);
    await expect.poll(() => testIdText(page, 'embryo-time-label')).not.toContain('loading');
    for (const [w, hgt] of [[1440, 900], [1280, 720]] as const) {
      await page.setViewportSize({ width: w, height: hgt });
      await page.waitForTimeout(300);
      const panel = (await page.getByTestId('time-point-panel').boundingBox())!;
      expect(panel.y + panel.height).toBeLessThanOrEqual(hgt);
      await page.screenshot({ path: join(ARTIFACTS, `embryo-time-${w}x${hgt}.png`) });
    }
  });

  it('a time point typed in the settings panel is shown, and saved as the settings\' time point', async () => {
    const { page } = h;
    await page.getByTestId('time-index').fill('20');
    await page.getByTestId('time-index').press('Enter');
    await expect.poll(() => attr(page, 'embryo-time-label', 'data-t')).toBe('20');
    await expect.poll(() => liveLambdaEl(page), { timeout: 60_000 }).toBeCloseTo(movieLambda[20], 9);
    await expect.poll(async () => (await projectOf(movieFolder)).settings.timeIndex).toBe(20);
  });
});

describe('a plain multi-page file with a time step', { timeout: 180_000 }, () => {
  it('is one Z stack until a time step is given, then its pages are time points with the numbers of `eggline batch --time-step 60 --time 5`', async () => {
    const { page } = h;
    await openFolderAt(h, pagesFolder, pagesName);
    await page.getByTestId('handle-anterior').waitFor({ timeout: 60_000 });
    expect(await page.getByTestId('time-point-panel').count()).toBe(0);
    await page.getByTestId('tab-time').click();
    await page.getByTestId('movie-time-step').fill('60');
    await page.getByTestId('movie-time-step').press('Enter');
    await expect.poll(async () => (await projectOf(pagesFolder)).files[pagesName]?.timeStepS).toBe(60);
    await page.getByTestId('tab-embryo').click();
    await page.getByTestId('time-point-panel').waitFor({ timeout: 60_000 });
    await expect.poll(() => testIdText(page, 'embryo-time-label')).toBe('1 of 12 · t = 0 min');
    await page.getByTestId('embryo-time-slider').fill('5');
    await expect.poll(() => testIdText(page, 'embryo-time-label'), { timeout: 60_000 }).toBe('6 of 12 · t = 5 min');
    await expect.poll(() => liveLambdaEl(page), { timeout: 60_000 }).toBeCloseTo(pagesLambda5, 9);
    // The analysis over time of the same frames gives the batch's λ there too.
    await page.getByTestId('tab-time').click();
    await page.getByTestId('movie-analyse').click();
    await page.getByTestId('movie-slider').waitFor({ timeout: 120_000 });
    await page.getByTestId('movie-slider').fill('5');
    await expect.poll(() => attr(page, 'movie-time-label', 'data-k')).toBe('5');
    expect(Number(await attr(page, 'movie-lambda-now', 'data-value'))).toBeCloseTo(pagesLambda5, 9);
    await page.screenshot({ path: join(ARTIFACTS, 'pages-over-time-1280x720.png') });
  });
});

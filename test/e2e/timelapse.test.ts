// The time-lapse view in Chromium over the real handlers (see harness.ts): the demo movie analysed over time in the
// window with progress and cancel; the slider and the arrow keys move the profile and the kymograph's marker; play
// advances; λ(t) and τ(x) are drawn; the numbers and the exported tables equal the batch's timecourse.csv and
// model_fit.csv for the same movie. Screenshots at 1280×720 and 1440×900. Demo data only.
import { mkdtempSync, promises as fs } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { runTimelapsePass, DEFAULT_TIMELAPSE_OPTIONS } from '../../app/batch/timelapse-pass';
import { DEMO_MOVIE_FILE } from '../../core/synth';
import { ARTIFACTS, csvFileRows, ensureRendererBuilt, openFolderAt, startReadyHarness, writeDemoMovieFolder } from './harness';
import type { Harness } from './harness';

let h: Harness;
let scratch: string;
let folder: string;
let batchOut: string;
const movieName = DEMO_MOVIE_FILE; // timelapse/forming-gradient_embryo-01.ome.tif

const attr = (page: Page, testId: string, name: string) => page.getByTestId(testId).first().getAttribute(name);
const markerY = (page: Page) => page.locator('[data-testid=movie-kymograph] .time-marker').getAttribute('y1');

beforeAll(async () => {
  scratch = mkdtempSync(join(tmpdir(), 'eggline-timelapse-'));
  batchOut = join(scratch, 'batch');
  await fs.mkdir(ARTIFACTS, { recursive: true });
  // The demo movie with the demo project's settings (channel 2 holds the boundary), and the batch's time pass over it.
  const written = await writeDemoMovieFolder(scratch);
  folder = written.folder;
  const doc = written.doc;
  await fs.mkdir(batchOut);
  const pass = await runTimelapsePass(folder, batchOut, [movieName], doc.settings, doc, DEFAULT_TIMELAPSE_OPTIONS);
  expect(pass?.movies).toHaveLength(1);
  await ensureRendererBuilt();
  h = await startReadyHarness(join(scratch, 'data'), 1, { width: 1280, height: 720 });
  await openFolderAt(h, folder, movieName);
}, 240_000);

afterAll(async () => {
  await h?.close();
  await fs.rm(scratch, { recursive: true, force: true });
});

describe('the time-lapse view', { timeout: 180_000 }, () => {
  it('analyses the movie with progress, and cancelling stops it and keeps nothing', async () => {
    const { page } = h;
    await page.getByTestId('tab-time').click();
    await page.getByTestId('movie-analyse').click();
    await page.getByTestId('movie-progress').waitFor();
    await expect.poll(() => h.movieProgress.length, { timeout: 60_000 }).toBeGreaterThan(0);
    await page.getByTestId('movie-cancel').click();
    await page.getByTestId('movie-cancelled').waitFor({ timeout: 60_000 });
    expect(h.movieProgress.at(-1)!.done).toBeLessThan(46);
    expect(await page.getByTestId('movie-slider').count()).toBe(0);
  });

  it('analyses it again to the end: one slider step per time point, λ(t), the kymograph and τ(x) drawn', async () => {
    const { page } = h;
    h.movieProgress.length = 0;
    await page.getByTestId('movie-analyse').click();
    await page.getByTestId('movie-slider').waitFor({ timeout: 120_000 });
    expect(h.movieProgress.map((p) => p.done)).toEqual(Array.from({ length: 46 }, (_, i) => i + 1));
    expect(await attr(page, 'movie-slider', 'max')).toBe('45');
    expect(await page.locator('[data-testid=movie-lambda] .lambda-point').count()).toBeGreaterThan(40);
    expect(await page.locator('[data-testid=movie-tau] .tau-point').count()).toBeGreaterThan(20);
    expect(await page.locator('[data-testid=movie-tau] .tau-fit').count()).toBe(1);
    expect(await page.locator('[data-testid=movie-kymograph] .kymograph-cells rect').count()).toBe(46 * 100);
    await page.screenshot({ path: join(ARTIFACTS, 'timelapse-1280x720.png') });
  });

  it('the slider and the arrow keys move the profile, the image and the kymograph marker; earlier profiles are faded behind', async () => {
    const { page } = h;
    expect(await attr(page, 'movie-time-label', 'data-k')).toBe('0');
    const y0 = Number(await markerY(page));
    await page.getByTestId('movie-slider').fill('20');
    await expect.poll(() => attr(page, 'movie-profile', 'data-t')).toBe('20');
    expect(await attr(page, 'movie-image', 'data-t')).toBe('20');
    expect(await page.getByTestId('movie-time-label').textContent()).toBe('t = 80 min · time point 21 of 46');
    const y20 = Number(await markerY(page));
    expect(y20).toBeGreaterThan(y0);
    expect(await page.locator('[data-testid=movie-profile] .earlier-profile').count()).toBe(10);
    await page.locator('[data-testid=movie-slider]').focus();
    await page.keyboard.press('ArrowRight');
    await expect.poll(() => attr(page, 'movie-time-label', 'data-k')).toBe('21');
    await page.keyboard.press('ArrowLeft');
    await page.keyboard.press('ArrowLeft');
    await expect.poll(() => attr(page, 'movie-time-label', 'data-k')).toBe('19');
    expect(Number(await markerY(page))).toBeLessThan(y20);
    await page.keyboard.press('Shift+ArrowRight');
    await expect.poll(() => attr(page, 'movie-time-label', 'data-k')).toBe('24');
    await page.keyboard.press('End');
    await expect.poll(() => attr(page, 'movie-time-label', 'data-k')).toBe('45');
    await page.keyboard.press('Home');
    await expect.poll(() => attr(page, 'movie-time-label', 'data-k')).toBe('0');
  });

  it('play advances the time point and pause stops it (Space does both)', async () => {
    const { page } = h;
    await page.getByTestId('movie-slider').fill('0');
    await page.locator('body').click({ position: { x: 5, y: 700 } }).catch(() => undefined);
    await page.getByTestId('movie-play').click();
    await expect.poll(async () => Number(await attr(page, 'movie-time-label', 'data-k')), { timeout: 10_000 }).toBeGreaterThanOrEqual(3);
    await page.getByTestId('movie-play').click();
    const stopped = Number(await attr(page, 'movie-time-label', 'data-k'));
    await page.waitForTimeout(800);
    expect(Number(await attr(page, 'movie-time-label', 'data-k'))).toBe(stopped);
    await page.getByTestId('movie-slider').focus();
    await page.keyboard.press(' ');
    await expect.poll(async () => Number(await attr(page, 'movie-time-label', 'data-k')), { timeout: 10_000 }).toBeGreaterThan(stopped);
    await page.keyboard.press(' ');
    expect(await attr(page, 'movie-play', 'aria-pressed')).toBe('false');
  });

  it('shows the numbers the batch writes: λ per time point as in timecourse.csv, k, D, λ_τ and λ as in model_fit.csv', async () => {
    const { page } = h;
    const course = await csvFileRows(join(batchOut, 'timecourse.csv'));
    expect(course).toHaveLength(46);
    for (const k of [5, 30, 45]) {
      await page.getByTestId('movie-slider').fill(String(k));
      await expect.poll(() => attr(page, 'movie-time-label', 'data-k')).toBe(String(k));
      const row = course.find((r) => r.t_index === String(k))!;
      expect(Number(await attr(page, 'movie-lambda-now', 'data-value'))).toBeCloseTo(Number(row.lambda_el), 9);
    }
    const [model] = await csvFileRows(join(batchOut, 'model_fit.csv'));
    const cases: [string, string][] = [['movie-tau0', 'tau0_s'], ['movie-k', 'k_per_s'], ['movie-d', 'd_um2_per_s'], ['movie-lambda-tau', 'lambda_tau_el'], ['movie-lambda-steady', 'lambda_el']];
    for (const [id, column] of cases) {
      const shown = Number(await attr(page, id, 'data-value'));
      expect(Math.abs(shown - Number(model[column])) / Math.abs(Number(model[column]))).toBeLessThan(1e-9);
    }
    expect(await page.getByTestId('movie-reading').textContent()).toBe(model.reading);
    // A changed option makes the shown analysis out of date, and says so; back to the old value, it is current again.
    expect(await page.getByTestId('movie-stale').count()).toBe(0);
    await page.getByLabel('τ fit range start (x/EL)').fill('0.15');
    await page.getByTestId('movie-stale').waitFor();
    await page.getByLabel('τ fit range start (x/EL)').fill('0.1');
    await expect.poll(() => page.getByTestId('movie-stale').count()).toBe(0);
  });

  it('exports the batch\'s tables byte for byte and the figures as SVG and PNG', async () => {
    const { page } = h;
    const saveDir = join(scratch, 'exports');
    await fs.mkdir(saveDir);
    h.dialogs.saveDir = saveDir;
    await page.getByTestId('movie-slider').fill('30');
    const exportOne = async (cmd: string) => {
      await page.getByTestId('movie-export').click();
      await page.getByTestId(`movie-export-${cmd}`).click();
      await expect.poll(() => page.getByTestId('message').textContent().catch(() => '')).toMatch(/^Saved /);
      await page.getByRole('button', { name: 'dismiss the message' }).click();
    };
    for (const cmd of ['timecourse-csv', 'model-fit-csv', 'accumulation-csv', 'lambda-svg', 'kymograph-png', 'image-png']) await exportOne(cmd);
    const stem = 'timelapse-forming-gradient_embryo-01-ome';
    for (const [mine, theirs] of [['timecourse', 'timecourse'], ['model_fit', 'model_fit'], ['accumulation', 'accumulation']]) {
      expect(await fs.readFile(join(saveDir, `${stem}-${mine}.csv`), 'utf8')).toBe(await fs.readFile(join(batchOut, `${theirs}.csv`), 'utf8'));
    }
    expect(await fs.readFile(join(saveDir, `${stem}-lambda.svg`), 'utf8')).toMatch(/^<svg[\s\S]*lambda-point[\s\S]*<\/svg>\s*$/);
    // Source: PNG specification §5.2 (the eight-byte signature).
    for (const png of [`${stem}-kymograph.png`, `${stem}-t30-image.png`]) {
      expect([...(await fs.readFile(join(saveDir, png))).subarray(0, 8)]).toEqual([137, 80, 78, 71, 13, 10, 26, 10]);
    }
  });

  it('at 1440×900 and 1280×720 the time bar, the figures and their axis titles are on screen and inside their cells', async () => {
    const { page } = h;
    for (const [w, hgt] of [[1440, 900], [1280, 720]] as const) {
      await page.setViewportSize({ width: w, height: hgt });
      await page.getByTestId('movie-slider').fill('30');
      await page.waitForTimeout(300);
      const slider = await page.getByTestId('movie-slider').boundingBox();
      expect(slider!.y + slider!.height).toBeLessThanOrEqual(hgt);
      for (const id of ['movie-profile', 'movie-kymograph', 'movie-lambda']) {
        const cell = (await page.getByTestId(id).boundingBox())!;
        const svg = (await page.locator(`[data-testid=${id}] svg`).boundingBox())!;
        expect(svg.width).toBeLessThanOrEqual(cell.width + 1);
        expect(svg.height).toBeLessThanOrEqual(cell.height + 1);
        expect(cell.width).toBeGreaterThanOrEqual(380);
      }
      await page.screenshot({ path: join(ARTIFACTS, `timelapse-${w}x${hgt}.png`) });
      await page.getByTestId('movie-numbers').scrollIntoViewIfNeeded();
      const numbers = (await page.getByTestId('movie-numbers').boundingBox())!;
      expect(numbers.y + numbers.height).toBeLessThanOrEqual(hgt);
      await page.screenshot({ path: join(ARTIFACTS, `timelapse-${w}x${hgt}-lower.png`) });
      await page.getByTestId('movie-slider').scrollIntoViewIfNeeded();
    }
  });
});

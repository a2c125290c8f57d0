// The window's movie controls in Chromium over the real handlers (see harness.ts): the time points to analyse (as
// `eggline batch --time A:B`) with the flag's refusal message, saved for the file in the project and analysed again
// when changed, a time point past the movie's end taken at the last one as the batch takes it; the Embryo view at the time point picked on the slider, with the numbers the batch writes for that
// time point; and edits of one time point (axis moved for it alone), saved in the project's per-time-point edits,
// measured live, equal to what the batch's time pass makes of the same project file, and cleared again.
// Demo data only; the reference is the batch's own time pass (app/batch/timelapse-pass.ts, the code behind
// `eggline batch --time`, with the command line's flag parser).
import { mkdtempSync, promises as fs } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { parseTimelapseFlags } from '../../app/cli/timelapse-step';
import { runTimelapsePass } from '../../app/batch/timelapse-pass';
import { parseProjectText } from '../../core/settings';
import { DEMO_MOVIE_FILE } from '../../core/synth';
import { ARTIFACTS, csvFileRows, ensureRendererBuilt, openFolderAt, startReadyHarness, writeDemoMovieFolder } from './harness';
import type { Harness } from './harness';

let h: Harness;
let scratch: string;
let folder: string;
const movieName = DEMO_MOVIE_FILE;
const projectFile = () => join(folder, 'eggline-project.json');

const attr = (page: Page, testId: string, name: string) => page.getByTestId(testId).first().getAttribute(name);
const liveLambdaEl = async (page: Page) => Number(await attr(page, 'lambda-el', 'data-value'));
/** The movie's entry in the saved project file. */
async function savedEntry(): Promise<Record<string, unknown>> {
  return (JSON.parse(await fs.readFile(projectFile(), 'utf8')) as { files: Record<string, Record<string, unknown>> }).files[movieName] ?? {};
}
/** The batch's time pass with `eggline batch --time <time>` over the project file as saved now; its timecourse rows. */
async function batchRows(time: string, out: string): Promise<Record<string, string>[]> {
  const doc = parseProjectText(await fs.readFile(projectFile(), 'utf8'), projectFile());
  await fs.mkdir(out, { recursive: true });
  const pass = await runTimelapsePass(folder, out, [movieName], doc.settings, doc, parseTimelapseFlags({ time }));
  expect(pass?.movies).toHaveLength(1);
  return csvFileRows(join(out, 'timecourse.csv'));
}
const rowAt = (rows: Record<string, string>[], t: number) => rows.find((r) => r.t_index === String(t))!;

let reference: Record<string, string>[];

beforeAll(async () => {
  scratch = mkdtempSync(join(tmpdir(), 'eggline-timelapse-edits-'));
  await fs.mkdir(ARTIFACTS, { recursive: true });
  folder = (await writeDemoMovieFolder(scratch)).folder;
  // The reference before any edit: `eggline batch --time 10:25`.
  reference = await batchRows('10:25', join(scratch, 'batch-range'));
  expect(reference.map((r) => r.t_index)).toEqual(Array.from({ length: 16 }, (_, i) => String(10 + i)));
  await ensureRendererBuilt();
  h = await startReadyHarness(join(scratch, 'data'), 1, { width: 1280, height: 720 });
  await openFolderAt(h, folder, movieName);
}, 240_000);

afterAll(async () => {
  await h?.close();
  await fs.rm(scratch, { recursive: true, force: true });
});

describe('the window\'s movie controls', { timeout: 180_000 }, () => {
  it('refuses a reversed range with the --time message, analyses the range A:B as the batch does, and saves it for the file', async () => {
    const { page } = h;
    await page.getByTestId('tab-time').click();
    // The demo movie gives its times (OME TimeIncrement): the time step is not used and says so.
    expect(await page.getByTestId('movie-time-step').isDisabled()).toBe(true);
    await expect.poll(() => page.getByTestId('movie-times').textContent()).toBe('All 46 time points; times from the file (OME TimeIncrement).');
    await page.getByTestId('movie-time').fill('25:10');
    await page.getByTestId('movie-time').press('Enter');
    expect(await page.getByTestId('field-error-movie-time').textContent()).toBe('time points must be all, a time point K or a range A:B (0-based, A ≤ B), got "25:10"');
    await page.getByTestId('movie-time').fill('50:60');
    await page.getByTestId('movie-time').press('Enter');
    expect(await page.getByTestId('field-error-movie-time').textContent()).toBe('time points: time point 50 is outside the movie (T = 46, time points 0 to 45)');
    await page.getByTestId('movie-time').fill('10:25');
    await page.getByTestId('movie-time').press('Enter');
    expect(await page.getByTestId('field-error-movie-time').count()).toBe(0);
    await expect.poll(savedEntry).toMatchObject({ time: '10:25' });
    expect(await page.getByTestId('movie-times').textContent()).toBe('Time points 10 to 25 (0-based) of 46; times from the file (OME TimeIncrement).');
    h.movieProgress.length = 0;
    await page.getByTestId('movie-analyse').click();
    await page.getByTestId('movie-slider').waitFor({ timeout: 120_000 });
    expect(h.movieProgress.map((p) => p.done)).toEqual(Array.from({ length: 16 }, (_, i) => i + 1));
    expect(await attr(page, 'movie-slider', 'max')).toBe('15');
    expect(await attr(page, 'movie-time-source', 'data-source')).toBe('ome-increment');
    for (const k of [0, 7, 15]) {
      await page.getByTestId('movie-slider').fill(String(k));
      await expect.poll(() => attr(page, 'movie-time-label', 'data-k')).toBe(String(k));
      expect(Number(await attr(page, 'movie-lambda-now', 'data-value'))).toBeCloseTo(Number(rowAt(reference, 10 + k).lambda_el), 9);
    }
    expect(await page.getByTestId('movie-time-label').textContent()).toMatch(/ · time point 26 of 46 \(16 of 16 analysed\)$/);
    // The bar with the new fields stays on screen and its controls do not overlap.
    for (const [w, hgt] of [[1440, 900], [1280, 720]] as const) {
      await page.setViewportSize({ width: w, height: hgt });
      await page.waitForTimeout(300);
      const ids = ['movie-time', 'movie-time-step', 'movie-axis-per-time', 'movie-analyse', 'movie-export'];
      const boxes = await Promise.all(ids.map(async (id) => (await page.getByTestId(id).first().boundingBox())!));
      for (const b of boxes) expect(b.x + b.width).toBeLessThanOrEqual(w);
      for (let i = 0; i < boxes.length; i++) for (let j = i + 1; j < boxes.length; j++) {
        const [a, b] = [boxes[i], boxes[j]];
        const apart = a.x + a.width <= b.x + 0.5 || b.x + b.width <= a.x + 0.5 || a.y + a.height <= b.y + 0.5 || b.y + b.height <= a.y + 0.5;
        expect(apart, `${ids[i]} and ${ids[j]} overlap at ${w}×${hgt}`).toBe(true);
      }
      await page.screenshot({ path: join(ARTIFACTS, `timelapse-range-${w}x${hgt}.png`) });
    }
  });

  it('a new range analyses the movie again at once (progress shown); one given while a run is under way cancels it first', async () => {
    const { page } = h;
    h.movieProgress.length = 0;
    await page.getByTestId('movie-time').fill('20:25');
    await page.getByTestId('movie-time').press('Enter');
    await expect.poll(() => attr(page, 'movie-slider', 'max'), { timeout: 120_000 }).toBe('5');
    expect(h.movieProgress.at(-1)).toMatchObject({ done: 6, total: 6 });
    // Every time point, then 10:25 while that run is under way: the first run stops, the second runs to its end. The
    // first run pauses after each time point, so it is still under way however fast this machine analyses.
    h.movieProgress.length = 0;
    h.slowNextMovie(150);
    await page.getByTestId('movie-time').fill('all');
    await page.getByTestId('movie-time').press('Enter');
    await expect.poll(() => h.movieProgress.some((p) => p.total === 46), { timeout: 60_000 }).toBe(true);
    await page.getByTestId('movie-progress').waitFor();
    await page.getByTestId('movie-time').fill('10:25');
    await page.getByTestId('movie-time').press('Enter');
    await expect.poll(() => attr(page, 'movie-slider', 'max'), { timeout: 120_000 }).toBe('15');
    await expect.poll(() => page.getByTestId('movie-progress').count(), { timeout: 120_000 }).toBe(0);
    expect(h.movieProgress.some((p) => p.total === 46 && p.done === 46)).toBe(false);
    expect(h.movieProgress.at(-1)).toMatchObject({ done: 16, total: 16 });
    await expect.poll(savedEntry).toMatchObject({ time: '10:25' });
    await page.getByTestId('movie-slider').fill('5');
    await expect.poll(() => attr(page, 'movie-time-label', 'data-k')).toBe('5');
    expect(Number(await attr(page, 'movie-lambda-now', 'data-value'))).toBeCloseTo(Number(rowAt(reference, 15).lambda_el), 9);
  });

  it('the Embryo view shows the time point picked on the slider, with the batch\'s λ for that time point', async () => {
    const { page } = h;
    await page.getByTestId('tab-embryo').click();
    await expect.poll(() => attr(page, 'embryo-time-label', 'data-t')).toBe('15');
    await expect.poll(() => page.getByTestId('embryo-time-label').textContent(), { timeout: 30_000 }).toMatch(/^16 of 46 · t = \d+ min$/);
    await expect.poll(() => page.locator('footer.statusbar').textContent()).toContain('time point 16 of 46');
    await expect.poll(() => liveLambdaEl(page), { timeout: 30_000 }).toBeCloseTo(Number(rowAt(reference, 15).lambda_el), 9);
    // The panel's step goes to the next analysed time point, and the numbers follow.
    await page.getByRole('button', { name: 'next time point' }).click();
    await expect.poll(() => liveLambdaEl(page), { timeout: 30_000 }).toBeCloseTo(Number(rowAt(reference, 16).lambda_el), 9);
    await page.getByRole('button', { name: 'previous time point' }).click();
    await expect.poll(() => liveLambdaEl(page), { timeout: 30_000 }).toBeCloseTo(Number(rowAt(reference, 15).lambda_el), 9);
    for (const [w, hgt] of [[1440, 900], [1280, 720]] as const) {
      await page.setViewportSize({ width: w, height: hgt });
      await page.waitForTimeout(300);
      const panel = (await page.getByTestId('time-point-panel').boundingBox())!;
      expect(panel.y + panel.height).toBeLessThanOrEqual(hgt);
      await page.screenshot({ path: join(ARTIFACTS, `time-point-${w}x${hgt}.png`) });
    }
  });

  it('moves the axis for this time point only: saved as that time point\'s edit, measured live, and the batch over the saved project gives the same λ there', async () => {
    const { page } = h;
    await page.getByTestId('edit-scope-time-point').check();
    const before = await liveLambdaEl(page);
    await page.getByTestId('handle-anterior').focus();
    for (let i = 0; i < 3; i++) await page.keyboard.press('Shift+ArrowRight');
    await expect.poll(() => liveLambdaEl(page)).not.toBeCloseTo(before, 6);
    await page.getByTestId('time-point-own').waitFor();
    expect(await page.getByTestId('time-point-own').textContent()).toContain('This time point has its own axis.');
    await expect.poll(async () => Object.keys((await savedEntry()).timePoints as object ?? {})).toEqual(['15']);
    const saved = await savedEntry();
    expect(saved.axis).toBeNull();
    expect((saved.timePoints as Record<string, { axis: { source: string } }>)['15'].axis.source).toBe('hand');
    const edited = await liveLambdaEl(page);
    // The next time point keeps the file's (automatic) axis.
    await page.getByRole('button', { name: 'next time point' }).click();
    await expect.poll(() => liveLambdaEl(page), { timeout: 30_000 }).toBeCloseTo(Number(rowAt(reference, 16).lambda_el), 9);
    expect(await page.getByTestId('time-point-own').count()).toBe(0);
    await page.getByRole('button', { name: 'previous time point' }).click();
    await expect.poll(() => liveLambdaEl(page), { timeout: 30_000 }).toBeCloseTo(edited, 12);
    // The batch's time pass over the same project file (the file's own time points, 10:25, come with it).
    const rows = await batchRows('all', join(scratch, 'batch-edited'));
    expect(rows.map((r) => r.t_index)).toEqual(reference.map((r) => r.t_index));
    expect(Number(rowAt(rows, 15).lambda_el)).toBeCloseTo(edited, 9);
    expect(rowAt(rows, 16).lambda_el).toBe(rowAt(reference, 16).lambda_el);
    // The analysis over time is now out of date, and says so.
    await page.getByTestId('tab-time').click();
    await page.getByTestId('movie-stale').waitFor();
    await page.getByTestId('tab-embryo').click();
  });

  it('clearing this time point\'s edits brings the file\'s axis and the batch\'s λ back, in the project too', async () => {
    const { page } = h;
    await page.getByTestId('clear-time-point').click();
    await expect.poll(() => liveLambdaEl(page)).toBeCloseTo(Number(rowAt(reference, 15).lambda_el), 9);
    await expect.poll(async () => (await savedEntry()).timePoints).toBeUndefined();
    expect(await page.getByTestId('time-point-own').count()).toBe(0);
    await page.getByTestId('edit-scope-file').check();
  });

  it('with the axis found at every time point, the Embryo view measures each time point in its own embryo, as the analysis over time did', async () => {
    const { page } = h;
    await page.getByTestId('tab-time').click();
    await page.getByTestId('movie-axis-per-time').check();
    await page.getByTestId('movie-analyse').click();
    await expect.poll(() => page.getByTestId('movie-stale').count(), { timeout: 120_000 }).toBe(0);
    await expect.poll(() => page.getByTestId('movie-progress').count(), { timeout: 120_000 }).toBe(0);
    await page.getByTestId('movie-slider').fill('9');
    await expect.poll(() => attr(page, 'movie-time-label', 'data-k')).toBe('9');
    const overTime = Number(await attr(page, 'movie-lambda-now', 'data-value'));
    // Another embryo outline and axis than the one found once for the movie, so another λ.
    expect(overTime).not.toBeCloseTo(Number(rowAt(reference, 19).lambda_el), 9);
    await page.getByTestId('tab-embryo').click();
    await expect.poll(() => attr(page, 'embryo-time-label', 'data-t')).toBe('19');
    await expect.poll(() => liveLambdaEl(page), { timeout: 30_000 }).toBeCloseTo(overTime, 9);
  });

  it('takes a time point past the movie\'s end as the batch does: analysed at the last, with the batch\'s warning and λ', async () => {
    const { page } = h;
    await page.getByTestId('tab-time').click();
    await page.getByTestId('movie-axis-per-time').uncheck();
    h.movieProgress.length = 0;
    await page.getByTestId('movie-time').fill('50');
    await page.getByTestId('movie-time').press('Enter');
    expect(await page.getByTestId('field-error-movie-time').count()).toBe(0);
    await expect.poll(savedEntry).toMatchObject({ time: '50' });
    expect(await page.getByTestId('movie-times').textContent()).toBe('Time point 45 (0-based) of 46 (50 asked for, past the movie\'s end); times from the file (OME TimeIncrement).');
    // The new time points analyse the movie again at once: one time point, the last.
    await expect.poll(() => attr(page, 'movie-slider', 'max'), { timeout: 120_000 }).toBe('0');
    await expect.poll(() => page.getByTestId('movie-progress').count(), { timeout: 120_000 }).toBe(0);
    expect(h.movieProgress.at(-1)).toMatchObject({ done: 1, total: 1 });
    const warning = `${movieName}: time point 50 asked for (this file's time points in the project, 0-based), but the movie has 46 time points (0 to 45); time point 45 was analysed`;
    expect(await page.getByTestId('movie-warnings').textContent()).toContain(warning);
    // The batch over the saved project (the file's own time points, 50, come with it): the same time point and λ.
    const rows = await batchRows('all', join(scratch, 'batch-past-end'));
    expect(rows.map((r) => r.t_index)).toEqual(['45']);
    expect(rows[0].warnings.startsWith(warning)).toBe(true);
    expect(Number(await attr(page, 'movie-lambda-now', 'data-value'))).toBeCloseTo(Number(rows[0].lambda_el), 9);
    await page.screenshot({ path: join(ARTIFACTS, 'timelapse-past-end-1280x720.png') });
  });
});

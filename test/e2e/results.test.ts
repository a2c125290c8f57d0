// Results that stay and lead back to the embryos, in Chromium over the real handlers (see harness.ts): a batch's
// rows open their embryo with its warnings, file states follow the batch and later edits, the report opens through
// the main process, the cohort tables scroll to their last column, and everything is back after a restart.
// Demo data only.
import { mkdtempSync, promises as fs } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { ARTIFACTS, chooseBatchOutput, ensureRendererBuilt, startReadyHarness, testIdText } from './harness';
import type { Harness } from './harness';

let h: Harness;
let scratch: string;
let out: string;

type Box = { x: number; y: number; width: number; height: number };
const text = testIdText;
const statuses = (page: Page) => page.getByTestId('folder-entry').evaluateAll((els) => els.map((e) => e.getAttribute('data-status')));
const currentFile = (page: Page) => page.locator('[data-testid=folder-entry].current').getAttribute('data-name');

beforeAll(async () => {
  scratch = mkdtempSync(join(tmpdir(), 'eggline-results-'));
  await fs.mkdir(ARTIFACTS, { recursive: true });
  await ensureRendererBuilt();
  h = await startReadyHarness(join(scratch, 'data'), 4, { width: 1280, height: 720 });
}, 180_000);

afterAll(async () => {
  await h?.close();
  await fs.rm(scratch, { recursive: true, force: true });
});

describe('results that stay', { timeout: 150_000 }, () => {
  it('files read new before a batch and analysed after it', async () => {
    const { page } = h;
    expect(new Set(await statuses(page))).toEqual(new Set(['new']));
    out = await chooseBatchOutput(h, join(scratch, 'out'));
    await page.getByTestId('batch-run').click();
    await page.getByTestId('batch-results').waitFor({ timeout: 120_000 });
    await expect.poll(() => statuses(page)).toEqual(['analysed', 'analysed', 'analysed', 'analysed']);
    // Each state has its text label, not only a colour.
    expect(await page.locator('[data-testid=folder-entry] .status').allTextContents()).toEqual(['analysed', 'analysed', 'analysed', 'analysed']);
    await page.screenshot({ path: join(ARTIFACTS, 'results-01-batch-1280x720.png') });
  });

  it('the batch table shows R² to four decimals, as the numbers panel does', async () => {
    const { page } = h;
    const r2 = await page.locator('[data-testid=batch-row]:not(.row-error) td:nth-child(6)').allTextContents();
    expect(r2.length).toBeGreaterThan(0);
    for (const v of r2) expect(v).toMatch(/^\d\.\d{4}$/);
  });

  it('a batch row opens its embryo in the embryo view, with the last batch\'s status shown', async () => {
    const { page } = h;
    const rows = page.getByTestId('batch-row');
    const file = (await rows.nth(2).getAttribute('data-file')) ?? '';
    await rows.nth(2).click();
    await expect.poll(() => currentFile(page)).toBe(file);
    await page.getByTestId('embryo-view').waitFor();
    await expect.poll(() => text(page, 'file-note')).toMatch(/analysed by the last batch/);
    // The keyboard does the same: focus a row, press Enter.
    await page.getByTestId('tab-batch').click();
    const other = (await rows.nth(1).getAttribute('data-file')) ?? '';
    await rows.nth(1).focus();
    await page.keyboard.press('Enter');
    await expect.poll(() => currentFile(page)).toBe(other);
    await page.getByTestId('handle-anterior').waitFor({ timeout: 30_000 });
  });

  it('an edit after the batch turns the file to edited', async () => {
    const { page } = h;
    await page.getByTestId('handle-anterior').waitFor({ timeout: 30_000 });
    await page.keyboard.press('s');
    await expect.poll(() => page.locator('[data-testid=folder-entry].current').getAttribute('data-status')).toBe('edited');
    await expect.poll(() => text(page, 'file-note')).toMatch(/changed after the last batch/);
    await page.keyboard.press('Control+z');
    await expect.poll(() => page.locator('[data-testid=folder-entry].current').getAttribute('data-status')).toBe('analysed');
  });

  it('Open report hands report.html to the system, and the app window stays on its page', async () => {
    const { page } = h;
    await page.getByTestId('tab-cohort').click();
    const report = await text(page, 'cohort-report');
    await page.getByTestId('cohort-open-report').click();
    await expect.poll(() => h.openedPaths).toEqual([report]);
    expect(report).toBe(join(out, 'report.html'));
    expect(page.url()).toBe('http://app.test/index.html');
  });

  it('the cohort tables scroll sideways to their last column, with the first column kept in view', async () => {
    const { page } = h;
    const viewport: Box = { x: 0, y: 0, width: 1280, height: 720 };
    for (const id of ['cohort-conditions', 'cohort-shifts']) {
      const last = page.locator(`[data-testid=${id}] thead th:last-child`);
      await last.scrollIntoViewIfNeeded();
      const b = (await last.boundingBox()) as Box;
      expect(b.x + b.width).toBeLessThanOrEqual(viewport.width);
      expect(b.x).toBeGreaterThanOrEqual(0);
      const scroller = (await page.getByTestId(`${id}-scroll`).boundingBox()) as Box;
      expect(b.x + b.width).toBeLessThanOrEqual(scroller.x + scroller.width + 1);
      // The sticky first column sits at the scroller's left edge, and the last column is not under it.
      const first = (await page.locator(`[data-testid=${id}] thead th:first-child`).boundingBox()) as Box;
      expect(Math.abs(first.x - scroller.x)).toBeLessThan(2);
      expect(b.x).toBeGreaterThanOrEqual(first.x + first.width - 1);
    }
    expect(await page.locator('[data-testid=cohort-conditions] thead th').allTextContents()).toContain('n');
    await page.screenshot({ path: join(ARTIFACTS, 'results-02-cohort-1280x720.png') });
  });

  it('after a restart the batch results, the cohort summary and the file states are back', async () => {
    const { page } = h;
    h.freshHandlers();
    await page.reload();
    await page.getByTestId('handle-anterior').waitFor({ timeout: 60_000 });
    await expect.poll(() => statuses(page), { timeout: 20_000 }).toEqual(['analysed', 'analysed', 'analysed', 'analysed']);
    await page.getByTestId('tab-batch').click();
    await page.getByTestId('batch-results').waitFor({ timeout: 20_000 });
    expect(await page.getByTestId('batch-row').count()).toBe(4);
    expect(await text(page, 'batch-out')).toBe(out);
    await page.getByTestId('tab-cohort').click();
    await page.getByTestId('cohort-view').waitFor();
    expect(await page.getByTestId('cohort-condition').count()).toBe(4);
    // The report still opens (the recorded output folder is allowed again after the restart).
    await page.getByTestId('cohort-open-report').click();
    await expect.poll(() => h.openedPaths.length).toBe(2);
    await page.screenshot({ path: join(ARTIFACTS, 'results-03-after-restart-1280x720.png') });
  });
});

// The window's layout in Chromium over the real handlers (see harness.ts), at the sizes the window must serve:
// the image and the profile's x axis on screen together without scrolling, a one-line toolbar, plot marks kept
// inside their frames and labels that do not cover each other. Demo data only.
import { mkdtempSync, promises as fs } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { ARTIFACTS, ensureRendererBuilt, startReadyHarness } from './harness';
import type { Harness } from './harness';

let h: Harness;
let scratch: string;

type Box = { x: number; y: number; width: number; height: number };
const box = async (page: Page, selector: string): Promise<Box> => {
  const b = await page.locator(selector).first().boundingBox();
  if (b === null) throw new Error(`${selector} is not visible`);
  return b;
};
/** True when `inner` lies inside `outer` (1 px tolerance for anti-aliased edges). */
const inside = (inner: Box, outer: Box) => inner.x >= outer.x - 1 && inner.y >= outer.y - 1
  && inner.x + inner.width <= outer.x + outer.width + 1 && inner.y + inner.height <= outer.y + outer.height + 1;
const overlaps = (a: Box, b: Box) => a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;

beforeAll(async () => {
  scratch = mkdtempSync(join(tmpdir(), 'eggline-layout-'));
  await fs.mkdir(ARTIFACTS, { recursive: true });
  await ensureRendererBuilt();
  h = await startReadyHarness(join(scratch, 'data'), 4);
  // A boundary channel, so boundaries, their labels and the scaled second channel are drawn too.
  await h.page.getByTestId('boundary-channel-2').check();
  await h.page.locator('[data-testid=profile-plot] .boundary-line').first().waitFor({ state: 'attached', timeout: 10_000 });
}, 180_000);

afterAll(async () => {
  await h?.close();
  await fs.rm(scratch, { recursive: true, force: true });
});

for (const [w, hgt] of [[1280, 720], [1440, 900], [2560, 1440]] as const) {
  describe(`at ${w}×${hgt}`, { timeout: 60_000 }, () => {
    it('shows the image and the whole profile plot, x axis included, without scrolling; the toolbar is one line', async () => {
      const { page } = h;
      await page.setViewportSize({ width: w, height: hgt });
      const viewport: Box = { x: 0, y: 0, width: w, height: hgt };
      await expect.poll(async () => (await box(page, '[data-testid=profile-plot]')).width, { timeout: 10_000 }).toBeGreaterThan(400);
      const image = await box(page, '[data-testid=image-view]');
      expect(inside(image, viewport)).toBe(true);
      expect(image.height).toBeGreaterThan(hgt * 0.3);
      expect(inside(await box(page, '[data-testid=profile-plot]'), viewport)).toBe(true);
      expect(inside(await box(page, '[data-testid=profile-x-title]'), viewport)).toBe(true);
      // Both handles are on screen, in the image.
      expect(inside(await box(page, '[data-testid=handle-anterior] circle'), image)).toBe(true);
      expect(inside(await box(page, '[data-testid=handle-posterior] circle'), image)).toBe(true);
      // Nothing scrolled to get there.
      expect(await page.evaluate(() => [document.scrollingElement?.scrollTop ?? 0, document.querySelector('.centre')?.scrollTop ?? 0])).toEqual([0, 0]);
      // The toolbar keeps one line: every button sits inside its 38 px bar.
      const bar = await box(page, '[data-testid=toolbar]');
      expect(bar.height).toBeLessThanOrEqual(39);
      for (const b of await page.locator('[data-testid=toolbar] > button, [data-testid=toolbar] .tool-group button, [data-testid=toolbar] .menu > button, [data-testid=toolbar] .tabs button').all()) {
        expect(inside((await b.boundingBox()) as Box, bar)).toBe(true);
      }
      await page.screenshot({ path: join(ARTIFACTS, `layout-${w}x${hgt}.png`) });
    });

    it('keeps every label of the profile plot inside the plot, the legend off the data and labels apart', async () => {
      const { page } = h;
      const plot = await box(page, '[data-testid=profile-plot]');
      for (const t of await page.locator('[data-testid=profile-plot] text').all()) {
        const b = (await t.boundingBox()) as Box;
        expect(inside(b, plot), `${await t.textContent()} outside the plot`).toBe(true);
      }
      // The marks are clipped to the panel whose frame is the axes: the clip rectangle spans x/EL 0–1.
      const clip = await page.locator('[data-testid=profile-main-marks]').evaluate((g) => {
        const id = /url\(#(.+)\)/.exec(g.getAttribute('clip-path') ?? '')?.[1] ?? '';
        const r = document.getElementById(id)?.querySelector('rect');
        return r === null || r === undefined ? null : r.getBoundingClientRect().toJSON() as Box;
      });
      expect(clip).not.toBeNull();
      const legend = await box(page, '[data-testid=profile-legend]');
      expect(overlaps(legend, clip as Box)).toBe(false);
      const labels = await Promise.all((await page.getByTestId('plot-label').all()).map(async (l) => (await l.boundingBox()) as Box));
      for (let i = 0; i < labels.length; i += 1) for (let j = i + 1; j < labels.length; j += 1) expect(overlaps(labels[i], labels[j]), JSON.stringify([labels[i], labels[j]])).toBe(false);
    });
  });
}

describe('splitter and overlays', { timeout: 60_000 }, () => {
  it('the bar between image and profile resizes them with the keyboard', async () => {
    const { page } = h;
    await page.setViewportSize({ width: 1280, height: 720 });
    const before = await box(page, '[data-testid=image-view]');
    await page.getByTestId('split-bar').focus();
    await page.keyboard.press('ArrowDown');
    await page.keyboard.press('ArrowDown');
    await expect.poll(async () => (await box(page, '[data-testid=image-view]')).height).toBeGreaterThan(before.height + 30);
  });

  it('a pole dragged off the embryo is warned about beside the numbers, and the warning goes with undo', async () => {
    const { page } = h;
    const a = await box(page, '[data-testid=handle-anterior] circle');
    const p = await box(page, '[data-testid=handle-posterior] circle');
    const from = { x: p.x + p.width / 2, y: p.y + p.height / 2 };
    // Further out along the axis by 40% of its screen length: well past the embryo's end.
    const to = { x: from.x + (from.x - a.x) * 0.4, y: from.y + (from.y - a.y) * 0.4 };
    await page.mouse.move(from.x, from.y);
    await page.mouse.down();
    for (let k = 1; k <= 6; k += 1) await page.mouse.move(from.x + ((to.x - from.x) * k) / 6, from.y + ((to.y - from.y) * k) / 6);
    await page.mouse.up();
    await expect.poll(async () => (await page.getByTestId('warnings').count()) > 0 ? page.getByTestId('warnings').textContent() : '', { timeout: 10_000 })
      .toMatch(/the posterior pole lies \d+ µm outside the embryo outline/);
    // The handle itself is marked too.
    expect(await page.getByTestId('outside-posterior').count()).toBe(1);
    expect(await page.getByTestId('outside-anterior').count()).toBe(0);
    await page.screenshot({ path: join(ARTIFACTS, 'layout-pole-outside.png') });
    await page.keyboard.press('Control+z');
    await expect.poll(async () => (await page.getByTestId('warnings').count()) > 0 ? page.getByTestId('warnings').textContent() : '').not.toMatch(/outside the embryo/);
    expect(await page.getByTestId('outside-posterior').count()).toBe(0);
  });

  it('each overlay can be hidden from its key and shown again', async () => {
    const { page } = h;
    await page.getByTestId('overlay-axis').uncheck();
    expect(await page.getByTestId('handle-anterior').count()).toBe(0);
    await page.getByTestId('overlay-axis').check();
    await page.getByTestId('handle-anterior').waitFor();
    await page.getByTestId('overlay-band').uncheck();
    expect(await page.getByTestId('band').count()).toBe(0);
    await page.getByTestId('overlay-band').check();
  });
});

describe('keyboard', { timeout: 60_000 }, () => {
  it('Tab starts in the toolbar and every focused control shows a focus ring', async () => {
    const { page } = h;
    await page.locator('body').click({ position: { x: 1, y: 700 } }).catch(() => undefined);
    await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
    await page.keyboard.press('Tab');
    const first = await page.evaluate(() => {
      const el = document.activeElement as HTMLElement;
      return { inToolbar: el.closest('[data-testid=toolbar]') !== null, outline: getComputedStyle(el).outlineStyle };
    });
    expect(first).toEqual({ inToolbar: true, outline: 'solid' });
  });

  it('moves a pole, the fit range and a new landmark without a mouse', async () => {
    const { page } = h;
    const before = await page.getByTestId('handle-posterior').getAttribute('data-x');
    await page.getByTestId('handle-posterior').focus();
    for (let k = 0; k < 3; k += 1) await page.keyboard.press('Shift+ArrowLeft');
    await expect.poll(() => page.getByTestId('handle-posterior').getAttribute('data-x')).toBe((Number(before) - 30).toFixed(1));
    const lambda = await page.getByTestId('lambda-um').textContent();
    await page.getByTestId('fit-hi').focus();
    await page.keyboard.press('Shift+ArrowRight');
    await expect.poll(() => page.getByTestId('lambda-um').textContent()).not.toBe(lambda);
    expect(await page.getByTestId('fit-hi').getAttribute('aria-valuenow')).toBe('0.65');
    const n = await page.getByTestId('landmark').count();
    await page.getByTestId('add-landmark').focus();
    await page.keyboard.press('Enter');
    await expect.poll(() => page.getByTestId('landmark').count()).toBe(n + 1);
    for (let k = 0; k < 4; k += 1) await page.keyboard.press('Control+z');
  });

  it('moves the display range handles of the histogram without a mouse', async () => {
    const { page } = h;
    const low = page.getByTestId('hist-low').first();
    const before = Number(await low.getAttribute('aria-valuenow'));
    await low.focus();
    await page.keyboard.press('Shift+ArrowRight');
    await expect.poll(async () => Number(await low.getAttribute('aria-valuenow'))).toBeGreaterThan(before);
    await page.keyboard.press('Home');
    await expect.poll(() => low.getAttribute('aria-valuenow')).toBe(await low.getAttribute('aria-valuemin'));
  });
});

describe('long messages', { timeout: 60_000 }, () => {
  it('a save that fails shows one line under the toolbar; the toolbar keeps its single line', async () => {
    const { page } = h;
    await page.setViewportSize({ width: 1280, height: 720 });
    // Fresh handlers have not opened this project, so the next autosave is refused with a long message.
    h.freshHandlers();
    await page.getByTestId('handle-anterior').focus();
    await page.keyboard.press('ArrowLeft');
    await expect.poll(() => page.getByTestId('save-status').textContent(), { timeout: 10_000 }).toBe('not saved ⚠');
    const message = page.getByTestId('message');
    expect(await message.textContent()).toMatch(/^Not saved: /);
    expect(((await page.getByTestId('toolbar').boundingBox()) as Box).height).toBeLessThanOrEqual(39);
    expect(((await message.boundingBox()) as Box).height).toBeLessThanOrEqual(20);
    // The image and the profile's x axis are still on screen.
    expect(inside(await box(page, '[data-testid=profile-x-title]'), { x: 0, y: 0, width: 1280, height: 720 })).toBe(true);
    await page.screenshot({ path: join(ARTIFACTS, 'layout-save-error-1280x720.png') });
  });
});

// The numbers panel says which standard error λ's interval rests on, in Chromium over the real handlers (see
// harness.ts): the SEs, their source and the lag-1 residual correlation shown for the demo file equal the row the
// batch wrote to embryos.csv, and the sentence is not clipped at 1280×720 or 1440×900. Demo data only.
import { mkdtempSync, promises as fs } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fmt } from '../../renderer/ui/format';
import { ARTIFACTS, chooseBatchOutput, csvFileRows, ensureRendererBuilt, startReadyHarness, testIdText } from './harness';
import type { Harness } from './harness';

let h: Harness;
let scratch: string;

beforeAll(async () => {
  scratch = mkdtempSync(join(tmpdir(), 'eggline-interval-source-'));
  await fs.mkdir(ARTIFACTS, { recursive: true });
  await ensureRendererBuilt();
  h = await startReadyHarness(join(scratch, 'data'), 1, { width: 1280, height: 720 });
}, 180_000);

afterAll(async () => {
  await h?.close();
  await fs.rm(scratch, { recursive: true, force: true });
});

describe('which standard error the interval rests on', { timeout: 150_000 }, () => {
  it('the panel\'s SEs, their source and the lag-1 correlation equal embryos.csv\'s for the shown demo file', async () => {
    const { page } = h;
    const out = await chooseBatchOutput(h, join(scratch, 'out'));
    await page.getByTestId('batch-run').click();
    await page.getByTestId('batch-results').waitFor({ timeout: 120_000 });
    const row = page.getByTestId('batch-row').first();
    const file = (await row.getAttribute('data-file')) ?? '';
    await row.click();
    await page.getByTestId('embryo-view').waitFor();
    await expect.poll(() => page.locator('[data-testid=folder-entry].current').getAttribute('data-name')).toBe(file);
    const note = page.getByTestId('lambda-ci-source');
    await note.waitFor({ timeout: 60_000 });
    await expect.poll(() => testIdText(page, 'file-note')).toMatch(/analysed by the last batch/);

    const csv = (await csvFileRows(join(out, 'embryos.csv'))).find((r) => r.file === file);
    expect(csv).toBeDefined();
    const c = csv as Record<string, string>;
    // The panel's values are the fit object's own, written in full, as embryos.csv writes them (String(number)).
    expect(await note.getAttribute('data-se-source')).toBe(c.lambda_se_source);
    // The window measures with the same core functions as the batch, but in Chromium's JavaScript engine, whose
    // Math.exp and friends may differ from Node's in the last bit (from memory: ECMAScript leaves their precision to
    // the implementation), so the values agree to 1e-9 relative rather than bit for bit.
    const same = async (attr: string, column: string) => {
      const shown = Number(await note.getAttribute(attr));
      const written = Number(c[column]);
      expect(Number.isFinite(written), column).toBe(true);
      expect(Math.abs(shown - written), column).toBeLessThanOrEqual(1e-9 * Math.abs(written));
    };
    await same('data-se-model-um', 'lambda_se_model_um');
    await same('data-se-serial-um', 'lambda_se_serial_um');
    await same('data-lag1', 'residual_lag1');
    // And the sentence shows them rounded.
    const sentence = (await note.textContent()) ?? '';
    expect(sentence).toContain(`model SE ${fmt(Number(c.lambda_se_model_um), 2)} µm`);
    expect(sentence).toContain(`serial-correlation SE ${fmt(Number(c.lambda_se_serial_um), 2)} µm`);
    expect(sentence).toMatch(c.lambda_se_source === 'serial' ? /^interval from the serial-correlation SE/ : /^interval from the model SE/);
    expect(await note.getAttribute('title')).toMatch(/wider/);
  });

  for (const [width, height] of [[1280, 720], [1440, 900]] as const) {
    it(`the sentence is not clipped at ${width}×${height}`, async () => {
      const { page } = h;
      await page.setViewportSize({ width, height });
      const note = page.getByTestId('lambda-ci-source');
      await note.scrollIntoViewIfNeeded();
      await page.screenshot({ path: join(ARTIFACTS, `interval-source-${width}x${height}.png`) });
      const fit = await note.evaluate((el) => {
        // The sentence lies inside its panel and inside the visible part of the side column that scrolls it, and
        // neither it nor its panel holds content wider than itself.
        const panel = el.closest('[data-testid=fit-numbers]') as HTMLElement;
        const column = panel.parentElement as HTMLElement;
        const a = el.getBoundingClientRect();
        const p = panel.getBoundingClientRect();
        const c = column.getBoundingClientRect();
        const visibleRight = c.left + column.clientWidth;
        return {
          insidePanel: a.left >= p.left - 0.5 && a.right <= p.right + 0.5,
          insideColumn: a.left >= c.left - 0.5 && a.right <= visibleRight + 0.5 && a.right <= window.innerWidth,
          noOverflow: el.scrollWidth <= el.clientWidth + 1 && panel.scrollWidth <= panel.clientWidth + 1,
          width: a.width,
        };
      });
      expect(fit).toEqual({ insidePanel: true, insideColumn: true, noOverflow: true, width: fit.width });
      expect(fit.width).toBeGreaterThan(0);
    });
  }
});

// End to end in Chromium: the built window over the real app handlers (see harness.ts). Demo data only.
import { mkdtempSync, promises as fs } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { openStackForAnalysis } from '../../app/decode/open-for-analysis';
import { ARTIFACTS, chooseBatchOutput, ensureRendererBuilt, startHarness, testIdText } from './harness';
import type { Harness } from './harness';
import { DEFAULT_SETTINGS } from '../../core/settings';

let h: Harness;
let scratch: string;
let dataDir: string;

const shot = (page: Page, name: string) => page.screenshot({ path: join(ARTIFACTS, `${name}.png`) });
const text = testIdText;
const centre = async (page: Page, selector: string) => {
  const box = await page.locator(selector).first().boundingBox();
  if (box === null) throw new Error(`${selector} is not visible`);
  return { x: box.x + box.width / 2, y: box.y + box.height / 2 };
};
const drag = async (page: Page, from: { x: number; y: number }, to: { x: number; y: number }) => {
  await page.mouse.move(from.x, from.y);
  await page.mouse.down();
  for (let k = 1; k <= 8; k += 1) await page.mouse.move(from.x + ((to.x - from.x) * k) / 8, from.y + ((to.y - from.y) * k) / 8);
  await page.mouse.up();
};
/** λ text changes away from `before`. */
/** x/EL shown for the landmark named `name` in the landmark table. */
const landmarkXel = (page: Page, name: string) => page.locator(`[data-testid=landmark-row][data-name="${name}"] [data-testid=landmark-xel]`).textContent().then((t) => t ?? '');
const lambdaChanges = (page: Page, before: string) => expect.poll(() => text(page, 'lambda-um'), { timeout: 10_000 }).not.toBe(before);
/** Mean of R+G+B over the image canvas (0–765): how bright the shown image is. */
const canvasBrightness = (page: Page) => page.locator('.image-canvas').first().evaluate((c: HTMLCanvasElement) => {
  const ctx = c.getContext('2d');
  if (ctx === null) return -1;
  const d = ctx.getImageData(0, 0, c.width, c.height).data;
  let sum = 0;
  for (let i = 0; i < d.length; i += 4) sum += d[i] + d[i + 1] + d[i + 2];
  return sum / (d.length / 4);
});
/** Open the batch tab and pick a new output folder `name` (in the scratch folder) through the fake dialog. */
const numberIn = (s: string) => Number(/-?\d+(\.\d+)?(e[-+]?\d+)?/i.exec(s)?.[0] ?? NaN);

beforeAll(async () => {
  scratch = mkdtempSync(join(tmpdir(), 'eggline-e2e-'));
  dataDir = join(scratch, 'data');
  await fs.mkdir(ARTIFACTS, { recursive: true });
  await ensureRendererBuilt();
  // Four demo embryos keep the run short; they span the demo's conditions.
  h = await startHarness(dataDir, 4);
}, 180_000);

afterAll(async () => {
  await h?.close();
  await fs.rm(scratch, { recursive: true, force: true });
});

describe('editor window', { timeout: 150_000 }, () => {
  let handleA = { x: 0, y: 0 };
  let handleP = { x: 0, y: 0 };
  let lambdaAfterEdits = '';
  let placedXel = '';

  it('opens the demo at start: the axis appears with A and P handles and a fitted λ', async () => {
    const { page } = h;
    await page.getByTestId('handle-anterior').waitFor({ timeout: 90_000 });
    await expect.poll(() => text(page, 'lambda-um'), { timeout: 20_000 }).toMatch(/µm/);
    expect(await page.getByTestId('folder-entry').count()).toBeGreaterThan(1);
    await expect.poll(() => page.getByTestId('band').count()).toBeGreaterThan(0);
    await shot(page, '01-demo-opened');
  });

  it('ticking a boundary channel in the settings draws its boundary across the embryo and on the profile', async () => {
    const { page } = h;
    await page.getByTestId('boundary-channel-2').check();
    await page.locator('.image-overlay .boundary-line').first().waitFor({ timeout: 10_000 });
    expect(await page.locator('[data-testid=profile-plot] .boundary-line').count()).toBeGreaterThan(0);
  });

  it('dragging the posterior handle changes λ', async () => {
    const { page } = h;
    const before = await text(page, 'lambda-um');
    const p = await centre(page, '[data-testid=handle-posterior] circle');
    await drag(page, p, { x: p.x - 70, y: p.y + 12 });
    await lambdaChanges(page, before);
    expect(await text(page, 'undo')).toBe('Undo');
    await shot(page, '02-posterior-dragged');
  });

  it('swap A/P exchanges the poles (button), and S swaps back', async () => {
    const { page } = h;
    const a0 = await centre(page, '[data-testid=handle-anterior] circle');
    const p0 = await centre(page, '[data-testid=handle-posterior] circle');
    await page.getByTestId('swap').click();
    const a1 = await centre(page, '[data-testid=handle-anterior] circle');
    expect(Math.abs(a1.x - p0.x)).toBeLessThan(1.5);
    expect(Math.abs(a1.y - p0.y)).toBeLessThan(1.5);
    await shot(page, '03-poles-swapped');
    await page.keyboard.press('s');
    const a2 = await centre(page, '[data-testid=handle-anterior] circle');
    expect(Math.abs(a2.x - a0.x)).toBeLessThan(1.5);
  });

  it('places a landmark, moves it, and undo puts it back', async () => {
    const { page } = h;
    await page.getByTestId('tool-landmark').click();
    const a = await centre(page, '[data-testid=handle-anterior] circle');
    const p = await centre(page, '[data-testid=handle-posterior] circle');
    const spot = { x: a.x + (p.x - a.x) * 0.35, y: a.y + (p.y - a.y) * 0.35 - 20 };
    await page.mouse.click(spot.x, spot.y);
    await page.locator('[data-testid=landmark][data-name=L1]').waitFor();
    const placed = await landmarkXel(page, 'L1');
    expect(Number(placed)).toBeGreaterThan(0.25);
    expect(Number(placed)).toBeLessThan(0.45);
    await drag(page, spot, { x: spot.x + 60, y: spot.y });
    await expect.poll(() => landmarkXel(page, 'L1')).not.toBe(placed);
    await shot(page, '04a-landmark-moved');
    await page.keyboard.press('Control+z');
    await expect.poll(() => landmarkXel(page, 'L1')).toBe(placed);
    placedXel = placed;
    // Select it in the table, Delete removes it, undo brings it back.
    await page.locator('[data-testid=landmark-row][data-name=L1] [data-testid=landmark-xel]').click();
    await page.keyboard.press('Delete');
    await expect.poll(() => page.locator('[data-testid=landmark][data-name=L1]').count()).toBe(0);
    await page.keyboard.press('Control+z');
    await expect.poll(() => landmarkXel(page, 'L1')).toBe(placed);
    await page.getByTestId('tool-axis').click();
    await shot(page, '04b-landmark-move-undone');
  });

  it('saves the project with the hand axis and the landmark', async () => {
    const { page } = h;
    await expect.poll(() => text(page, 'save-status'), { timeout: 10_000 }).toMatch(/^saved/);
    const doc = JSON.parse(await fs.readFile(join(dataDir, 'demo', 'eggline-project.json'), 'utf8')) as { files: Record<string, { axis: { source: string } | null; landmarks: { name: string }[] }> };
    const edited = Object.values(doc.files).find((f) => f.landmarks.some((l) => l.name === 'L1'));
    expect(edited?.axis?.source).toBe('hand');
    handleA = await centre(page, '[data-testid=handle-anterior] circle');
    handleP = await centre(page, '[data-testid=handle-posterior] circle');
    lambdaAfterEdits = await text(page, 'lambda-um');
  });

  it('refuses a reversed fit range at the field with the rule\'s message, and the project keeps saving other edits', async () => {
    const { page } = h;
    const projectFile = join(dataDir, 'demo', 'eggline-project.json');
    type Saved = { settings: { fitRangeEl: number[]; profile: { edgeDepthUm: number } } };
    const saved = async () => JSON.parse(await fs.readFile(projectFile, 'utf8')) as Saved;
    // Source: core/settings' rule for the fit range (0 ≤ a < b ≤ 1), the same rule the command line states.
    await page.getByTestId('fit-range-from').fill('0.7');
    await page.getByTestId('fit-range-from').press('Enter');
    await expect.poll(() => text(page, 'field-error-fit-range'))
      .toBe('fit range x/EL must be two numbers [a, b] with 0 ≤ a < b ≤ 1 (got 0.7, 0.6)');
    await shot(page, '04c-fit-range-refused');
    // Another setting still goes into the saved project, and the refused range never did.
    await page.getByTestId('edge-depth').fill('10');
    await page.getByTestId('edge-depth').press('Enter');
    await expect.poll(async () => (await saved()).settings.profile.edgeDepthUm, { timeout: 10_000 }).toBe(10);
    expect((await saved()).settings.fitRangeEl).toEqual([0.1, 0.6]);
    // The status may still say "saving…" for a moment after the file is written.
    await expect.poll(() => text(page, 'save-status'), { timeout: 10_000 }).toMatch(/^saved/);
    // Back to the demo's values for the tests that follow.
    await page.getByTestId('fit-range-from').fill('0.1');
    await page.getByTestId('fit-range-from').press('Enter');
    await page.getByTestId('edge-depth').fill(String(DEFAULT_SETTINGS.profile.edgeDepthUm));
    await page.getByTestId('edge-depth').press('Enter');
    await expect.poll(async () => (await saved()).settings.profile.edgeDepthUm, { timeout: 10_000 }).toBe(DEFAULT_SETTINGS.profile.edgeDepthUm);
    await expect.poll(() => page.getByTestId('field-error-fit-range').count()).toBe(0);
    await expect.poll(() => text(page, 'lambda-um'), { timeout: 10_000 }).toBe(lambdaAfterEdits);
  });

  it('switching the profile mode shows that sampler\'s own settings, its region on the image, and its numbers', async () => {
    const { page } = h;
    // [polygons, points] of the drawn region. Source: core/profile/samplers (the axis strip is one rectangle, the edge
    // band the contours of its pixels: many points).
    const shape = async () => {
      const d = (await page.getByTestId('band').getAttribute('d')) ?? '';
      return [d.split('M').length - 1, d.split(',').length - 1];
    };
    const isBand = async () => { const [polygons, points] = await shape(); return polygons >= 1 && points > 4 * polygons; };
    await expect.poll(isBand, { timeout: 10_000 }).toBe(true);
    await page.getByTestId('profile').selectOption('axis');
    await expect.poll(() => page.getByTestId('strip-width').count()).toBe(1);
    expect(await page.getByTestId('edge-depth').count()).toBe(0);
    await expect.poll(shape, { timeout: 10_000 }).toEqual([1, 4]);
    await expect.poll(() => text(page, 'lambda-um'), { timeout: 10_000 }).not.toBe(lambdaAfterEdits);
    await shot(page, '04d-axis-strip');
    await page.getByTestId('profile').selectOption('edge');
    await expect.poll(() => page.getByTestId('edge-depth').count()).toBe(1);
    await expect.poll(isBand, { timeout: 10_000 }).toBe(true);
    await expect.poll(() => text(page, 'lambda-um'), { timeout: 10_000 }).toBe(lambdaAfterEdits);
    // The project is saved with the edge band again before the next test reloads it.
    const projectFile = join(dataDir, 'demo', 'eggline-project.json');
    const savedMode = async () => (JSON.parse(await fs.readFile(projectFile, 'utf8')) as { settings: { profile: { mode: string } } }).settings.profile.mode;
    await expect.poll(savedMode, { timeout: 10_000 }).toBe('edge');
    await expect.poll(() => text(page, 'save-status'), { timeout: 10_000 }).toMatch(/^saved/);
  });

  it('the file\'s own dorsal side: shown for a one-sided band, moves the band and λ, saved in the project, and back; each side apart shows both fits and their difference', async () => {
    const { page } = h;
    const projectFile = join(dataDir, 'demo', 'eggline-project.json');
    type Saved = { settings: { profile: { edgeSide: string } }; files: Record<string, { dorsalSide?: string | null }> };
    const saved = async () => JSON.parse(await fs.readFile(projectFile, 'utf8')) as Saved;
    const band = async () => (await page.getByTestId('band').getAttribute('d')) ?? '';
    // With both sides sampled the file's dorsal side changes nothing, so the control is not offered.
    expect(await page.getByTestId('file-dorsal-side').count()).toBe(0);
    await page.getByTestId('edge-side').selectOption('dorsal');
    await expect.poll(() => page.getByTestId('file-dorsal-side').count(), { timeout: 10_000 }).toBe(1);
    await expect.poll(() => text(page, 'lambda-um'), { timeout: 10_000 }).not.toBe(lambdaAfterEdits);
    // Settled: the band and λ read the same twice, half a second apart.
    const settled = async () => { const a = [await band(), await text(page, 'lambda-um')]; await page.waitForTimeout(500); const b = [await band(), await text(page, 'lambda-um')]; return a[0] === b[0] && a[1] === b[1]; };
    await expect.poll(settled, { timeout: 10_000 }).toBe(true);
    const sharedBand = await band();
    const sharedLambda = await text(page, 'lambda-um');
    // The other side of A→P for this file only: the band moves to the other half of the outline and λ follows it.
    const other = DEFAULT_SETTINGS.profile.dorsalSide === 'left' ? 'right' : 'left';
    await page.getByTestId('file-dorsal-side').selectOption(other);
    await expect.poll(band, { timeout: 10_000 }).not.toBe(sharedBand);
    await expect.poll(() => text(page, 'lambda-um'), { timeout: 10_000 }).not.toBe(sharedLambda);
    await expect.poll(async () => Object.values((await saved()).files).filter((f) => f.dorsalSide === other).length, { timeout: 10_000 }).toBe(1);
    // Back to the settings' side: the band and λ are the shared ones again and the project forgets the file's own.
    await page.getByTestId('file-dorsal-side').selectOption('shared');
    await expect.poll(band, { timeout: 10_000 }).toBe(sharedBand);
    await expect.poll(() => text(page, 'lambda-um'), { timeout: 10_000 }).toBe(sharedLambda);
    await expect.poll(async () => Object.values((await saved()).files).filter((f) => f.dorsalSide === other).length, { timeout: 10_000 }).toBe(0);
    // Each side apart: λ stays that of both sides pooled; each side's fit, its band and their difference appear.
    await page.getByTestId('edge-side').selectOption('each');
    await expect.poll(() => text(page, 'lambda-um'), { timeout: 10_000 }).toBe(lambdaAfterEdits);
    await expect.poll(() => text(page, 'lambda-difference'), { timeout: 10_000 }).toMatch(/µm \(95% CI .+ – .+\)$/);
    expect(await text(page, 'lambda-dorsal')).toMatch(/µm/);
    expect(await page.getByTestId('side-fit-dorsal').count()).toBe(1);
    expect(await page.getByTestId('side-fit-ventral').count()).toBe(1);
    expect(await page.getByTestId('file-dorsal-side').count()).toBe(1);
    await shot(page, '04e-each-side');
    // Both sides again for the tests that follow.
    await page.getByTestId('edge-side').selectOption('both');
    await expect.poll(() => text(page, 'lambda-um'), { timeout: 10_000 }).toBe(lambdaAfterEdits);
    await expect.poll(async () => (await saved()).settings.profile.edgeSide, { timeout: 10_000 }).toBe('both');
    await expect.poll(() => text(page, 'save-status'), { timeout: 10_000 }).toMatch(/^saved/);
  });

  it('after a reload with fresh handlers on the same data folder, everything is restored', async () => {
    const { page } = h;
    h.freshHandlers();
    await page.reload();
    await page.locator('[data-testid=landmark][data-name=L1]').waitFor({ timeout: 60_000 })
      .catch(async (e: unknown) => { await shot(page, '05-FAILED-reload'); throw e; });
    await expect.poll(() => text(page, 'lambda-um'), { timeout: 20_000 }).toBe(lambdaAfterEdits);
    const a = await centre(page, '[data-testid=handle-anterior] circle');
    const p = await centre(page, '[data-testid=handle-posterior] circle');
    expect(Math.abs(a.x - handleA.x) + Math.abs(a.y - handleA.y)).toBeLessThan(1.5);
    expect(Math.abs(p.x - handleP.x) + Math.abs(p.y - handleP.y)).toBeLessThan(1.5);
    expect(await landmarkXel(page, 'L1')).toBe(placedXel);
    expect(await page.getByTestId('boundary-channel-2').isChecked()).toBe(true);
    // Hand edits are marked in the list; no batch has run, so the file is still new.
    expect(await page.locator('[data-testid=folder-entry] .hand-edited').count()).toBeGreaterThanOrEqual(1);
    expect(await page.locator('[data-testid=folder-entry].current').getAttribute('data-status')).toBe('new');
    await shot(page, '05-restored-after-reload');
  });

  it('dragging the fit-range end changes λ', async () => {
    const { page } = h;
    const before = await text(page, 'lambda-um');
    const hi = await centre(page, '[data-testid=fit-hi] rect');
    await drag(page, hi, { x: hi.x + 90, y: hi.y });
    await lambdaChanges(page, before);
    await shot(page, '06-fit-range-dragged');
  });

  it('the Z slider shows one raw slice and goes back to the projection', async () => {
    const { page } = h;
    const slider = page.getByTestId('z-slider');
    await slider.fill('1');
    await expect.poll(() => page.locator('.channel-panel').textContent()).toMatch(/Z 2 \/ \d+/);
    expect(await page.getByTestId('message').count()).toBe(0);
    await shot(page, '06b-z-slice');
    await slider.fill('-1');
    await expect.poll(() => page.locator('.channel-panel').textContent()).toMatch(/Z projection/);
  });

  it('dragging the histogram\'s high handle lowers the display high and brightens the image', async () => {
    const { page } = h;
    const highBefore = numberIn(await text(page, 'display-high'));
    const lowBefore = numberIn(await text(page, 'display-low'));
    const brightBefore = await canvasBrightness(page);
    const lambdaBefore = await text(page, 'lambda-um');
    const hi = await centre(page, '[data-testid=hist-high] rect');
    const lo = await centre(page, '[data-testid=hist-low] rect');
    await page.locator('.channel-panel').screenshot({ path: join(ARTIFACTS, '06c-display-before.png') });
    // Halfway towards the low handle: the display range roughly halves, so channel 1 is drawn brighter.
    await drag(page, hi, { x: (hi.x + lo.x) / 2, y: hi.y });
    await expect.poll(async () => numberIn(await text(page, 'display-high'))).toBeLessThan(highBefore);
    const highAfter = numberIn(await text(page, 'display-high'));
    expect(highAfter).toBeGreaterThan(lowBefore);
    expect(numberIn(await text(page, 'display-low'))).toBe(lowBefore);
    const handleAfter = await centre(page, '[data-testid=hist-high] rect');
    expect(Math.abs(handleAfter.x - (hi.x + lo.x) / 2)).toBeLessThan(3);
    await expect.poll(() => canvasBrightness(page)).toBeGreaterThan(brightBefore);
    // Display only: the measurement is untouched.
    expect(await text(page, 'lambda-um')).toBe(lambdaBefore);
    await page.locator('.channel-panel').screenshot({ path: join(ARTIFACTS, '06d-display-high-dragged.png') });
    await shot(page, '06e-display-high-dragged');
  });

  it('exports the profile figure (SVG), the annotated image (PNG) and the profile table (CSV)', async () => {
    const { page } = h;
    const saveDir = join(scratch, 'exports');
    await fs.mkdir(saveDir);
    h.dialogs.saveDir = saveDir;
    for (const label of ['Profile figure (SVG)', 'Annotated image (PNG, full resolution)', 'Annotated image (PNG, 2× for high-DPI)', 'Profile table (CSV)']) {
      await page.getByTestId('export').click();
      await page.getByRole('menuitem', { name: label }).click();
      await expect.poll(() => text(page, 'message'), { timeout: 30_000 }).toMatch(/^Saved /);
      await page.getByTestId('message').click();
    }
    const files = (await fs.readdir(saveDir)).sort();
    expect(files).toHaveLength(4);
    const svg = await fs.readFile(join(saveDir, files.find((f) => f.endsWith('.svg')) ?? ''), 'utf8');
    expect(svg).toContain('<svg');
    const png = await fs.readFile(join(saveDir, files.find((f) => f.endsWith('-annotated.png')) ?? ''));
    const png2 = await fs.readFile(join(saveDir, files.find((f) => f.endsWith('-annotated@2x.png')) ?? ''));
    // Source: PNG specification §5.2 (signature bytes).
    expect(Array.from(png.subarray(0, 8))).toEqual([137, 80, 78, 71, 13, 10, 26, 10]);
    // Source: PNG specification §11.2.2 (IHDR: width and height, 4-byte big-endian, at bytes 16 and 20).
    const size = (b: Buffer) => [b.readUInt32BE(16), b.readUInt32BE(20)];
    const shown = await page.locator('[data-testid=folder-entry].current').getAttribute('data-name');
    const opened = await openStackForAnalysis(join(dataDir, 'demo', shown ?? ''), shown ?? '');
    await opened.source.close();
    // The annotated image has the stack's full resolution, and the 2× export twice that.
    expect(size(png)).toEqual([opened.info.sizeX, opened.info.sizeY]);
    expect(size(png2)).toEqual([2 * opened.info.sizeX, 2 * opened.info.sizeY]);
    const csv = await fs.readFile(join(saveDir, files.find((f) => f.endsWith('.csv')) ?? ''), 'utf8');
    expect(csv.split('\n')[0]).toContain('x_el');
    // Keep the exports beside the screenshots, to look at.
    for (const f of files) await fs.copyFile(join(saveDir, f), join(ARTIFACTS, `export-${f}`));
  });

  it('runs a batch on the demo folder: progress, then results', async () => {
    const { page } = h;
    const out = await chooseBatchOutput(h, join(scratch, 'out'));
    await page.getByTestId('batch-run').click();
    await page.getByTestId('batch-results').waitFor({ timeout: 120_000 });
    expect(h.progress.length).toBeGreaterThan(2);
    expect(await text(page, 'batch-progress')).toMatch(/^(\d+) \/ \1/);
    expect(await page.locator('[data-testid=batch-results] tbody tr').count()).toBe(4);
    const summary = await text(page, 'batch-summary');
    expect(summary).toMatch(/^Finished: [1-4] ok/);
    expect(await fs.readdir(out)).not.toHaveLength(0);
    // The demo folder has samples.csv, so the cohort step ran after the batch.
    expect(await text(page, 'batch-cohort')).toMatch(/^Conditions compared \(4, from samples\.csv\)/);
    await shot(page, '07-batch-finished');
  });

  it('the cohort view shows the four dosage conditions (from the demo samples.csv), the dosage test and the report figures', async () => {
    const { page } = h;
    await page.getByTestId('tab-cohort').click();
    await page.getByTestId('cohort-view').waitFor();
    // Demo data: the demo sample sheet lists dosages 0.5, 1, 2 and 4 (one embryo each with the 4-file subset).
    const names = await page.getByTestId('cohort-condition').evaluateAll((rows) => rows.map((r) => r.getAttribute('data-name')));
    expect(names).toEqual(['dosage-0.5x', 'dosage-1x', 'dosage-2x', 'dosage-4x']);
    expect(await page.getByTestId('cohort-n').allTextContents()).toEqual(['1', '1', '1', '1']);
    expect(await text(page, 'cohort-conditions')).toContain('(reference)');
    // n = 1 per condition: values without intervals, never NaN.
    expect(await text(page, 'cohort-view')).not.toMatch(/NaN/);
    await page.getByTestId('cohort-dosage').waitFor();
    expect(await page.getByTestId('cohort-slope').count()).toBeGreaterThan(0);
    const shiftConditions = await page.getByTestId('cohort-shift').evaluateAll((rows) => rows.map((r) => r.getAttribute('data-condition')));
    expect(new Set(shiftConditions)).toEqual(new Set(['dosage-0.5x', 'dosage-2x', 'dosage-4x']));
    expect(await page.locator('[data-testid=cohort-figure] svg').count()).toBeGreaterThanOrEqual(4);
    const report = await text(page, 'cohort-report');
    expect(report).toMatch(/report\.html$/);
    expect((await fs.readFile(report, 'utf8')).startsWith('<!DOCTYPE html>')).toBe(true);
    // The figures keep their own colours: the window's plot styles must not repaint the injected SVG.
    const strokes = await page.locator('[data-testid=cohort-figure][data-name=cohort-profiles] .mean-line')
      .evaluateAll((lines) => lines.map((l) => [getComputedStyle(l).stroke, l.getAttribute('stroke')]));
    expect(strokes).toHaveLength(4);
    expect(new Set(strokes.map(([computed]) => computed)).size).toBe(4);
    await shot(page, '08-cohort');
    await page.getByTestId('cohort-figure').first().scrollIntoViewIfNeeded();
    await shot(page, '08b-cohort-figures');
    for (const fig of await page.getByTestId('cohort-figure').all()) {
      await fig.screenshot({ path: join(ARTIFACTS, `08c-figure-${await fig.getAttribute('data-name')}.png`) });
    }
  });

  it('cancelling a batch: the panel says it was cancelled and the files finished before keep their rows', async () => {
    const { page } = h;
    await chooseBatchOutput(h, join(scratch, 'out-cancelled'));
    const from = h.progress.length;
    // The demo files analyse in well under a second each, so the run is held before its second file until
    // Cancel reaches the app: then the first file is surely done and the rest surely not (real analysis throughout).
    h.holdBatchUntilCancel(1);
    await page.getByTestId('batch-run').click();
    await page.locator('.batch-files .status-ok, .batch-files .status-error').first().waitFor({ timeout: 120_000 });
    await shot(page, '09a-batch-running');
    await page.getByTestId('batch-cancel').click();
    await page.getByTestId('batch-results').waitFor({ timeout: 120_000 });
    const events = h.progress.slice(from);
    expect(events.at(-1)?.status).toBe('cancelled');
    const finished = events.filter((e) => e.file !== null && (e.status === 'ok' || e.status === 'error'));
    const ok = finished.filter((e) => e.status === 'ok').length;
    // The first file, plus the second, which had started when Cancel came and is allowed to finish; files 3 and 4 never start.
    expect(finished).toHaveLength(2);
    expect(events.filter((e) => e.status === 'running')).toHaveLength(2);
    expect(await text(page, 'batch-summary')).toMatch(new RegExp(`^Cancelled: ${ok} ok, ${finished.length - ok} failed, 2 not run ·`));
    const rows = await page.locator('[data-testid=batch-results] tbody tr td:first-child').allTextContents();
    expect([...rows].sort()).toEqual(finished.map((e) => e.file).sort());
    // Each finished file's row carries its λ (a number, not a dash).
    const lambdas = await page.locator('[data-testid=batch-results] tbody tr:not(.row-error) td:nth-child(3)').allTextContents();
    expect(lambdas).toHaveLength(ok);
    for (const l of lambdas) expect(Number.isFinite(numberIn(l))).toBe(true);
    expect(await page.getByTestId('batch-cohort').count()).toBe(0);
    await shot(page, '09b-batch-cancelled');
    await page.getByTestId('tab-cohort').click();
    expect(await text(page, 'cohort-hint')).toMatch(/cancelled/);
  });
});

describe('undo stays on the shown file', { timeout: 120_000 }, () => {
  it('Ctrl+Z on another file never changes the file edited before; back on it, undo works', async () => {
    const { page } = h;
    await page.getByTestId('tab-embryo').click();
    await page.getByTestId('handle-anterior').waitFor({ timeout: 30_000 });
    const first = await page.locator('[data-testid=folder-entry].current').getAttribute('data-name');
    const a0 = await centre(page, '[data-testid=handle-anterior] circle');
    const p0 = await centre(page, '[data-testid=handle-posterior] circle');
    await page.getByTestId('swap').click();
    await page.keyboard.press('PageDown');
    await expect.poll(() => page.locator('[data-testid=folder-entry].current').getAttribute('data-name'), { timeout: 30_000 }).not.toBe(first);
    await page.getByTestId('handle-anterior').waitFor({ timeout: 30_000 });
    expect(await page.getByTestId('undo').isDisabled()).toBe(true);
    await page.keyboard.press('Control+z');
    await page.keyboard.press('PageUp');
    await expect.poll(() => page.locator('[data-testid=folder-entry].current').getAttribute('data-name'), { timeout: 30_000 }).toBe(first);
    await page.getByTestId('handle-anterior').waitFor({ timeout: 30_000 });
    // Still swapped: the Ctrl+Z on the other file did not reach this one. Compared as the direction A→P on screen, which
    // a change of zoom or pane size (the view is fitted again on return) leaves alone: −1 swapped, +1 as detected.
    const directionNow = async () => {
      const a = await centre(page, '[data-testid=handle-anterior] circle');
      const p = await centre(page, '[data-testid=handle-posterior] circle');
      const [ux, uy, vx, vy] = [p0.x - a0.x, p0.y - a0.y, p.x - a.x, p.y - a.y];
      return (ux * vx + uy * vy) / (Math.hypot(ux, uy) * Math.hypot(vx, vy));
    };
    await expect.poll(directionNow, { timeout: 20_000 }).toBeLessThan(-0.999);
    await shot(page, '10-undo-on-other-file-kept-swap');
    await page.keyboard.press('Control+z');
    await expect.poll(directionNow).toBeGreaterThan(0.999);
  });
  it('files dropped on the window open as loose files (the real openDropped handler)', async () => {
    const { page } = h;
    const demo = join(dataDir, 'demo');
    const name = (await fs.readdir(demo)).filter((f) => f.endsWith('.ome.tif')).sort()[1];
    await page.evaluate(([root, file]) => {
      (window as unknown as { __egglineDropRoot: string }).__egglineDropRoot = root;
      const dt = new DataTransfer();
      dt.items.add(new File([new Uint8Array(8)], file));
      document.querySelector('.app')?.dispatchEvent(new DragEvent('drop', { dataTransfer: dt, bubbles: true, cancelable: true }));
    }, [demo, name]);
    await expect.poll(() => page.locator('[data-testid=folder-entry]').count(), { timeout: 30_000 }).toBe(1);
    expect(await page.locator('[data-testid=folder-entry]').first().textContent()).toContain(name);
    await page.getByTestId('handle-anterior').waitFor({ timeout: 30_000 });
    // Loose files have no project: the status bar must not claim a save is under way.
    await expect.poll(() => page.getByText('saving…').count(), { timeout: 10_000 }).toBe(0);
    await shot(page, '11-dropped-file');
  });
});

// The Cohort tab's comparison options in Chromium over the real handlers (see harness.ts): a reference and a
// normalisation picked in the window recompute the comparison; the σx shown equals what `eggline cohort` writes with the
// same flags, and with `--project` over the project file the window saved. Demo data only (8 demo embryos, 2 per
// condition).
import { mkdtempSync, promises as fs } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cohortCommand } from '../../app/cli/cohort-command';
import { escapeXml, valueWithCi } from '../../core/figures';
import { ARTIFACTS, chooseBatchOutput, ensureRendererBuilt, startReadyHarness, testIdText } from './harness';
import type { Harness } from './harness';

let h: Harness;
let scratch: string;
let out: string;

const text = testIdText;
const quiet = { stdout: { write: () => true }, stderr: { write: () => true } };

/** The rows of a CSV written by the cohort step (no quoted commas in these tables). */
async function csvRows(path: string): Promise<Record<string, string>[]> {
  const [head, ...lines] = (await fs.readFile(path, 'utf8')).trim().split(/\r?\n/);
  const keys = head.split(',');
  return lines.map((l) => Object.fromEntries(l.split(',').map((v, i) => [keys[i], v])));
}

/** The window's "value [lo, hi]" for a σx row of positional_error.csv at x (same formatting, core/figures valueWithCi). */
function shownSigma(rows: Record<string, string>[], condition: string, xEl: number): string {
  const r = rows.find((row) => row.condition === condition && Math.abs(Number(row.x_el) - xEl) < 1e-6);
  if (r === undefined) throw new Error(`no positional_error.csv row for ${condition} at ${xEl}`);
  const v = valueWithCi(Number(r.sigma_x_el), Number(r.sigma_x_ci_low_el), Number(r.sigma_x_ci_high_el), { signed: false });
  return v.ci === 'n/a' ? v.value : `${v.value} ${v.ci}`;
}

beforeAll(async () => {
  scratch = mkdtempSync(join(tmpdir(), 'eggline-cohort-options-'));
  await fs.mkdir(ARTIFACTS, { recursive: true });
  await ensureRendererBuilt();
  h = await startReadyHarness(join(scratch, 'data'), 8);
}, 180_000);

afterAll(async () => {
  await h?.close();
  await fs.rm(scratch, { recursive: true, force: true });
});

describe('comparison options in the Cohort tab', { timeout: 240_000 }, () => {
  it('a reference and a normalisation picked in the window give the σx that eggline cohort writes with the same flags', async () => {
    const { page } = h;
    out = await chooseBatchOutput(h, join(scratch, 'out'));
    await page.getByTestId('batch-run').click();
    await page.getByTestId('batch-results').waitFor({ timeout: 180_000 });
    await page.getByTestId('tab-cohort').click();
    await page.getByTestId('cohort-options').waitFor();
    // Defaults first: scale-offset, and the reference is the condition with dosage 1.
    expect(await text(page, 'cohort-sigma-normalisation')).toBe('scale-offset');
    const names = await page.getByTestId('cohort-condition').evaluateAll((els) => els.map((e) => e.getAttribute('data-name') ?? ''));
    const defaultRef = await page.locator('[data-testid=cohort-condition]:has-text("(reference)")').getAttribute('data-name');
    const reference = names.find((n) => n !== defaultRef) as string;
    await page.getByTestId('cohort-opt-reference').selectOption(reference);
    await page.getByTestId('cohort-opt-normalisation').selectOption('minmax');
    await expect.poll(() => text(page, 'cohort-sigma-normalisation'), { timeout: 60_000 }).toBe('minmax');
    await expect.poll(() => page.locator('[data-testid=cohort-condition]:has-text("(reference)")').getAttribute('data-name'), { timeout: 60_000 }).toBe(reference);

    // The same comparison on the command line, from the batch's results.json.
    const sheet = await text(page, 'cohort-sheet');
    const cliOut = join(scratch, 'cli');
    expect(await cohortCommand([out, '--samples', sheet, '--reference', reference, '--normalise', 'minmax', '--out', cliOut], quiet)).toBe(0);
    const rows = await csvRows(join(cliOut, 'positional_error.csv'));
    const shown: string[] = [];
    for (const condition of names) {
      for (const x of ['0.3', '0.4']) {
        const cell = page.locator(`[data-testid=cohort-sigma-row][data-condition="${condition}"] td[data-x="${x}"]`);
        expect(await cell.textContent()).toBe(shownSigma(rows, condition, Number(x)));
        shown.push((await cell.textContent()) ?? '');
      }
    }
    expect(shown.length).toBe(names.length * 2);
    // Numbers, not "n/a" on both sides (on 2 demo embryos per condition the noise-corrected spread is often 0).
    expect(shown.filter((t) => /^\d/.test(t)).length).toBeGreaterThan(names.length);
    // The shift table follows the new reference: its observed and predicted shifts are shifts.csv's, row for row (the
    // reference itself is not a row).
    const shiftCells = await page.getByTestId('cohort-shift').evaluateAll((els) => els.map((e) => [...e.querySelectorAll('td')].map((td) => td.textContent ?? '')));
    const shifts = await csvRows(join(cliOut, 'shifts.csv'));
    const signed = (v: string, lo: string, hi: string) => {
      const f = valueWithCi(Number(v), Number(lo), Number(hi), { signed: true });
      return f.ci === 'n/a' ? f.value : `${f.value} ${f.ci}`;
    };
    expect(shiftCells.length).toBe(shifts.length);
    expect(shiftCells.length).toBeGreaterThan(0);
    for (const [i, row] of shifts.entries()) {
      expect(row.condition).not.toBe(reference);
      expect(shiftCells[i][1]).toBe(row.condition);
      expect(shiftCells[i][3]).toBe(signed(row.observed_shift_el, row.ci_low, row.ci_high));
      expect(shiftCells[i][4]).toBe(signed(row.predicted_shift_el, row.predicted_ci_low, row.predicted_ci_high));
    }

    // The reading and its caveats under the dosage test are report.html's, word for word.
    const caveats = await page.locator('[data-testid=cohort-caveats] li').allTextContents();
    expect(caveats.length).toBeGreaterThan(1);
    const report = await fs.readFile(join(cliOut, 'report.html'), 'utf8');
    for (const c of caveats) expect(report).toContain(`<li>${escapeXml(c)}</li>`);
    const firstFinding = await page.getByTestId('cohort-finding').first().locator('p').first().textContent();
    expect(report).toContain(`<p>${escapeXml(firstFinding ?? '')}</p>`);

    // The choice is saved in the project (autosave), and `eggline cohort --project` over it writes the same table.
    const projectPath = join(dirname(sheet), 'eggline-project.json');
    await expect.poll(async () => (JSON.parse(await fs.readFile(projectPath, 'utf8')) as { cohort?: unknown }).cohort, { timeout: 10_000 })
      .toEqual({ reference, normalisation: 'minmax' });
    const viaProject = join(scratch, 'cli-project');
    expect(await cohortCommand([out, '--samples', sheet, '--project', projectPath, '--out', viaProject], quiet)).toBe(0);
    expect(await fs.readFile(join(viaProject, 'positional_error.csv'), 'utf8')).toBe(await fs.readFile(join(cliOut, 'positional_error.csv'), 'utf8'));
    expect(await fs.readFile(join(viaProject, 'shifts.csv'), 'utf8')).toBe(await fs.readFile(join(cliOut, 'shifts.csv'), 'utf8'));
  });

  it('a bad equivalence margin is refused at the field with the command line\'s rule; a good one is kept', async () => {
    const { page } = h;
    const margin = page.getByTestId('cohort-opt-margin');
    await margin.fill('1.5');
    await margin.press('Enter');
    expect(await text(page, 'cohort-opt-margin-problem')).toBe('Equivalence margin must be a number between 0 and 1 (got "1.5")');
    await margin.fill('0.2');
    await margin.press('Enter');
    await expect.poll(() => page.getByTestId('cohort-opt-margin-problem').count()).toBe(0);
    await expect.poll(() => page.getByTestId('cohort-options').getAttribute('aria-busy'), { timeout: 60_000 }).toBe('false');
  });

  it('a background condition picked in the window leaves the comparison and stays offered; the default brings it back', async () => {
    const { page } = h;
    const names = await page.getByTestId('cohort-condition').evaluateAll((els) => els.map((e) => e.getAttribute('data-name') ?? ''));
    const reference = await page.getByTestId('cohort-opt-reference').inputValue();
    const background = names.find((n) => n !== reference) as string;
    await page.getByTestId('cohort-opt-background').selectOption(background);
    await expect.poll(() => page.getByTestId('cohort-condition').count(), { timeout: 60_000 }).toBe(names.length - 1);
    expect(await page.getByTestId('cohort-warnings').first().textContent()).toContain(`background condition "${background}"`);
    expect(await page.locator(`[data-testid=cohort-opt-background] option[value="${background}"]`).count()).toBe(1);
    await page.getByTestId('cohort-opt-background').selectOption('');
    await expect.poll(() => page.getByTestId('cohort-condition').count(), { timeout: 60_000 }).toBe(names.length);
  });

  it('"none" with a role column in the sheet gives eggline cohort --background-condition none\'s numbers; Undo and Redo step through the choice', async () => {
    const { page } = h;
    const sheet = await text(page, 'cohort-sheet');
    const original = await fs.readFile(sheet, 'utf8');
    const names = await page.getByTestId('cohort-condition').evaluateAll((els) => els.map((e) => e.getAttribute('data-name') ?? ''));
    const reference = await page.getByTestId('cohort-opt-reference').inputValue();
    const marked = names.find((n) => n !== reference) as string;
    // Demo data: the sheet's rows of one condition marked background in a role column.
    const [head, ...lines] = original.trim().split(/\r?\n/);
    const condIndex = head.split(',').indexOf('condition');
    await fs.writeFile(sheet, [`${head},role`, ...lines.map((l) => `${l},${l.split(',')[condIndex] === marked ? 'background' : ''}`)].join('\n') + '\n');
    try {
      const firstNote = () => page.locator('[data-testid=cohort-warnings] li').first().textContent();
      // "none": nothing is subtracted, and the marked condition stays out of the comparison.
      await page.getByTestId('cohort-opt-background').selectOption('none');
      await expect.poll(firstNote, { timeout: 60_000 }).toContain('no background condition:');
      expect(await firstNote()).toContain(`"${marked}", marked background in the sample sheet's role column, is left out of the comparison`);
      await expect.poll(() => page.getByTestId('cohort-options').getAttribute('aria-busy'), { timeout: 60_000 }).toBe('false');
      expect(await page.getByTestId('cohort-condition').count()).toBe(names.length - 1);
      expect(await page.locator(`[data-testid=cohort-opt-background] option[value="${marked}"]`).count()).toBe(1);

      // The command line with the same options (the project's, which the window saved) and --background-condition none.
      const projectPath = join(dirname(sheet), 'eggline-project.json');
      await expect.poll(async () => (JSON.parse(await fs.readFile(projectPath, 'utf8')) as { cohort?: { backgroundCondition?: string } }).cohort?.backgroundCondition, { timeout: 10_000 }).toBe('none');
      const cliOut = join(scratch, 'cli-none');
      expect(await cohortCommand([out, '--samples', sheet, '--project', projectPath, '--background-condition', 'none', '--out', cliOut], quiet)).toBe(0);
      const rows = await csvRows(join(cliOut, 'positional_error.csv'));
      let compared = 0;
      for (const condition of names.filter((n) => n !== marked)) {
        for (const x of ['0.3', '0.4']) {
          const cell = page.locator(`[data-testid=cohort-sigma-row][data-condition="${condition}"] td[data-x="${x}"]`);
          expect(await cell.textContent()).toBe(shownSigma(rows, condition, Number(x)));
          compared += 1;
        }
      }
      expect(compared).toBe((names.length - 1) * 2);
      expect(rows.some((r) => r.condition === marked)).toBe(false);
      const record = JSON.parse(await fs.readFile(join(cliOut, 'background_condition.json'), 'utf8')) as { choice: string; setAside: string };
      expect([record.choice, record.setAside]).toEqual(['none', marked]);

      // Undo: back to the default (the role column subtracts the marked condition); Redo: "none" again.
      await page.getByTestId('undo').click();
      await expect.poll(() => page.getByTestId('cohort-opt-background').inputValue()).toBe('');
      await expect.poll(firstNote, { timeout: 60_000 }).toContain(`after subtracting background condition "${marked}"`);
      await page.getByTestId('redo').click();
      await expect.poll(() => page.getByTestId('cohort-opt-background').inputValue()).toBe('none');
      await expect.poll(firstNote, { timeout: 60_000 }).toContain('no background condition:');
      await expect.poll(() => page.getByTestId('cohort-options').getAttribute('aria-busy'), { timeout: 60_000 }).toBe('false');
      await page.screenshot({ path: join(ARTIFACTS, 'cohort-options-none.png') });
    } finally {
      await fs.writeFile(sheet, original);
    }
    // Back to the default for the tests after this one (the sheet has no role column again).
    await page.getByTestId('cohort-opt-background').selectOption('');
    await expect.poll(() => page.getByTestId('cohort-condition').count(), { timeout: 60_000 }).toBe(names.length);
  });

  it('covariates ticked in the window give eggline cohort --covariate\'s reading and numbers; Undo takes one back', async () => {
    const { page } = h;
    const sheet = await text(page, 'cohort-sheet');
    const original = await fs.readFile(sheet, 'utf8');
    // Demo data: a stage (minutes) and a batch column that vary within every condition.
    const [head, ...lines] = original.trim().split(/\r?\n/);
    await fs.writeFile(sheet, [`${head},stage,batch`, ...lines.map((l, i) => `${l},${30 + ((i * 7) % 11)},${i % 2 === 0 ? 'B1' : 'B2'}`)].join('\n') + '\n');
    try {
      // Any recomputation reads the sheet again and offers its free columns.
      await page.getByTestId('cohort-opt-normalisation').selectOption('none');
      const tick = (c: string) => page.locator(`[data-testid=cohort-opt-covariate][data-column="${c}"]`);
      await tick('stage').waitFor({ timeout: 60_000 });
      await tick('stage').check();
      await expect.poll(() => page.getByTestId('cohort-options').getAttribute('aria-busy'), { timeout: 60_000 }).toBe('false');
      // How a ticked column is read, as COLUMN:numeric on the command line.
      await page.locator('[data-testid=cohort-opt-covariate-kind][data-column="stage"]').selectOption('numeric');
      await expect.poll(() => page.getByTestId('cohort-options').getAttribute('aria-busy'), { timeout: 60_000 }).toBe('false');
      await tick('batch').check();
      const slopeSentence = () => page.getByTestId('cohort-finding').first().locator('p').nth(1).textContent();
      await expect.poll(slopeSentence, { timeout: 60_000 }).toContain('Adjusted for stage and batch');
      await expect.poll(() => page.getByTestId('cohort-options').getAttribute('aria-busy'), { timeout: 60_000 }).toBe('false');
      const shown = (await slopeSentence()) ?? '';

      // The command line with the same options as flags, and with --project over what the window saved.
      const cliOut = join(scratch, 'cli-covariates');
      const reference = await page.getByTestId('cohort-opt-reference').inputValue();
      expect(await cohortCommand([out, '--samples', sheet, '--normalise', 'none', ...(reference ? ['--reference', reference] : []),
        '--equivalence-margin', '0.2', '--covariate', 'stage:numeric', '--covariate', 'batch', '--out', cliOut], quiet)).toBe(0);
      const report = await fs.readFile(join(cliOut, 'report.html'), 'utf8');
      expect(report).toContain(`<p>${escapeXml(shown)}</p>`);
      const adjusted = (await csvRows(join(cliOut, 'dosage_fit.csv'))).filter((r) => r.method === 'covariate-adjusted:stage+batch');
      expect(adjusted.length).toBeGreaterThan(0);
      expect(shown).toContain(`the slope is ${valueWithCi(Number(adjusted[0].slope_el), Number(adjusted[0].ci_low), Number(adjusted[0].ci_high)).value} (`);
      const projectPath = join(dirname(sheet), 'eggline-project.json');
      await expect.poll(async () => (JSON.parse(await fs.readFile(projectPath, 'utf8')) as { cohort?: { covariates?: string[] } }).cohort?.covariates, { timeout: 10_000 }).toEqual(['stage:numeric', 'batch']);
      const viaProject = join(scratch, 'cli-covariates-project');
      expect(await cohortCommand([out, '--samples', sheet, '--project', projectPath, '--out', viaProject], quiet)).toBe(0);
      expect(await fs.readFile(join(viaProject, 'covariates.csv'), 'utf8')).toBe(await fs.readFile(join(cliOut, 'covariates.csv'), 'utf8'));

      // Undo takes batch back out: the reading is adjusted for stage alone.
      await page.getByTestId('undo').click();
      await expect.poll(slopeSentence, { timeout: 60_000 }).toContain('Adjusted for stage (');
      expect(await tick('batch').isChecked()).toBe(false);
      await expect.poll(() => page.getByTestId('cohort-options').getAttribute('aria-busy'), { timeout: 60_000 }).toBe('false');
      await page.getByTestId('cohort-opt-covariates').scrollIntoViewIfNeeded();
      await page.screenshot({ path: join(ARTIFACTS, 'cohort-options-covariates.png') });
      await tick('stage').uncheck();
      await expect.poll(slopeSentence, { timeout: 60_000 }).not.toContain('Adjusted for');
    } finally {
      await fs.writeFile(sheet, original);
    }
    await page.getByTestId('cohort-opt-normalisation').selectOption('scale-offset');
    await expect.poll(() => page.getByTestId('cohort-options').getAttribute('aria-busy'), { timeout: 60_000 }).toBe('false');
  });

  it('nothing in the options area is clipped or overlapping at 1280×720 and 1440×900', async () => {
    const { page } = h;
    for (const [width, height] of [[1280, 720], [1440, 900]] as const) {
      await page.setViewportSize({ width, height });
      const area = page.getByTestId('cohort-options');
      await area.scrollIntoViewIfNeeded();
      const boxes = await area.locator('.comparison-option').evaluateAll((els) => els.map((e) => {
        const r = e.getBoundingClientRect();
        return { x: r.x, y: r.y, w: r.width, h: r.height, fits: e.scrollWidth <= e.clientWidth + 1 };
      }));
      const outer = await area.boundingBox();
      expect(boxes.length).toBe(6);
      for (const [i, b] of boxes.entries()) {
        expect(b.fits).toBe(true);
        expect(b.x + b.w).toBeLessThanOrEqual((outer?.x ?? 0) + (outer?.width ?? 0) + 1);
        for (const c of boxes.slice(i + 1)) {
          const apart = b.x + b.w <= c.x + 0.5 || c.x + c.w <= b.x + 0.5 || b.y + b.h <= c.y + 0.5 || c.y + c.h <= b.y + 0.5;
          expect(apart).toBe(true);
        }
      }
      await page.screenshot({ path: join(ARTIFACTS, `cohort-options-${width}x${height}.png`) });
    }
  });
});

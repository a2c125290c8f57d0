import { XMLValidator } from 'fast-xml-parser';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { makeDemoCohort } from '../../core/cohort';
import type { EmbryoResult } from '../../core/model';
import { runCohortStep } from '../../app/cohort/run-cohort';

// Source: demo data throughout (invented synthetic embryos, dosages 0.5–6, λ = 0.2 EL).
const dir = mkdtempSync(join(tmpdir(), 'eggline-cohort-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const demo = makeDemoCohort({ conditions: [0.5, 1, 2, 6].map((d) => ({ name: d === 1 ? 'reference' : `x${d}`, dosage: d, count: 6 })), seed: 13 });
const failed: EmbryoResult = { ...demo.results[0], file: 'broken/embryo_99.tif', status: 'error', error: 'broken/embryo_99.tif: not a TIFF file' };
const sheetPath = join(dir, 'samples.csv');
writeFileSync(sheetPath, demo.sheetCsv);

describe('runCohortStep', () => {
  it('writes the tables, one SVG per figure and a self-contained report', async () => {
    const out = join(dir, 'out');
    const r = await runCohortStep({
      results: [...demo.results, failed], failures: [{ file: 'gone.tif', error: 'gone.tif: file vanished during the batch' }],
      sampleSheetPath: sheetPath, reference: null, outDir: out, runRecord: { settings: { fitRangeEl: [0.1, 0.6] }, eggline: '0.1.0' },
      normalisation: 'amplitude', lambdaPosteriorEl: 0.3,
    });
    const names = readdirSync(out).sort();
    const figures = ['cohort-profiles', 'lambda-by-condition', 'positional-error', 'shift-boundary-target-half-max', 'shift-boundary-target-logistic', 'shift-landmark-furrow'];
    expect(names).toEqual([...figures.flatMap((f) => [`${f}.png`, `${f}.svg`]), 'conditions.csv', 'dosage_fit.csv', 'positional_error.csv', 'report.html', 'shifts.csv'].sort());
    expect(r.written.length).toBe(names.length);
    expect(r.warnings).toEqual([]); // the failed result is a failure, not an unmatched file
    const shifts = readFileSync(join(out, 'shifts.csv'), 'utf8').trim().split('\r\n');
    expect(shifts.length).toBe(1 + 3 * 3);
    const fits = readFileSync(join(out, 'dosage_fit.csv'), 'utf8');
    expect(fits).toContain('boundary:target:logistic,condition-means,0.');
    expect(fits).toContain('boundary:target:logistic,embryos-hc3,0.');
    for (const n of names.filter((x) => x.endsWith('.svg'))) expect(XMLValidator.validate(readFileSync(join(out, n), 'utf8'))).toBe(true);
    const html = readFileSync(join(out, 'report.html'), 'utf8');
    expect(html).not.toMatch(/<script|<link|<img|src="|url\(http|@import/i);
    expect((html.match(/<svg /g) ?? []).length).toBe(6);
    expect(html).toContain('gone.tif: file vanished during the batch');
    expect(html).toContain('broken/embryo_99.tif: not a TIFF file');
    expect(html).toContain('profile normalisation</td><td class="t">amplitude');
    expect(html).toContain('Caveats');
    expect(html).toContain('&quot;fitRangeEl&quot;');
    expect(html).toContain('settings.fitRangeEl</td><td class="t">0.1, 0.6');
    // Order a reader needs: summary, figures, dosage test, conditions, failed files, run settings last.
    const at = (id: string): number => html.indexOf(`id="${id}"`);
    const order = ['summary', 'figures', 'dosage', 'conditions', 'failed', 'settings'].map(at);
    expect(order.every((p) => p > 0)).toBe(true);
    expect([...order].sort((p, q) => p - q)).toEqual(order);
    // Key settings stay visible; everything else is folded.
    const settings = html.slice(at('settings'));
    expect(settings.indexOf('fit range</td><td class="t">0.1 to 0.6 x/EL')).toBeLessThan(settings.indexOf('<details>'));
    expect(settings.indexOf('<details>')).toBeLessThan(settings.indexOf('profile normalisation</td>'));
    // The summary names the dosage-test headline with readable labels (no "boundary target logistic" run-together).
    const summary = html.slice(at('summary'), at('figures'));
    expect(summary).toContain('<strong>24</strong> files analysed without error, <strong>2</strong> failed');
    expect(summary).toContain('boundary in ‘target’ (logistic)');
    expect(summary).toMatch(/ratio λ_eff\/λ_ref \[95% CI\]/);
    expect(summary).toContain("test of ratio = 1");
    // No interval printed with equal ends ("0.2 to 0.2", "[0.200, 0.200]"); the demo's amplitude is exactly A·f in every
    // embryo of a condition, so its interval has zero width and is left out of this check.
    const text = html.replace(/<tr><td class="t">amplitude A<\/td>.*?<\/tr>/g, '');
    expect(text.length).toBeLessThan(html.length);
    expect([...text.matchAll(/(-?\+?\d+(?:\.\d+)?) to (-?\+?\d+(?:\.\d+)?)</g)].filter((m) => m[1] === m[2]).map((m) => text.slice(m.index - 80, m.index + 30))).toEqual([]);
    for (const m of text.matchAll(/\[(-?\+?\d+(?:\.\d+)?), (-?\+?\d+(?:\.\d+)?)\]/g)) expect(m[1]).not.toBe(m[2]);
    // CSV keys stay machine-friendly and full precision.
    expect(readFileSync(join(out, 'conditions.csv'), 'utf8')).toMatch(/\r\nreference,1,boundary:target:logistic,EL,6,0\.\d{8,}/);
  });
  it('without a sample sheet all embryos form one condition and the dosage test is skipped', async () => {
    const out = join(dir, 'nosheet');
    const r = await runCohortStep({ results: demo.results, failures: [], sampleSheetPath: null, reference: null, outDir: out, runRecord: null });
    expect(r.warnings[0]).toBe('no sample sheet: all embryos form one condition "all"; no dosage test');
    expect(readFileSync(join(out, 'shifts.csv'), 'utf8').trim().split('\r\n').length).toBe(1);
    expect(readFileSync(join(out, 'conditions.csv'), 'utf8')).toContain('all,,lambda,EL,24,');
  });
  it('a file-name rule can stand in for the sheet', async () => {
    const r = await runCohortStep({ results: demo.results, failures: [], sampleSheetPath: null, reference: 'reference', outDir: join(dir, 'rule'), runRecord: null,
      filenameRule: { pattern: '^(?<condition>[a-z0-9.]+)/', dosages: { reference: 1, 'x0.5': 0.5, x2: 2, x6: 6 } } });
    expect(r.warnings).toEqual([]);
    expect(readFileSync(join(dir, 'rule', 'shifts.csv'), 'utf8')).toContain(',x6,6,1.79');
  });
  it('bad input rejects with one line naming the file', async () => {
    await expect(runCohortStep({ results: demo.results, failures: [], sampleSheetPath: join(dir, 'missing.csv'), reference: null, outDir: join(dir, 'x'), runRecord: null }))
      .rejects.toThrow(`${join(dir, 'missing.csv')}: cannot read the sample sheet (ENOENT)`);
    const bad = join(dir, 'bad.csv');
    writeFileSync(bad, 'file,cond\na,b\n');
    await expect(runCohortStep({ results: demo.results, failures: [], sampleSheetPath: bad, reference: null, outDir: join(dir, 'x'), runRecord: null }))
      .rejects.toThrow('bad.csv: missing column "condition" (the header needs file, condition; dosage is optional)');
  });
});

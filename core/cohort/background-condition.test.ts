import { describe, expect, it } from 'vitest';
import type { EmbryoResult, Profile } from '../model';
import { DEFAULT_SETTINGS } from '../settings';
import { analyseCohort } from './analyse';
import { jackknifeSe } from './background-condition';
import { backgroundConditionOf, backgroundProfile } from './background-profile';
import { NO_BACKGROUND_CONDITION } from '../model';
import { refitEmbryo, refitWindowOf, subtractProfile } from './background-refit';
import { parseSampleSheet } from './sample-sheet';

import { backgroundDemoCohort as cohort, BOUNDARY_EL, LAMBDA_EL, xEl } from './background-demo.test-helper';

const lambdaStat = (a: ReturnType<typeof analyseCohort>) => a.stats.find((s) => s.condition === 'stained' && s.quantity === 'lambda' && s.unit === 'EL')!;

describe('background condition', () => {
  const { results, sheet: text } = cohort(11);
  const sheet = parseSampleSheet(text, 'samples.csv');

  it('recovers λ within its interval after subtracting the background condition; without it λ is biased', () => {
    // Source: demo data (truth λ = 0.2 EL, known additive background shared by the null-stained embryos)
    const plain = analyseCohort(results.filter((r) => r.file.startsWith('stained')), parseSampleSheet(text.split('\n').filter((l) => !l.startsWith('null')).join('\n'), 'samples.csv'));
    const before = lambdaStat(plain);
    expect(before.ciLow > LAMBDA_EL || before.ciHigh < LAMBDA_EL).toBe(true);
    expect(Math.abs(before.mean - LAMBDA_EL)).toBeGreaterThan(0.02);
    const a = analyseCohort(results, sheet, { backgroundCondition: 'null-stain', refitSettings: DEFAULT_SETTINGS });
    const after = lambdaStat(a);
    expect(after.n).toBe(6);
    // The interval that counts the background's own noise (shared by every embryo) holds the truth ...
    const lam = a.backgroundCondition!.summaries.find((s) => s.quantity === 'lambda' && s.unit === 'EL')!;
    expect(lam.meanAfter).toBeCloseTo(after.mean, 14);
    expect(lam.ciLow).toBeLessThan(LAMBDA_EL);
    expect(lam.ciHigh).toBeGreaterThan(LAMBDA_EL);
    expect(lam.seCombined).toBeCloseTo(Math.hypot(after.sem, lam.seBackground!), 12);
    // ... while the spread between embryos alone does not see that shared error (here it is most of the error)
    expect(lam.seBackground!).toBeGreaterThan(after.sem);
    // each embryo's refitted λ lies within 2.6 combined SEs (≈ 99%) of the truth, and nearer than before
    const refitted = a.backgroundCondition!.refits.filter((r) => r.quantity === 'lambda' && r.unit === 'EL');
    expect(refitted).toHaveLength(6);
    for (const r of refitted) {
      expect(Math.abs((r.after as number) - LAMBDA_EL)).toBeLessThan(2.6 * Math.hypot(r.seFit as number, r.seBackground as number));
      expect(Math.abs((r.before as number) - LAMBDA_EL)).toBeGreaterThan(10 * Math.abs((r.after as number) - LAMBDA_EL));
    }
    expect(a.conditions.map((c) => c.name)).toEqual(['stained']);
    expect(a.backgroundCondition!.files).toEqual(['null_1.tif', 'null_2.tif', 'null_3.tif', 'null_4.tif']);
  });

  it('moves a boundary that sits on the background bump back to its true place', () => {
    // Source: demo data (truth: the target's half-maximum at 0.45 EL without the bump)
    const a = analyseCohort(results, sheet, { backgroundCondition: 'null-stain', refitSettings: DEFAULT_SETTINGS });
    const half = a.backgroundCondition!.summaries.find((s) => s.quantity === 'boundary:target:half-max' && s.unit === 'EL')!;
    expect(Math.abs(half.meanAfter - BOUNDARY_EL)).toBeLessThan(0.005);
    expect(Math.abs(half.meanBefore - BOUNDARY_EL)).toBeGreaterThan(0.01);
    const stat = a.stats.find((s) => s.quantity === 'boundary:target:half-max' && s.unit === 'EL')!;
    expect(stat.mean).toBe(half.meanAfter);
  });

  it('the background profile is the mean of the background embryos with SE = SD/√n; subtraction keeps the embryo\'s pixel SD', () => {
    // Source: demo data, checked by hand: bins (1, 3) and (2, 6) give means 2 and 4, SDs √2 and √8, SEs 1 and 2
    const p = (m: number[]): Profile => ({ channel: 'c', xEl: Float64Array.of(0.25, 0.75), xUm: Float64Array.of(1, 3), mean: Float64Array.from(m), sd: Float64Array.of(9, 9), n: Float64Array.of(5, 5) });
    const bg = backgroundProfile('c', [p([1, 2]), p([3, 6])]);
    expect([...bg.mean]).toEqual([2, 4]);
    expect(bg.sd[0]).toBeCloseTo(Math.SQRT2, 12);
    expect(bg.se[1]).toBeCloseTo(2, 12);
    const d = subtractProfile(p([10, 10]), bg);
    expect([...d.mean]).toEqual([8, 6]);
    expect([...d.sd]).toEqual([9, 9]);
    const gap = subtractProfile(p([10, 10]), { ...bg, n: Float64Array.of(0, 2), mean: Float64Array.of(NaN, 4) });
    expect([...gap.n]).toEqual([0, 5]);
  });

  it('a refit against a zero background reproduces the batch fit and boundaries exactly (the same functions)', () => {
    const r = results[0];
    const zero = (c: string) => ({ channel: c, xEl, mean: new Float64Array(100), sd: new Float64Array(100), se: new Float64Array(100), n: new Float64Array(100).fill(3) });
    const again = refitEmbryo(r, new Map([['gradient', zero('gradient')], ['target', zero('target')]]), DEFAULT_SETTINGS, 'zero');
    expect(again.gradientFit!.lambdaEl).toBe(r.gradientFit!.lambdaEl);
    expect(again.gradientFit!.lambdaSeEl).toBe(r.gradientFit!.lambdaSeEl);
    expect(again.boundaries).toEqual(r.boundaries);
    expect(again.warnings.at(-1)).toBe('background condition "zero" subtracted; λ and boundaries fitted again');
  });

  it('jackknife SE: known answer for the mean, where it equals SD/√n', () => {
    // Source: Efron & Tibshirani (1993) §11.2, from memory: the jackknife SE of a mean is the usual SD/√n.
    const x = [3, 7, 8, 12, 15];
    const loo = x.map((_, j) => x.filter((__, i) => i !== j).reduce((s, v) => s + v, 0) / 4);
    const m = 9, sd = Math.sqrt(x.reduce((s, v) => s + (v - m) ** 2, 0) / 4);
    expect(jackknifeSe(loo)).toBeCloseTo(sd / Math.sqrt(5), 12);
    expect(jackknifeSe([1])).toBeNull();
    expect(jackknifeSe([1, null])).toBeNull();
  });

  it('the background noise enters as a jackknife SE per embryo and per condition mean', () => {
    const a = analyseCohort(results, sheet, { backgroundCondition: 'null-stain', refitSettings: DEFAULT_SETTINGS });
    const lam = a.backgroundCondition!.summaries.find((s) => s.quantity === 'lambda' && s.unit === 'EL')!;
    expect(lam.seBackground).toBeGreaterThan(0);
    expect(lam.seBackground).toBeLessThan(0.02);
    const one = analyseCohort(results.filter((r) => r.file !== 'null_2.tif' && r.file !== 'null_3.tif' && r.file !== 'null_4.tif'), sheet, { backgroundCondition: 'null-stain', refitSettings: DEFAULT_SETTINGS });
    expect(one.backgroundCondition!.summaries[0].seBackground).toBeNull();
    expect(one.warnings).toContain('background condition "null-stain" has one embryo: the background\'s own noise cannot be estimated, and it adds to every embryo\'s');
    expect(one.warnings).toContain('samples.csv: no analysed result for null_2.tif');
  });

  it('takes the background condition from the sheet\'s role column', () => {
    const marked = text.split('\n').map((l, i) => (i === 0 ? `${l},role` : l === '' ? l : `${l},${l.startsWith('null') ? 'background' : ''}`)).join('\n');
    const a = analyseCohort(results, parseSampleSheet(marked, 'samples.csv'), { refitSettings: DEFAULT_SETTINGS });
    expect(a.backgroundCondition!.condition).toBe('null-stain');
    expect(a.backgroundCondition!.source).toBe('sheet');
  });

  describe('which background rule applies: one function for every caller', () => {
    // Source: demo data (the invented null-stain sheet above); the rule is this project's own (README, Background condition).
    const marked = text.split('\n').map((l, i) => (i === 0 ? `${l},role` : l === '' ? l : `${l},${l.startsWith('null') ? 'background' : ''}`)).join('\n');
    const markedSheet = parseSampleSheet(marked, 'samples.csv');
    it('a named condition (flag or project) wins over the role column and says who named it', () => {
      const c = backgroundConditionOf(markedSheet, 'stained', "project file's cohort.backgroundCondition");
      expect(c).toEqual({ rule: 'option', name: 'stained', setAside: null, namedBy: "project file's cohort.backgroundCondition",
        why: 'project file\'s cohort.backgroundCondition names "stained": its mean profile is subtracted' });
      expect(backgroundConditionOf(sheet, 'null-stain')?.namedBy).toBe('--background-condition');
    });
    it('the role column decides when nothing is given; no role column and nothing given: no rule at all', () => {
      expect(backgroundConditionOf(markedSheet, null)).toMatchObject({ rule: 'sheet', name: 'null-stain', namedBy: "the sample sheet's role column" });
      expect(backgroundConditionOf(sheet, null)).toBeNull();
    });
    it('"none" subtracts nothing: with a role column its condition is set aside, without one nothing is', () => {
      expect(NO_BACKGROUND_CONDITION).toBe('none');
      expect(backgroundConditionOf(markedSheet, 'none')).toEqual({ rule: 'none', name: null, setAside: 'null-stain', namedBy: '--background-condition',
        why: '--background-condition is "none": nothing is subtracted; "null-stain", marked background in the sample sheet\'s role column, is left out of the comparison' });
      expect(backgroundConditionOf(sheet, 'none')).toMatchObject({ rule: 'none', name: null, setAside: null });
    });
    it('with "none" the comparison is the batch\'s own numbers for the other conditions, and the record says why', () => {
      const a = analyseCohort(results, markedSheet, { backgroundCondition: 'none', refitSettings: DEFAULT_SETTINGS });
      const plainText = text.split('\n').filter((l) => !l.startsWith('null')).join('\n');
      const plain = analyseCohort(results.filter((r) => !r.file.startsWith('null')), parseSampleSheet(plainText, 'samples.csv'));
      expect(a.backgroundCondition).toBeUndefined();
      expect(a.conditions.map((c) => c.name)).toEqual(['stained']);
      expect(a.stats).toEqual(plain.stats);
      expect(a.profiles).toEqual(plain.profiles);
      expect(a.backgroundChoice).toEqual({ rule: 'none', condition: null, setAside: 'null-stain', setAsideFiles: ['null_1.tif', 'null_2.tif', 'null_3.tif', 'null_4.tif'],
        namedBy: '--background-condition', why: backgroundConditionOf(markedSheet, 'none')!.why });
      // ... while the role column alone subtracts, and says so
      const sub = analyseCohort(results, markedSheet, { refitSettings: DEFAULT_SETTINGS });
      expect(sub.backgroundChoice).toMatchObject({ rule: 'sheet', condition: 'null-stain', setAside: null, setAsideFiles: [] });
      expect(lambdaStat(sub).mean).not.toBe(lambdaStat(a).mean);
      // No role column, nothing given: no record (the outputs stay as they were before the choice existed)
      expect(analyseCohort(results, sheet).backgroundChoice).toBeUndefined();
      expect(analyseCohort(results, sheet, { backgroundCondition: 'none' }).backgroundChoice).toMatchObject({ rule: 'none', setAside: null, setAsideFiles: [] });
      expect(analyseCohort(results, sheet, { backgroundCondition: 'none' }).stats).toEqual(analyseCohort(results, sheet).stats);
    });
    it('"none" with a role column: the set-aside condition cannot be the reference; a condition named "none" is warned about', () => {
      expect(() => analyseCohort(results, markedSheet, { backgroundCondition: 'none', reference: 'null-stain' }))
        .toThrow('samples.csv: "null-stain" is marked background in the role column, so it cannot be the reference; unmark it or choose another reference');
      const named = parseSampleSheet(text.replace(/null-stain/g, 'none'), 'samples.csv');
      expect(analyseCohort(results, named, { backgroundCondition: 'none' }).warnings)
        .toContain('samples.csv: a condition is named "none"; the background choice "none" means no background condition, so it is compared like the others');
      const only = parseSampleSheet('file,condition,role\nnull_1.tif,null-stain,background\n', 'samples.csv');
      expect(() => analyseCohort(results, only, { backgroundCondition: 'none' })).toThrow('samples.csv: "null-stain", marked background in the role column, is the only condition; there is nothing to compare');
    });
  });

  it('one clear line for each bad case', () => {
    const run = (rs: readonly EmbryoResult[], s: string, bg: string) => () => analyseCohort(rs, parseSampleSheet(s, 'samples.csv'), { backgroundCondition: bg, refitSettings: DEFAULT_SETTINGS });
    expect(run(results, text, 'secondary-only')).toThrow('samples.csv: background condition "secondary-only" is not in the sheet (conditions: stained, null-stain)');
    expect(run(results.filter((r) => !r.file.startsWith('null')), text, 'null-stain')).toThrow('background condition "null-stain" has no analysed embryos; its files failed or are not in the results');
    const fewer = results.map((r) => (r.file === 'null_2.tif' ? { ...r, boundaryProfiles: [] } : r));
    expect(run(fewer, text, 'null-stain')).toThrow('background condition "null-stain": its embryos have different channels (null_1.tif: gradient, target; null_2.tif: gradient)');
    const range = results.map((r) => (r.file === 'null_3.tif' ? { ...r, gradientFit: { ...r.gradientFit!, fitRangeEl: [0.2, 0.6] as const } } : r));
    expect(run(range, text, 'null-stain')).toThrow('background condition "null-stain": its embryos were fitted over different x/EL ranges (null_1.tif: 0.1–0.6; null_3.tif: 0.2–0.6); analyse them with one fit range');
    // A null-stained embryo whose exponential fit failed is still a background embryo (its range is not compared)
    const failed = results.map((r) => (r.file === 'null_1.tif' ? { ...r, gradientFit: null } : r));
    expect(run(failed, text, 'null-stain')).not.toThrow();
    const extra = results.map((r) => (r.file === 'stained_2.tif' ? { ...r, boundaryProfiles: [...r.boundaryProfiles, { ...r.boundaryProfiles[0], channel: 'late' }] } : r));
    expect(run(extra, text, 'null-stain')).toThrow('stained_2.tif: channel "late" has no profile in background condition "null-stain" (it has gradient, target)');
    expect(() => analyseCohort(results, sheet, { backgroundCondition: 'stained', reference: 'stained' })).toThrow('samples.csv: "stained" cannot be both the reference and the background condition');
    const only = 'file,condition\nnull_1.tif,null-stain\n';
    expect(run(results, only, 'null-stain')).toThrow('samples.csv: background condition "null-stain" is the only condition; there is nothing to subtract it from');
  });

  it('a boundary channel\'s own window follows it by name, or by number when the channel was given by number', () => {
    const s = { ...DEFAULT_SETTINGS, boundaryChannels: [2, 'late'], boundaryWindows: [{ channel: 2, rangeEl: [0.2, 0.6] as const }, { channel: 'LATE', rangeEl: [0.5, 0.9] as const }] };
    expect(refitWindowOf(0, 'target', 2, s)).toEqual([0.2, 0.6]);
    expect(refitWindowOf(1, 'late', 2, s)).toEqual([0.5, 0.9]);
    expect(refitWindowOf(0, 'late', 1, s)).toEqual([0.5, 0.9]);
    expect(refitWindowOf(0, 'target', 1, s)).toEqual([0, 1]);
  });
});

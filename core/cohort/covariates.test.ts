import { describe, expect, it } from 'vitest';
import { covariateAdjustment, covariateColumns, parseCovariateRequest } from './covariates';
import { withinGroupFit } from '../stats';
import type { Observation, SampleSheet } from '../model';

// Demo data: three dosages, four embryos each; stage in minutes, batch B1/B2 mixed within conditions.
const dosage = [0.5, 1, 2];
const stage = [10, 14, 18, 25, 12, 15, 22, 30, 20, 24, 27, 35];
const batch = ['B1', 'B2', 'B1', 'B2', 'B1', 'B1', 'B2', 'B2', 'B2', 'B1', 'B2', 'B1'];
const pos = [0.301, 0.322, 0.310, 0.341, 0.351, 0.360, 0.368, 0.383, 0.402, 0.411, 0.425, 0.430];
const file = (i: number): string => `d${Math.floor(i / 4)}_e${i % 4}.tif`;
const cond = (i: number): string => `dose-${dosage[Math.floor(i / 4)]}`;

function sheet(extra: (i: number) => Record<string, string>): SampleSheet {
  return { source: 'samples.csv', rows: pos.map((_, i) => ({ file: file(i), condition: cond(i), dosage: dosage[Math.floor(i / 4)], extra: extra(i), line: i + 2 })) };
}
const observations: Observation[] = pos.map((value, i) => ({
  file: file(i), condition: cond(i), lnF: Math.log(dosage[Math.floor(i / 4)]), quantity: 'boundary:b:logistic', kind: 'boundary', unit: 'EL', value,
}) as Observation);
const full = sheet((i) => ({ stage: String(stage[i]), batch: batch[i] }));

describe('parseCovariateRequest', () => {
  it('reads column, column:numeric and column:categorical', () => {
    expect(parseCovariateRequest('stage')).toEqual({ column: 'stage', kind: 'auto' });
    expect(parseCovariateRequest('stage:numeric')).toEqual({ column: 'stage', kind: 'numeric' });
    expect(parseCovariateRequest(' mounting session:categorical ')).toEqual({ column: 'mounting session', kind: 'categorical' });
    expect(parseCovariateRequest('time:0')).toEqual({ column: 'time:0', kind: 'auto' });
    expect(() => parseCovariateRequest(':numeric')).toThrow('covariate ":numeric": give a column of the sample sheet (e.g. stage, stage:numeric, batch:categorical)');
  });
});

describe('covariateColumns', () => {
  it('takes a column numeric when every value is a number, else categorical with its first level as the base', () => {
    const cols = covariateColumns(full, [parseCovariateRequest('Stage'), parseCovariateRequest('batch')]);
    expect(cols.map(({ column, kind, levels, baseLevel }) => ({ column, kind, levels, baseLevel }))).toEqual([
      { column: 'stage', kind: 'numeric', levels: [], baseLevel: null },
      { column: 'batch', kind: 'categorical', levels: ['B1', 'B2'], baseLevel: 'B1' },
    ]);
  });

  it('gives one line naming the sheet for an unknown column or a non-number in a numeric column', () => {
    expect(() => covariateColumns(full, [parseCovariateRequest('stgae')])).toThrow('samples.csv: no column "stgae" for the covariate (free columns: stage, batch)');
    const bad = sheet((i) => ({ stage: i === 5 ? 'late' : String(stage[i]) }));
    expect(() => covariateColumns(bad, [parseCovariateRequest('stage:numeric')])).toThrow('samples.csv line 7: covariate "stage" is declared numeric but "late" (d1_e1.tif) is not a number');
    expect(() => covariateColumns(full, [parseCovariateRequest('stage'), parseCovariateRequest('STAGE')])).toThrow('samples.csv: covariate "stage" is given twice');
  });
});

describe('covariateAdjustment', () => {
  it('warns when a column of few whole numbers is taken as numeric without being declared so', () => {
    const coded = sheet((i) => ({ stage: String(stage[i]), lot: String(1 + (i % 3)) }));
    const a = covariateAdjustment(observations, coded, ['stage', 'lot'].map(parseCovariateRequest));
    expect(a.warnings).toEqual(['samples.csv: covariate "lot" is taken as numeric (every value is a whole number); if its values are labels (batch 1, 2, 3), give it as lot:categorical']);
    expect(covariateAdjustment(observations, coded, ['stage', 'lot:numeric'].map(parseCovariateRequest)).warnings).toEqual([]);
    expect(covariateAdjustment(observations, coded, ['stage', 'lot:categorical'].map(parseCovariateRequest)).fits.get('boundary:b:logistic')!.terms.map((t) => t.term)).toEqual(['stage', 'lot=2', 'lot=3']);
  });

  it('uses the within-condition coefficients (equal to the dummy-variable fit) and names the covariates', () => {
    const a = covariateAdjustment(observations, full, ['stage', 'batch'].map(parseCovariateRequest));
    const fit = a.fits.get('boundary:b:logistic')!;
    const w = withinGroupFit(pos.map((_, i) => cond(i)), [stage, batch.map((b) => (b === 'B2' ? 1 : 0))], pos);
    expect(fit.covariates).toEqual(['stage', 'batch']);
    expect(fit.terms.map((t) => t.term)).toEqual(['stage', 'batch=B2']);
    expect(fit.terms[0].coefficientEl).toBe(w.beta[0]);
    expect(fit.terms[1].coefficientEl).toBe(w.beta[1]);
    expect(fit.terms[1].baseLevel).toBe('B1');
    expect(fit.n).toBe(12);
    expect(fit.conditions).toBe(3);
    expect(fit.dof).toBe(1);
    expect(a.warnings).toEqual([]);
  });

  it('refuses a covariate constant within every condition, naming the column', () => {
    const confounded = sheet((i) => ({ session: `s${Math.floor(i / 4)}` }));
    expect(() => covariateAdjustment(observations, confounded, [parseCovariateRequest('session')]))
      .toThrow('samples.csv: covariate "session" is constant within every condition, so its effect cannot be told apart from the dosage\'s; leave it out');
  });

  it('leaves out embryos missing a value, and warns about a level seen in one condition only', () => {
    const s = sheet((i) => ({ stage: i === 3 ? '' : String(stage[i]), batch: i === 1 ? 'B3' : i < 4 ? 'B1' : batch[i] }));
    const a = covariateAdjustment(observations, s, ['stage', 'batch:categorical'].map(parseCovariateRequest));
    expect(a.warnings).toContain('samples.csv: 1 embryo without a value of stage, batch left out of the covariate-adjusted fit: d0_e3.tif');
    expect(a.warnings).toContain('samples.csv: level "B3" of covariate "batch" is seen in condition "dose-0.5" only; its coefficient rests on that condition\'s embryos');
    expect(a.fits.get('boundary:b:logistic')!.n).toBe(11);
  });

  it('drops a level that fills whole conditions (absorbed by them) with a warning', () => {
    const s = sheet((i) => ({ stage: String(stage[i]), batch: i >= 8 ? 'B3' : batch[i] }));
    const a = covariateAdjustment(observations, s, ['stage', 'batch'].map(parseCovariateRequest));
    expect(a.warnings).toEqual(['samples.csv: level "B3" of covariate "batch" fills whole conditions (dose-2); its effect is absorbed by them and not estimated']);
    expect(a.fits.get('boundary:b:logistic')!.terms.map((t) => t.term)).toEqual(['stage', 'batch=B2']);
  });
});

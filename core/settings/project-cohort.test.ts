// The project's cohort entry: good values read back, bad ones give one line naming the field, old files stay valid.
// Condition names are demo data; the rules are the `eggline cohort` flags' (app/cli/cohort-command.ts).
import { describe, expect, it } from 'vitest';
import { parseProjectText } from './project-check';
import { checkProjectCohort } from './project-cohort';

const base = { schema: 'eggline-project', version: 2, folder: '/data', settings: {}, files: {} };
const read = (cohort: unknown) => parseProjectText(JSON.stringify({ ...base, cohort }), 'p.eggline.json');

describe('project cohort options', () => {
  it('reads every option and keeps them through a write and read', () => {
    const cohort = { reference: 'wt', backgroundCondition: 'secondary-only', normalisation: 'minmax', equivalenceMargin: 0.2, lambdaPosteriorEl: 0.15, covariates: ['stage:numeric', 'batch'] };
    const doc = read(cohort);
    expect(doc.cohort).toEqual(cohort);
    expect(parseProjectText(JSON.stringify(doc), 'again.json')).toEqual(doc);
  });

  it('leaves out absent and null fields (the defaults apply) and accepts every normalisation', () => {
    expect(read({ reference: null, equivalenceMargin: null }).cohort).toEqual({});
    for (const n of ['scale-offset', 'none', 'amplitude', 'minmax']) expect(checkProjectCohort({ normalisation: n })).toEqual({ normalisation: n });
  });

  it('keeps the background choice "none" (subtract nothing) apart from an absent field (the sheet\'s role column decides)', () => {
    // Source: this project's rule (README, Background condition); condition names are demo data.
    expect(read({ backgroundCondition: 'none' }).cohort).toEqual({ backgroundCondition: 'none' });
    expect(read({ reference: 'none', backgroundCondition: 'none' }).cohort).toEqual({ reference: 'none', backgroundCondition: 'none' });
    expect(read({}).cohort).toEqual({});
  });

  it('reads a project file without a cohort entry (older files) with no cohort options', () => {
    expect(parseProjectText(JSON.stringify(base), 'old.json').cohort).toBeUndefined();
    expect(read(null).cohort).toBeUndefined();
  });

  it.each([
    [{ equivalenceMargin: 1 }, 'p.eggline.json: cohort.equivalenceMargin must be a number between 0 and 1 (got 1)'],
    [{ equivalenceMargin: 0 }, 'p.eggline.json: cohort.equivalenceMargin must be a number between 0 and 1 (got 0)'],
    [{ equivalenceMargin: '0.2' }, 'p.eggline.json: cohort.equivalenceMargin must be a number between 0 and 1 (got "0.2")'],
    [{ lambdaPosteriorEl: -0.1 }, 'p.eggline.json: cohort.lambdaPosteriorEl must be a positive number (x/EL) (got -0.1)'],
    [{ normalisation: 'zscore' }, 'p.eggline.json: cohort.normalisation must be scale-offset, none, amplitude or minmax (got "zscore")'],
    [{ reference: '  ' }, 'p.eggline.json: cohort.reference must be a condition name of the sample sheet (non-empty text)'],
    [{ reference: 'wt', backgroundCondition: 'wt' }, 'p.eggline.json: cohort.backgroundCondition must differ from the reference ("wt")'],
    [{ covariates: 'stage' }, 'p.eggline.json: cohort.covariates must be a list of sample-sheet column names (got "stage")'],
    [{ covariates: ['stage', ''] }, 'p.eggline.json: cohort.covariates must hold column names of the sample sheet, e.g. "stage:numeric" (got "")'],
    [{ covariates: ['stage', 'Stage:numeric'] }, 'p.eggline.json: cohort.covariates names the column "Stage:numeric" twice'],
    ['scale-offset', 'p.eggline.json: cohort must be an object {reference, backgroundCondition, normalisation, equivalenceMargin, lambdaPosteriorEl, covariates}'],
  ])('refuses %j with one line naming the file and field', (cohort, message) => {
    expect(() => read(cohort)).toThrow(message);
    expect(message).not.toContain('\n');
  });
});

// The cohort options' precedence on the command line: a flag over the project's cohort entry over the default, for
// `eggline batch --project P --samples S` and `eggline cohort --project P`. Condition names and files are demo data;
// the defaults are the cohort step's (core/cohort checkCohortOptions).
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { cohortChoices, DEFAULT_COHORT_CHOICES } from '../cohort/cohort-choices';
import { mergeCohortArgs, planBatch } from './batch-command';
import { parseCohortArgs, planChoices } from './cohort-command';

const root = mkdtempSync(join(tmpdir(), 'eggline-cohort-opts-'));
const input = join(root, 'in');
mkdirSync(input);
const kept = { reference: 'half', backgroundCondition: 'null-stain', normalisation: 'minmax', equivalenceMargin: 0.25, lambdaPosteriorEl: 0.12, covariates: ['stage'] };
// The resolved choices also say who gave the background condition (the record names it).
const fromKept = { ...kept, backgroundConditionNamedBy: "the project's cohort.backgroundCondition" };
const projectPath = join(root, 'kept.eggline.json');
writeFileSync(projectPath, JSON.stringify({ schema: 'eggline-project', version: 2, folder: '.', settings: {}, files: {}, cohort: kept }));
const samples = join(root, 'samples.csv');
writeFileSync(samples, 'file,condition,dosage\na.tif,wt,1\nb.tif,half,0.5\n');
afterAll(() => rmSync(root, { recursive: true, force: true }));

const plan = (argv: string[]) => {
  const p = parseCohortArgs(argv);
  if (p === 'help' || 'usage' in p) throw new Error(`unexpected ${JSON.stringify(p)}`);
  return p;
};

describe('cohort options: flag over project over default', () => {
  it('takes each default when neither a flag nor the project sets it', () => {
    expect(cohortChoices(undefined)).toEqual(DEFAULT_COHORT_CHOICES);
    expect(DEFAULT_COHORT_CHOICES).toEqual({ reference: null, backgroundCondition: null, backgroundConditionNamedBy: '--background-condition', normalisation: 'scale-offset', lambdaPosteriorEl: null, equivalenceMargin: null, covariates: [] });
    expect(cohortChoices({ normalisation: 'none' }, { reference: 'wt' })).toEqual({ ...DEFAULT_COHORT_CHOICES, normalisation: 'none', reference: 'wt' });
  });

  it('eggline cohort --project: the project\'s options, each flag over its own', async () => {
    expect((await planChoices(plan(['res', '--samples', samples, '--project', projectPath]))).choices).toEqual(fromKept);
    const flagged = await planChoices(plan(['res', '--samples', samples, '--project', projectPath, '--reference', 'wt', '--normalise', 'amplitude', '--equivalence-margin', '0.1']));
    expect(flagged.choices).toEqual({ ...fromKept, reference: 'wt', normalisation: 'amplitude', equivalenceMargin: 0.1 });
    // --covariate (repeatable) replaces the project's list as a whole.
    const covariates = await planChoices(plan(['res', '--samples', samples, '--project', projectPath, '--covariate', 'batch', '--covariate', 'age:numeric']));
    expect(covariates.choices).toEqual({ ...fromKept, covariates: ['batch', 'age:numeric'] });
    expect((await planChoices(plan(['res', '--samples', samples]))).choices).toEqual(DEFAULT_COHORT_CHOICES);
  });

  it('eggline cohort --project with a bad project file rejects with one line naming it', async () => {
    const bad = join(root, 'bad.eggline.json');
    writeFileSync(bad, JSON.stringify({ schema: 'eggline-project', version: 2, folder: null, settings: {}, files: {}, cohort: { equivalenceMargin: 2 } }));
    await expect(planChoices(plan(['res', '--samples', samples, '--project', bad]))).rejects.toThrow('bad.eggline.json: cohort.equivalenceMargin must be a number between 0 and 1 (got 2)');
  });

  it('eggline batch --project P --samples S: the project\'s options, --reference and --background-condition over them', async () => {
    const fromProject = await planBatch([input, '--out', join(root, 'o'), '--project', projectPath, '--samples', samples]);
    expect(fromProject !== 'help' && fromProject.cohort).toEqual(fromKept);
    const flagged = await planBatch([input, '--out', join(root, 'o'), '--project', projectPath, '--samples', samples, '--reference', 'wt', '--background-condition', 'other']);
    expect(flagged !== 'help' && flagged.cohort).toEqual({ ...kept, reference: 'wt', backgroundCondition: 'other', backgroundConditionNamedBy: '--background-condition' });
    // "none" is a value like a name: from the flag over the project's name, or from the project itself.
    const noneFlag = await planBatch([input, '--out', join(root, 'o'), '--project', projectPath, '--samples', samples, '--background-condition', 'none']);
    expect(noneFlag !== 'help' && noneFlag.cohort).toMatchObject({ backgroundCondition: 'none', backgroundConditionNamedBy: '--background-condition' });
    expect(cohortChoices({ backgroundCondition: 'none' })).toMatchObject({ backgroundCondition: 'none', backgroundConditionNamedBy: "the project's cohort.backgroundCondition" });
    expect(cohortChoices({ backgroundCondition: 'none' }, { backgroundCondition: 'null-stain' })).toMatchObject({ backgroundCondition: 'null-stain', backgroundConditionNamedBy: '--background-condition' });
    const none = await planBatch([input, '--out', join(root, 'o'), '--no-project', '--samples', samples]);
    expect(none !== 'help' && none.cohort).toEqual(DEFAULT_COHORT_CHOICES);
  });

  it('eggline batch: --normalise, --lambda-posterior-el and --equivalence-margin over the project, with eggline cohort\'s rules', async () => {
    const flagged = await planBatch([input, '--out', join(root, 'o'), '--project', projectPath, '--samples', samples,
      '--normalise', 'none', '--lambda-posterior-el', '0.2', '--equivalence-margin', '0.3']);
    expect(flagged !== 'help' && flagged.cohort).toEqual({ ...fromKept, normalisation: 'none', lambdaPosteriorEl: 0.2, equivalenceMargin: 0.3 });
    await expect(planBatch([input, '--out', join(root, 'o'), '--samples', samples, '--equivalence-margin', '-1']))
      .rejects.toThrow('--equivalence-margin must be a number between 0 and 1 (got "-1")');
    await expect(planBatch([input, '--out', join(root, 'o'), '--samples', samples, '--normalise', 'z']))
      .rejects.toThrow('--normalise must be scale-offset, none, amplitude or minmax (got "z")');
    await expect(planBatch([input, '--out', join(root, 'o'), '--normalise', 'none'])).rejects.toThrow('--normalise needs --samples');
  });
});

describe('eggline batch --slurm hands the cohort options to the merge job', () => {
  it('with a project cohort entry: --project and only the flags given (so the merge resolves and records them alike)', async () => {
    const plain = await planBatch([input, '--out', join(root, 'o'), '--project', projectPath, '--samples', samples]);
    if (plain === 'help') throw new Error('unexpected help');
    expect(mergeCohortArgs(plain)).toEqual(['--project', projectPath]);
    const flagged = await planBatch([input, '--out', join(root, 'o'), '--project', projectPath, '--samples', samples, '--reference', 'wt', '--covariate', 'batch']);
    if (flagged === 'help') throw new Error('unexpected help');
    expect(mergeCohortArgs(flagged)).toEqual(['--project', projectPath, '--reference', 'wt', '--covariate', 'batch']);
  });

  it('without a project: the options in force as flags', async () => {
    const none = await planBatch([input, '--out', join(root, 'o'), '--no-project', '--samples', samples, '--normalise', 'none', '--covariate', 'stage']);
    if (none === 'help') throw new Error('unexpected help');
    expect(mergeCohortArgs(none)).toEqual(['--normalise', 'none', '--covariate', 'stage']);
  });
});

describe('eggline merge takes the same three options', () => {
  const io = { stdout: { write: () => true }, stderr: { write: () => true } };
  it('refuses them without --samples, and a bad value with eggline cohort\'s rule', async () => {
    const { mergeCommand } = await import('./merge-command');
    await expect(mergeCommand([root, '--normalise', 'none'], io)).rejects.toThrow('--normalise needs --samples');
    await expect(mergeCommand([root, '--samples', samples, '--lambda-posterior-el', '-0.1'], io)).rejects.toThrow('--lambda-posterior-el must be a positive number (got "-0.1")');
  });
});

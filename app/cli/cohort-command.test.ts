import { describe, expect, it } from 'vitest';
import { parseCohortArgs } from './cohort-command';

// Source: this project's pinned wording for the cohort command's options.
describe('parseCohortArgs', () => {
  it('gives an option\'s own rule for a negative number written as a separate word', () => {
    expect(parseCohortArgs(['out', '--samples', 's.csv', '--lambda-posterior-el', '-0.2'])).toEqual({ usage: '--lambda-posterior-el must be a positive number (got "-0.2")' });
    expect(parseCohortArgs(['out', '--samples', 's.csv', '--equivalence-margin', '-1'])).toEqual({ usage: '--equivalence-margin must be a number between 0 and 1 (got "-1")' });
  });
  it('reads a plan with the defaults', () => {
    const plan = parseCohortArgs(['res', '--samples', 's.csv']);
    expect(plan !== 'help' && !('usage' in plan) && [plan.resultsDir, plan.samples, plan.normalisation, plan.lambdaPosteriorEl]).toEqual(['res', 's.csv', 'scale-offset', null]);
  });
});

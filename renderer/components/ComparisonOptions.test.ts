// The comparison options' number fields: empty is none, otherwise the command line's rule and wording
// (`eggline cohort --equivalence-margin`, `--lambda-posterior-el`). Values are demo data.
import { describe, expect, it } from 'vitest';
import { equivalenceMarginProblem, lambdaPosteriorElProblem } from '../../core/settings';
import { numberField } from './ComparisonOptions';

describe('numberField', () => {
  it('reads empty as none and a valid number as itself', () => {
    expect(numberField('  ', 'Equivalence margin', equivalenceMarginProblem)).toEqual({ value: null });
    expect(numberField('0.2', 'Equivalence margin', equivalenceMarginProblem)).toEqual({ value: 0.2 });
    expect(numberField('.15', 'Posterior gradient λ', lambdaPosteriorElProblem)).toEqual({ value: 0.15 });
  });
  it('refuses with the flag\'s rule', () => {
    expect(numberField('1', 'Equivalence margin', equivalenceMarginProblem)).toEqual({ problem: 'Equivalence margin must be a number between 0 and 1 (got "1")' });
    expect(numberField('abc', 'Equivalence margin', equivalenceMarginProblem)).toEqual({ problem: 'Equivalence margin must be a number between 0 and 1 (got "abc")' });
    expect(numberField('-0.2', 'Posterior gradient λ', lambdaPosteriorElProblem)).toEqual({ problem: 'Posterior gradient λ must be a positive number (got "-0.2")' });
  });
});

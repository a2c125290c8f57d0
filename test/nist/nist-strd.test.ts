// Source: NIST StRD nonlinear regression certified values (files in data/, a copy of the NIST files,
// read at test time). Pass rule: parameters to ≥ 6 significant digits (relative 1e-6),
// certified standard deviations to ≥ 4 (relative 1e-4), from both NIST starting points.
import { describe, expect, it } from 'vitest';
import { fitNonlinear } from '../../core/fit';
import { loadStrd } from './strd-file';
import { STRD_MODELS } from './strd-models';

const DATASETS = ['Misra1a', 'BoxBOD', 'Rat42', 'Rat43', 'Lanczos3', 'Chwirut2', 'Eckerle4'];
// Beyond the required set: also pass, with central differences (no analytic Jacobian given).
const EXTRA_DATASETS = ['DanWood', 'MGH09', 'Thurber', 'Gauss1'];

function relativeError(actual: number, expected: number): number {
  return Math.abs(actual - expected) / Math.abs(expected);
}

describe('NIST StRD nonlinear regression', () => {
  for (const name of [...DATASETS, ...EXTRA_DATASETS]) {
    const problem = loadStrd(name);
    const { model, jacobian } = STRD_MODELS[name];
    for (const [startName, start] of [['Start 1', problem.start1], ['Start 2', problem.start2]] as const) {
      for (const derivatives of jacobian ? ['central differences', 'analytic Jacobian'] as const : ['central differences'] as const) {
        it(`${name} from ${startName} (${derivatives}) reproduces the certified values`, () => {
          const fit = fitNonlinear(problem.x, problem.y, model, start.slice(),
            derivatives === 'analytic Jacobian' ? { jacobian } : {});
          // Source: NIST StRD Rat43 — the file states 9 degrees of freedom, but n − p = 11 is what the
          // certified residual SD uses (see the README beside the data); our dof is always n − p.
          expect(fit.dof).toBe(problem.x.length - start.length);
          problem.certified.forEach((value, k) => expect(relativeError(fit.params[k], value)).toBeLessThan(1e-6));
          problem.certifiedSd.forEach((value, k) => expect(relativeError(fit.se[k], value)).toBeLessThan(1e-4));
          expect(relativeError(fit.rss, problem.rss)).toBeLessThan(1e-6);
          expect(relativeError(fit.residualSd, problem.residualSd)).toBeLessThan(1e-6);
        });
      }
    }
  }
});

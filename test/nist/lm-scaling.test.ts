// Source: NIST StRD BoxBOD (certified values in data/BoxBOD.dat) and the note in
// the README beside it: from Start 1 (b1 = 1, b2 = 1) LM with Jacobian column scaling stalls near (172.5, large
// b2) with RSS ≈ 9.77E+03, while unit scaling reaches the certified solution. This is why fitNonlinear runs both.
import { describe, expect, it } from 'vitest';
import { fitNonlinear } from '../../core/fit';
import { runLevenbergMarquardt } from '../../core/fit/lm-core';
import { loadStrd } from './strd-file';
import { STRD_MODELS } from './strd-models';

describe('LM parameter scaling on BoxBOD Start 1', () => {
  const p = loadStrd('BoxBOD');
  const problem = { x: p.x, y: p.y, sqrtW: new Float64Array(p.x.length).fill(1), model: STRD_MODELS.BoxBOD.model, jacobian: null };
  it('column scaling stalls on the plateau, unit scaling converges', () => {
    const column = runLevenbergMarquardt(problem, p.start1, 'column', 500);
    expect(column.rss / 9.7715e3).toBeCloseTo(1, 3);
    expect(column.params[0]).toBeCloseTo(172.5, 1);
    const unit = runLevenbergMarquardt(problem, p.start1, 'unit', 500);
    expect(Math.abs(unit.rss / p.rss - 1)).toBeLessThan(1e-9);
  });
  it('fitNonlinear keeps the better of the two', () => {
    const fit = fitNonlinear(p.x, p.y, STRD_MODELS.BoxBOD.model, p.start1.slice());
    expect(Math.abs(fit.params[0] / p.certified[0] - 1)).toBeLessThan(1e-6);
  });
});

import { describe, expect, it } from 'vitest';
import { householderQr, inverseGramFromR, solveLeastSquares, solveUpperTriangular } from './least-squares-qr';

describe('Householder QR least squares', () => {
  it('solves a square system exactly', () => {
    // Source: hand computation — 2a + b = 5, a + 3b = 10 → a = 1, b = 3.
    const x = solveLeastSquares(new Float64Array([2, 1, 1, 3]), new Float64Array([5, 10]), 2, 2)!;
    expect(x[0]).toBeCloseTo(1, 14);
    expect(x[1]).toBeCloseTo(3, 14);
  });
  it('gives the least-squares line through four points', () => {
    // Source: hand computation — points (0,1), (1,3), (2,2), (3,5): slope 1.1, intercept 1.1 (OLS).
    const a = new Float64Array([1, 0, 1, 1, 1, 2, 1, 3]);
    const x = solveLeastSquares(a, new Float64Array([1, 3, 2, 5]), 4, 2)!;
    expect(x[0]).toBeCloseTo(1.1, 13);
    expect(x[1]).toBeCloseTo(1.1, 13);
  });
  it('keeps R consistent with AᵀA and does not modify the inputs', () => {
    const a = new Float64Array([1, 2, 3, 4, 5, 6]);
    const b = new Float64Array([1, 1, 1]);
    const { r } = householderQr(a, b, 3, 2);
    // Source: hand computation — AᵀA = [[35, 44], [44, 56]], and RᵀR must equal it.
    expect(r[0] * r[0]).toBeCloseTo(35, 12);
    expect(r[0] * r[1]).toBeCloseTo(44, 12);
    expect(r[1] * r[1] + r[3] * r[3]).toBeCloseTo(56, 12);
    expect(r[2]).toBe(0);
    expect(Array.from(a)).toEqual([1, 2, 3, 4, 5, 6]);
    expect(Array.from(b)).toEqual([1, 1, 1]);
    // Source: hand computation — (AᵀA)⁻¹ = [[56, −44], [−44, 35]] / 24.
    const inv = inverseGramFromR(r, 2)!;
    expect(inv[0]).toBeCloseTo(56 / 24, 12);
    expect(inv[1]).toBeCloseTo(-44 / 24, 12);
    expect(inv[3]).toBeCloseTo(35 / 24, 12);
  });
  it('reports rank deficiency as null', () => {
    expect(solveLeastSquares(new Float64Array([1, 2, 2, 4, 3, 6]), new Float64Array([1, 2, 3]), 3, 2)).toBeNull();
    expect(solveUpperTriangular(new Float64Array([1, 1, 0, 0]), new Float64Array([1, 1]), 2)).toBeNull();
  });
});

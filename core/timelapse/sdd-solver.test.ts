import { describe, expect, it } from 'vitest';
import { defaultSddGrid, sddLambdaUm, sddSteadyState, sddValueAt, solveSdd } from './sdd-solver';
import type { SddModel } from './sdd-solver';

// Demo data: an invented gradient with λ = 100 µm and a degradation time of 600 s on a 1200 µm line.
const MODEL: SddModel = { diffusionUm2PerS: 100 ** 2 / 600, degradationPerS: 1 / 600, sourceFlux: 1, lengthUm: 1200 };

describe('solveSdd', () => {
  it('reaches the closed-form steady state (jλ/D)·cosh((L−x)/λ)/sinh(L/λ)', () => {
    // Source: the steady-state equation D·C'' = k·C with −D·C'(0) = j and C'(L) = 0, solved in closed form
    // (standard linear ODE; e.g. Crank, The Mathematics of Diffusion, 1975 — from memory).
    const sol = solveSdd(MODEL, [30 * 600]);
    for (const xUm of [0, 50, 100, 250, 600, 1200]) {
      // Second-order differences in x: the discrete decay rate is off by ≈ h²/(24λ²), 1e-4 per λ at h = λ/20.
      expect(Math.abs(sddValueAt(sol, 0, xUm) / sddSteadyState(MODEL, xUm) - 1)).toBeLessThan(2e-3);
    }
  });

  it('keeps the total amount on dM/dt = j − k·M, so M(t) = (j/k)(1 − e^{−kt})', () => {
    // Source: integrating the equation over [0, L] (flux j in at x = 0, none out at x = L) — derived, exact.
    const times = [60, 300, 600, 1800];
    const sol = solveSdd(MODEL, times);
    const h = sol.xUm[1] - sol.xUm[0];
    times.forEach((t, m) => {
      const c = sol.concentration[m];
      let amount = (c[0] + c[c.length - 1]) * h / 2;
      for (let i = 1; i < c.length - 1; i++) amount += c[i] * h;
      const exact = (MODEL.sourceFlux / MODEL.degradationPerS) * (1 - Math.exp(-MODEL.degradationPerS * t));
      // The implicit Euler start steps are first order in time: ≈ 1e-4 at one minute, far less later.
      expect(Math.abs(amount / exact - 1)).toBeLessThan(3e-4);
    });
  });

  it('gives C(0, t) = 2j·√(t/(πD)) at early times when degradation is negligible', () => {
    // Source: constant flux into a half-space, surface value 2F√(t/(πD)) (Carslaw & Jaeger, Conduction of Heat in
    // Solids, 2nd ed. 1959, §2.9 — from memory).
    const model: SddModel = { ...MODEL, degradationPerS: 1e-9 };
    const grid = { nodes: 1201, maxStepS: 0.5 };
    const sol = solveSdd(model, [100, 400], grid);
    [100, 400].forEach((t, m) => {
      const exact = 2 * model.sourceFlux * Math.sqrt(t / (Math.PI * model.diffusionUm2PerS));
      expect(sol.concentration[m][0] / exact - 1).toBeCloseTo(0, 2);
    });
  });

  it('returns zero at t = 0 and one row per requested time', () => {
    const sol = solveSdd(MODEL, [0, 0, 10]);
    expect(sol.concentration).toHaveLength(3);
    expect(Math.max(...sol.concentration[0])).toBe(0);
    expect(sol.concentration[2][0]).toBeGreaterThan(0);
  });

  it('derives λ and a grid of 20 nodes per λ', () => {
    expect(sddLambdaUm(MODEL)).toBeCloseTo(100, 10);
    expect(defaultSddGrid(MODEL)).toEqual({ nodes: 241, maxStepS: 3 });
  });

  it('rejects bad options with one-line messages', () => {
    expect(() => solveSdd({ ...MODEL, diffusionUm2PerS: 0 }, [1])).toThrow('solveSdd: diffusionUm2PerS must be a positive number, got 0');
    expect(() => solveSdd(MODEL, [5, 1])).toThrow('solveSdd: times must be finite, ≥ 0 and non-decreasing (time 1 is 1)');
    expect(() => solveSdd(MODEL, [1], { nodes: 2, maxStepS: 1 })).toThrow('solveSdd: nodes must be an integer ≥ 3, got 2');
  });
});

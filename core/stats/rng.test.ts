import { describe, expect, it } from 'vitest';
import { logGamma } from './log-gamma';
import { createRng } from './rng';

function moments(values: number[]): { m: number; v: number } {
  const m = values.reduce((s, x) => s + x, 0) / values.length;
  const v = values.reduce((s, x) => s + (x - m) ** 2, 0) / (values.length - 1);
  return { m, v };
}

describe('logGamma', () => {
  it('matches exact factorials and Γ(1/2) = √π', () => {
    // Source: from memory — Γ(n) = (n−1)!, Γ(1/2) = √π.
    expect(logGamma(1)).toBeCloseTo(0, 14);
    expect(logGamma(2)).toBeCloseTo(0, 14);
    expect(logGamma(5)).toBeCloseTo(Math.log(24), 13);
    expect(logGamma(10)).toBeCloseTo(Math.log(362880), 12);
    expect(logGamma(0.5)).toBeCloseTo(Math.log(Math.sqrt(Math.PI)), 13);
    let lnFact = 0;
    for (let k = 2; k < 171; k++) lnFact += Math.log(k);
    expect(logGamma(171) / lnFact).toBeCloseTo(1, 13); // ln(170!)
  });
});

describe('createRng', () => {
  it('is deterministic per seed and differs between seeds', () => {
    const a = createRng(42), b = createRng(42), c = createRng(43);
    const sa = Array.from({ length: 5 }, () => a.uniform());
    const sb = Array.from({ length: 5 }, () => b.uniform());
    const sc = Array.from({ length: 5 }, () => c.uniform());
    expect(sa).toEqual(sb);
    expect(sa).not.toEqual(sc);
    // Regression pin: mulberry32 seeded with 1 gives 0.6270739405881613 first (from memory; this implementation
    // agrees). Integer-only arithmetic makes it platform-independent; the pin guards
    // against accidental changes that would alter every piece of demo data.
    expect(createRng(1).uniform()).toBe(PIN_SEED1_FIRST);
  });
  it('uniform has mean 1/2 and variance 1/12 and stays in [0, 1)', () => {
    // Source: from memory — moments of U(0,1).
    const r = createRng(7);
    const v = Array.from({ length: 100000 }, () => r.uniform());
    expect(Math.min(...v)).toBeGreaterThanOrEqual(0);
    expect(Math.max(...v)).toBeLessThan(1);
    const { m, v: s2 } = moments(v);
    expect(Math.abs(m - 0.5)).toBeLessThan(5 * Math.sqrt(1 / 12 / 1e5));
    expect(s2).toBeCloseTo(1 / 12, 2);
  });
  it('normal has mean 0, variance 1 and the right tail mass', () => {
    // Source: from memory — P(|Z| > 1.96) = 0.05 for the standard normal.
    const r = createRng(11);
    const v = Array.from({ length: 100000 }, () => r.normal());
    const { m, v: s2 } = moments(v);
    expect(Math.abs(m)).toBeLessThan(5 / Math.sqrt(1e5));
    expect(Math.abs(s2 - 1)).toBeLessThan(0.02);
    const tail = v.filter((x) => Math.abs(x) > 1.959963985).length / v.length;
    expect(Math.abs(tail - 0.05)).toBeLessThan(5 * Math.sqrt(0.05 * 0.95 / 1e5));
  });
  it.each([0.3, 4, 9.99, 10, 37.5, 1e4, 1e7])('poisson(%f) has mean and variance equal to the mean', (lam) => {
    // Source: from memory — Poisson mean = variance = λ.
    const r = createRng(Math.round(lam * 100));
    const n = 40000;
    const v = Array.from({ length: n }, () => r.poisson(lam));
    expect(v.every((k) => Number.isInteger(k) && k >= 0)).toBe(true);
    const { m, v: s2 } = moments(v);
    expect(Math.abs(m - lam)).toBeLessThan(5 * Math.sqrt(lam / n));
    // SD of the sample variance ≈ λ·√(2/n) for large λ (plus λ/n from the fourth cumulant).
    expect(Math.abs(s2 - lam)).toBeLessThan(5 * Math.sqrt((2 * lam * lam + lam) / n));
  });
  it('poisson frequencies match the exact probability mass function', () => {
    // Source: from memory — P(k) = e^{−λ} λ^k / k!.
    for (const lam of [3.2, 14.5, 60]) {
      const r = createRng(99);
      const n = 200000;
      const counts = new Map<number, number>();
      for (let i = 0; i < n; i++) { const k = r.poisson(lam); counts.set(k, (counts.get(k) ?? 0) + 1); }
      const lo = Math.max(0, Math.floor(lam - 3 * Math.sqrt(lam)));
      const hi = Math.ceil(lam + 3 * Math.sqrt(lam));
      for (let k = lo; k <= hi; k++) {
        const p = Math.exp(-lam + k * Math.log(lam) - logGamma(k + 1));
        const observed = (counts.get(k) ?? 0) / n;
        expect(Math.abs(observed - p)).toBeLessThan(5 * Math.sqrt(p * (1 - p) / n) + 1e-6);
      }
    }
  });
  it('rejects bad seeds and means with exact messages', () => {
    expect(() => createRng(NaN)).toThrow('createRng: seed must be a finite number, got NaN');
    expect(() => createRng(1).poisson(-1)).toThrow('poisson: mean must be a finite number ≥ 0, got -1');
    expect(createRng(1).poisson(0)).toBe(0);
  });
});

const PIN_SEED1_FIRST = 0.6270739405881613;

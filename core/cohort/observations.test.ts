import { describe, expect, it } from 'vitest';
import type { EmbryoResult } from '../model';
import { conditionStats } from './condition-stats';
import { makeDemoCohort } from './demo-cohort';
import { boundaryQuantity, landmarkQuantity, observationsOf, quantityLabel } from './observations';

// Source: demo data (invented synthetic embryos).
const base = makeDemoCohort({ conditions: [{ name: 'c', dosage: 2, count: 1 }], seed: 1 }).results[0];
const cond = { name: 'c', dosage: 2, factor: 2 };

describe('observationsOf', () => {
  it('one value per quantity and unit; missing boundary positions and repeated names are skipped', () => {
    const e: EmbryoResult = {
      ...base,
      boundaries: [{ ...base.boundaries[0], positionEl: null, positionUm: null }, base.boundaries[1], { ...base.boundaries[1], positionEl: 0.9 }],
      landmarks: [base.landmarks[0], { ...base.landmarks[0], xEl: 0.99 }],
    };
    const obs = observationsOf(e, cond);
    expect(obs.map((o) => `${o.quantity}|${o.unit}`)).toEqual([
      'lambda|EL', 'lambda|um', 'amplitude|a.u.', 'egg_length|um', 'boundary:target:half-max|EL', 'boundary:target:half-max|um', 'landmark:furrow|EL', 'landmark:furrow|um',
    ]);
    expect(obs.find((o) => o.quantity === 'landmark:furrow' && o.unit === 'EL')!.value).toBe(base.landmarks[0].xEl);
    expect(obs.every((o) => o.lnF === Math.log(2) && o.condition === 'c')).toBe(true);
  });
  it('an embryo without a fit contributes no λ or amplitude', () => {
    const obs = observationsOf({ ...base, gradientFit: null }, cond);
    expect(obs.some((o) => o.kind === 'lambda' || o.kind === 'amplitude')).toBe(false);
  });
});

describe('quantity keys and labels', () => {
  it('keys are machine-friendly; labels read well even when the channel is called "boundary"', () => {
    // Source: the key format documented in observations.ts (project convention).
    expect([boundaryQuantity('boundary', 'logistic'), landmarkQuantity('furrow')]).toEqual(['boundary:boundary:logistic', 'landmark:furrow']);
    expect(quantityLabel('boundary:boundary:logistic')).toBe('boundary in ‘boundary’ (logistic)');
    expect(quantityLabel('boundary:ch:2:half-max')).toBe('boundary in ‘ch:2’ (half-max)'); // a ':' in the channel name survives
    expect(quantityLabel('landmark:furrow')).toBe('landmark ‘furrow’');
    expect(quantityLabel('landmark:a:b')).toBe('landmark ‘a:b’');
    expect([quantityLabel('lambda'), quantityLabel('egg_length'), quantityLabel('amplitude'), quantityLabel('other')])
      .toEqual(['decay length λ', 'egg length', 'amplitude A', 'other']);
  });
});

describe('conditionStats', () => {
  it('known answer on three embryos: mean, SD, SEM and t-CI of the landmark position', () => {
    // Source: hand-computed: values 0.3, 0.32, 0.34 → mean 0.32, SD 0.02, SEM 0.02/√3; t(0.975, 2) = 4.302653 (t table, from memory)
    const embryos = [0.3, 0.32, 0.34].map((x) => ({ ...base, landmarks: [{ ...base.landmarks[0], xEl: x }] }));
    const obs = embryos.flatMap((e) => observationsOf(e, cond));
    const s = conditionStats(obs, [cond]).find((r) => r.quantity === 'landmark:furrow' && r.unit === 'EL')!;
    expect(s.n).toBe(3);
    expect(s.mean).toBeCloseTo(0.32, 12);
    expect(s.sd).toBeCloseTo(0.02, 12);
    expect(s.sem).toBeCloseTo(0.02 / Math.sqrt(3), 12);
    expect(s.ciHigh - s.mean).toBeCloseTo(4.302653 * (0.02 / Math.sqrt(3)), 6);
  });
});

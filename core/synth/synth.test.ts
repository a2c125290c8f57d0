import { describe, expect, it } from 'vitest';
import { makeSyntheticEmbryo } from './embryo';
import { demoDataSet, DEMO_DOSAGES, FURROW_BUFFERING } from './demo';
import { ellipseDepth } from './ellipse-distance';
import { checkSynthParams, DEFAULT_SYNTH_PARAMS } from './params';
import { syntheticPlaneSource, syntheticStackInfo } from './source';

const small = { widthPx: 160, heightPx: 120, sizeZ: 2, pixelSizeUm: 4 };

describe('makeSyntheticEmbryo (demo data)', () => {
  it('is deterministic for a seed and differs between seeds', () => {
    const a = makeSyntheticEmbryo(small, 5);
    const b = makeSyntheticEmbryo(small, 5);
    const c = makeSyntheticEmbryo(small, 6);
    expect(a.stack.planes[3]).toEqual(b.stack.planes[3]);
    expect(a.stack.planes[3]).not.toEqual(c.stack.planes[3]);
    expect(a.stack.planes).toHaveLength(4);
    expect(a.stack.planes[0]).toBeInstanceOf(Uint16Array);
  });

  it('records truth consistent with its parameters', () => {
    const e = makeSyntheticEmbryo({ ...small, angleDeg: 90, centre: { x: 80, y: 60 }, dosage: 2 }, 1);
    // Source: geometry of the construction; heading +y, anterior pole half an egg length above the centre.
    expect(e.truth.anterior.x).toBeCloseTo(80, 9);
    expect(e.truth.anterior.y).toBeCloseTo(60 - 250 / 4, 9);
    expect(e.truth.posterior.y).toBeCloseTo(60 + 250 / 4, 9);
    // Threshold rule: the boundary moves by λ·ln f (here f = 2): 0.35 + 100·ln 2 / 500.
    expect(e.truth.boundaryEl).toBeCloseTo(0.35 + (100 * Math.log(2)) / 500, 12);
    expect(e.truth.furrowEl).toBeCloseTo(0.3 + (100 * Math.log(2)) / 500, 12);
    // Furrow on the outline, left of A→P: heading +y, left is +x.
    expect(e.truth.furrowPoint.x).toBeGreaterThan(80);
  });

  it('puts signal where the embryo is: brighter anterior than posterior in channel 1', () => {
    const e = makeSyntheticEmbryo({ ...small, angleDeg: 0, centre: { x: 80, y: 60 } }, 2);
    const at = (x: number, y: number) => e.stack.planes[0][y * 160 + x];
    expect(at(25, 60)).toBeGreaterThan(at(130, 60) + 200);
    expect(at(130, 60)).toBeGreaterThan(at(5, 5));
  });

  it('rejects bad parameters with exact messages', () => {
    expect(() => checkSynthParams({ ...DEFAULT_SYNTH_PARAMS, lambdaUm: 0 })).toThrow('lambdaUm must be a positive number, got 0');
    expect(() => checkSynthParams({ ...DEFAULT_SYNTH_PARAMS, sizeZ: 2.5 })).toThrow('sizeZ must be an integer, got 2.5');
    expect(() => checkSynthParams({ ...DEFAULT_SYNTH_PARAMS, eggWidthUm: 600 })).toThrow('eggWidthUm (600) must not exceed eggLengthUm (500)');
  });

  it('serves its planes through an in-memory PlaneSource', async () => {
    const e = makeSyntheticEmbryo(small, 3);
    const info = syntheticStackInfo(e);
    expect([info.sizeX, info.sizeY, info.sizeZ, info.sizeC, info.pixelSize.xUm]).toEqual([160, 120, 2, 2, 4]);
    const plane = await syntheticPlaneSource(e).readPlane(1, 1, 0);
    expect(plane.data).toBe(e.stack.planes[3]);
    await expect(syntheticPlaneSource(e).readPlane(2, 0, 0)).rejects.toThrow('no plane z=2 c=0 t=0');
  });
});

describe('ellipseDepth', () => {
  it('gives exact distances at known points', () => {
    // Source: hand computation for semi-axes 5 × 3: centre is 3 from the nearest side; (0, 4) lies 1 outside.
    expect(ellipseDepth(0, 0, 5, 3)).toBeCloseTo(3, 9);
    expect(ellipseDepth(5, 0, 5, 3)).toBeCloseTo(0, 9);
    expect(ellipseDepth(0, -4, 5, 3)).toBeCloseTo(-1, 9);
    expect(ellipseDepth(-7, 0, 5, 3)).toBeCloseTo(-2, 9);
    expect(ellipseDepth(3, 2, 3, 3)).toBeCloseTo(3 - Math.hypot(3, 2), 9); // circle: radius − distance from centre
  });
});

describe('demoDataSet', () => {
  it('describes 4 dosage conditions × 6 embryos with unique names and seeds', () => {
    const items = demoDataSet();
    expect(items).toHaveLength(24);
    expect([...new Set(items.map((i) => i.dosage))]).toEqual([...DEMO_DOSAGES]);
    expect(new Set(items.map((i) => i.fileName)).size).toBe(24);
    expect(new Set(items.map((i) => i.seed)).size).toBe(24);
    expect(items[0].fileName).toBe('dosage-0.5x_embryo-01.ome.tif');
    expect(items.every((i) => i.params.dosage === i.dosage && i.params.widthPx === 512 && i.params.sizeZ === 8)).toBe(true);
  });
  it('varies λ, amplitude and egg length from embryo to embryo, deterministically', () => {
    const items = demoDataSet();
    const lambdas = items.map((i) => i.params.lambdaUm);
    const meanLambda = lambdas.reduce((a, b) => a + b, 0) / lambdas.length;
    const cv = Math.sqrt(lambdas.reduce((a, b) => a + (b - meanLambda) ** 2, 0) / (lambdas.length - 1)) / meanLambda;
    expect(cv).toBeGreaterThan(0.02);
    expect(cv).toBeLessThan(0.1);
    expect(new Set(items.map((i) => i.params.gradientAmplitude)).size).toBe(24);
    expect(demoDataSet()).toEqual(items);
  });
  it('buffers the furrow: its threshold follows f^0.5, so it moves by half of λ·ln f; the boundary threshold is fixed', () => {
    // Threshold rule (demo scenario): x = λ·ln(A·f / T) / L in x/EL, so the shift from f = 1 is λ·ln f·(1 − 0.5) / L.
    for (const item of demoDataSet()) {
      const p = item.params;
      expect(p.boundaryThreshold).toBe(DEFAULT_SYNTH_PARAMS.boundaryThreshold);
      expect(p.furrowThreshold).toBeCloseTo(DEFAULT_SYNTH_PARAMS.furrowThreshold * Math.sqrt(item.dosage), 9);
      const furrowEl = (t: number, f: number): number => (p.lambdaUm * Math.log((p.gradientAmplitude * f) / t)) / p.eggLengthUm;
      const shift = furrowEl(p.furrowThreshold, item.dosage) - furrowEl(DEFAULT_SYNTH_PARAMS.furrowThreshold, 1);
      expect(shift).toBeCloseTo(((1 - FURROW_BUFFERING) * p.lambdaUm * Math.log(item.dosage)) / p.eggLengthUm, 9);
    }
  });
});

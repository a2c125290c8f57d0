import { describe, expect, it } from 'vitest';
import type { PlaneSource, StackInfo } from '../model';
import { DEFAULT_SETTINGS } from '../settings';
import { makeSyntheticEmbryo, syntheticPlaneSource, syntheticStackInfo } from '../synth';
import { errorResult } from '../model';
import { analyseStack } from './analyse';

// Demo data: a small synthetic embryo (240×160 px at 3 µm/px, 2 slices).
const embryo = makeSyntheticEmbryo({ widthPx: 240, heightPx: 160, sizeZ: 2, pixelSizeUm: 3, angleDeg: 200 }, 11);
const info = syntheticStackInfo(embryo);
const settings = { ...DEFAULT_SETTINGS, boundaryChannels: [2] };

describe('analyseStack', () => {
  it('measures a synthetic embryo end to end', async () => {
    const r = await analyseStack(info, syntheticPlaneSource(embryo), settings, { fileLabel: 'a/one.ome.tif' });
    expect(r.status).toBe('ok');
    expect(r.file).toBe('a/one.ome.tif');
    expect(r.pixelSizeSource).toBe('ome');
    expect(r.axis!.source).toBe('auto');
    expect(Math.abs(r.eggLengthUm! / 500 - 1)).toBeLessThan(0.03);
    expect(r.gradientFit).not.toBeNull();
    expect(r.boundaries.length).toBe(2);
    expect(r.backgrounds.map((b) => b.channel)).toEqual(['gradient', 'boundary']);
  });

  it('uses the hand axis and projects hand landmarks', async () => {
    const t = embryo.truth;
    const r = await analyseStack(info, syntheticPlaneSource(embryo), settings, {
      fileLabel: 'b.tif',
      handEdits: { axis: { anterior: t.anterior, posterior: t.posterior, source: 'auto' }, landmarks: [{ name: 'furrow', point: t.furrowPoint }] },
    });
    expect(r.axis).toEqual({ anterior: t.anterior, posterior: t.posterior, source: 'hand' });
    expect(r.eggLengthUm).toBeCloseTo(500, 9);
    expect(r.landmarks[0].xEl).toBeCloseTo(t.furrowEl, 9);
  });

  it('works in pixels with a warning when the pixel size is unknown', async () => {
    const noSize: StackInfo = { ...info, pixelSize: { xUm: null, yUm: null, zUm: null, source: 'unknown' } };
    const r = await analyseStack(noSize, syntheticPlaneSource(embryo), settings, { fileLabel: 'c.tif' });
    expect(r.status).toBe('ok');
    expect([r.pixelSizeUm, r.eggLengthUm, r.eggWidthUm]).toEqual([null, null, null]);
    expect(r.warnings).toContain('pixel size unknown: lengths are in pixels and µm values are left empty');
    expect(Math.abs(r.gradientFit!.lambdaEl / 0.2 - 1)).toBeLessThan(0.1);
  });

  it('turns bad data into a one-line error naming the file, never a throw', async () => {
    const failing: PlaneSource = { async readPlane() { throw new Error('strip 3 is truncated\nmore detail'); }, async close() { /* */ } };
    const r = await analyseStack(info, failing, settings, { fileLabel: 'bad.tif' });
    expect([r.status, r.error]).toEqual(['error', 'bad.tif: strip 3 is truncated']);
    const wrongSize: PlaneSource = { async readPlane() { return { width: 3, height: 3, data: new Uint16Array(9) }; }, async close() { /* */ } };
    expect((await analyseStack(info, wrongSize, settings, { fileLabel: 'w.tif' })).error).toBe('w.tif: plane z=0 c=0 t=0 is 3×3, expected 240×160');
    const blank: PlaneSource = { async readPlane() { return { width: 240, height: 160, data: new Uint16Array(240 * 160).fill(100) }; }, async close() { /* */ } };
    expect((await analyseStack(info, blank, settings, { fileLabel: 'blank.tif' })).error).toBe('blank.tif: no embryo found: no region stands out from the background');
    expect((await analyseStack({ ...info, sizeZ: 0 }, blank, settings, { fileLabel: 'z.tif' })).error).toBe('z.tif: stack has 0 slice(s), 2 channel(s), 1 time point(s); nothing to analyse');
    expect((await analyseStack(info, blank, { ...settings, timeIndex: 4 }, { fileLabel: 't.tif' })).error).toBe('t.tif: time index 4 is out of range (the file has 1 time point(s))');
  });

  it('errorResult keeps only the first line', () => {
    expect(errorResult('f.tif', 'one\ntwo').error).toBe('f.tif: one');
    expect(errorResult('f.tif', 'f.tif: bad').error).toBe('f.tif: bad');
    expect(errorResult('f.tif', ' \n').error).toBe('f.tif: unknown error');
  });
});

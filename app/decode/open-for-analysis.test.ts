import { describe, expect, it } from 'vitest';
import type { PlaneSource } from '../../core/model';
import { TiffError } from '../../core/tiff';
import { withDecoderFallback } from './open-for-analysis';

/** Demo data: a fake decoder that fails or returns a 1×1 plane holding `value`. */
const fake = (value: number | Error): PlaneSource & { closed: boolean } => ({
  closed: false,
  async readPlane() {
    if (value instanceof Error) throw value;
    return { width: 1, height: 1, data: new Uint16Array([value]) };
  },
  async close() { this.closed = true; },
});

describe('withDecoderFallback', () => {
  it('uses the primary decoder when it works, without warnings', async () => {
    const warnings: string[] = [];
    const source = withDecoderFallback(fake(5), fake(9), warnings, 'a.tif');
    expect(Array.from((await source.readPlane(0, 0, 0)).data)).toEqual([5]);
    expect(warnings).toEqual([]);
  });

  it('falls back per plane and records a warning naming file, plane and reason', async () => {
    const warnings: string[] = [];
    const primary = fake(new TiffError('decode', 'a.tif', 'cannot decode plane z=1 c=0 t=0 (IFD 1): bad strip'));
    const fallback = fake(9);
    const source = withDecoderFallback(primary, fallback, warnings, 'a.tif');
    expect(Array.from((await source.readPlane(1, 0, 0)).data)).toEqual([9]);
    expect(warnings).toEqual(['a.tif: plane z=1 c=0 t=0 decoded with the pure-JS decoder (cannot decode plane z=1 c=0 t=0 (IFD 1): bad strip)']);
    await source.close();
    expect(primary.closed && fallback.closed).toBe(true);
  });

  it('switches to the fallback for the rest of the file after three failures', async () => {
    const warnings: string[] = [];
    let primaryCalls = 0;
    const primary: PlaneSource = { readPlane: async () => { primaryCalls++; throw new Error('no'); }, close: async () => undefined };
    const source = withDecoderFallback(primary, fake(1), warnings, 'b.tif');
    for (let z = 0; z < 6; z++) await source.readPlane(z, 0, 0);
    expect(primaryCalls).toBe(3);
    expect(warnings).toHaveLength(4);
    expect(warnings[3]).toBe('b.tif: remaining planes decoded with the pure-JS decoder');
  });

  it('does not retry out-of-range planes and reports the fallback error when both fail', async () => {
    const warnings: string[] = [];
    await expect(withDecoderFallback(fake(new RangeError('outside')), fake(1), warnings, 'a.tif').readPlane(9, 0, 0)).rejects.toThrow('outside');
    const both = withDecoderFallback(fake(new Error('x')), fake(new TiffError('truncated', 'a.tif', 'cut')), warnings, 'a.tif');
    await expect(both.readPlane(0, 0, 0)).rejects.toMatchObject({ code: 'truncated', message: 'a.tif: cut' });
    expect(warnings).toEqual([]);
  });
});

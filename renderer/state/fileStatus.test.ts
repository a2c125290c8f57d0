import { describe, expect, it } from 'vitest';
import type { EmbryoResult } from '../../core/model';
import { editsMatchResult, fileStatus } from './fileStatus';

// Demo entries, edits and results (invented numbers).
const entry = { path: '/d/a.tif', name: 'a.tif', status: 'new' as const, message: null };
const axis = { anterior: { x: 10, y: 20 }, posterior: { x: 300, y: 40 }, source: 'hand' as const };
const result = (over: Partial<EmbryoResult> = {}): EmbryoResult => ({
  file: 'a.tif', status: 'ok', error: null, warnings: [], pixelSizeUm: 1, pixelSizeSource: 'ome', eggLengthUm: 290, eggWidthUm: 100,
  axis: { ...axis, source: 'auto' }, gradientChannel: 'c1', gradientProfile: null, gradientFit: null, boundaryProfiles: [], boundaries: [],
  landmarks: [], backgrounds: [], ...over,
});

describe('file status', () => {
  it('is new before any batch, whatever the hand edits', () => {
    expect(fileStatus(entry, { axis, landmarks: [], fitRangeEl: null }, undefined, null).state).toBe('new');
  });
  it('is analysed when the batch used the edits the file has now', () => {
    expect(fileStatus(entry, undefined, result(), null)).toMatchObject({ state: 'analysed', label: 'analysed' });
    expect(fileStatus(entry, { axis, landmarks: [], fitRangeEl: null }, result({ axis }), null).state).toBe('analysed');
  });
  it('is edited when the axis or a landmark changed after the batch', () => {
    expect(fileStatus(entry, { axis, landmarks: [], fitRangeEl: null }, result(), null).state).toBe('edited');
    const lm = { name: 'L1', point: { x: 5, y: 5 } };
    expect(editsMatchResult({ axis: null, landmarks: [lm], fitRangeEl: null }, result())).toBe(false);
    expect(editsMatchResult({ axis: null, landmarks: [lm], fitRangeEl: null }, result({ landmarks: [{ ...lm, xEl: 0, xUm: 0, offAxisUm: 0 }] }))).toBe(true);
  });
  it('is error with the reason from the listing, a failed load or the batch', () => {
    expect(fileStatus({ ...entry, status: 'error', message: 'a.tif: missing' }, undefined, undefined, null)).toMatchObject({ state: 'error', reason: 'a.tif: missing' });
    expect(fileStatus(entry, undefined, result(), 'a.tif: not a TIFF file')).toMatchObject({ state: 'error', reason: 'a.tif: not a TIFF file' });
    expect(fileStatus(entry, undefined, result({ status: 'error', error: 'a.tif: truncated' }), null).reason).toBe('last batch: a.tif: truncated');
  });
});

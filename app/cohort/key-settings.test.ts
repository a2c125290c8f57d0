import { describe, expect, it } from 'vitest';
import { keySettings } from './key-settings';

// Source: demo data (a run record shaped like the batch writes it).
describe('keySettings', () => {
  it('picks channels, projection, profile, fit range and background from the run record', () => {
    const record = { settings: { gradientChannel: 1, boundaryChannels: [2, 'late'], projection: 'mean', profile: { mode: 'edge', edgeSide: 'both', edgeDepthUm: 12 },
      fitRangeEl: [0.1, 0.6], background: { mode: 'outside', regionPx: null } } };
    expect(keySettings(record)).toEqual([
      ['gradient channel', 'channel 1'], ['boundary channels', 'channel 2, channel ‘late’'], ['projection', 'mean'],
      ['profile', 'edge band, both side(s), 12 µm deep'], ['fit range', '0.1 to 0.6 x/EL'], ['background', 'outside the embryo'],
    ]);
  });
  it('names the flat-field and background images with the start of their SHA-256 when the run used them', () => {
    const record = { settings: {}, corrections: { flatField: { file: '/data/flat.tif', sha256: 'a'.repeat(64) }, backgroundImage: null } };
    expect(keySettings(record)).toEqual([['flat-field image (divided by)', `/data/flat.tif (SHA-256 ${'a'.repeat(12)}…)`]]);
  });
  it('skips what the record does not have, and never throws on odd shapes', () => {
    expect(keySettings(null)).toEqual([]);
    expect(keySettings({ settings: [] })).toEqual([]);
    expect(keySettings({ settings: { projection: 'max', profile: { mode: 'axis', axisWidthUm: 20 }, background: { mode: 'region', regionPx: { x: 1, y: 2, width: 30, height: 40 } } } }))
      .toEqual([['projection', 'max'], ['profile', 'strip along the axis, 20 µm wide'], ['background', 'region x 1, y 2, 30 × 40 px']]);
  });
});

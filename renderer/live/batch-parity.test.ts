import { describe, expect, it } from 'vitest';
import type { LoadedStack } from '../../core/contract';
import { analyseStack, detectEmbryo, projectStack } from '../../core/pipeline';
import { DEFAULT_SETTINGS, type AnalysisSettings } from '../../core/settings';
import { makeSyntheticEmbryo, syntheticPlaneSource, syntheticStackInfo } from '../../core/synth';
import { measureLive, prepareLive } from './measure';

// Demo data: a small synthetic embryo (240×160 px at 3 µm/px, 2 slices), tilted, with a boundary channel.
const embryo = makeSyntheticEmbryo({ widthPx: 240, heightPx: 160, sizeZ: 2, pixelSizeUm: 3, angleDeg: 200 }, 11);
const info = syntheticStackInfo(embryo);
const base = { ...DEFAULT_SETTINGS, boundaryChannels: [2] };
const landmarks = [{ name: 'furrow', point: embryo.truth.furrowPoint }];

/** The batch's result and the window's live measurement of the same file with the same settings and hand edits. */
async function both(settings: AnalysisSettings) {
  const batch = await analyseStack(info, syntheticPlaneSource(embryo), settings, { fileLabel: 'e.ome.tif', handEdits: { axis: null, landmarks } });
  const projected = await projectStack(info, syntheticPlaneSource(embryo), settings);
  const stack: LoadedStack = { path: 'e.ome.tif', info, projected, detection: detectEmbryo(projected, settings) };
  const live = measureLive(prepareLive(stack, settings), stack.detection.axis, settings, landmarks, settings.fitRangeEl);
  return { batch, live };
}

// The window must show the numbers the batch writes: the same sampler and fit, so equal to the last bit.
describe('live measurement equals the batch, per profile mode', () => {
  const modes: [string, AnalysisSettings][] = [
    ['edge band, both sides', base],
    ['edge band, dorsal side, dorsal right', { ...base, profile: { ...base.profile, edgeSide: 'dorsal', dorsalSide: 'right' } }],
    ['edge band, each side apart, dorsal right', { ...base, profile: { ...base.profile, edgeSide: 'each', dorsalSide: 'right' } }],
    ['axis strip', { ...base, profile: { ...base.profile, mode: 'axis', axisWidthUm: 30 } }],
  ];
  it.each(modes)('%s', async (_, settings) => {
    const { batch, live } = await both(settings);
    expect(batch.status).toBe('ok');
    expect(live.profile).toEqual(batch.gradientProfile);
    expect(live.fit).toEqual(batch.gradientFit);
    expect(live.boundaryProfiles).toEqual(batch.boundaryProfiles);
    expect(live.boundaries).toEqual(batch.boundaries);
    expect(live.landmarks).toEqual(batch.landmarks);
    expect(live.eggLengthUm).toBe(batch.eggLengthUm);
    expect(live.fit).not.toBeNull();
    expect(live.sides).toEqual(batch.sides ?? null);
  });
});

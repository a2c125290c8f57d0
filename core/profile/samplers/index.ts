// The profile samplers, one per value of settings.profile.mode. Adding a mode: one file implementing ProfileSampler,
// its entry in PROFILE_SAMPLERS and its name in the settings table's profile.mode choices (see DEVELOPERS.md).
import { SettingsError } from '../../settings';
import { AXIS_STRIP } from './axis-strip';
import { EDGE_BAND } from './edge-band';
import type { ProfileSampler } from './types';

export type { BinningMemo, MaskBox, PixelSet, PreparedSampling, ProfileSampler, SampledRegion, SamplingBase, SideBins } from './types';
export { EDGE_BAND, edgeDepthPx, edgeSideFilter } from './edge-band';
export { AXIS_STRIP, stripHalfWidthPx } from './axis-strip';
export { rowsWhere } from './rows';

/** Every sampler, in the order the window offers them. */
export const PROFILE_SAMPLERS: readonly ProfileSampler[] = [EDGE_BAND, AXIS_STRIP];

/** The sampler of `mode` among `samplers`; throws a SettingsError naming the modes there are for any other value. */
export function samplerFor(mode: unknown, samplers: readonly ProfileSampler[] = PROFILE_SAMPLERS): ProfileSampler {
  const found = samplers.find((s) => s.mode === mode);
  if (found !== undefined) return found;
  const names = samplers.map((s) => `"${s.mode}"`);
  const rule = names.length > 1 ? `${names.slice(0, -1).join(', ')} or ${names[names.length - 1]}` : names.join('');
  throw new SettingsError(`profile.mode must be ${rule} (got ${JSON.stringify(mode) ?? String(mode)})`);
}

/** The straightened view's half width: 0.6 × the egg width (the embryo with a margin), px. eggWidthUm holds px when the
 *  pixel size is unknown (as the detection gives it). */
export function straightViewHalfWidthPx(eggWidthUm: number, pixelSizeUm: number | null): number {
  return (eggWidthUm / (pixelSizeUm ?? 1)) * 0.6;
}

// Subtract the background condition's mean profile from one embryo's profiles and fit λ and the boundaries again,
// with the same functions the batch uses (core/profile fitProfile, core/fit findBoundaries), on the embryo's own fit
// range and the batch's boundary settings.
import type { BackgroundProfile, EmbryoResult, Profile } from '../model';
import type { AnalysisSettings, ChannelRef } from '../settings';
import { axisLengthPx } from '../geometry';
import { findBoundaries } from '../fit';
import { binsWithin, filledBins, fitProfile } from '../profile';
import { CohortError } from './cohort-error';
import { profilesByChannel, sameBins } from './background-profile';

/** The batch settings a refit needs: the shared fit range (for embryos without a fit) and the boundary search. */
export type RefitSettings = Pick<AnalysisSettings,
  'fitRangeEl' | 'boundaryChannels' | 'boundaryMethods' | 'boundaryThresholdFraction' | 'boundarySearchEl' | 'boundaryWindows'>;

/** A profile minus a background profile on the same bins; bins the background lacks become empty (NaN, n = 0). The
 *  embryo's own pixel SD and count stay, so the fit's bin weights are those of the batch. */
export function subtractProfile(p: Profile, bg: BackgroundProfile): Profile {
  const mean = new Float64Array(p.mean.length);
  const n = Float64Array.from(p.n);
  for (let b = 0; b < mean.length; b++) {
    const ok = bg.n[b] > 0 && Number.isFinite(bg.mean[b]);
    mean[b] = ok ? p.mean[b] - bg.mean[b] : NaN;
    if (!ok) n[b] = 0;
  }
  return { channel: p.channel, xEl: p.xEl, xUm: p.xUm, mean, sd: p.sd, n };
}

const isIndex = (ref: ChannelRef): boolean => typeof ref === 'number' || /^\d+$/.test(ref.trim());

/** Whether a channel reference of a window names the boundary channel at position k (its own reference `own`, its
 *  name `name`): by name, or by number when the boundary channel was given by number too. */
function namesChannel(ref: ChannelRef, own: ChannelRef | undefined, name: string): boolean {
  if (!isIndex(ref)) return String(ref).trim().toLowerCase() === name.trim().toLowerCase();
  return own !== undefined && isIndex(own) && Number(own) === Number(ref);
}

/** The boundary search window of boundary profile k: the last --channel-window naming its channel, else the shared
 *  window (the batch's boundaryWindowOf, from what a result keeps: the channel's name and the settings' order). */
export function refitWindowOf(k: number, name: string, boundaryCount: number, settings: RefitSettings): readonly [number, number] {
  // The profiles follow settings.boundaryChannels when every one was found in the file; else only names match.
  const own = boundaryCount === settings.boundaryChannels.length ? settings.boundaryChannels[k] : undefined;
  let window = settings.boundarySearchEl;
  for (const w of settings.boundaryWindows) if (namesChannel(w.channel, own, name)) window = w.rangeEl;
  return window;
}

/**
 * The embryo with every profile minus the background's profile of its channel, and λ, amplitude and the boundaries
 * fitted again (its landmarks, axis and egg length are unchanged). Throws CohortError when a profiled channel has no
 * background profile or other bins.
 */
export function refitEmbryo(r: EmbryoResult, background: ReadonlyMap<string, BackgroundProfile>, settings: RefitSettings, condition: string): EmbryoResult {
  for (const p of profilesByChannel(r).values()) {
    const bg = background.get(p.channel);
    if (!bg) throw new CohortError(`${r.file}: channel "${p.channel}" has no profile in background condition "${condition}" (it has ${[...background.keys()].join(', ')})`);
    if (!sameBins(p, { ...p, xEl: bg.xEl })) throw new CohortError(`${r.file}: ${p.xEl.length} x/EL bins, background condition "${condition}" ${bg.xEl.length}; analyse them with one bin count`);
  }
  const sub = (p: Profile): Profile => subtractProfile(p, background.get(p.channel) as BackgroundProfile);
  const warnings: string[] = [];
  const gradientProfile = r.gradientProfile ? sub(r.gradientProfile) : null;
  const axisPx = r.axis ? axisLengthPx(r.axis) : NaN;
  const fitRange = r.gradientFit?.fitRangeEl ?? settings.fitRangeEl;
  const gradientFit = gradientProfile && Number.isFinite(axisPx) ? fitProfile(gradientProfile, axisPx, r.pixelSizeUm, fitRange, warnings) : null;
  const boundaryProfiles = r.boundaryProfiles.map(sub);
  const boundaries = boundaryProfiles.flatMap((p, k) => {
    try {
      const window = refitWindowOf(k, p.channel, boundaryProfiles.length, settings);
      return findBoundaries(binsWithin(filledBins(p), window), settings.boundaryMethods, settings.boundaryThresholdFraction, r.eggLengthUm);
    } catch (e) {
      warnings.push(`boundaries of ${p.channel} failed: ${e instanceof Error ? e.message : String(e)}`);
      return [];
    }
  });
  const note = `background condition "${condition}" subtracted; λ and boundaries fitted again`;
  return { ...r, gradientProfile, gradientFit, boundaryProfiles, boundaries, warnings: [...r.warnings, note, ...warnings.map((w) => `after subtraction: ${w}`)] };
}

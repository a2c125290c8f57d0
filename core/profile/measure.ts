// Measure one embryo along a given AP axis: profiles, exponential fit, boundaries and landmark positions.
// Fast enough for live use: everything independent of the axis was done by prepareSampling.
import type { ApAxis, EmbryoResult, ExponentialFit, Landmark, Mask, Profile } from '../model';
import type { AnalysisSettings, ChannelRef } from '../settings';
import { describeChannelRef, resolveChannel } from '../image';
import { axisLengthPx, distanceOutsideMaskPx, projectPointOntoAxis } from '../geometry';
import { findBoundaries, fitExponentialDecayWeighted, type WeightedExponentialFit } from '../fit';
import { notDecayingWarning } from '../stats';
import type { PreparedSampling } from './samplers';
import { binProfile, groupByBin, groupedProfile, type BinGroups } from './bin';
import { checkSamplingSettings } from './check-settings';
import { measureSides, type SideProfiles } from './sides';

/**
 * Everything measured along one axis: the measurement fields of an EmbryoResult. µm values are null/NaN when the pixel
 * size is unknown; gradientFit is null (with a warning) when the fit fails or the gradient channel is missing.
 */
export type Measurement = Pick<EmbryoResult,
  'gradientChannel' | 'gradientProfile' | 'gradientFit' | 'boundaryProfiles' | 'boundaries' | 'landmarks' | 'backgrounds'
  | 'eggLengthUm' | 'warnings' | 'sides'>;

/** Copy of a profile without its empty bins (fit and boundary finders need finite values). */
export function filledBins(p: Profile): Profile {
  const keep: number[] = [];
  for (let b = 0; b < p.n.length; b++) if (p.n[b] > 0 && Number.isFinite(p.mean[b])) keep.push(b);
  const pick = (a: Float64Array): Float64Array => Float64Array.from(keep, (b) => a[b]);
  return { channel: p.channel, xEl: pick(p.xEl), xUm: pick(p.xUm), mean: pick(p.mean), sd: pick(p.sd), n: pick(p.n) };
}

/** Copy of a profile with only the bins whose centre lies in [start, end] x/EL (the boundary search window). */
export function binsWithin(p: Profile, [start, end]: readonly [number, number]): Profile {
  const keep: number[] = [];
  for (let b = 0; b < p.xEl.length; b++) if (p.xEl[b] >= start && p.xEl[b] <= end) keep.push(b);
  if (keep.length === p.xEl.length) return p;
  const pick = (a: Float64Array): Float64Array => Float64Array.from(keep, (b) => a[b]);
  return { channel: p.channel, xEl: pick(p.xEl), xUm: pick(p.xUm), mean: pick(p.mean), sd: pick(p.sd), n: pick(p.n) };
}

/**
 * Inverse-variance weights n/SD² of bin means (relative; the fit estimates the common scale from its residuals).
 * A bin's variance is floored at 1% of the median so that one bin with a tiny SD cannot take all the weight; bins
 * with fewer than 2 pixels get the median variance. Null (unweighted) when no bin has a usable SD.
 */
export function binWeights(sd: Float64Array, n: Float64Array): Float64Array | null {
  const variance = Float64Array.from(sd, (s, i) => (n[i] >= 2 && s > 0 && Number.isFinite(s) ? (s * s) / n[i] : NaN));
  const usable = Array.from(variance).filter(Number.isFinite).sort((a, b) => a - b);
  if (usable.length === 0) return null;
  const median = usable[Math.floor(usable.length / 2)];
  return variance.map((v) => 1 / (Number.isFinite(v) ? Math.max(v, 0.01 * median) : median));
}

/**
 * Exponential fit of a profile over settings.fitRangeEl; null + warning on failure. Without a pixel size the fit
 * runs in pixels and its µm values are NaN (λ in EL stays valid).
 */
export function fitProfile(profile: Profile, axisPx: number, pixelSizeUm: number | null, fitRangeEl: readonly [number, number], warnings: string[]): ExponentialFit | null {
  return fitProfileWeighted(profile, axisPx, pixelSizeUm, fitRangeEl, warnings)?.fit ?? null;
}

/** fitProfile with the weights the fit gave its points (the filled bins inside the fit range; null = unweighted). */
export function fitProfileWeighted(profile: Profile, axisPx: number, pixelSizeUm: number | null, fitRangeEl: readonly [number, number], warnings: string[]): WeightedExponentialFit | null {
  const p = filledBins(profile);
  const scale = pixelSizeUm ?? 1;
  const xUm = Float64Array.from(p.xEl, (x) => x * axisPx * scale);
  try {
    const weights = binWeights(p.sd, p.n);
    const raw = fitExponentialDecayWeighted(xUm, p.mean, { eggLengthUm: axisPx * scale, fitRangeEl, xEl: p.xEl, ...(weights ? { weights } : {}) });
    const fit = pixelSizeUm !== null ? raw.fit : { ...raw.fit, lambdaUm: NaN, lambdaSeUm: NaN, lambdaCiLowUm: NaN, lambdaCiHighUm: NaN };
    const odd = notDecayingWarning(profile.channel, fit);
    if (odd !== null) warnings.push(odd);
    return { fit, weights: raw.weights };
  } catch (e) {
    warnings.push(`exponential fit of ${profile.channel} failed: ${e instanceof Error ? e.message : String(e)}`);
    return null;
  }
}

/** Resolve channel refs, warning (not failing) for channels the file lacks. */
function resolveRefs(refs: readonly ChannelRef[], names: readonly string[], role: string, warnings: string[]): number[] {
  const out: number[] = [];
  for (const ref of refs) {
    const c = resolveChannel(ref, names);
    if (c === null) warnings.push(`the file has no ${describeChannelRef(ref)} (${role}); it was skipped`);
    else out.push(c);
  }
  return out;
}

/** Slack before a pole counts as outside the embryo: 2 px plus 2% of the axis length (the automatic poles lie on the
 *  outline, within a pixel or two of a mask pixel). */
export function poleSlackPx(axisPx: number): number {
  return 2 + 0.02 * axisPx;
}

/** Warnings for poles that lie outside the embryo's mask by more than the slack (egg length is pole to pole, so it
 *  is too long then). Lengths in µm when the pixel size is known, else px. */
export function polesOutsideWarnings(mask: Mask, axis: ApAxis, pixelSizeUm: number | null): string[] {
  const axisPx = axisLengthPx(axis);
  const slack = poleSlackPx(axisPx);
  const len = (v: number): string => (pixelSizeUm !== null ? `${Math.round(v * pixelSizeUm)} µm` : `${Math.round(v)} px`);
  const out: string[] = [];
  for (const end of ['anterior', 'posterior'] as const) {
    const d = distanceOutsideMaskPx(mask, axis[end], axisPx);
    if (d > slack) {
      const how = Number.isFinite(d) ? `${len(d)} outside` : 'far outside';
      out.push(`the ${end} pole lies ${how} the embryo outline, so the egg length (${len(axisPx)}, pole to pole) is too long; move the pole onto the embryo's end`);
    }
  }
  return out;
}

/** The sampler's step: binned, background-subtracted profiles of the gradient and boundary channels along one axis. */
export interface SampledProfiles {
  readonly axis: ApAxis;
  readonly axisPx: number;
  readonly pixelSizeUm: number | null;
  /** Egg length, pole to pole, µm (null when the pixel size is unknown). */
  readonly eggLengthUm: number | null;
  /** Index of the gradient channel (null when the file lacks it), and its profile. */
  readonly gradient: number | null;
  readonly gradientProfile: Profile | null;
  /** Indices and profiles of the boundary channels the file has. */
  readonly boundaryChannels: readonly number[];
  readonly boundaryProfiles: readonly Profile[];
  /** The gradient channel's profile on each side on its own, when the sampler measures the sides apart; else null. */
  readonly sideProfiles: SideProfiles | null;
  /** Warnings so far: the preparation's, poles outside the embryo, then missing gradient and boundary channels. */
  readonly warnings: readonly string[];
  readonly gradientWarnings: readonly string[];
  readonly boundaryWarnings: readonly string[];
}

/**
 * The sampler's bins of the region pixels along `axis`, grouped by bin: remembered in prepared.binning (when the
 * preparation has one) for the next preparation of the series measured along the same axis with the same settings.
 */
function binGroupsAlong(prepared: PreparedSampling, axis: ApAxis, settings: AnalysisSettings): BinGroups {
  const binCount = settings.profile.binCount;
  const memo = prepared.binning;
  if (!memo) return groupByBin(prepared.sampler.bins(prepared, axis, settings), binCount);
  const key = JSON.stringify([axis, { ...settings, timeIndex: 0 }]);
  if (memo.last?.key !== key) memo.last = { key, groups: groupByBin(prepared.sampler.bins(prepared, axis, settings), binCount) };
  return memo.last.groups;
}

/**
 * Sample along `axis` with the prepared sampler: its bins for every region pixel, then one profile per channel used
 * (gradient, boundary channels), background subtracted.
 */
export function sampleProfiles(prepared: PreparedSampling, axis: ApAxis, settings: AnalysisSettings): SampledProfiles {
  checkSamplingSettings(settings);
  const px = prepared.pixelSizeUm;
  const warnings = [...prepared.warnings, ...polesOutsideWarnings(prepared.mask, axis, px)];
  const axisPx = axisLengthPx(axis);
  const eggLengthUm = px !== null ? axisPx * px : null;
  const groups = binGroupsAlong(prepared, axis, settings);
  const values = prepared.region.pixels.values;
  const profileOf = (c: number): Profile => groupedProfile(values[c], groups, prepared.channelNames[c], eggLengthUm);
  const gradientWarnings: string[] = [];
  const g = resolveRefs([settings.gradientChannel], prepared.channelNames, 'gradient', gradientWarnings)[0] ?? null;
  const boundaryWarnings: string[] = [];
  const bc = resolveRefs(settings.boundaryChannels, prepared.channelNames, 'boundary', boundaryWarnings);
  const sideBins = g !== null ? prepared.sampler.sideBins?.(prepared, axis, settings) ?? null : null;
  const sideProfile = (b: Int32Array): Profile => binProfile(values[g!], b, settings.profile.binCount, prepared.channelNames[g!], eggLengthUm);
  return {
    axis, axisPx, pixelSizeUm: px, eggLengthUm, gradient: g, gradientProfile: g !== null ? profileOf(g) : null,
    boundaryChannels: bc, boundaryProfiles: bc.map(profileOf),
    sideProfiles: sideBins ? {
      dorsal: sideProfile(sideBins.dorsal), ventral: sideProfile(sideBins.ventral),
      ...(sideBins.outerHalf ? { outerHalf: { dorsal: sideProfile(sideBins.outerHalf.dorsal), ventral: sideProfile(sideBins.outerHalf.ventral) } } : {}),
    } : null,
    warnings, gradientWarnings, boundaryWarnings,
  };
}

/** The x/EL search window of boundary channel `c` (0-based): its own from settings.boundaryWindows (the last entry
 *  naming it, by number or name), else settings.boundarySearchEl. */
export function boundaryWindowOf(c: number, channelNames: readonly string[], settings: AnalysisSettings): readonly [number, number] {
  let window = settings.boundarySearchEl;
  for (const w of settings.boundaryWindows) if (resolveChannel(w.channel, channelNames) === c) window = w.rangeEl;
  return window;
}

/**
 * The fitter's step on sampled profiles: the exponential fit of the gradient over settings.fitRangeEl, boundaries per
 * boundary channel within settings.boundarySearchEl, and the landmarks' positions on the axis.
 */
export function fitSampledProfiles(sampled: SampledProfiles, prepared: PreparedSampling, settings: AnalysisSettings, landmarks: readonly Landmark[]): Measurement {
  const { axis, axisPx, eggLengthUm, gradient: g, gradientProfile, boundaryProfiles } = sampled;
  const px = sampled.pixelSizeUm;
  const warnings: string[] = [...sampled.warnings, ...sampled.gradientWarnings];
  const gradientFit = gradientProfile ? fitProfile(gradientProfile, axisPx, px, settings.fitRangeEl, warnings) : null;
  const sides = sampled.sideProfiles ? measureSides(sampled.sideProfiles, axisPx, px, settings.fitRangeEl, warnings) : null;
  warnings.push(...sampled.boundaryWarnings);
  const boundaries = boundaryProfiles.flatMap((p, k) => {
    try {
      const window = boundaryWindowOf(sampled.boundaryChannels[k], prepared.channelNames, settings);
      return findBoundaries(binsWithin(filledBins(p), window), settings.boundaryMethods, settings.boundaryThresholdFraction, eggLengthUm);
    } catch (e) {
      warnings.push(`boundaries of ${p.channel} failed: ${e instanceof Error ? e.message : String(e)}`);
      return [];
    }
  });
  const bc = sampled.boundaryChannels;
  const used = [...new Set(g !== null ? [g, ...bc] : bc)];
  return {
    gradientChannel: g !== null ? prepared.channelNames[g] : null, gradientProfile, gradientFit, boundaryProfiles: [...boundaryProfiles], boundaries,
    landmarks: landmarks.map((l) => ({ name: l.name, point: l.point, ...pick(projectPointOntoAxis(l.point, axis, px)) })),
    backgrounds: used.map((c) => prepared.backgrounds[c]), eggLengthUm, warnings, ...(sides ? { sides } : {}),
  };
}

/**
 * Measure along `axis` with the prepared sampler: sampleProfiles, then fitSampledProfiles (profiles, the exponential
 * fit of the gradient, boundaries per boundary channel and the landmarks' positions on the axis).
 */
export function measureEmbryo(prepared: PreparedSampling, axis: ApAxis, settings: AnalysisSettings, landmarks: readonly Landmark[]): Measurement {
  return fitSampledProfiles(sampleProfiles(prepared, axis, settings), prepared, settings, landmarks);
}

function pick(p: { xEl: number; xUm: number; offAxisUm: number }): { xEl: number; xUm: number; offAxisUm: number } {
  return { xEl: p.xEl, xUm: p.xUm, offAxisUm: p.offAxisUm };
}

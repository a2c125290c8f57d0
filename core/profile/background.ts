// Background estimates per channel: outside the embryo (robust), a drawn rectangle, or none.
import type { BackgroundEstimate, Mask, Plane, RawPlane } from '../model';
import type { BackgroundSettings } from '../settings';
import { counterMedian, maskRuns, maskedMedian, runCounter, sampleMedian, sortedQuantile, squareDilate, wholeNumberMedian, type MaskRuns, type RunCounter } from '../image';

/** Fewest outside pixels accepted for the 'outside' estimate before falling back to a low percentile. */
const MIN_OUTSIDE_PX = 100;

/**
 * 'outside' background: the median of the pixels beyond a square margin of marginPx around the mask (the margin keeps blurred
 * embryo light out of the estimate; the median ignores debris and neighbours). With too few such pixels, the 2nd
 * percentile of the whole image is used instead and a warning says so.
 */
export function outsideBackground(plane: Plane, mask: Mask, marginPx: number): { value: number; warning: string | null } {
  return outsideBackgroundFar(plane, farFromMask(mask, marginPx));
}

/** 1 where a pixel lies outside the mask grown by a (2·marginPx+1)² square (a square margin is enough here). */
export function farFromMask(mask: Mask, marginPx: number): Uint8Array {
  const grown = squareDilate(mask, marginPx).data;
  const far = new Uint8Array(grown.length);
  for (let i = 0; i < far.length; i++) far[i] = +(grown[i] === 0);
  return far;
}

/** The pixels far from a mask (farFromMask) as a 0/1 image and as its runs along rows: made once per mask. */
export interface FarPixels {
  readonly mask: Uint8Array;
  readonly runs: MaskRuns;
  /** Counts these pixels' decoded samples, one plane at a time (counterMedian). */
  readonly counter: RunCounter;
}

/** farFromMask with the runs of those pixels, for a series of planes measured within one mask (a movie). */
export function farPixels(mask: Mask, marginPx: number): FarPixels {
  const far = farFromMask(mask, marginPx);
  const runs = maskRuns({ width: mask.width, height: mask.height, data: far }, true);
  return { mask: far, runs, counter: runCounter(runs, mask.width * mask.height) };
}

/**
 * outsideBackground with the far-from-mask pixels already known (so several channels share one distance map), and
 * their runs when known (farRuns = maskRuns of far). With the runs and `raw`, the decoded 8/16-bit plane whose
 * values `plane` holds exactly (ProjectedStack.rawPlanes), the median is counted from those samples (counterMedian
 * with `counter`, a RunCounter of farRuns, when given; else sampleMedian);
 * else whole-number values (8/16-bit samples, not averaged) take it from one counting pass over the floats
 * (wholeNumberMedian), others from maskedMedian: the same number every way.
 */
export function outsideBackgroundFar(plane: Plane, far: Uint8Array, farRuns: MaskRuns | null = null, raw: RawPlane | null = null,
  counter: RunCounter | null = null): { value: number; warning: string | null } {
  const samples = raw?.data;
  const counted = farRuns && (samples instanceof Uint16Array || samples instanceof Uint8Array) && samples.length === plane.width * plane.height
    ? (counter ? counterMedian(counter, samples) : sampleMedian(samples, farRuns)) : null;
  const { median, count } = counted ?? wholeNumberMedian(plane.data, far, farRuns) ?? maskedMedian(plane.data, far);
  if (count >= MIN_OUTSIDE_PX) return { value: median, warning: null };
  const all = Float64Array.from(plane.data).sort();
  return { value: sortedQuantile(all, 0.02), warning: 'too little background outside the embryo; the 2nd percentile of the image was used as background' };
}

/** Mean of the pixels of `plane` inside the rectangle (clipped to the image); NaN when nothing is left. */
export function regionMean(plane: Plane, region: { x: number; y: number; width: number; height: number }): number {
  const x0 = Math.max(0, Math.floor(region.x));
  const y0 = Math.max(0, Math.floor(region.y));
  const x1 = Math.min(plane.width, Math.floor(region.x + region.width));
  const y1 = Math.min(plane.height, Math.floor(region.y + region.height));
  let s = 0;
  let n = 0;
  for (let y = y0; y < y1; y++) for (let x = x0; x < x1; x++) { s += plane.data[y * plane.width + x]; n++; }
  return n > 0 ? s / n : NaN;
}

/** Background of every channel by settings.mode, with warnings (a bad region gives 0 and a warning). */
export function estimateBackgrounds(channels: readonly Plane[], names: readonly string[], mask: Mask, settings: BackgroundSettings, marginPx: number,
  knownFar: FarPixels | null = null, rawPlanes: readonly RawPlane[] | null = null): { backgrounds: BackgroundEstimate[]; warnings: string[] } {
  const warnings: string[] = [];
  // knownFar: farPixels(mask, marginPx) already computed for this mask (a movie's time points share one mask).
  const far = settings.mode === 'outside' ? knownFar ?? { mask: farFromMask(mask, marginPx), runs: null, counter: null } : null;
  const backgrounds = channels.map((plane, c): BackgroundEstimate => {
    if (settings.mode === 'none') return { channel: names[c], method: 'none', value: 0 };
    if (settings.mode === 'region') {
      const v = settings.regionPx ? regionMean(plane, settings.regionPx) : NaN;
      if (!Number.isFinite(v)) {
        if (c === 0) warnings.push('background region is missing or lies outside the image; no background was subtracted');
        return { channel: names[c], method: 'region', value: 0 };
      }
      return { channel: names[c], method: 'region', value: v };
    }
    // rawPlanes: the decoded samples the channels hold exactly (ProjectedStack.rawPlanes), when known.
    const out = outsideBackgroundFar(plane, far!.mask, far!.runs, rawPlanes?.[c] ?? null, far!.counter);
    if (out.warning && c === 0) warnings.push(out.warning);
    return { channel: names[c], method: 'outside', value: out.value };
  });
  return { backgrounds, warnings };
}

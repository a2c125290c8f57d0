// Everything about sampling that does not depend on where the axis handles are: computed once per detection.
import type { BackgroundEstimate, Detection, Mask, ProjectedStack, RawPlane } from '../model';
import type { AnalysisSettings } from '../settings';
import { foregroundBox } from '../image';
import { estimateBackgrounds, farPixels, type FarPixels } from './background';
import { checkSamplingSettings } from './check-settings';
import { PROFILE_SAMPLERS, samplerFor } from './samplers';
import type { BinningMemo, MaskBox, PixelSet, PreparedSampling, ProfileSampler, SamplingBase } from './samplers';

export type { PixelSet, PreparedSampling } from './samplers';

/** Half-open bounding box of the mask's pixels, or null when it is empty. */
type Box = MaskBox | null;

/**
 * Collect positions and background-subtracted values of the pixels where keep[i] is 1, in row-major order. Only
 * the box is scanned: keep is 0 everywhere outside it. The pixel loops are functions of their own (see "Pixel loops
 * in small functions" in DEVELOPERS.md).
 */
function pixelSet(projected: ProjectedStack, keep: Uint8Array, backgrounds: readonly BackgroundEstimate[], box: Box): PixelSet {
  const { idx, xs, ys } = keptPositions(keep, projected.channels[0].width, box);
  return { xs, ys, values: valuesAt(projected, idx, backgrounds) };
}

/** Index, column and row of each pixel with keep[i] = 1 within the box (row-major): the pixels gather lists. */
function keptPositions(keep: Uint8Array, width: number, box: Box): { idx: Int32Array; xs: Float32Array; ys: Float32Array } {
  const { x0, y0, x1, y1 } = box ?? { x0: 0, y0: 0, x1: 0, y1: 0 };
  const n = countKept(keep, width, x0, y0, x1, y1);
  const idx = new Int32Array(n);
  const xs = new Float32Array(n);
  const ys = new Float32Array(n);
  keptPixelPositions(keep, width, x0, y0, x1, y1, idx, xs, ys);
  return { idx, xs, ys };
}

/** The background-subtracted values of every channel at the pixels idx, into `into[c]` when given (else new arrays);
 *  through `runs` (indexRuns(idx)) when given, the same values read along rows, and from `raw` (the decoded 8/16-bit
 *  samples the channels hold exactly, ProjectedStack.rawPlanes) when given: raw − b rounds to the same float as
 *  float(raw) − b, as every such sample is exact in a float. */
function valuesAt(projected: ProjectedStack, idx: Int32Array, backgrounds: readonly BackgroundEstimate[], into: Float32Array[] | null = null,
  runs: IndexRuns | null = null, raw: readonly RawPlane[] | null = null): Float32Array[] {
  const values: Float32Array[] = [];
  for (let c = 0; c < projected.channels.length; c++) {
    const v = into?.[c] ?? new Float32Array(idx.length);
    const { width, height } = projected.channels[c];
    const samples = raw?.[c]?.data;
    if (runs && samples instanceof Uint16Array && samples.length === width * height) subtractAlongRuns16(samples, runs, backgrounds[c].value, v);
    else if (runs && samples instanceof Uint8Array && samples.length === width * height) subtractAlongRuns8(samples, runs, backgrounds[c].value, v);
    else if (runs) subtractAlongRuns(projected.channels[c].data, runs, backgrounds[c].value, v);
    else subtractAt(projected.channels[c].data, idx, backgrounds[c].value, v);
    values.push(v);
  }
  return values;
}

/** Stretches of consecutive pixel indices in an ascending index list: idx is the concatenation of start[r] … end[r] − 1. */
interface IndexRuns { readonly start: Int32Array; readonly end: Int32Array }

/** The runs of consecutive values in an ascending list of pixel indices. */
export function indexRuns(idx: Int32Array): IndexRuns {
  let count = 0;
  for (let k = 0; k < idx.length; k++) if (k === 0 || idx[k] !== idx[k - 1] + 1) count++;
  const start = new Int32Array(count);
  const end = new Int32Array(count);
  for (let k = 0, r = -1; k < idx.length; k++) {
    if (k === 0 || idx[k] !== idx[k - 1] + 1) start[++r] = idx[k];
    end[r] = idx[k] + 1;
  }
  return { start, end };
}

/** subtractAt for the pixels of `runs`: out[k] = data[i] − b for i along each run in turn (no index list to read). */
function subtractAlongRuns(data: Float32Array, runs: IndexRuns, b: number, out: Float32Array): void {
  for (let r = 0, k = 0; r < runs.start.length; r++) {
    for (let i = runs.start[r], end = runs.end[r]; i < end; i++) out[k++] = data[i] - b;
  }
}

/** subtractAlongRuns over 16-bit samples (a function of its own, so each loop sees one array type). */
function subtractAlongRuns16(data: Uint16Array, runs: IndexRuns, b: number, out: Float32Array): void {
  for (let r = 0, k = 0; r < runs.start.length; r++) {
    for (let i = runs.start[r], end = runs.end[r]; i < end; i++) out[k++] = data[i] - b;
  }
}

/** subtractAlongRuns over 8-bit samples. */
function subtractAlongRuns8(data: Uint8Array, runs: IndexRuns, b: number, out: Float32Array): void {
  for (let r = 0, k = 0; r < runs.start.length; r++) {
    for (let i = runs.start[r], end = runs.end[r]; i < end; i++) out[k++] = data[i] - b;
  }
}

/** Number of pixels with keep[i] = 1 in [x0, x1) × [y0, y1). */
function countKept(keep: Uint8Array, width: number, x0: number, y0: number, x1: number, y1: number): number {
  let n = 0;
  for (let y = y0; y < y1; y++) for (let i = y * width + x0, end = y * width + x1; i < end; i++) n += keep[i];
  return n;
}

/** Index, column and row of each pixel with keep[i] set in [x0, x1) × [y0, y1), row-major. */
function keptPixelPositions(keep: Uint8Array, width: number, x0: number, y0: number, x1: number, y1: number, idx: Int32Array, xs: Float32Array, ys: Float32Array): void {
  for (let y = y0, k = 0; y < y1; y++) {
    const o = y * width;
    for (let x = x0; x < x1; x++) {
      if (!keep[o + x]) continue;
      idx[k] = o + x;
      xs[k] = x;
      ys[k++] = y;
    }
  }
}

/** out[k] = data[idx[k]] − b. */
function subtractAt(data: Float32Array, idx: Int32Array, b: number, out: Float32Array): void {
  for (let k = 0; k < idx.length; k++) out[k] = data[idx[k]] - b;
}

/**
 * Prepare sampling for one detection: background estimates per channel (outside margin: 10 µm, at least 5 px), then
 * the sampler of settings.profile.mode (among `samplers`) prepares the pixels it draws from. Re-prepare when the
 * projection, the mask, the mode, its settings or the background settings change.
 */
export function prepareSampling(projected: ProjectedStack, detection: Detection, settings: AnalysisSettings, samplers: readonly ProfileSampler[] = PROFILE_SAMPLERS, known: MaskBasics | null = null): PreparedSampling {
  checkSamplingSettings(settings);
  const sampler = samplerFor(settings.profile.mode, samplers);
  const base = samplingBase(projected, detection, settings, known);
  return { ...base, sampler, region: sampler.prepare(base, settings) };
}

/** Background margin around the mask: 10 µm, at least 5 px (10 px when the pixel size is unknown). */
function backgroundMarginPx(pixelSizeUm: number | null): number {
  return Math.max(5, pixelSizeUm ? 10 / pixelSizeUm : 10);
}

/** What every sampler prepares from: mask, its box, backgrounds, and the pixel gatherer. */
export function samplingBase(projected: ProjectedStack, detection: Detection, settings: AnalysisSettings, known: MaskBasics | null = null): SamplingBase {
  const warnings: string[] = [];
  const px = projected.pixelSizeUm;
  if (px === null) warnings.push('pixel size unknown: edge depth, strip width and background margin are taken as pixels');
  const mask = detection.mask;
  const bg = estimateBackgrounds(projected.channels, projected.channelNames, mask, settings.background, backgroundMarginPx(px), known?.far ?? null, projected.rawPlanes ?? null);
  warnings.push(...bg.warnings);
  // Every sampled pixel lies within the mask's bounding box.
  const box = known ? known.box : foregroundBox(mask);
  return {
    width: mask.width, height: mask.height, pixelSizeUm: px, channelNames: projected.channelNames, mask, box,
    backgrounds: bg.backgrounds, warnings, gather: (keep) => pixelSet(projected, keep, bg.backgrounds, box),
  };
}

/** What the base of a preparation takes from the mask alone: its box and, for the 'outside' background, the pixels
 *  far from it. */
interface MaskBasics {
  readonly box: MaskBox | null;
  /** farPixels(mask, margin) for the 'outside' background, else null. */
  readonly far: FarPixels | null;
}

/** The parts of a preparation that depend on the mask and the settings only, not on the pixel values. */
interface MaskParts extends MaskBasics {
  /** The sampler's region mask. */
  readonly region: Mask;
  /** Its pixels' indices and positions (row-major, as gather lists them): only their values change per projection. */
  readonly idx: Int32Array;
  readonly xs: Float32Array;
  readonly ys: Float32Array;
  /** idx as runs of consecutive pixels (the region's rows), along which the values are read. */
  readonly runs: IndexRuns;
  /** The bins along the last axis measured, shared by every preparation made from these parts. */
  readonly binning: BinningMemo;
  /** Per channel, the array the region pixels' values are written into at every later preparation. */
  readonly values: Float32Array[];
}

/**
 * prepareSampling for a series of projections measured within one detection (a movie whose embryo is found once):
 * the first call prepares as prepareSampling does; later calls with the same pixel size, channels and sampling and
 * background settings reuse what depends on the mask alone (its box, the pixels far from it and their index list,
 * the sampler's region and its pixels' positions: the edge band's distance map is the costly part) and only
 * estimate the backgrounds and take the region pixels' values again, into the same arrays each time: a later
 * call's values replace the earlier preparation's (measure each before preparing the next, as a movie does). The preparations share a BinningMemo, so
 * measuring them along the same axis with the same settings bins the pixels once. Each call gives what
 * prepareSampling gives on that projection (the region's pixels are by contract base.gather(region.mask.data));
 * other settings are prepared from scratch.
 */
export function samplingWithin(detection: Detection, samplers: readonly ProfileSampler[] = PROFILE_SAMPLERS): (projected: ProjectedStack, settings: AnalysisSettings) => PreparedSampling {
  let kept: { key: string; parts: MaskParts } | null = null;
  return (projected, settings) => {
    const key = JSON.stringify([projected.pixelSizeUm, projected.channels.length, settings.profile, settings.background]);
    if (kept?.key !== key) {
      // The box and the far pixels are made once here and given to the first preparation too, not made twice.
      const far = settings.background.mode === 'outside' ? farPixels(detection.mask, backgroundMarginPx(projected.pixelSizeUm)) : null;
      const prepared = prepareSampling(projected, detection, settings, samplers, { box: foregroundBox(detection.mask), far });
      const { mask } = prepared.region;
      const positions = keptPositions(mask.data, mask.width, prepared.box);
      const values = projected.channels.map(() => new Float32Array(positions.idx.length));
      const parts = { box: prepared.box, far, region: mask, ...positions, runs: indexRuns(positions.idx), binning: { last: null }, values };
      kept = { key, parts };
      return { ...prepared, binning: parts.binning };
    }
    const { parts } = kept;
    const base = samplingBase(projected, detection, settings, parts);
    const sampler = samplerFor(settings.profile.mode, samplers);
    const pixels = { xs: parts.xs, ys: parts.ys, values: valuesAt(projected, parts.idx, base.backgrounds, parts.values, parts.runs, projected.rawPlanes ?? null) };
    return { ...base, sampler, region: { mask: parts.region, pixels }, binning: parts.binning };
  };
}

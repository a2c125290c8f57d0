// Everything about sampling that does not depend on where the axis handles are: computed once per detection.
import type { BackgroundEstimate, Detection, Mask, ProjectedStack } from '../model';
import type { AnalysisSettings } from '../settings';
import { distanceInside, foregroundBox } from '../image';
import { estimateBackgrounds } from './background';
import { checkSamplingSettings } from './check-settings';

/** Pixel positions (px, pixel centres) and background-subtracted values of every channel at those pixels. */
export interface PixelSet {
  readonly xs: Float32Array;
  readonly ys: Float32Array;
  /** values[c][k] = channel c at pixel k, background subtracted. */
  readonly values: readonly Float32Array[];
}

/** Result of prepareSampling; pass it to measureEmbryo and sampleBandOutline. Re-prepare when the projection,
 * the mask, the edge depth or the background settings change. */
export interface PreparedSampling {
  readonly width: number;
  readonly height: number;
  readonly pixelSizeUm: number | null;
  readonly channelNames: readonly string[];
  readonly mask: Mask;
  /** Distance from each mask pixel centre to the nearest outside pixel centre, px (0 outside). */
  readonly depthPx: Float32Array;
  /** Band depth used (px) and the mask of the band pixels. */
  readonly edgeDepthPx: number;
  readonly bandMask: Mask;
  /** Pixels of the edge band, and all pixels of the mask (for the axis strip). */
  readonly band: PixelSet;
  readonly inside: PixelSet;
  readonly backgrounds: readonly BackgroundEstimate[];
  readonly warnings: readonly string[];
}

/** Half-open bounding box of the mask's pixels, or null when it is empty. */
type Box = ReturnType<typeof foregroundBox>;

/**
 * Collect positions and background-subtracted values of the pixels where keep[i] is 1, in row-major order. Only
 * the box is scanned: keep is 0 everywhere outside it. The pixel loops are functions of their own (see "Pixel loops
 * in small functions" in DEVELOPERS.md).
 */
function pixelSet(projected: ProjectedStack, keep: Uint8Array, backgrounds: readonly BackgroundEstimate[], box: Box): PixelSet {
  const { width } = projected.channels[0];
  const { x0, y0, x1, y1 } = box ?? { x0: 0, y0: 0, x1: 0, y1: 0 };
  const n = countKept(keep, width, x0, y0, x1, y1);
  const idx = new Int32Array(n);
  const xs = new Float32Array(n);
  const ys = new Float32Array(n);
  keptPixelPositions(keep, width, x0, y0, x1, y1, idx, xs, ys);
  const values: Float32Array[] = [];
  for (let c = 0; c < projected.channels.length; c++) {
    const v = new Float32Array(n);
    subtractAt(projected.channels[c].data, idx, backgrounds[c].value, v);
    values.push(v);
  }
  return { xs, ys, values };
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

/** 1 where a mask pixel's centre lies within edgeDepthPx of the outline (depth − 0.5 ≤ edgeDepthPx), in the box. */
function bandPixels(mask: Uint8Array, depthPx: Float32Array, width: number, x0: number, y0: number, x1: number, y1: number, edgeDepthPx: number, out: Uint8Array): void {
  for (let y = y0; y < y1; y++) {
    for (let i = y * width + x0, end = y * width + x1; i < end; i++) out[i] = +(mask[i] === 1 && depthPx[i] - 0.5 <= edgeDepthPx);
  }
}

/**
 * Prepare sampling for one detection: distance-to-edge map, the edge band (pixels whose centre lies within
 * edgeDepthUm of the outline: depth − 0.5 px ≤ edgeDepth, the outline lying half a pixel outside the last inside
 * centre), all mask pixels, and background estimates per channel (outside margin: 10 µm, at least 5 px).
 */
export function prepareSampling(projected: ProjectedStack, detection: Detection, settings: AnalysisSettings): PreparedSampling {
  checkSamplingSettings(settings);
  const warnings: string[] = [];
  const px = projected.pixelSizeUm;
  if (px === null) warnings.push('pixel size unknown: edge depth, strip width and background margin are taken as pixels');
  const toPx = (um: number): number => (px ? um / px : um);
  const mask = detection.mask;
  const depthPx = distanceInside(mask);
  const edgeDepthPx = toPx(settings.profile.edgeDepthUm);
  const bg = estimateBackgrounds(projected.channels, projected.channelNames, mask, settings.background, Math.max(5, toPx(10)));
  warnings.push(...bg.warnings);
  // Band and pixel sets lie within the mask's bounding box (outside it the mask, and so the band, is 0).
  const box = foregroundBox(mask);
  const bandData = new Uint8Array(mask.data.length);
  if (box) bandPixels(mask.data, depthPx, mask.width, box.x0, box.y0, box.x1, box.y1, edgeDepthPx, bandData);
  // The whole-mask pixel set serves only the axis-strip profile: gathered on first use, then kept.
  let inside: PixelSet | null = null;
  return {
    width: mask.width, height: mask.height, pixelSizeUm: px, channelNames: projected.channelNames, mask, depthPx,
    edgeDepthPx, bandMask: { width: mask.width, height: mask.height, data: bandData },
    band: pixelSet(projected, bandData, bg.backgrounds, box),
    get inside(): PixelSet {
      inside ??= pixelSet(projected, mask.data, bg.backgrounds, box);
      return inside;
    },
    backgrounds: bg.backgrounds, warnings,
  };
}

// The edge band: pixels just inside the outline (the nuclear layer), on the dorsal, ventral or both sides of the axis;
// with --edge-side each, both pooled and, besides, each side on its own (for the paired difference of their λ).
import type { ApAxis, ImagePoint, Mask } from '../../model';
import type { AnalysisSettings } from '../../settings';
import { distanceInside } from '../../image';
import { maskContours } from '../../geometry';
import { binIndices, type SideFilter } from '../bin';
import { rowsWhere } from './rows';
import type { PreparedSampling, ProfileSampler, SampledRegion, SamplingBase, SideBins } from './types';

/**
 * Side of the A→P line the band is sampled on: 'all' for both sides, else the side (left or right of the direction
 * anterior→posterior in image coordinates) that edgeSide names, given which side is dorsal.
 */
export function edgeSideFilter(settings: AnalysisSettings): SideFilter {
  const p = settings.profile;
  if (p.edgeSide === 'both' || p.edgeSide === 'each') return 'all';
  const dorsalLeft = p.dorsalSide === 'left';
  return (p.edgeSide === 'dorsal') === dorsalLeft ? 'left' : 'right';
}

/** The sides of A→P (left/right in image coordinates) that are dorsal and ventral. */
function dorsalVentralFilters(settings: AnalysisSettings): { dorsal: SideFilter; ventral: SideFilter } {
  return settings.profile.dorsalSide === 'left' ? { dorsal: 'left', ventral: 'right' } : { dorsal: 'right', ventral: 'left' };
}

/** Whether the settings ask for each side measured on its own besides the pooled band. */
function eachSide(settings: AnalysisSettings): boolean {
  return settings.profile.edgeSide === 'each';
}

/** 1 where a mask pixel's centre lies within edgeDepthPx of the outline (depth − 0.5 ≤ edgeDepthPx), in the box. */
function bandPixels(mask: Uint8Array, depthPx: Float32Array, width: number, x0: number, y0: number, x1: number, y1: number, edgeDepthPx: number, out: Uint8Array): void {
  for (let y = y0; y < y1; y++) {
    for (let i = y * width + x0, end = y * width + x1; i < end; i++) out[i] = +(mask[i] === 1 && depthPx[i] - 0.5 <= edgeDepthPx);
  }
}

/** Band depth in px: edgeDepthUm over the pixel size (taken as px when the pixel size is unknown). */
export function edgeDepthPx(settings: AnalysisSettings, pixelSizeUm: number | null): number {
  return pixelSizeUm ? settings.profile.edgeDepthUm / pixelSizeUm : settings.profile.edgeDepthUm;
}

/** The band pixels of any side (pixels whose centre lies within edgeDepthUm of the outline: depth − 0.5 px ≤ depth, the
 *  outline lying half a pixel outside the last inside centre). Band and pixels lie within the mask's box. */
function prepare(base: SamplingBase, settings: AnalysisSettings): SampledRegion {
  const { mask, box } = base;
  const depthPx = distanceInside(mask);
  const data = new Uint8Array(mask.data.length);
  if (box) bandPixels(mask.data, depthPx, mask.width, box.x0, box.y0, box.x1, box.y1, edgeDepthPx(settings, base.pixelSizeUm), data);
  return { mask: { width: mask.width, height: mask.height, data }, pixels: base.gather(data) };
}

function bins(prepared: PreparedSampling, axis: ApAxis, settings: AnalysisSettings): Int32Array {
  const { xs, ys } = prepared.region.pixels;
  return binIndices(xs, ys, axis, settings.profile.binCount, edgeSideFilter(settings));
}

/** Contours of the band pixels on one side of A→P ('all': both): outer and inner rings. */
function sideContours(prepared: PreparedSampling, axis: ApAxis, side: SideFilter): ImagePoint[][] {
  const { xs, ys } = prepared.region.pixels;
  const { width, height } = prepared;
  const onSide = binIndices(xs, ys, axis, 1, side);
  const data = new Uint8Array(width * height);
  for (let k = 0; k < onSide.length; k++) if (onSide[k] >= 0) data[ys[k] * width + xs[k]] = 1;
  const sided: Mask = { width, height, data };
  return maskContours(sided).filter((c) => c.length >= 3);
}

/** Contours of the band on the chosen side; with each side measured apart, the two sides' bands separately. */
function outline(prepared: PreparedSampling, axis: ApAxis, settings: AnalysisSettings): ImagePoint[][] {
  if (!eachSide(settings)) return sideContours(prepared, axis, edgeSideFilter(settings));
  const { dorsal, ventral } = dorsalVentralFilters(settings);
  return [...sideContours(prepared, axis, dorsal), ...sideContours(prepared, axis, ventral)];
}

/** `bins` with −1 for the pixels whose centre lies deeper than halfDepthPx (depth − 0.5 > halfDepthPx, as bandPixels). */
export function outerHalfBins(bins: Int32Array, depthPx: Float32Array, xs: Float32Array, ys: Float32Array, width: number, halfDepthPx: number): Int32Array {
  return Int32Array.from(bins, (b, k) => (depthPx[ys[k] * width + xs[k]] - 0.5 <= halfDepthPx ? b : -1));
}

/** Each side's bins on its own when --edge-side is 'each', and the same for the outer half of the band's depth. */
function sideBins(prepared: PreparedSampling, axis: ApAxis, settings: AnalysisSettings): SideBins | null {
  if (!eachSide(settings)) return null;
  const { xs, ys } = prepared.region.pixels;
  const { dorsal, ventral } = dorsalVentralFilters(settings);
  const binCount = settings.profile.binCount;
  const d = binIndices(xs, ys, axis, binCount, dorsal);
  const v = binIndices(xs, ys, axis, binCount, ventral);
  const depthPx = distanceInside(prepared.mask);
  const half = edgeDepthPx(settings, prepared.pixelSizeUm) / 2;
  const w = prepared.mask.width;
  return { dorsal: d, ventral: v, outerHalf: { dorsal: outerHalfBins(d, depthPx, xs, ys, w, half), ventral: outerHalfBins(v, depthPx, xs, ys, w, half) } };
}

/** Rows on the sampled side(s); the band's depth is already in the region. */
function stripRows(rowCount: number, _rowStepUm: number, settings: AnalysisSettings): Uint8Array {
  const side = edgeSideFilter(settings);
  return rowsWhere(rowCount, (d) => (d <= 0 ? side !== 'right' : side !== 'left'));
}

/** Edge band sampler ('edge'). */
export const EDGE_BAND: ProfileSampler = {
  mode: 'edge',
  label: 'edge band',
  settingKeys: ['profile.edgeSide', 'profile.dorsalSide', 'profile.edgeDepthUm'],
  describe: (get) => `edge band, ${String(get('edgeSide') ?? '?')} side(s), ${String(get('edgeDepthUm') ?? '?')} µm deep`,
  prepare, bins, outline, stripRows, sideBins,
};

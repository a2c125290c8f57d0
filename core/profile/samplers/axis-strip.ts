// The axis strip: pixels of the embryo within half the strip width of the AP axis, on both sides.
import type { ApAxis, ImagePoint } from '../../model';
import type { AnalysisSettings } from '../../settings';
import { axisFrame } from '../../geometry';
import { binIndices } from '../bin';
import { rowsWhere } from './rows';
import type { PreparedSampling, ProfileSampler, SampledRegion, SamplingBase } from './types';

/** Half the strip width in px (axisWidthUm taken as px when the pixel size is unknown). */
export function stripHalfWidthPx(settings: AnalysisSettings, pixelSizeUm: number | null): number {
  return (pixelSizeUm ? settings.profile.axisWidthUm / pixelSizeUm : settings.profile.axisWidthUm) / 2;
}

/** Every pixel of the mask: the strip's width depends on where the axis lies, so it is applied per measurement. */
function prepare(base: SamplingBase): SampledRegion {
  return { mask: base.mask, pixels: base.gather(base.mask.data) };
}

function bins(prepared: PreparedSampling, axis: ApAxis, settings: AnalysisSettings): Int32Array {
  const { xs, ys } = prepared.region.pixels;
  return binIndices(xs, ys, axis, settings.profile.binCount, 'all', stripHalfWidthPx(settings, prepared.pixelSizeUm));
}

/** One rectangle: anterior-left, posterior-left, posterior-right, anterior-right (px). */
function outline(prepared: PreparedSampling, axis: ApAxis, settings: AnalysisSettings): ImagePoint[][] {
  const half = stripHalfWidthPx(settings, prepared.pixelSizeUm);
  const f = axisFrame(axis);
  const at = (p: ImagePoint, s: number): ImagePoint => ({ x: p.x + s * half * f.nx, y: p.y + s * half * f.ny });
  return [[at(axis.anterior, 1), at(axis.posterior, 1), at(axis.posterior, -1), at(axis.anterior, -1)]];
}

/** Rows within half the strip width of the axis row. */
function stripRows(rowCount: number, rowStepUm: number, settings: AnalysisSettings): Uint8Array {
  const half = settings.profile.axisWidthUm / 2 / rowStepUm;
  return rowsWhere(rowCount, (d) => Math.abs(d) <= half);
}

/** Axis strip sampler ('axis'). */
export const AXIS_STRIP: ProfileSampler = {
  mode: 'axis',
  label: 'axis strip',
  settingKeys: ['profile.axisWidthUm'],
  describe: (get) => `strip along the axis, ${String(get('axisWidthUm') ?? '?')} µm wide`,
  prepare, bins, outline, stripRows,
};

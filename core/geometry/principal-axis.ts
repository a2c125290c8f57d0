// Principal axis of a binary mask from its second-order central moments.
import type { ImagePoint, Mask } from '../model';
import { foregroundBox } from '../image';

/** Centroid (px), unit direction of the major axis, and SDs of the pixel positions along/across it (px). */
export interface PrincipalAxis {
  readonly centroid: ImagePoint;
  readonly ux: number;
  readonly uy: number;
  readonly majorSdPx: number;
  readonly minorSdPx: number;
}

/** Principal axis of the foreground pixels (centres at integer coordinates); throws on an empty mask. */
export function principalAxis(mask: Mask): PrincipalAxis {
  const { width, data } = mask;
  // Only the mask's bounding box holds foreground pixels.
  const { x0, y0, x1, y1 } = foregroundBox(mask) ?? { x0: 0, y0: 0, x1: 0, y1: 0 };
  const sums = new Float64Array(3);
  firstMoments(data, width, x0, y0, x1, y1, sums);
  const n = sums[0];
  if (n === 0) throw new Error('the mask is empty');
  const cx = sums[1] / n;
  const cy = sums[2] / n;
  secondMoments(data, width, x0, y0, x1, y1, cx, cy, sums);
  const mxx = sums[0] / n;
  const myy = sums[1] / n;
  const mxy = sums[2] / n;
  const angle = 0.5 * Math.atan2(2 * mxy, mxx - myy);
  const common = Math.sqrt(((mxx - myy) / 2) ** 2 + mxy * mxy);
  const mid = (mxx + myy) / 2;
  return {
    centroid: { x: cx, y: cy }, ux: Math.cos(angle), uy: Math.sin(angle),
    majorSdPx: Math.sqrt(mid + common), minorSdPx: Math.sqrt(Math.max(0, mid - common)),
  };
}

// The pixel loops are functions of their own: see "Pixel loops in small functions" in DEVELOPERS.md.

/** Count, Σx and Σy of the set pixels in [x0, x1) × [y0, y1), into out[0..2]; rows and columns in memory order. */
function firstMoments(data: Uint8Array, width: number, x0: number, y0: number, x1: number, y1: number, out: Float64Array): void {
  let n = 0;
  let sx = 0;
  let sy = 0;
  for (let y = y0; y < y1; y++) {
    const o = y * width;
    for (let x = x0; x < x1; x++) if (data[o + x]) { n++; sx += x; sy += y; }
  }
  out[0] = n;
  out[1] = sx;
  out[2] = sy;
}

/** Σdx², Σdy² and Σdx·dy about (cx, cy) over the set pixels in [x0, x1) × [y0, y1), into out[0..2]. */
function secondMoments(data: Uint8Array, width: number, x0: number, y0: number, x1: number, y1: number, cx: number, cy: number, out: Float64Array): void {
  let mxx = 0;
  let myy = 0;
  let mxy = 0;
  for (let y = y0; y < y1; y++) {
    const o = y * width;
    const dy = y - cy;
    for (let x = x0; x < x1; x++) {
      if (!data[o + x]) continue;
      const dx = x - cx;
      mxx += dx * dx; myy += dy * dy; mxy += dx * dy;
    }
  }
  out[0] = mxx;
  out[1] = myy;
  out[2] = mxy;
}

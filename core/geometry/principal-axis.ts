// Principal axis of a binary mask from its second-order central moments.
import type { ImagePoint, Mask } from '../model';

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
  let n = 0;
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < data.length; i++) if (data[i]) { n++; sx += i % width; sy += Math.floor(i / width); }
  if (n === 0) throw new Error('the mask is empty');
  const cx = sx / n;
  const cy = sy / n;
  let mxx = 0;
  let myy = 0;
  let mxy = 0;
  for (let i = 0; i < data.length; i++) {
    if (!data[i]) continue;
    const dx = (i % width) - cx;
    const dy = Math.floor(i / width) - cy;
    mxx += dx * dx; myy += dy * dy; mxy += dx * dy;
  }
  mxx /= n; myy /= n; mxy /= n;
  const angle = 0.5 * Math.atan2(2 * mxy, mxx - myy);
  const common = Math.sqrt(((mxx - myy) / 2) ** 2 + mxy * mxy);
  const mid = (mxx + myy) / 2;
  return {
    centroid: { x: cx, y: cy }, ux: Math.cos(angle), uy: Math.sin(angle),
    majorSdPx: Math.sqrt(mid + common), minorSdPx: Math.sqrt(Math.max(0, mid - common)),
  };
}

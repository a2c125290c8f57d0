// Poles and size of an embryo: extremes of its outline along and across the principal axis.
import type { ImagePoint } from '../model';
import type { PrincipalAxis } from './principal-axis';

/** Both ends of the embryo on the principal axis line, and its length and width in px. */
export interface PoleExtent {
  /** End at the smallest projection along (ux, uy). */
  readonly first: ImagePoint;
  /** End at the largest projection along (ux, uy). */
  readonly second: ImagePoint;
  readonly lengthPx: number;
  readonly widthPx: number;
}

/**
 * Poles = points on the principal axis line (through the centroid) at the outline's extreme projections along it;
 * width = extent of the outline perpendicular to the axis. Outline vertices lie on the mask's half-level edge.
 */
export function polesFromOutline(outline: readonly ImagePoint[], axis: PrincipalAxis): PoleExtent {
  if (outline.length === 0) throw new Error('the outline is empty');
  const { centroid: c, ux, uy } = axis;
  const e = new Float64Array(4);
  extents(outline, c.x, c.y, ux, uy, e);
  const [tMin, tMax, sMin, sMax] = e;
  return {
    first: { x: c.x + tMin * ux, y: c.y + tMin * uy },
    second: { x: c.x + tMax * ux, y: c.y + tMax * uy },
    lengthPx: tMax - tMin,
    widthPx: sMax - sMin,
  };
}

/**
 * Smallest and largest projection of the points along (ux, uy) and across it, about (cx, cy), into
 * out = [tMin, tMax, sMin, sMax]. A loop of its own: see "Pixel loops in small functions" in DEVELOPERS.md.
 */
function extents(points: readonly ImagePoint[], cx: number, cy: number, ux: number, uy: number, out: Float64Array): void {
  let tMin = Infinity;
  let tMax = -Infinity;
  let sMin = Infinity;
  let sMax = -Infinity;
  for (const p of points) {
    const dx = p.x - cx;
    const dy = p.y - cy;
    const t = dx * ux + dy * uy;
    const s = dy * ux - dx * uy;
    if (t < tMin) tMin = t;
    if (t > tMax) tMax = t;
    if (s < sMin) sMin = s;
    if (s > sMax) sMax = s;
  }
  out[0] = tMin; out[1] = tMax; out[2] = sMin; out[3] = sMax;
}

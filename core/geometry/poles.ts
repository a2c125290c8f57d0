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
  let tMin = Infinity;
  let tMax = -Infinity;
  let sMin = Infinity;
  let sMax = -Infinity;
  for (const p of outline) {
    const dx = p.x - c.x;
    const dy = p.y - c.y;
    const t = dx * ux + dy * uy;
    const s = dy * ux - dx * uy;
    if (t < tMin) tMin = t;
    if (t > tMax) tMax = t;
    if (s < sMin) sMin = s;
    if (s > sMax) sMax = s;
  }
  return {
    first: { x: c.x + tMin * ux, y: c.y + tMin * uy },
    second: { x: c.x + tMax * ux, y: c.y + tMax * uy },
    lengthPx: tMax - tMin,
    widthPx: sMax - sMin,
  };
}

// Positions along the AP axis, for overlays and landmark labels (x/EL 0 = anterior pole, 1 = posterior pole).
import type { ImagePoint } from '../../core/model';

/** Fraction along anterior→posterior of the foot of the perpendicular from p (x/EL, not clamped). */
export function axisFraction(anterior: ImagePoint, posterior: ImagePoint, p: ImagePoint): number {
  const dx = posterior.x - anterior.x;
  const dy = posterior.y - anterior.y;
  const len2 = dx * dx + dy * dy;
  if (len2 === 0) return 0;
  return ((p.x - anterior.x) * dx + (p.y - anterior.y) * dy) / len2;
}

/** The image point at fraction t (x/EL) along anterior→posterior. */
export function pointAtFraction(anterior: ImagePoint, posterior: ImagePoint, t: number): ImagePoint {
  return { x: anterior.x + t * (posterior.x - anterior.x), y: anterior.y + t * (posterior.y - anterior.y) };
}

/** Unit normal to the left of anterior→posterior in image coordinates (y down), or (0,0) for a zero-length axis. */
export function axisLeftNormal(anterior: ImagePoint, posterior: ImagePoint): ImagePoint {
  const dx = posterior.x - anterior.x;
  const dy = posterior.y - anterior.y;
  const len = Math.hypot(dx, dy);
  if (len === 0) return { x: 0, y: 0 };
  // "Left" as seen walking A→P on screen (y down): rotate the direction by −90°.
  return { x: dy / len, y: -dx / len };
}

/** Distance between two image points in pixels. */
export function distancePx(a: ImagePoint, b: ImagePoint): number {
  return Math.hypot(b.x - a.x, b.y - a.y);
}

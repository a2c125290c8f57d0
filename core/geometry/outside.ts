// How far a point lies outside a mask: used to warn when a pole of the AP axis was put off the embryo, since the
// egg length is the pole-to-pole distance and silently grows with it.
import type { ImagePoint, Mask } from '../model';

/** True when the pixel nearest `p` is inside the image and set in the mask. */
function setAt(mask: Mask, x: number, y: number): boolean {
  return x >= 0 && y >= 0 && x < mask.width && y < mask.height && mask.data[y * mask.width + x] !== 0;
}

/**
 * Distance (px) from `p` to the centre of the nearest mask pixel: 0 when the pixel nearest `p` is in the mask,
 * Infinity when no mask pixel lies within `maxPx`. Searches square rings outwards, so the cost grows with the
 * distance, not with the image.
 */
export function distanceOutsideMaskPx(mask: Mask, p: ImagePoint, maxPx: number): number {
  const cx = Math.round(p.x), cy = Math.round(p.y);
  if (setAt(mask, cx, cy)) return 0;
  let best = Infinity;
  const limit = Math.ceil(Math.max(0, maxPx)) + 1;
  for (let r = 1; r <= limit; r += 1) {
    // A pixel on ring r is at least r − 1 px from p (p lies within half a pixel of the centre).
    if (r - 1 > Math.min(best, maxPx)) break;
    for (let k = -r; k <= r; k += 1) {
      for (const [x, y] of [[cx + k, cy - r], [cx + k, cy + r], [cx - r, cy + k], [cx + r, cy + k]]) {
        if (setAt(mask, x, y)) best = Math.min(best, Math.hypot(x - p.x, y - p.y));
      }
    }
  }
  return best <= maxPx ? best : Infinity;
}

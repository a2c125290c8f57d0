// Background level of one channel for live measurement.
import type { Mask, Plane } from '../../core/model';
import { median } from '../../core/stats';
import type { BackgroundSettings } from '../../core/settings';

/** Background to subtract (image intensity units): median outside the mask, mean of a rectangle, or 0. */
export function backgroundLevel(plane: Plane, mask: Mask, settings: BackgroundSettings): number {
  if (settings.mode === 'none') return 0;
  if (settings.mode === 'region' && settings.regionPx !== null) {
    const { x, y, width, height } = settings.regionPx;
    let sum = 0, n = 0;
    for (let r = Math.max(0, y); r < Math.min(plane.height, y + height); r += 1) {
      for (let c = Math.max(0, x); c < Math.min(plane.width, x + width); c += 1) { sum += plane.data[r * plane.width + c]; n += 1; }
    }
    return n > 0 ? sum / n : 0;
  }
  // Outside: every k-th pixel is plenty for a median and keeps file switching fast on large images.
  const stride = Math.max(1, Math.floor(plane.data.length / 200_000));
  const values: number[] = [];
  for (let k = 0; k < plane.data.length; k += stride) if (mask.data[k] === 0) values.push(plane.data[k]);
  return values.length > 0 ? median(values) : 0;
}

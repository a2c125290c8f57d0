// Choose which pole is anterior from the gradient channel (the gradient is high at the anterior end).
import type { ImagePoint, Mask, Plane } from '../model';
import { estimateBackgroundLevel, foregroundBox } from '../image';

/** Mean background-subtracted intensity of `plane` over mask pixels in the first and last `fraction` of first→second. */
export function endMeans(plane: Plane, mask: Mask, first: ImagePoint, second: ImagePoint, fraction = 0.2): { first: number; second: number } {
  const dx = second.x - first.x;
  const dy = second.y - first.y;
  const len2 = dx * dx + dy * dy;
  const bg = estimateBackgroundLevel(plane.data).level;
  let s1 = 0; let n1 = 0; let s2 = 0; let n2 = 0;
  const { width, data } = mask;
  // Only the mask's bounding box holds mask pixels; rows in the same order as a full scan, so the sums agree.
  const box = foregroundBox(mask) ?? { x0: 0, y0: 0, x1: 0, y1: 0 };
  for (let y = box.y0; y < box.y1; y++) {
    const o = y * width;
    const along = (y - first.y) * dy;
    for (let x = box.x0; x < box.x1; x++) {
      const i = o + x;
      if (!data[i]) continue;
      const t = ((x - first.x) * dx + along) / len2;
      if (t <= fraction) { s1 += plane.data[i] - bg; n1++; } else if (t >= 1 - fraction) { s2 += plane.data[i] - bg; n2++; }
    }
  }
  return { first: n1 ? s1 / n1 : NaN, second: n2 ? s2 / n2 : NaN };
}

/**
 * Which end is anterior: 'high' (and 'auto') = the end with the higher gradient-channel mean in its last 20% EL,
 * 'low' = the other. Returns whether `first` is anterior, and a warning when the two ends differ by < 20%.
 */
export function chooseAnterior(means: { first: number; second: number }, mode: 'auto' | 'high' | 'low'): { firstIsAnterior: boolean; warning: string | null } {
  const firstHigher = means.first >= means.second;
  const hi = Math.max(means.first, means.second);
  const lo = Math.min(means.first, means.second);
  let warning: string | null = null;
  if (mode === 'auto' && !(hi > 0 && hi >= 1.2 * Math.max(lo, 0))) {
    warning = `anterior end is ambiguous: the gradient channel differs little between the two ends (${round(means.first)} vs ${round(means.second)}); check the axis`;
  }
  return { firstIsAnterior: mode === 'low' ? !firstHigher : firstHigher, warning };
}

function round(v: number): string {
  return Number.isFinite(v) ? v.toPrecision(3) : 'n/a';
}

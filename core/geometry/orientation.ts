// Choose which pole is anterior from the gradient channel (the gradient is high at the anterior end).
import type { ImagePoint, Mask, Plane } from '../model';
import { estimateBackgroundLevel, foregroundBox } from '../image';

/** Mean background-subtracted intensity of `plane` over mask pixels in the first and last `fraction` of first→second. */
export function endMeans(plane: Plane, mask: Mask, first: ImagePoint, second: ImagePoint, fraction = 0.2): { first: number; second: number } {
  const bg = estimateBackgroundLevel(plane.data).level;
  // Only the mask's bounding box holds mask pixels; rows in the same order as a full scan, so the sums agree.
  const box = foregroundBox(mask) ?? { x0: 0, y0: 0, x1: 0, y1: 0 };
  const sums = new Float64Array(4);
  endSums(plane.data, mask.data, mask.width, box.x0, box.y0, box.x1, box.y1, first.x, first.y, second.x, second.y, fraction, bg, sums);
  const [s1, n1, s2, n2] = sums;
  return { first: n1 ? s1 / n1 : NaN, second: n2 ? s2 / n2 : NaN };
}

/**
 * Sums and counts of values − bg over the mask pixels in [x0, x1) × [y0, y1) whose position t along (ax, ay)→(bx, by)
 * is ≤ fraction (first end) or ≥ 1 − fraction (second end), into out = [Σ first, n first, Σ second, n second]. A loop
 * of its own: see "Pixel loops in small functions" in DEVELOPERS.md.
 */
function endSums(
  values: Float32Array, mask: Uint8Array, width: number, x0: number, y0: number, x1: number, y1: number,
  ax: number, ay: number, bx: number, by: number, fraction: number, bg: number, out: Float64Array,
): void {
  const dx = bx - ax;
  const dy = by - ay;
  const len2 = dx * dx + dy * dy;
  let s1 = 0; let n1 = 0; let s2 = 0; let n2 = 0;
  for (let y = y0; y < y1; y++) {
    const o = y * width;
    const along = (y - ay) * dy;
    for (let x = x0; x < x1; x++) {
      const i = o + x;
      if (!mask[i]) continue;
      const t = ((x - ax) * dx + along) / len2;
      if (t <= fraction) { s1 += values[i] - bg; n1++; } else if (t >= 1 - fraction) { s2 += values[i] - bg; n2++; }
    }
  }
  out[0] = s1; out[1] = n1; out[2] = s2; out[3] = n2;
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

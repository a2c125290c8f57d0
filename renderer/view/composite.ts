// Turns float channels into display pixels: each channel scaled by its display range and tinted, merged additively.
import type { Plane } from '../../core/model';
import type { DisplayState } from '../state';
import { parseHexColour } from './colour';

/**
 * RGBA bytes (row-major, 4 per pixel, alpha 255) for the shown channels: value v maps linearly from [low, high]
 * to [0, 1] (clamped; NaN counts as 0), times the channel colour; merged channels add and clip at 255.
 */
export function compositeRgba(planes: readonly Plane[], display: DisplayState): Uint8ClampedArray<ArrayBuffer> {
  const first = planes[0];
  if (first === undefined) return new Uint8ClampedArray(0);
  const n = first.width * first.height;
  const acc = new Float32Array(n * 3);
  const shown = display.mode === 'single' ? [display.active] : planes.map((_, i) => i);
  for (const c of shown) {
    const plane = planes[c], d = display.channels[c];
    if (plane === undefined || d === undefined) continue;
    const [r, g, b] = parseHexColour(d.colour);
    const span = d.high > d.low ? d.high - d.low : 1;
    for (let k = 0; k < n; k += 1) {
      const v = plane.data[k];
      const f = v > d.low ? (v >= d.high ? 1 : (v - d.low) / span) : 0;
      acc[3 * k] += f * r; acc[3 * k + 1] += f * g; acc[3 * k + 2] += f * b;
    }
  }
  const out = new Uint8ClampedArray(n * 4);
  for (let k = 0; k < n; k += 1) {
    out[4 * k] = acc[3 * k]; out[4 * k + 1] = acc[3 * k + 1]; out[4 * k + 2] = acc[3 * k + 2]; out[4 * k + 3] = 255;
  }
  return out;
}

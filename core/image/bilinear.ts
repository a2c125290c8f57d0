// Bilinear sampling at sub-pixel positions (pixel centres at integer coordinates).
import type { Plane } from '../model';

/** Value at (x, y) by bilinear interpolation; `outside` when the point is beyond the outermost pixel centres. */
export function sampleBilinear(plane: Plane, x: number, y: number, outside = 0): number {
  const { width, height, data } = plane;
  if (!(x >= 0 && y >= 0 && x <= width - 1 && y <= height - 1)) return outside;
  const x0 = Math.min(Math.floor(x), width - 2 < 0 ? 0 : width - 2);
  const y0 = Math.min(Math.floor(y), height - 2 < 0 ? 0 : height - 2);
  const fx = x - x0;
  const fy = y - y0;
  const x1 = Math.min(x0 + 1, width - 1);
  const y1 = Math.min(y0 + 1, height - 1);
  const top = data[y0 * width + x0] * (1 - fx) + data[y0 * width + x1] * fx;
  const bottom = data[y1 * width + x0] * (1 - fx) + data[y1 * width + x1] * fx;
  return top * (1 - fy) + bottom * fy;
}

// Resamples an image along the AP axis into a horizontal strip (anterior at column 0).
import type { ApAxis, Plane } from '../../core/model';
import { axisLeftNormal } from '../geometry';

/** Bilinear value at image point (x, y) (pixel centres at integers); NaN outside the pixel centres' hull. */
export function bilinearAt(plane: Plane, x: number, y: number): number {
  const { width, height, data } = plane;
  if (!(x >= 0 && y >= 0 && x <= width - 1 && y <= height - 1)) return Number.NaN;
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

/**
 * Straighten `plane` along `axis`: column i samples x/EL = i/(samplesAlong−1) (both poles included); row j lies
 * (halfWidthPx − j)·rowStepPx px to the left of anterior→posterior, so row 0 is the left side. Returns a Float32 Plane of
 * samplesAlong × (2·halfWidthPx + 1); samples outside the image are NaN.
 */
export function straightenPlane(plane: Plane, axis: ApAxis, halfWidthPx: number, samplesAlong: number, rowStepPx = 1): Plane {
  if (!Number.isInteger(halfWidthPx) || halfWidthPx < 0) throw new Error('halfWidthPx must be a non-negative integer');
  if (!Number.isInteger(samplesAlong) || samplesAlong < 2) throw new Error('samplesAlong must be an integer of at least 2');
  const rows = 2 * halfWidthPx + 1;
  const out = new Float32Array(samplesAlong * rows);
  const n = axisLeftNormal(axis.anterior, axis.posterior);
  const dx = axis.posterior.x - axis.anterior.x;
  const dy = axis.posterior.y - axis.anterior.y;
  for (let i = 0; i < samplesAlong; i += 1) {
    const t = i / (samplesAlong - 1);
    const cx = axis.anterior.x + t * dx;
    const cy = axis.anterior.y + t * dy;
    for (let j = 0; j < rows; j += 1) {
      const off = (halfWidthPx - j) * rowStepPx;
      out[j * samplesAlong + i] = bilinearAt(plane, cx + off * n.x, cy + off * n.y);
    }
  }
  return { width: samplesAlong, height: rows, data: out };
}

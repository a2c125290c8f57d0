// Resamples an image along the AP axis into a horizontal strip (anterior at column 0).
import type { ApAxis, Plane } from '../../core/model';
import { sampleBilinear } from '../../core/image';
import { axisLeftNormal } from '../geometry';

/** Bilinear value at image point (x, y) (pixel centres at integers); NaN outside the pixel centres' hull. */
export function bilinearAt(plane: Plane, x: number, y: number): number {
  return sampleBilinear(plane, x, y, Number.NaN);
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
  const dx = (axis.posterior.x - axis.anterior.x) / (samplesAlong - 1);
  const dy = (axis.posterior.y - axis.anterior.y) / (samplesAlong - 1);
  const { width, height, data } = plane;
  // Inlined bilinear sampling (same rule as bilinearAt): this loop runs on every drag step of a large image.
  for (let j = 0; j < rows; j += 1) {
    const off = (halfWidthPx - j) * rowStepPx;
    let x = axis.anterior.x + off * n.x;
    let y = axis.anterior.y + off * n.y;
    for (let i = 0, k = j * samplesAlong; i < samplesAlong; i += 1, k += 1, x += dx, y += dy) {
      if (!(x >= 0 && y >= 0 && x <= width - 1 && y <= height - 1)) { out[k] = Number.NaN; continue; }
      const x0 = x < width - 1 ? Math.floor(x) : Math.max(0, width - 2);
      const y0 = y < height - 1 ? Math.floor(y) : Math.max(0, height - 2);
      const fx = x - x0, fy = y - y0;
      const r0 = y0 * width + x0;
      const r1 = Math.min(y0 + 1, height - 1) * width + x0;
      const x1 = x0 + 1 < width ? 1 : 0;
      const top = data[r0] + (data[r0 + x1] - data[r0]) * fx;
      const bottom = data[r1] + (data[r1 + x1] - data[r1]) * fx;
      out[k] = top + (bottom - top) * fy;
    }
  }
  return { width: samplesAlong, height: rows, data: out };
}

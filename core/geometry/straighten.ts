// Resample an image along its AP axis into a horizontal strip (anterior left): the straightened view of the window,
// the exported figures and the live re-measurement all use this one function.
import type { ApAxis, Plane } from '../model';
import { axisLeftNormal } from './axis-math';

/**
 * Straighten `plane` along `axis`: column i samples x/EL = i/(samplesAlong−1) (both poles included); row j lies
 * (halfWidthPx − j)·rowStepPx px to the left of anterior→posterior, so row 0 is the left side (dorsal when dorsalSide is
 * 'left'). Bilinear sampling with pixel centres at integers (the rule of core/image sampleBilinear); samples beyond the
 * outermost pixel centres are `outside` (NaN by default: no data there). Returns samplesAlong × (2·halfWidthPx + 1).
 */
export function straightenPlane(
  plane: Plane, axis: ApAxis, halfWidthPx: number, samplesAlong: number, rowStepPx = 1, outside = Number.NaN,
): Plane {
  if (!Number.isInteger(halfWidthPx) || halfWidthPx < 0) throw new Error(`halfWidthPx must be an integer ≥ 0, got ${halfWidthPx}`);
  if (!Number.isInteger(samplesAlong) || samplesAlong < 2) throw new Error(`samplesAlong must be an integer ≥ 2, got ${samplesAlong}`);
  const rows = 2 * halfWidthPx + 1;
  const out = new Float32Array(samplesAlong * rows);
  const n = axisLeftNormal(axis);
  const dx = (axis.posterior.x - axis.anterior.x) / (samplesAlong - 1);
  const dy = (axis.posterior.y - axis.anterior.y) / (samplesAlong - 1);
  const { width, height, data } = plane;
  // Bilinear sampling inlined: this loop runs on every drag step of a large image.
  for (let j = 0; j < rows; j += 1) {
    const off = (halfWidthPx - j) * rowStepPx;
    let x = axis.anterior.x + off * n.x;
    let y = axis.anterior.y + off * n.y;
    for (let i = 0, k = j * samplesAlong; i < samplesAlong; i += 1, k += 1, x += dx, y += dy) {
      if (!(x >= 0 && y >= 0 && x <= width - 1 && y <= height - 1)) { out[k] = outside; continue; }
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

// Resample an embryo along its AP axis into a horizontal strip (anterior left) for the straightened view.
import type { ApAxis, Plane } from '../model';
import { sampleBilinear } from '../image';
import { axisFrame } from './axis-math';

/**
 * Straightened strip of width samplesAlong and height 2·halfWidthPx + 1: column i is at x/EL = i / (samplesAlong − 1)
 * (both poles included), row j is (halfWidthPx − j) px to the LEFT of the A→P direction, so row 0 is the left side
 * (dorsal when dorsalSide is 'left'). Bilinear sampling; points outside the image are 0.
 */
export function straightenEmbryo(plane: Plane, axis: ApAxis, halfWidthPx: number, samplesAlong: number): Plane {
  if (!Number.isInteger(halfWidthPx) || halfWidthPx < 0) throw new Error(`halfWidthPx must be an integer ≥ 0, got ${halfWidthPx}`);
  if (!Number.isInteger(samplesAlong) || samplesAlong < 2) throw new Error(`samplesAlong must be an integer ≥ 2, got ${samplesAlong}`);
  const f = axisFrame(axis);
  const height = 2 * halfWidthPx + 1;
  const out = new Float32Array(samplesAlong * height);
  const step = f.lengthPx / (samplesAlong - 1);
  for (let j = 0; j < height; j++) {
    const off = halfWidthPx - j;
    for (let i = 0; i < samplesAlong; i++) {
      const x = axis.anterior.x + i * step * f.ux + off * f.nx;
      const y = axis.anterior.y + i * step * f.uy + off * f.ny;
      out[j * samplesAlong + i] = sampleBilinear(plane, x, y, 0);
    }
  }
  return { width: samplesAlong, height, data: out };
}

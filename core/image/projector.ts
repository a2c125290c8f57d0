// Streaming Z projection: planes are added one at a time so a whole stack is never held in memory.
import type { Plane, ProjectionMethod, RawPlane } from '../model';

/** Accumulates planes of one channel; result() returns the projection as a float plane (same units as the input). */
export interface Projector {
  /** Add one plane (any pixel type); its size must match the projector's. */
  add(plane: RawPlane | Plane): void;
  /** The projection so far; throws when no plane was added. */
  result(): Plane;
  /** Number of planes added. */
  readonly count: number;
}

/** Check projector options first so callers get exact messages. */
function checkProjectorOptions(widthPx: number, heightPx: number, method: string): void {
  if (!Number.isInteger(widthPx) || widthPx < 1 || !Number.isInteger(heightPx) || heightPx < 1) {
    throw new Error(`projector size must be positive integers, got ${widthPx}×${heightPx}`);
  }
  if (!['max', 'mean', 'sum', 'slice'].includes(method)) {
    throw new Error(`unknown projection method "${method}" (use max, mean, sum or slice)`);
  }
}

/**
 * Create a projector over Z for planes of widthPx × heightPx: 'max' = per-pixel maximum, 'mean' = average,
 * 'sum' = total, 'slice' = the last plane added (the caller adds only the chosen slice).
 */
export function createProjector(widthPx: number, heightPx: number, method: ProjectionMethod): Projector {
  checkProjectorOptions(widthPx, heightPx, method);
  const n = widthPx * heightPx;
  // Float64 accumulation keeps sums of many 16/32-bit planes exact.
  const acc = new Float64Array(n);
  if (method === 'max') acc.fill(-Infinity);
  let count = 0;
  return {
    get count() { return count; },
    add(plane) {
      if (plane.width !== widthPx || plane.height !== heightPx || plane.data.length !== n) {
        throw new Error(`plane is ${plane.width}×${plane.height} but the projection is ${widthPx}×${heightPx}`);
      }
      const d = plane.data;
      if (method === 'max') {
        for (let i = 0; i < n; i++) if (d[i] > acc[i]) acc[i] = d[i];
      } else if (method === 'slice') {
        for (let i = 0; i < n; i++) acc[i] = d[i];
      } else {
        for (let i = 0; i < n; i++) acc[i] += d[i];
      }
      count++;
    },
    result() {
      if (count === 0) throw new Error('no planes were added to the projection');
      const out = new Float32Array(n);
      const scale = method === 'mean' ? 1 / count : 1;
      for (let i = 0; i < n; i++) out[i] = acc[i] * scale;
      return { width: widthPx, height: heightPx, data: out };
    },
  };
}

// Conversion of decoded planes (any sample type) to the float planes every analysis step uses.
import type { Plane, RawPlane } from '../model';

/** Copy a decoded plane into a new Float32 plane (values unchanged, same size). */
export function toFloatPlane(raw: RawPlane | Plane): Plane {
  return { width: raw.width, height: raw.height, data: Float32Array.from(raw.data as ArrayLike<number>) };
}

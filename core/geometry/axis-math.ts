// Position of points relative to an AP axis: the one implementation of axis math for the core and the window.
// Image coordinates: x = column, y = row (y down), pixel centres at integers.
import type { ApAxis, ImagePoint } from '../model';

/** Where a point lies relative to the axis: along it (x/EL, px, µm) and across it (signed, left of A→P positive). */
export interface AxisPosition {
  /** Fraction of the anterior→posterior distance (0 = anterior pole, 1 = posterior; may fall outside 0..1). */
  readonly xEl: number;
  readonly xPx: number;
  /** µm from the anterior pole along the axis; NaN when the pixel size is unknown. */
  readonly xUm: number;
  /** Signed distance from the axis line, px; positive = left of the direction anterior→posterior (image, y down). */
  readonly offAxisPx: number;
  /** Same as offAxisPx in µm; NaN when the pixel size is unknown. */
  readonly offAxisUm: number;
}

/** Distance between two image points in pixels. */
export function distancePx(a: ImagePoint, b: ImagePoint): number {
  return Math.hypot(b.x - a.x, b.y - a.y);
}

/** Axis length in pixels (anterior to posterior). */
export function axisLengthPx(axis: ApAxis): number {
  return distancePx(axis.anterior, axis.posterior);
}

/** Unit normal to the left of anterior→posterior (image coordinates, y down); (0, 0) for a zero-length axis. */
export function axisLeftNormal(axis: ApAxis): ImagePoint {
  const lengthPx = axisLengthPx(axis);
  if (lengthPx === 0) return { x: 0, y: 0 };
  // With y pointing down, the left of a walker heading (ux, uy) is (uy, −ux): heading +x, left is up (−y).
  return { x: (axis.posterior.y - axis.anterior.y) / lengthPx, y: -((axis.posterior.x - axis.anterior.x) / lengthPx) };
}

/** Unit vector from anterior to posterior, and the unit normal pointing to the left of it (image coordinates). */
export function axisFrame(axis: ApAxis): { ux: number; uy: number; nx: number; ny: number; lengthPx: number } {
  const lengthPx = axisLengthPx(axis);
  if (!(lengthPx > 0)) throw new Error('the AP axis has zero length (anterior and posterior are the same point)');
  const ux = (axis.posterior.x - axis.anterior.x) / lengthPx;
  const uy = (axis.posterior.y - axis.anterior.y) / lengthPx;
  return { ux, uy, nx: uy, ny: -ux, lengthPx };
}

/** Project an image point onto the AP axis: x/EL, distance from the anterior pole and signed off-axis distance. */
export function projectPointOntoAxis(point: ImagePoint, axis: ApAxis, pixelSizeUm: number | null): AxisPosition {
  const f = axisFrame(axis);
  const dx = point.x - axis.anterior.x;
  const dy = point.y - axis.anterior.y;
  const xPx = dx * f.ux + dy * f.uy;
  const offAxisPx = dx * f.nx + dy * f.ny;
  const um = pixelSizeUm !== null && pixelSizeUm > 0 ? pixelSizeUm : NaN;
  return { xEl: xPx / f.lengthPx, xPx, xUm: xPx * um, offAxisPx, offAxisUm: offAxisPx * um };
}

/** x/EL of the foot of the perpendicular from `point` (not clamped); 0 for a zero-length axis, for a pointer readout
 *  while a handle is dragged onto the other. */
export function axisFraction(axis: ApAxis, point: ImagePoint): number {
  return axisLengthPx(axis) > 0 ? projectPointOntoAxis(point, axis, null).xEl : 0;
}

/** The image point at fraction xEl along the axis and offAxisPx to its left (the anterior pole for a zero-length axis). */
export function pointOnAxis(axis: ApAxis, xEl: number, offAxisPx = 0): ImagePoint {
  const n = axisLeftNormal(axis);
  return {
    x: axis.anterior.x + xEl * (axis.posterior.x - axis.anterior.x) + offAxisPx * n.x,
    y: axis.anterior.y + xEl * (axis.posterior.y - axis.anterior.y) + offAxisPx * n.y,
  };
}

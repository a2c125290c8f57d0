// Plane numbering in an OME DimensionOrder (OME-TIFF spec; ome.xsd Pixels@DimensionOrder).
import type { DimensionOrder } from '../model';

/** The six orders; after "XY" the letters run from fastest- to slowest-varying. */
export const DIMENSION_ORDERS: readonly DimensionOrder[] = ['XYZCT', 'XYZTC', 'XYCTZ', 'XYCZT', 'XYTCZ', 'XYTZC'];

/** Sizes of the three non-spatial dimensions. */
export interface PlaneCounts {
  readonly sizeZ: number;
  readonly sizeC: number;
  readonly sizeT: number;
}

/** True when `s` is one of the six OME dimension orders. */
export function isDimensionOrder(s: string): s is DimensionOrder {
  return (DIMENSION_ORDERS as readonly string[]).includes(s);
}

/** Linear plane number of (z, c, t) in file order: i_d0 + S_d0·(i_d1 + S_d1·i_d2). */
export function planeNumber(order: DimensionOrder, counts: PlaneCounts, z: number, c: number, t: number): number {
  const idx: Record<string, number> = { Z: z, C: c, T: t };
  const size: Record<string, number> = { Z: counts.sizeZ, C: counts.sizeC, T: counts.sizeT };
  const [d0, d1, d2] = [order[2], order[3], order[4]];
  return idx[d0] + size[d0] * (idx[d1] + size[d1] * idx[d2]);
}

/** Inverse of planeNumber: the (z, c, t) of plane number `n` in file order. */
export function planeCoordinates(order: DimensionOrder, counts: PlaneCounts, n: number): { z: number; c: number; t: number } {
  const size: Record<string, number> = { Z: counts.sizeZ, C: counts.sizeC, T: counts.sizeT };
  const out: Record<string, number> = { Z: 0, C: 0, T: 0 };
  let rest = n;
  for (const d of [order[2], order[3], order[4]]) {
    out[d] = rest % size[d];
    rest = Math.floor(rest / size[d]);
  }
  return { z: out.Z, c: out.C, t: out.T };
}

/** Index into StackInfo.planeIfd for (z, c, t): (t·sizeC + c)·sizeZ + z. */
export function planeSlot(counts: PlaneCounts, z: number, c: number, t: number): number {
  return (t * counts.sizeC + c) * counts.sizeZ + z;
}

// Binary morphology with a Euclidean disk, via the exact distance transform (cost independent of the radius).
import type { Mask } from '../model';
import { distanceInside, squaredDistanceToFeatures } from './distance';

/** Dilation by a disk of radius radiusPx: pixels whose centre lies within radiusPx of a foreground centre. */
export function dilate(mask: Mask, radiusPx: number): Mask {
  const sq = squaredDistanceToFeatures(mask);
  const r2 = radiusPx * radiusPx;
  const out = new Uint8Array(sq.length);
  for (let i = 0; i < sq.length; i++) out[i] = sq[i] <= r2 ? 1 : 0;
  return { width: mask.width, height: mask.height, data: out };
}

/** Erosion by a disk of radius radiusPx: foreground pixels farther than radiusPx from every background centre. */
export function erode(mask: Mask, radiusPx: number): Mask {
  const d = distanceInside(mask);
  const out = new Uint8Array(d.length);
  for (let i = 0; i < d.length; i++) out[i] = d[i] > radiusPx ? 1 : 0;
  return { width: mask.width, height: mask.height, data: out };
}

/** Opening (erode then dilate): removes protrusions thinner than 2·radiusPx. */
export function open(mask: Mask, radiusPx: number): Mask {
  return dilate(erode(mask, radiusPx), radiusPx);
}

/** Closing (dilate then erode): bridges gaps narrower than 2·radiusPx. */
export function close(mask: Mask, radiusPx: number): Mask {
  return erode(dilate(mask, radiusPx), radiusPx);
}

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

/**
 * Opening (erode then dilate): removes protrusions thinner than 2·radiusPx. A radius in [√2, 2) is exactly the 3×3
 * square (the 8 neighbours lie at 1 and √2), done with the O(N) square filters because it is the common case.
 */
export function open(mask: Mask, radiusPx: number): Mask {
  if (radiusPx >= Math.SQRT2 && radiusPx < 2) return squareDilate(squareErode(mask, 1), 1);
  return dilate(erode(mask, radiusPx), radiusPx);
}

/** Closing (dilate then erode): bridges gaps narrower than 2·radiusPx. */
export function close(mask: Mask, radiusPx: number): Mask {
  return erode(dilate(mask, radiusPx), radiusPx);
}

/**
 * 1 where a foreground pixel lies within r along x (pass 'x') or along y (pass 'y'), by a forward and a backward
 * scan remembering the last foreground position; rows are walked in memory order for both passes.
 */
function nearAlong(data: Uint8Array, width: number, height: number, r: number, pass: 'x' | 'y'): Uint8Array {
  const out = new Uint8Array(width * height);
  if (pass === 'x') {
    for (let y = 0; y < height; y++) {
      const o = y * width;
      let last = -Infinity;
      for (let x = 0; x < width; x++) { if (data[o + x]) last = x; if (x - last <= r) out[o + x] = 1; }
      last = Infinity;
      for (let x = width - 1; x >= 0; x--) { if (data[o + x]) last = x; if (last - x <= r) out[o + x] = 1; }
    }
    return out;
  }
  const last = new Float64Array(width).fill(-Infinity);
  for (let y = 0; y < height; y++) {
    const o = y * width;
    for (let x = 0; x < width; x++) { if (data[o + x]) last[x] = y; if (y - last[x] <= r) out[o + x] = 1; }
  }
  last.fill(Infinity);
  for (let y = height - 1; y >= 0; y--) {
    const o = y * width;
    for (let x = 0; x < width; x++) { if (data[o + x]) last[x] = y; if (last[x] - y <= r) out[o + x] = 1; }
  }
  return out;
}

/** Binary dilation by the (2r+1)² square (separable: along x, then along y); O(N) whatever r. */
function squareDilateData(data: Uint8Array, width: number, height: number, r: number): Uint8Array {
  return nearAlong(nearAlong(data, width, height, r, 'x'), width, height, r, 'y');
}

/** Dilation by a (2r+1)² square (r = round(radiusPx)); cheap for large radii where the shape does not matter. */
export function squareDilate(mask: Mask, radiusPx: number): Mask {
  const r = Math.max(0, Math.round(radiusPx));
  return { width: mask.width, height: mask.height, data: squareDilateData(mask.data, mask.width, mask.height, r) };
}

/** Erosion by a (2r+1)² square; pixels beyond the image border count as background. */
export function squareErode(mask: Mask, radiusPx: number): Mask {
  const { width, height } = mask;
  const r = Math.max(0, Math.round(radiusPx));
  const inv = new Uint8Array(width * height);
  for (let i = 0; i < inv.length; i++) inv[i] = mask.data[i] ? 0 : 1;
  const grown = squareDilateData(inv, width, height, r);
  const out = new Uint8Array(inv.length);
  for (let y = r; y < height - r; y++) {
    const o = y * width;
    for (let x = r; x < width - r; x++) out[o + x] = grown[o + x] ? 0 : 1;
  }
  return { width, height, data: out };
}

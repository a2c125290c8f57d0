// Binary morphology with a Euclidean disk, via the exact distance transform (cost independent of the radius).
import type { Mask } from '../model';
import { distanceInside, foregroundBox, withinSquaredDistance } from './distance';

/** Dilation by a disk of radius radiusPx: pixels whose centre lies within radiusPx of a foreground centre. */
export function dilate(mask: Mask, radiusPx: number): Mask {
  return { width: mask.width, height: mask.height, data: withinSquaredDistance(mask, radiusPx * radiusPx) };
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

/*
 * Square windows are separable. Dilation asks "is any pixel of the window foreground", erosion "are all of them
 * foreground and is the window inside the image". Both are a running count of foreground pixels along x and then
 * along y, kept at least `need` (1, or 2r + 1): integer arithmetic, exact, with no branch on pixel values. A window
 * clipped at the border holds fewer than 2r + 1 pixels, so need = 2r + 1 rejects it as the erosion must.
 */

/** 1 where the window [x − r, x + r] of the row (clipped to it) holds at least `need` nonzero pixels. */
function countAlongRows(src: Uint8Array, dst: Uint8Array, width: number, height: number, r: number, need: number): void {
  const addEnd = Math.max(0, width - r);
  const subStart = Math.min(width, r);
  for (let o = 0; o < width * height; o += width) {
    let count = 0;
    for (let x = 0; x < subStart; x++) count += +(src[o + x] !== 0);
    let x = 0;
    for (const e = Math.min(addEnd, subStart); x < e; x++) { count += +(src[o + x + r] !== 0); dst[o + x] = +(count >= need); }
    if (addEnd <= subStart) for (; x < subStart; x++) dst[o + x] = +(count >= need);
    else for (; x < addEnd; x++) { count += +(src[o + x + r] !== 0); dst[o + x] = +(count >= need); count -= +(src[o + x - r] !== 0); }
    for (; x < width; x++) { dst[o + x] = +(count >= need); count -= +(src[o + x - r] !== 0); }
  }
}

/**
 * 1 where the window [y − r, y + r] of the column (clipped to it) holds at least `need` ones (src holds 0/1); the
 * per-column counts are updated a whole row at a time, in memory order. Rows beyond the image are read from a row
 * of zeros, so one loop serves the edges and the interior.
 */
function countAlongColumns(src: Uint8Array, dst: Uint8Array, width: number, height: number, r: number, need: number): void {
  const counts = new Int32Array(width);
  const zeros = new Uint8Array(width);
  for (let y = 0; y < Math.min(height, r); y++) for (let x = 0; x < width; x++) counts[x] += src[y * width + x];
  for (let y = 0; y < height; y++) {
    const add = y + r < height ? src : zeros;
    const ao = y + r < height ? (y + r) * width : 0;
    const sub = y >= r ? src : zeros;
    const so = y >= r ? (y - r) * width : 0;
    slideCounts(counts, add, ao, sub, so, dst, y * width, need);
  }
}

/**
 * For every column x: c = counts[x] + add[ao + x]; dst[o + x] = c ≥ need; counts[x] = c − sub[so + x]. Unrolled by
 * four (independent columns; roughly halves the per-element loop overhead in V8).
 */
function slideCounts(counts: Int32Array, add: Uint8Array, ao: number, sub: Uint8Array, so: number, dst: Uint8Array, o: number, need: number): void {
  const width = counts.length;
  let x = 0;
  for (; x + 4 <= width; x += 4) {
    const c0 = counts[x] + add[ao + x];
    const c1 = counts[x + 1] + add[ao + x + 1];
    const c2 = counts[x + 2] + add[ao + x + 2];
    const c3 = counts[x + 3] + add[ao + x + 3];
    dst[o + x] = +(c0 >= need);
    dst[o + x + 1] = +(c1 >= need);
    dst[o + x + 2] = +(c2 >= need);
    dst[o + x + 3] = +(c3 >= need);
    counts[x] = c0 - sub[so + x];
    counts[x + 1] = c1 - sub[so + x + 1];
    counts[x + 2] = c2 - sub[so + x + 2];
    counts[x + 3] = c3 - sub[so + x + 3];
  }
  for (; x < width; x++) {
    const c = counts[x] + add[ao + x];
    dst[o + x] = +(c >= need);
    counts[x] = c - sub[so + x];
  }
}

/** Square-window dilation (need = 1) or erosion (need = 2r + 1, window inside the image) of the whole mask data. */
function squareWindowFull(data: Uint8Array, width: number, height: number, r: number, need: number): Uint8Array {
  const tmp = new Uint8Array(width * height);
  const out = new Uint8Array(width * height);
  countAlongRows(data, tmp, width, height, r, need);
  countAlongColumns(tmp, out, width, height, r, need);
  return out;
}

/**
 * Square-window dilation or erosion, computed only on the foreground's bounding box grown by r (clipped to the
 * image): every pixel outside it is 0 either way. Inside that crop the result is the same as on the whole image —
 * pixels cut off by the crop are background, so they add nothing to a count, and a foreground pixel's window
 * reaches past the crop only where the crop meets the image border.
 */
function squareWindow(mask: Mask, r: number, erosion: boolean): Mask {
  const { width, height } = mask;
  const box = foregroundBox(mask);
  if (box === null) return { width, height, data: new Uint8Array(width * height) };
  const x0 = Math.max(0, box.x0 - r);
  const y0 = Math.max(0, box.y0 - r);
  const cw = Math.min(width, box.x1 + r) - x0;
  const ch = Math.min(height, box.y1 + r) - y0;
  const need = erosion ? 2 * r + 1 : 1;
  if (cw === width && ch === height) return { width, height, data: squareWindowFull(mask.data, width, height, r, need) };
  const crop = new Uint8Array(cw * ch);
  for (let y = 0; y < ch; y++) crop.set(mask.data.subarray((y + y0) * width + x0, (y + y0) * width + x0 + cw), y * cw);
  const done = squareWindowFull(crop, cw, ch, r, need);
  const out = new Uint8Array(width * height);
  for (let y = 0; y < ch; y++) out.set(done.subarray(y * cw, (y + 1) * cw), (y + y0) * width + x0);
  return { width, height, data: out };
}

/** Dilation by a (2r+1)² square (r = round(radiusPx)); cheap for large radii where the shape does not matter. */
export function squareDilate(mask: Mask, radiusPx: number): Mask {
  return squareWindow(mask, Math.max(0, Math.round(radiusPx)), false);
}

/** Erosion by a (2r+1)² square; pixels beyond the image border count as background. */
export function squareErode(mask: Mask, radiusPx: number): Mask {
  return squareWindow(mask, Math.max(0, Math.round(radiusPx)), true);
}

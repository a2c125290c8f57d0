// Outlines of a binary mask by marching squares at the 0.5 level: vertices sit half-way between an inside and an
// outside pixel centre. Pixels beyond the image border count as outside, so every contour is closed.
import type { ImagePoint, Mask } from '../model';
import { foregroundBox } from '../image';

/** Corner offsets of a cell (top-left, top-right, bottom-right, bottom-left) and its edges as corner pairs. */
const CORNERS = [[0, 0], [1, 0], [1, 1], [0, 1]] as const;
const EDGES = [[0, 1], [1, 2], [2, 3], [3, 0]] as const;

/** One oriented segment of a contour, from (sx, sy) to (ex, ey). */
export interface Segment { sx: number; sy: number; ex: number; ey: number }

/** Segments of one cell, oriented so the inside corner is on the same side (cross product > 0). */
export function cellSegments(inside: readonly boolean[], x: number, y: number, out: Segment[]): void {
  const mid = (e: number): [number, number] => {
    const [i, j] = EDGES[e];
    return [x + (CORNERS[i][0] + CORNERS[j][0]) / 2, y + (CORNERS[i][1] + CORNERS[j][1]) / 2];
  };
  const crossing = [0, 1, 2, 3].filter((e) => inside[EDGES[e][0]] !== inside[EDGES[e][1]]);
  if (crossing.length === 0) return;
  let pairs: [number, number, number][];
  if (crossing.length === 2) {
    pairs = [[crossing[0], crossing[1], inside.indexOf(true)]];
  } else if (inside[0]) {
    pairs = [[3, 0, 0], [1, 2, 2]]; // saddle: keep the two inside corners apart
  } else {
    pairs = [[0, 1, 1], [2, 3, 3]];
  }
  for (const [e1, e2, k] of pairs) {
    let [sx, sy] = mid(e1);
    let [ex, ey] = mid(e2);
    const kx = x + CORNERS[k][0];
    const ky = y + CORNERS[k][1];
    if ((ex - sx) * (ky - sy) - (ey - sy) * (kx - sx) < 0) { [sx, sy, ex, ey] = [ex, ey, sx, sy]; }
    out.push({ sx, sy, ex, ey });
  }
}

/**
 * The segments of each of the 16 cells (index: top-left inside = 1, top-right = 2, bottom-right = 4, bottom-left = 8)
 * at x = y = 0, in the order cellSegments gives them; a cell at (x, y) has them moved by (x, y). Coordinates are
 * whole or half numbers, so moving them is exact and gives the very numbers cellSegments computes there.
 */
const CELL_SEGMENTS: readonly (readonly Segment[])[] = Array.from({ length: 16 }, (_, k) => {
  const out: Segment[] = [];
  cellSegments([(k & 1) !== 0, (k & 2) !== 0, (k & 4) !== 0, (k & 8) !== 0], 0, 0, out);
  return out;
});

/** All closed contours of the mask (each a list of vertices, last vertex not repeated), in discovery order. */
export function maskContours(mask: Mask): ImagePoint[][] {
  const { width, height, data } = mask;
  const segs: Segment[] = [];
  const box = foregroundBox(mask);
  if (box === null) return [];
  // Rows of the mask padded by one outside pixel on each side; cell (x, y) has corners in rows y and y + 1. Only
  // cells touching the foreground's bounding box can hold segments, so the scan stays inside it (same order).
  let top = new Uint8Array(width + 2);
  let bottom = new Uint8Array(width + 2);
  for (let y = box.y0 - 1; y < box.y1; y++) {
    bottom.fill(0);
    if (y + 1 < box.y1) for (let x = box.x0; x < box.x1; x++) bottom[x + 1] = data[(y + 1) * width + x] !== 0 ? 1 : 0;
    for (let x = box.x0 - 1; x < box.x1; x++) {
      const k = top[x + 1] | (top[x + 2] << 1) | (bottom[x + 2] << 2) | (bottom[x + 1] << 3);
      if (k === 0 || k === 15) continue;
      for (const c of CELL_SEGMENTS[k]) segs.push({ sx: x + c.sx, sy: y + c.sy, ex: x + c.ex, ey: y + c.ey });
    }
    [top, bottom] = [bottom, top];
  }
  const stride = 2 * height + 8;
  const key = (px: number, py: number): number => (2 * px + 4) * stride + (2 * py + 4);
  const byStart = new Map<number, number>();
  segs.forEach((s, i) => byStart.set(key(s.sx, s.sy), i));
  const used = new Uint8Array(segs.length);
  const contours: ImagePoint[][] = [];
  for (let i = 0; i < segs.length; i++) {
    if (used[i]) continue;
    const contour: ImagePoint[] = [];
    let j: number | undefined = i;
    while (j !== undefined && !used[j]) {
      used[j] = 1;
      contour.push({ x: segs[j].sx, y: segs[j].sy });
      j = byStart.get(key(segs[j].ex, segs[j].ey));
    }
    contours.push(contour);
  }
  return contours;
}

/** The outline of the mask: its longest contour (the outer boundary of the largest region); [] for an empty mask. */
export function maskOutline(mask: Mask): ImagePoint[] {
  let best: ImagePoint[] = [];
  for (const c of maskContours(mask)) if (c.length > best.length) best = c;
  return best;
}

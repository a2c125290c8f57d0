// Horizontal runs of a binary mask and the union–find root used to join them into regions.
import type { Mask } from '../model';

/** Runs of one kind of pixel: absolute start and end (exclusive) indices in raster order, and each row's first run
 * index (rowFirst[height] = run count). */
export interface MaskRuns { readonly start: Int32Array; readonly end: Int32Array; readonly rowFirst: Int32Array; readonly count: number }

/** Maximal horizontal stretches of foreground (nonzero) pixels when `foreground` is true, else of zeros, per row in
 * memory order. */
export function maskRuns(mask: Mask, foreground: boolean): MaskRuns {
  const { width, height, data } = mask;
  const cap = ((width + 1) >> 1) * height;
  const start = new Int32Array(cap);
  const end = new Int32Array(cap);
  const rowFirst = new Int32Array(height + 1);
  let count = 0;
  for (let y = 0; y < height; y++) {
    rowFirst[y] = count;
    const e = (y + 1) * width;
    let i = y * width;
    while (i < e) {
      while (i < e && (data[i] !== 0) !== foreground) i++;
      if (i === e) break;
      start[count] = i;
      while (i < e && (data[i] !== 0) === foreground) i++;
      end[count++] = i;
    }
  }
  rowFirst[height] = count;
  return { start, end, rowFirst, count };
}

/** Root of run a in a union–find forest, halving the path on the way. */
export function runRoot(parent: Int32Array, a: number): number {
  while (parent[a] !== a) { parent[a] = parent[parent[a]]; a = parent[a]; }
  return a;
}

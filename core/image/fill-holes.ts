// Hole filling: background not 4-connected to the image border becomes foreground.
import type { Mask } from '../model';

/*
 * Instead of flooding pixel by pixel, the background is cut into runs (maximal horizontal stretches of zeros per
 * row). Two runs in neighbouring rows are 4-connected exactly when their column ranges overlap, so a union–find over
 * runs gives the background's 4-connected regions; a region is outside when one of its runs touches the border.
 * Everything else — foreground and enclosed runs — becomes 1. The work is one scan of the pixels plus a little per
 * run, and the output is written with whole-run fills.
 */

/** Background runs of a mask: absolute start and end (exclusive) indices, in raster order, and each row's first run. */
interface Runs { readonly start: Int32Array; readonly end: Int32Array; readonly rowFirst: Int32Array; readonly count: number }

/** The background runs of each row, scanned in memory order. */
function backgroundRuns(mask: Mask): Runs {
  const { width, height, data } = mask;
  const cap = ((width + 1) >> 1) * height;
  const start = new Int32Array(cap);
  const end = new Int32Array(cap);
  const rowFirst = new Int32Array(height + 1);
  let count = 0;
  for (let y = 0; y < height; y++) {
    rowFirst[y] = count;
    const o = y * width;
    const e = o + width;
    let i = o;
    while (i < e) {
      while (i < e && data[i] !== 0) i++;
      if (i === e) break;
      start[count] = i;
      while (i < e && data[i] === 0) i++;
      end[count++] = i;
    }
  }
  rowFirst[height] = count;
  return { start, end, rowFirst, count };
}

/** Root of run a, halving the path on the way (union–find). */
function root(parent: Int32Array, a: number): number {
  while (parent[a] !== a) { parent[a] = parent[parent[a]]; a = parent[a]; }
  return a;
}

/** 1 for each run whose 4-connected background region touches the image border. */
function runsReachingBorder(runs: Runs, width: number, height: number): Uint8Array {
  const { start, end, rowFirst, count } = runs;
  const parent = new Int32Array(count);
  const border = new Uint8Array(count);
  for (let y = 0; y < height; y++) {
    const o = y * width;
    let p = y > 0 ? rowFirst[y - 1] : 0;
    const pEnd = y > 0 ? rowFirst[y] : 0;
    for (let k = rowFirst[y]; k < rowFirst[y + 1]; k++) {
      parent[k] = k;
      border[k] = +(y === 0 || y === height - 1 || start[k] === o || end[k] === o + width);
      // Runs of the row above whose column range overlaps [start, end) (absolute indices shifted by one row).
      while (p < pEnd && end[p] + width <= start[k]) p++;
      for (let q = p; q < pEnd && start[q] + width < end[k]; q++) {
        const a = root(parent, q);
        const b = root(parent, k);
        if (a !== b) { parent[b] = a; border[a] |= border[b]; }
      }
    }
  }
  const out = new Uint8Array(count);
  for (let k = 0; k < count; k++) out[k] = border[root(parent, k)];
  return out;
}

/** Copy of the mask with every enclosed background region (hole) set to 1. */
export function fillHoles(mask: Mask): Mask {
  const { width, height } = mask;
  const out = new Uint8Array(width * height).fill(1);
  const runs = backgroundRuns(mask);
  const outside = runsReachingBorder(runs, width, height);
  for (let k = 0; k < runs.count; k++) if (outside[k]) out.fill(0, runs.start[k], runs.end[k]);
  return { width, height, data: out };
}

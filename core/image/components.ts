// Connected components of a binary mask (8-connected), by union–find over foreground runs.
import type { Mask } from '../model';
import { maskRuns, runRoot as root } from './runs';

/*
 * The foreground is cut into runs (maximal horizontal stretches of nonzero pixels per row). Two runs in neighbouring
 * rows are 8-connected exactly when their column ranges overlap or touch diagonally, so a union–find over runs gives
 * the regions with one scan of the pixels. Labels are numbered by the raster position of each region's first pixel
 * (the order a raster-order flood fill finds them), so labels and sizes do not depend on the method.
 */

/** Foreground runs: absolute start and end (exclusive) indices in raster order, each run's region label (1-based). */
interface LabelledRuns { readonly start: Int32Array; readonly end: Int32Array; readonly label: Int32Array; readonly runs: number; readonly count: number; readonly sizes: number[] }

/** Runs joined into 8-connected regions, labelled 1..count in raster order of their first pixel. */
function labelRuns(mask: Mask): LabelledRuns {
  const { width, height } = mask;
  const { start, end, rowFirst } = maskRuns(mask, true);
  const runs = rowFirst[height];
  const parent = new Int32Array(runs);
  for (let y = 0; y < height; y++) {
    let p = y > 0 ? rowFirst[y - 1] : 0;
    const pEnd = y > 0 ? rowFirst[y] : 0;
    for (let k = rowFirst[y]; k < rowFirst[y + 1]; k++) {
      parent[k] = k;
      // Runs above overlapping [start − 1, end + 1) in columns (absolute indices are one row, `width`, apart).
      while (p < pEnd && end[p] + width < start[k]) p++;
      for (let q = p; q < pEnd && start[q] + width <= end[k]; q++) {
        const a = root(parent, q);
        const b = root(parent, k);
        // Keep the earlier run as root, so a region's root is its first run in raster order.
        if (a < b) parent[b] = a;
        else if (b < a) parent[a] = b;
      }
    }
  }
  const label = new Int32Array(runs);
  const sizes: number[] = [0];
  for (let k = 0; k < runs; k++) {
    const r = root(parent, k);
    if (r === k) { label[k] = sizes.length; sizes.push(0); } else label[k] = label[r];
    sizes[label[k]] += end[k] - start[k];
  }
  return { start, end, label, runs, count: sizes.length - 1, sizes };
}

/** Label 8-connected foreground regions: labels[i] = 1..count for foreground pixels, 0 for background. */
export function labelComponents(mask: Mask): { labels: Int32Array; count: number; sizes: number[] } {
  const { start, end, label, runs, count, sizes } = labelRuns(mask);
  const labels = new Int32Array(mask.width * mask.height);
  for (let k = 0; k < runs; k++) labels.fill(label[k], start[k], end[k]);
  return { labels, count, sizes };
}

/** The largest 8-connected foreground region as a new mask (all zero when the mask is empty; ties: first found). */
export function largestComponent(mask: Mask): Mask {
  const { start, end, label, runs, count, sizes } = labelRuns(mask);
  const out = new Uint8Array(mask.data.length);
  if (count === 0) return { width: mask.width, height: mask.height, data: out };
  let best = 1;
  for (let l = 2; l <= count; l++) if (sizes[l] > sizes[best]) best = l;
  for (let k = 0; k < runs; k++) if (label[k] === best) out.fill(1, start[k], end[k]);
  return { width: mask.width, height: mask.height, data: out };
}

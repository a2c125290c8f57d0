// Hole filling: background not 4-connected to the image border becomes foreground.
import type { Mask } from '../model';
import { maskRuns, runRoot as root } from './runs';
import type { MaskRuns as Runs } from './runs';

/*
 * Instead of flooding pixel by pixel, the background is cut into runs (maximal horizontal stretches of zeros per
 * row). Two runs in neighbouring rows are 4-connected exactly when their column ranges overlap, so a union–find over
 * runs gives the background's 4-connected regions; a region is outside when one of its runs touches the border.
 * Everything else — foreground and enclosed runs — becomes 1. The work is one scan of the pixels plus a little per
 * run, and the output is written with whole-run fills.
 */

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
  const runs = maskRuns(mask, false);
  const outside = runsReachingBorder(runs, width, height);
  for (let k = 0; k < runs.count; k++) if (outside[k]) out.fill(0, runs.start[k], runs.end[k]);
  return { width, height, data: out };
}

// Connected components of a binary mask (8-connected), by breadth-first labelling.
import type { Mask } from '../model';

/** Label 8-connected foreground regions: labels[i] = 1..count for foreground pixels, 0 for background. */
export function labelComponents(mask: Mask): { labels: Int32Array; count: number; sizes: number[] } {
  const { width, height, data } = mask;
  const labels = new Int32Array(width * height);
  const queue = new Int32Array(width * height);
  const sizes: number[] = [0];
  let count = 0;
  for (let start = 0; start < data.length; start++) {
    if (!data[start] || labels[start]) continue;
    count++;
    let head = 0;
    let tail = 0;
    queue[tail++] = start;
    labels[start] = count;
    while (head < tail) {
      const p = queue[head++];
      const px = p % width;
      const py = (p - px) / width;
      for (let dy = -1; dy <= 1; dy++) {
        const y = py + dy;
        if (y < 0 || y >= height) continue;
        for (let dx = -1; dx <= 1; dx++) {
          const x = px + dx;
          if (x < 0 || x >= width) continue;
          const q = y * width + x;
          if (data[q] && !labels[q]) { labels[q] = count; queue[tail++] = q; }
        }
      }
    }
    sizes.push(tail);
  }
  return { labels, count, sizes };
}

/** The largest 8-connected foreground region as a new mask (all zero when the mask is empty; ties: first found). */
export function largestComponent(mask: Mask): Mask {
  const { labels, count, sizes } = labelComponents(mask);
  const out = new Uint8Array(mask.data.length);
  if (count === 0) return { width: mask.width, height: mask.height, data: out };
  let best = 1;
  for (let l = 2; l <= count; l++) if (sizes[l] > sizes[best]) best = l;
  for (let i = 0; i < out.length; i++) out[i] = labels[i] === best ? 1 : 0;
  return { width: mask.width, height: mask.height, data: out };
}

// Hole filling: background not 4-connected to the image border becomes foreground.
import type { Mask } from '../model';

/** Copy of the mask with every enclosed background region (hole) set to 1. */
export function fillHoles(mask: Mask): Mask {
  const { width, height, data } = mask;
  const outside = new Uint8Array(width * height);
  const queue = new Int32Array(width * height);
  let tail = 0;
  const seed = (i: number): void => {
    if (!data[i] && !outside[i]) { outside[i] = 1; queue[tail++] = i; }
  };
  for (let x = 0; x < width; x++) { seed(x); seed((height - 1) * width + x); }
  for (let y = 0; y < height; y++) { seed(y * width); seed(y * width + width - 1); }
  for (let head = 0; head < tail; head++) {
    const p = queue[head];
    const x = p % width;
    if (x > 0) seed(p - 1);
    if (x < width - 1) seed(p + 1);
    if (p >= width) seed(p - width);
    if (p < (height - 1) * width) seed(p + width);
  }
  const out = new Uint8Array(width * height);
  for (let i = 0; i < out.length; i++) out[i] = outside[i] ? 0 : 1;
  return { width, height, data: out };
}

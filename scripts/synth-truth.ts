// For the experiment scripts: a synthetic embryo's detection taken from the generator's own truth instead of the image.
import { maskOutline, type EmbryoDetection } from '../core/geometry';
import type { SyntheticEmbryo } from '../core/synth';

/** The generator's own embryo outline: the ellipse of its egg length and width, with its poles as the axis. */
export function trueDetection(e: SyntheticEmbryo): EmbryoDetection {
  const { sizeX: w, sizeY: h } = e.stack;
  const t = e.truth;
  const a = t.eggLengthUm / 2 / e.pixelSizeUm, b = t.eggWidthUm / 2 / e.pixelSizeUm;
  const c = Math.cos((t.angleDeg * Math.PI) / 180), s = Math.sin((t.angleDeg * Math.PI) / 180);
  const data = new Uint8Array(w * h);
  for (let y = 0; y < h; y++) for (let x = 0; x < w; x++) {
    const dx = x - t.centre.x, dy = y - t.centre.y;
    const u = dx * c + dy * s, v = -dx * s + dy * c;
    data[y * w + x] = +((u / a) ** 2 + (v / b) ** 2 <= 1);
  }
  const mask = { width: w, height: h, data };
  return { mask, outline: maskOutline(mask), axis: { anterior: t.anterior, posterior: t.posterior, source: 'auto' }, eggLengthUm: t.eggLengthUm, eggWidthUm: t.eggWidthUm,
    eggLengthPx: 2 * a, eggWidthPx: 2 * b, warnings: [] };
}

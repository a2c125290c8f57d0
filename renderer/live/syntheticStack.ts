// Synthetic embryo stacks for tests, the micro-benchmark and the browser harness (demo data, invented).
import type { LoadedStack } from '../../core/contract';
import type { ImagePoint } from '../../core/model';
import { createRng } from '../../core/stats';

/** Parameters of a synthetic elliptical embryo lying along x, anterior at the left. */
export interface SyntheticEmbryo {
  readonly widthPx: number;
  readonly heightPx: number;
  readonly pixelSizeUm: number;
  /** Semi-axes of the ellipse, px. */
  readonly semiMajorPx: number;
  readonly semiMinorPx: number;
  readonly amplitude: number;
  readonly lambdaUm: number;
  readonly offset: number;
  /** Boundary of the second channel (x/EL) where it steps from high (anterior) to low. */
  readonly boundaryEl: number;
  readonly backgroundLevel: number;
  readonly noiseSd: number;
  readonly seed: number;
}

/** A stack with two channels (gradient, boundary), its mask, outline and axis, built from known parameters. */
export function syntheticStack(p: SyntheticEmbryo): LoadedStack {
  const rng = createRng(p.seed);
  const { widthPx: w, heightPx: h } = p;
  const cx = (w - 1) / 2, cy = (h - 1) / 2;
  const grad = new Float32Array(w * h), bnd = new Float32Array(w * h), mask = new Uint8Array(w * h);
  const eggUm = 2 * p.semiMajorPx * p.pixelSizeUm;
  for (let y = 0; y < h; y += 1) {
    for (let x = 0; x < w; x += 1) {
      const k = y * w + x;
      const inside = ((x - cx) / p.semiMajorPx) ** 2 + ((y - cy) / p.semiMinorPx) ** 2 <= 1;
      const xUm = (x - (cx - p.semiMajorPx)) * p.pixelSizeUm;
      mask[k] = inside ? 1 : 0;
      const g = inside ? p.amplitude * Math.exp(-xUm / p.lambdaUm) + p.offset : 0;
      const b = inside ? p.amplitude / (1 + Math.exp((xUm / eggUm - p.boundaryEl) / 0.02)) + p.offset : 0;
      grad[k] = g + p.backgroundLevel + p.noiseSd * rng.normal();
      bnd[k] = b + p.backgroundLevel + p.noiseSd * rng.normal();
    }
  }
  const outline: ImagePoint[] = Array.from({ length: 96 }, (_, i) => {
    const t = (2 * Math.PI * i) / 96;
    return { x: cx + p.semiMajorPx * Math.cos(t), y: cy + p.semiMinorPx * Math.sin(t) };
  });
  const axis = { anterior: { x: cx - p.semiMajorPx, y: cy }, posterior: { x: cx + p.semiMajorPx, y: cy }, source: 'auto' as const };
  return {
    path: '/demo/synthetic.tif',
    info: {
      byteOrder: 'II', bigTiff: false, isOme: true, sizeX: w, sizeY: h, sizeZ: 1, sizeC: 2, sizeT: 1, dimensionOrder: 'XYZCT',
      sampleType: 'float32', samplesPerPixel: 1, channelNames: ['gradient', 'boundary'],
      pixelSize: { xUm: p.pixelSizeUm, yUm: p.pixelSizeUm, zUm: null, source: 'ome' }, compression: 'none',
      planeIfd: Int32Array.from([0, 1]), ifdCount: 2, description: null, warnings: [],
    },
    projected: {
      channels: [{ width: w, height: h, data: grad }, { width: w, height: h, data: bnd }], channelNames: ['gradient', 'boundary'],
      pixelSizeUm: p.pixelSizeUm, pixelSizeSource: 'ome', projection: 'max', sliceIndex: null, warnings: [],
    },
    detection: {
      mask: { width: w, height: h, data: mask }, outline, axis,
      eggLengthUm: eggUm, eggWidthUm: 2 * p.semiMinorPx * p.pixelSizeUm, warnings: [],
    },
  };
}

/** A small default embryo (demo data): 200×100 px, 2.5 µm/px, egg length 450 µm, λ = 90 µm. */
export const SMALL_EMBRYO: SyntheticEmbryo = {
  widthPx: 200, heightPx: 100, pixelSizeUm: 2.5, semiMajorPx: 90, semiMinorPx: 36,
  amplitude: 1000, lambdaUm: 90, offset: 40, boundaryEl: 0.45, backgroundLevel: 100, noiseSd: 5, seed: 11,
};

// Seeded synthetic embryo stack (demo data): an ellipsoidal embryo with a nuclear layer, an exponential gradient
// channel and a boundary channel, imaged as a small Z stack with defocus blur, camera offset, shot and read noise.
import type { ImagePoint, Plane } from '../model';
import { boxWidthsForSigma, fastGaussianSmooth } from '../image';
import { createRng } from '../stats';
import type { Rng } from '../stats';
import { ellipseDepth } from './ellipse-distance';
import { pixelTable } from './camera-table';
import type { PixelTable } from './camera-table';
import { checkSynthParams, DEFAULT_SYNTH_PARAMS } from './params';
import type { SyntheticEmbryoParams } from './params';

/** The known answers a synthetic embryo was built from (image coordinates in px, x/EL from the anterior pole). */
export interface SyntheticTruth {
  readonly anterior: ImagePoint;
  readonly posterior: ImagePoint;
  readonly centre: ImagePoint;
  readonly angleDeg: number;
  readonly eggLengthUm: number;
  readonly eggWidthUm: number;
  readonly lambdaUm: number;
  /** Where the boundary channel switches off (gradient = threshold), x/EL; NaN when the gradient never reaches it. */
  readonly boundaryEl: number;
  /** Furrow landmark on the outline, left of A→P, at x/EL furrowEl (same threshold rule). */
  readonly furrowPoint: ImagePoint;
  readonly furrowEl: number;
}

/** A synthetic stack: uint16 planes in XYZCT order (plane index = c·sizeZ + z), plus calibration and truth. */
export interface SyntheticEmbryo {
  readonly stack: { readonly sizeX: number; readonly sizeY: number; readonly sizeZ: number; readonly sizeC: number; readonly planes: Uint16Array[] };
  readonly pixelSizeUm: number;
  readonly channelNames: readonly string[];
  readonly params: SyntheticEmbryoParams;
  readonly truth: SyntheticTruth;
}

/** Relative gradient level at xAp µm from the anterior pole: exp(−x/λ), or the sampled shape when given. */
export function gradientShapeAt(p: SyntheticEmbryoParams, xAp: number): number {
  const shape = p.gradientShape;
  if (!shape) return Math.exp(-xAp / p.lambdaUm);
  const u = Math.max(0, xAp / shape.stepUm);
  const i = Math.floor(u);
  if (i >= shape.values.length - 1) return shape.values[shape.values.length - 1];
  return shape.values[i] + (u - i) * (shape.values[i + 1] - shape.values[i]);
}

/** µm from the anterior pole where the gradient first falls to `level` (x = λ·ln(ampl/level) for the exponential). */
function thresholdUm(p: SyntheticEmbryoParams, level: number): number {
  const ampl = p.gradientAmplitude * p.dosage;
  if (!(level > 0)) return NaN;
  if (!p.gradientShape) return ampl > level ? p.lambdaUm * Math.log(ampl / level) : NaN;
  const { stepUm, values } = p.gradientShape;
  if (!(ampl * values[0] > level)) return NaN;
  for (let i = 1; i < values.length; i++) {
    const a = ampl * values[i - 1], b = ampl * values[i];
    if (b <= level) return (i - 1 + (a - level) / (a - b)) * stepUm;
  }
  return NaN;
}

/** x/EL where the gradient of amplitude ampl decays to level. */
function thresholdEl(p: SyntheticEmbryoParams, level: number): number {
  return thresholdUm(p, level) / p.eggLengthUm;
}

/** Random or given placement that keeps the rotated ellipse (plus a margin) inside the frame. */
function placement(p: SyntheticEmbryoParams, rng: Rng): { centre: ImagePoint; angleDeg: number } {
  const angleDeg = p.angleDeg ?? rng.uniform() * 360;
  if (p.centre) return { centre: p.centre, angleDeg };
  const th = (angleDeg * Math.PI) / 180;
  const a = p.eggLengthUm / 2 / p.pixelSizeUm;
  const b = p.eggWidthUm / 2 / p.pixelSizeUm;
  const hx = Math.hypot(a * Math.cos(th), b * Math.sin(th)) + 12;
  const hy = Math.hypot(a * Math.sin(th), b * Math.cos(th)) + 12;
  const pick = (size: number, h: number): number => (size - 1 - 2 * h > 0 ? h + rng.uniform() * (size - 1 - 2 * h) : (size - 1) / 2);
  return { centre: { x: pick(p.widthPx, hx), y: pick(p.heightPx, hy) }, angleDeg };
}

/** The centre (px) and A→P angle (degrees) an embryo made from these params and seed gets. */
export function syntheticPlacement(params: Partial<SyntheticEmbryoParams>, seed: number): { centre: ImagePoint; angleDeg: number } {
  const p: SyntheticEmbryoParams = { ...DEFAULT_SYNTH_PARAMS, ...params };
  checkSynthParams(p);
  return placement(p, createRng(seed));
}

/** Build the truth record from the placement. */
function makeTruth(p: SyntheticEmbryoParams, centre: ImagePoint, angleDeg: number): SyntheticTruth {
  const th = (angleDeg * Math.PI) / 180;
  const ux = Math.cos(th);
  const uy = Math.sin(th);
  const a = p.eggLengthUm / 2 / p.pixelSizeUm;
  const b = p.eggWidthUm / 2 / p.pixelSizeUm;
  const furrowEl = thresholdEl(p, p.furrowThreshold);
  const fx = -a + (Number.isFinite(furrowEl) ? furrowEl : 0.5) * 2 * a;
  const fy = b * Math.sqrt(Math.max(0, 1 - (fx / a) ** 2));
  // Left of the A→P heading (ux, uy) in image coordinates is (uy, −ux).
  return {
    anterior: { x: centre.x - a * ux, y: centre.y - a * uy },
    posterior: { x: centre.x + a * ux, y: centre.y + a * uy },
    centre, angleDeg, eggLengthUm: p.eggLengthUm, eggWidthUm: p.eggWidthUm, lambdaUm: p.lambdaUm,
    boundaryEl: thresholdEl(p, p.boundaryThreshold),
    furrowPoint: { x: centre.x + fx * ux + fy * uy, y: centre.y + fx * uy - fy * ux },
    furrowEl,
  };
}

/** Pixel rectangle [x0, x1) × [y0, y1) of an image. */
interface Box { readonly x0: number; readonly y0: number; readonly x1: number; readonly y1: number }

/**
 * Pixels that can receive signal in a section whose ellipse has semi-axes aUm × bUm: the rotated ellipse grown by
 * the 2 px partial-cover rim, plus marginPx, clipped to the image.
 */
function sectionBox(p: SyntheticEmbryoParams, t: SyntheticTruth, aUm: number, bUm: number, marginPx: number): Box {
  const th = (t.angleDeg * Math.PI) / 180;
  const a = aUm / p.pixelSizeUm + 2;
  const b = bUm / p.pixelSizeUm + 2;
  const hx = Math.hypot(a * Math.cos(th), b * Math.sin(th)) + marginPx;
  const hy = Math.hypot(a * Math.sin(th), b * Math.cos(th)) + marginPx;
  const clip = (v: number, n: number): number => Math.min(n, Math.max(0, v));
  return {
    x0: clip(Math.floor(t.centre.x - hx), p.widthPx), x1: clip(Math.ceil(t.centre.x + hx) + 1, p.widthPx),
    y0: clip(Math.floor(t.centre.y - hy), p.heightPx), y1: clip(Math.ceil(t.centre.y + hy) + 1, p.heightPx),
  };
}

/** Per-pixel terms that do not change with z: position in the embryo frame (µm) and the channels' AP patterns. */
interface Frame {
  readonly X: Float32Array;
  readonly Y: Float32Array;
  /** Gradient-channel signal of the layer: (B + A·f·exp(−x/λ)) × nuclei texture. */
  readonly gradient: Float32Array;
  /** Boundary-channel signal of the layer: amplitude × logistic on/off × nuclei texture. */
  readonly boundary: Float32Array;
}

/** Compute the z-independent terms once per embryo, inside `box` only (no section reaches beyond it). */
function embryoFrame(p: SyntheticEmbryoParams, t: SyntheticTruth, box: Box): Frame {
  const { widthPx: w, heightPx: h, pixelSizeUm: px } = p;
  const th = (t.angleDeg * Math.PI) / 180;
  const ux = Math.cos(th);
  const uy = Math.sin(th);
  const n = w * h;
  const f = { X: new Float32Array(n), Y: new Float32Array(n), gradient: new Float32Array(n), boundary: new Float32Array(n) };
  const ampl = p.gradientAmplitude * p.dosage;
  const period = 7; // µm between nuclei of the texture
  const widthUm = p.boundaryWidthUm > 0 ? p.boundaryWidthUm : 1e-6;
  // A sampled shape that never reaches the threshold leaves the boundary channel off.
  const xbShape = p.gradientShape ? thresholdUm(p, p.boundaryThreshold) : NaN;
  const xb = !p.gradientShape ? p.lambdaUm * Math.log(ampl / p.boundaryThreshold) : Number.isFinite(xbShape) ? xbShape : -Infinity;
  // The gradient's parameters right of A→P (Y < 0): a decay length of their own when rightLambdaUm is set.
  const right = p.rightLambdaUm ? { ...p, lambdaUm: p.rightLambdaUm } : p;
  for (let y = box.y0; y < box.y1; y++) {
    const dy = (y - t.centre.y) * px;
    for (let x = box.x0; x < box.x1; x++) {
      const i = y * w + x;
      const dx = (x - t.centre.x) * px;
      const X = dx * ux + dy * uy; // µm along A→P from the centre
      const Y = dx * uy - dy * ux; // µm to the left of A→P
      const xAp = X + p.eggLengthUm / 2;
      const tex = 1 - p.nucleiContrast * 0.5 * (1 - Math.cos((2 * Math.PI * X) / period) * Math.cos((2 * Math.PI * Y) / period));
      f.X[i] = X;
      f.Y[i] = Y;
      f.gradient[i] = (p.gradientBaseline + ampl * gradientShapeAt(Y < 0 ? right : p, xAp)) * tex;
      f.boundary[i] = (p.boundaryAmplitude * tex) / (1 + Math.exp((xAp - xb) / widthUm));
    }
  }
  return f;
}

/** Noise-free signal (photons) of both channels in the Z section at height zUm from the mid-section, and the box
 * outside which both are zero. */
function sectionSignal(p: SyntheticEmbryoParams, t: SyntheticTruth, f: Frame, zUm: number): { planes: [Plane, Plane]; box: Box } {
  const { widthPx: w, heightPx: h, pixelSizeUm: px } = p;
  const s = Math.sqrt(Math.max(0, 1 - (zUm / (p.eggWidthUm / 2)) ** 2));
  const ia = 1 / ((p.eggLengthUm / 2) * s);
  const ib = 1 / ((p.eggWidthUm / 2) * s);
  const g = new Float32Array(w * h);
  const e = new Float32Array(w * h);
  const box = sectionBox(p, t, (p.eggLengthUm / 2) * s, (p.eggWidthUm / 2) * s, 1);
  const layerAt = (depthUm: number): number => p.interiorLevel + (1 - p.interiorLevel) / (1 + Math.exp((depthUm - p.nuclearLayerUm) / 2));
  const deepLayer = layerAt(40);
  for (let y = box.y0; y < box.y1; y++) {
    for (let i = y * w + box.x0; i < y * w + box.x1; i++) {
      const qx = f.X[i] * ia;
      const qy = f.Y[i] * ib;
      const r = Math.sqrt(qx * qx + qy * qy);
      if (r > 1 + 2 * px * ia) continue;
      // Deep inside, only "deeper than the layer" matters, so the exact distance is computed near the surface only.
      const deep = r < 1 - 40 * ib;
      const depthUm = deep ? 40 : ellipseDepth(f.X[i], f.Y[i], 1 / ia, 1 / ib);
      const cover = Math.min(1, Math.max(0, 0.5 + depthUm / px));
      if (cover === 0) continue;
      const layer = deep ? deepLayer : layerAt(depthUm);
      g[i] = cover * (p.autofluorescence + f.gradient[i] * layer);
      e[i] = cover * (p.autofluorescence + f.boundary[i] * layer);
    }
  }
  return { planes: [{ width: w, height: h, data: g }, { width: w, height: h, data: e }], box };
}

/**
 * Defocus blur of a plane that is zero outside `box`: only the box grown by the blur's reach is smoothed (the rest
 * stays zero), which equals blurring the whole frame.
 */
function blurInBox(plane: Plane, blurPx: number, box: Box): Float32Array {
  const reach = boxWidthsForSigma(blurPx).reduce((s, wd) => s + (wd - 1) / 2, 0) + 1;
  const x0 = Math.max(0, box.x0 - reach);
  const y0 = Math.max(0, box.y0 - reach);
  const cw = Math.min(plane.width, box.x1 + reach) - x0;
  const ch = Math.min(plane.height, box.y1 + reach) - y0;
  const out = new Float32Array(plane.width * plane.height);
  if (cw <= 0 || ch <= 0) return out;
  const crop = new Float32Array(cw * ch);
  for (let y = 0; y < ch; y++) crop.set(plane.data.subarray((y0 + y) * plane.width + x0, (y0 + y) * plane.width + x0 + cw), y * cw);
  const blurred = fastGaussianSmooth({ width: cw, height: ch, data: crop }, blurPx).data;
  for (let y = 0; y < ch; y++) out.set(blurred.subarray(y * cw, (y + 1) * cw), (y0 + y) * plane.width + x0);
  return out;
}

/**
 * Blur for defocus, then camera: offset + Poisson(photons + background) + Gaussian read noise, rounded to uint16.
 * Poisson(photons + background) = Poisson(background) + Poisson(photons) for independent draws, so the
 * scene-independent part comes from the exact table `base` (one uniform) and only lit pixels draw a Poisson.
 */
function camera(plane: Plane, box: Box, blurPx: number, rng: Rng, base: PixelTable): Uint16Array {
  const blurred = blurInBox(plane, blurPx, box);
  const out = new Uint16Array(blurred.length);
  const { cdf, guide, first } = base;
  const slots = guide.length;
  // The table draws use their own mulberry32 stream seeded from rng, written inline because it runs per pixel.
  let state = Math.floor(rng.uniform() * 4294967296) >>> 0;
  for (let i = 0; i < out.length; i++) {
    state = (state + 0x6d2b79f5) >>> 0;
    let q = Math.imul(state ^ (state >>> 15), state | 1);
    q ^= q + Math.imul(q ^ (q >>> 7), q | 61);
    const u = ((q ^ (q >>> 14)) >>> 0) / 4294967296;
    let k = guide[Math.floor(u * slots)];
    while (cdf[k] <= u) k++;
    const b = blurred[i];
    const v = first + k + (b > 0 ? rng.poisson(b) : 0);
    out[i] = v < 0 ? 0 : v > 65535 ? 65535 : v;
  }
  return out;
}

/**
 * Make a synthetic embryo (demo data) from params (missing fields take DEFAULT_SYNTH_PARAMS) and a seed.
 * Channel 1 = gradient A·f·exp(−x/λ) + B, channel 2 = boundary (on where the gradient exceeds boundaryThreshold).
 */
export function makeSyntheticEmbryo(params: Partial<SyntheticEmbryoParams>, seed: number): SyntheticEmbryo {
  const p: SyntheticEmbryoParams = { ...DEFAULT_SYNTH_PARAMS, ...params };
  checkSynthParams(p);
  const rng = createRng(seed);
  const { centre, angleDeg } = placement(p, rng);
  const truth = makeTruth(p, centre, angleDeg);
  const planes: Uint16Array[] = new Array(2 * p.sizeZ);
  const frame = embryoFrame(p, truth, sectionBox(p, truth, p.eggLengthUm / 2, p.eggWidthUm / 2, 1));
  const base = pixelTable(p.cameraOffset, p.backgroundPhotons, p.readNoiseSd);
  for (let z = 0; z < p.sizeZ; z++) {
    const zUm = (z - (p.sizeZ - 1) / 2) * p.zStepUm;
    const blurPx = p.blurPx + p.defocusBlurPxPerUm * Math.abs(zUm);
    const { planes: [g, e], box } = sectionSignal(p, truth, frame, zUm);
    planes[z] = camera(g, box, blurPx, rng, base);
    planes[p.sizeZ + z] = camera(e, box, blurPx, rng, base);
  }
  return {
    stack: { sizeX: p.widthPx, sizeY: p.heightPx, sizeZ: p.sizeZ, sizeC: 2, planes },
    pixelSizeUm: p.pixelSizeUm, channelNames: ['gradient', 'boundary'], params: p, truth,
  };
}

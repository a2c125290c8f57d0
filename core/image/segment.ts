// Embryo segmentation that works whatever the channels contain (a bright gradient end next to a dim end).
import type { Mask, Plane } from '../model';
import { estimateBackgroundLevel } from './background-level';
import { largestComponent } from './components';
import { fillHoles } from './fill-holes';
import { fastGaussianSmooth } from './box-blur';
import { rowMaximaAt } from './max-filter';
import { open, squareDilate, squareErode } from './morphology';
import { otsuThreshold } from './threshold';

/** Options of segmentEmbryo, all in pixels or noise-SD units. */
export interface SegmentOptions {
  /** Strong smoothing for the coarse mask (px). @default 4 */
  readonly coarseSigmaPx?: number;
  /** Light smoothing for the edge position (px). @default 1.5 */
  readonly fineSigmaPx?: number;
  /** Radius of the neighbourhood whose maximum is the local embryo level (px); small so a steep gradient along
   * the edge does not raise it much. @default 5 */
  readonly localRadiusPx?: number;
  /** Edge = where the signal falls to this fraction of the local level (0..1). @default 0.5 */
  readonly edgeFraction?: number;
  /** Run the coarse stage on 2×2-averaged images (1 or 2); null = 2 for images over 500 000 pixels. @default null */
  readonly coarseDownsample?: 1 | 2 | null;
  /** Segment on images binned by this integer factor, upsample the mask and refine its edge at full resolution;
   * null = the smallest factor that brings the long side to at most 384 px (1 for smaller images), limited so the
   * short side keeps at least 64 px (autoBinFactor). @default null */
  readonly binFactor?: number | null;
}

/** Check and fill segmentation options; exact messages are pinned by tests. */
export function checkSegmentOptions(o: SegmentOptions = {}): Required<SegmentOptions> {
  const out = { coarseSigmaPx: 4, fineSigmaPx: 1.5, localRadiusPx: 5, edgeFraction: 0.5, coarseDownsample: null, binFactor: null, ...o };
  for (const key of ['coarseSigmaPx', 'fineSigmaPx', 'localRadiusPx'] as const) {
    if (!(out[key] > 0) || !Number.isFinite(out[key])) throw new Error(`${key} must be a positive number, got ${out[key]}`);
  }
  if (out.coarseDownsample !== null && out.coarseDownsample !== 1 && out.coarseDownsample !== 2) {
    throw new Error(`coarseDownsample must be 1, 2 or null, got ${out.coarseDownsample}`);
  }
  if (out.binFactor !== null && !(Number.isInteger(out.binFactor) && out.binFactor >= 1)) {
    throw new Error(`binFactor must be a positive integer or null, got ${out.binFactor}`);
  }
  if (!(out.edgeFraction > 0 && out.edgeFraction < 1)) {
    throw new Error(`edgeFraction must be between 0 and 1, got ${out.edgeFraction}`);
  }
  return out;
}

/** One channel smoothed by sigmaPx, minus its background level, divided by its noise SD (units: noise SDs). */
export function channelSnr(channel: Plane, sigmaPx: number): Plane {
  const s = fastGaussianSmooth(channel, sigmaPx).data;
  const bg = estimateBackgroundLevel(s);
  const out = new Float32Array(s.length);
  for (let i = 0; i < s.length; i++) out[i] = (s[i] - bg.level) / bg.noiseSd;
  return { width: channel.width, height: channel.height, data: out };
}

/**
 * Signal-to-noise image: the maximum over channels of channelSnr. Normalising by noise lets a dim channel count as
 * much as a bright one. Each channel is scaled straight into the maximum (no plane of its own): the scaled value is
 * rounded to Float32 as channelSnr stores it, and a NaN never wins (the maximum starts at −Infinity).
 */
export function combinedSnr(channels: readonly Plane[], sigmaPx: number): Plane {
  const { width, height } = channels[0];
  const out = new Float32Array(width * height).fill(-Infinity);
  // One smoothing buffer serves every channel in turn.
  const buffer = new Float32Array(width * height);
  for (const ch of channels) {
    const s = fastGaussianSmooth(ch, sigmaPx, buffer).data;
    const bg = estimateBackgroundLevel(s);
    maxScaled(s, bg.level, bg.noiseSd, out);
  }
  return { width, height, data: out };
}

/** out[i] = max(out[i], fround((s[i] − level) / sd)), keeping out[i] when the scaled value is NaN. */
function maxScaled(s: Float32Array, level: number, sd: number, out: Float32Array): void {
  for (let i = 0; i < s.length; i++) {
    const z = Math.fround((s[i] - level) / sd);
    if (z > out[i]) out[i] = z;
  }
}

/** Coarse mask: Otsu on log SNR (log so a dim end is not lost beside a bright one), kept within 4..30 noise SDs. */
function coarseMask(snr: Plane): Mask {
  const logs = new Float32Array(snr.data.length);
  logAboveOne(snr.data, logs);
  const t = Math.min(30, Math.max(4, Math.exp(otsuThreshold(logs))));
  const data = new Uint8Array(logs.length);
  above(snr.data, t, data);
  return fillHoles(largestComponent({ width: snr.width, height: snr.height, data }));
}

/** out[i] = 1 where v[i] > t, else 0 (pixel loops sit in small functions: see DEVELOPERS.md). */
function above(v: Float32Array, t: number, out: Uint8Array): void {
  for (let i = 0; i < out.length; i++) out[i] = v[i] > t ? 1 : 0;
}

/** out[i] = log(max(1, v[i])), without calling log where the value is at most 1 (most of the background). */
function logAboveOne(v: Float32Array, out: Float32Array): void {
  for (let i = 0; i < v.length; i++) {
    const x = v[i];
    out[i] = x > 1 ? Math.log(x) : x !== x ? NaN : 0;
  }
}

/** Mean of 2×2 blocks (a last odd row or column is averaged with itself), half the size rounded up. */
export function downsample2(plane: Plane): Plane {
  const { width, height, data } = plane;
  const w = Math.ceil(width / 2);
  const h = Math.ceil(height / 2);
  const out = new Float32Array(w * h);
  for (let y = 0; y < h; y++) {
    const y0 = 2 * y * width;
    const y1 = Math.min(2 * y + 1, height - 1) * width;
    for (let x = 0; x < w; x++) {
      const x0 = 2 * x;
      const x1 = Math.min(2 * x + 1, width - 1);
      out[y * w + x] = (data[y0 + x0] + data[y0 + x1] + data[y1 + x0] + data[y1 + x1]) / 4;
    }
  }
  return { width: w, height: h, data: out };
}

/** Coarse mask at full size, computed on 2×2-averaged images when `factor` is 2 (nearest-neighbour upsampling). */
function coarseAtScale(channels: readonly Plane[], sigmaPx: number, factor: 1 | 2): Mask {
  if (factor === 1) return coarseMask(combinedSnr(channels, sigmaPx));
  const small = coarseMask(combinedSnr(channels.map(downsample2), sigmaPx / 2));
  const { width, height } = channels[0];
  const data = new Uint8Array(width * height);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) data[y * width + x] = small.data[(y >> 1) * small.width + (x >> 1)];
  }
  return { width, height, data };
}

/**
 * The edge rule at the pixels listed in `at` (indices into the channels' pixels): 1 where some channel, smoothed by
 * fineSigmaPx and scaled to noise SDs as channelSnr scales it, is at least edgeFraction of its own local maximum
 * (the maximum over the (2·localRadiusPx + 1)² square, clipped at the border) and above 3 noise SDs; 0 elsewhere.
 * The local maximum of the noise-scaled image is the noise-scaled maximum of the smoothed one (the scaling is
 * monotone), so it is taken on the smoothed values: the maximum of the row maxima of the window's rows. Only the
 * pixels where the rule decides anything are listed, so neither a full-image maximum filter nor the row maxima of
 * the whole image are needed: the row maxima are taken only where a listed pixel's window reaches (rowMaximaAt),
 * about a tenth of the image near the edge band.
 */
function nearLocalLevelAt(channels: readonly Plane[], at: Int32Array, o: Required<SegmentOptions>, box: PixelBox | null = null): Uint8Array {
  const width = box ? box.x1 - box.x0 : channels[0].width;
  const height = box ? box.y1 - box.y0 : channels[0].height;
  const keep = new Uint8Array(width * height);
  const r = Math.max(0, Math.round(o.localRadiusPx));
  // One buffer each for the crop, the smoothed plane and its row maxima serves every channel in turn.
  const crop = box ? new Float32Array(width * height) : null;
  const smoothed = new Float32Array(width * height);
  const rowMax = new Float32Array(width * height);
  const windowRows = windowRowPixels(at, width, height, r);
  for (const channel of channels) {
    const ch = box && crop ? cropPlane(channel, box, crop) : channel;
    const smooth = fastGaussianSmooth(ch, o.fineSigmaPx, smoothed);
    rowMaximaAt(smooth, r, windowRows, rowMax);
    const bg = estimateBackgroundLevel(smooth.data);
    edgeRuleAt(smooth.data, rowMax, width, height, r, at, bg.level, bg.noiseSd, o.edgeFraction, keep);
  }
  return keep;
}

/** The pixels whose row maxima edgeRuleAt reads: for each listed pixel, its column from r rows above to r rows below
 *  (clipped at the border); each once, in no particular order. */
function windowRowPixels(at: Int32Array, width: number, height: number, r: number): Int32Array {
  const seen = new Uint8Array(width * height);
  const out = new Int32Array(at.length * (2 * r + 1));
  const n = markColumns(at, width, height, r, seen, out);
  return out.subarray(0, n);
}

/** windowRowPixels' loop: appends each not yet seen pixel of the listed pixels' columns to out; returns the count. */
function markColumns(at: Int32Array, width: number, height: number, r: number, seen: Uint8Array, out: Int32Array): number {
  let n = 0;
  for (let k = 0; k < at.length; k++) {
    const i = at[k];
    const y = (i / width) | 0;
    const x = i - y * width;
    const y0 = y - r < 0 ? 0 : y - r;
    const y1 = y + r > height - 1 ? height - 1 : y + r;
    for (let q = y0 * width + x, end = y1 * width + x; q <= end; q += width) {
      if (seen[q] === 0) { seen[q] = 1; out[n++] = q; }
    }
  }
  return n;
}

/**
 * keep[i] = 1 for the pixels i of `at` where the noise-scaled smoothed value s is at least edgeFraction of the
 * noise-scaled maximum of the (2r + 1)² window (from the row maxima `rows`) and above 3 noise SDs. Pixels already
 * kept (by an earlier channel) are not evaluated again: a channel can only add pixels.
 */
function edgeRuleAt(s: Float32Array, rows: Float32Array, width: number, height: number, r: number, at: Int32Array, level: number, noiseSd: number, edgeFraction: number, keep: Uint8Array): void {
  for (let k = 0; k < at.length; k++) {
    const i = at[k];
    if (keep[i]) continue;
    const y = (i / width) | 0;
    const x = i - y * width;
    const local = columnMax(rows, width, x, Math.max(0, y - r), Math.min(height - 1, y + r));
    // Rounded to Float32 as channelSnr's output plane stores them.
    const fine = Math.fround((s[i] - level) / noiseSd);
    const localFine = Math.fround((local - level) / noiseSd);
    if (fine >= Math.max(3, edgeFraction * localFine)) keep[i] = 1;
  }
}

/** Maximum of values in column x over rows y0..y1 (inclusive) of a row-major image `width` wide. */
function columnMax(values: Float32Array, width: number, x: number, y0: number, y1: number): number {
  let m = -Infinity;
  for (let i = y0 * width + x, end = y1 * width + x; i <= end; i += width) if (values[i] > m) m = values[i];
  return m;
}

/** The part of a plane inside box, as a plane of its own (in `into`, at least the box's size). */
function cropPlane(plane: Plane, box: PixelBox, into: Float32Array): Plane {
  const cw = box.x1 - box.x0;
  const data = into.subarray(0, cw * (box.y1 - box.y0));
  for (let y = box.y0; y < box.y1; y++) data.set(plane.data.subarray(y * plane.width + box.x0, y * plane.width + box.x1), (y - box.y0) * cw);
  return { width: cw, height: box.y1 - box.y0, data };
}

/** Pixel rectangle [x0, x1) × [y0, y1). */
export interface PixelBox { readonly x0: number; readonly y0: number; readonly x1: number; readonly y1: number }

/** Bounding box of the pixels where 0 < up < 1, grown by marginPx and clipped to the image; null when none. */
function bandBox(up: Float32Array, width: number, height: number, marginPx: number): PixelBox | null {
  let x0 = width; let y0 = height; let x1 = -1; let y1 = -1;
  for (let y = 0; y < height; y++) {
    const o = y * width;
    for (let x = 0; x < width; x++) {
      const u = up[o + x];
      if (!(u > 0 && u < 1)) continue;
      if (x < x0) x0 = x;
      if (x > x1) x1 = x;
      if (y < y0) y0 = y;
      y1 = y;
    }
  }
  if (x1 < 0) return null;
  const m = Math.ceil(marginPx);
  return { x0: Math.max(0, x0 - m), y0: Math.max(0, y0 - m), x1: Math.min(width, x1 + 1 + m), y1: Math.min(height, y1 + 1 + m) };
}

/** Background ring (px) kept around the band when refining the edge at full resolution. */
const REFINE_RING_PX = 32;

/** Long side (px) that automatic binning aims at: large enough for the outline, small enough to be quick. */
const BINNED_LONG_SIDE_PX = 384;

/** Short side (px) a binned image keeps at least: thinner frames (strips, line scans) are segmented unbinned. */
const BINNED_MIN_SHORT_SIDE_PX = 64;

/** Automatic bin factor: the smallest that brings the long side to at most 384 px, but none that would leave the
 *  short side under 64 px. */
export function autoBinFactor(width: number, height: number): number {
  const f = Math.ceil(Math.max(width, height) / BINNED_LONG_SIDE_PX);
  return Math.max(1, Math.min(f, Math.floor(Math.min(width, height) / BINNED_MIN_SHORT_SIDE_PX)));
}

/**
 * Mean of f×f blocks (x = column, y = row); blocks cut by the right or bottom edge average the pixels they hold.
 * Each block's sum runs in float64 from 0, row by row and left to right within a row.
 */
export function binMean(plane: Plane, f: number): Plane {
  const { width, height, data } = plane;
  const w = Math.ceil(width / f);
  const h = Math.ceil(height / f);
  const out = new Float32Array(w * h);
  for (let by = 0; by < h; by++) {
    const y0 = by * f;
    const rows = Math.min(f, height - y0);
    if (f === 2 && rows === 2) binRowPairs(data, y0 * width, width, out, by * w);
    else binBlockRow(data, width, y0, rows, f, out, by * w, w);
  }
  return { width: w, height: h, data: out };
}

/** One row of f×f block means (rows image rows from y0; the last block may be narrower), into out[o..o + w). */
function binBlockRow(data: Float32Array, width: number, y0: number, rows: number, f: number, out: Float32Array, o: number, w: number): void {
  for (let bx = 0; bx < w; bx++) {
    const x0 = bx * f;
    const x1 = Math.min(width, x0 + f);
    let acc = 0;
    for (let y = y0; y < y0 + rows; y++) for (let i = y * width + x0, end = y * width + x1; i < end; i++) acc += data[i];
    out[o + bx] = acc / (rows * (x1 - x0));
  }
}

/** binBlockRow for f = 2 and two whole rows (at data[r]): the same additions in the same order, written out. */
function binRowPairs(data: Float32Array, r: number, width: number, out: Float32Array, o: number): void {
  const below = r + width;
  const pairs = width >> 1;
  for (let bx = 0; bx < pairs; bx++) {
    const x = 2 * bx;
    let acc = 0;
    acc += data[r + x];
    acc += data[r + x + 1];
    acc += data[below + x];
    acc += data[below + x + 1];
    out[o + bx] = acc / 4;
  }
  if (width & 1) {
    let acc = 0;
    acc += data[r + width - 1];
    acc += data[below + width - 1];
    out[o + pairs] = acc / 2;
  }
}

/**
 * The 0/1 mask smoothed by the separable [1 2 1]/4 kernel (edges replicated). Straight edges keep their 0.5 level;
 * the corners of a blocky staircase are rounded, so the upsampled outline has no bumps at block corners (an outline's
 * extremes, the poles, would pick them up).
 */
export function smooth121(mask: Mask): Float32Array {
  const { width: w, height: h, data } = mask;
  const tmp = new Float32Array(w * h);
  for (let y = 0; y < h; y++) {
    const o = y * w;
    for (let x = 0; x < w; x++) tmp[o + x] = (data[o + Math.max(0, x - 1)] + 2 * data[o + x] + data[o + Math.min(w - 1, x + 1)]) / 4;
  }
  const out = new Float32Array(w * h);
  for (let y = 0; y < h; y++) {
    const up = Math.max(0, y - 1) * w;
    const o = y * w;
    const down = Math.min(h - 1, y + 1) * w;
    for (let x = 0; x < w; x++) out[o + x] = (tmp[up + x] + 2 * tmp[o + x] + tmp[down + x]) / 4;
  }
  return out;
}

/**
 * Full-size mask from a mask binned by f: bilinear interpolation of the 0/1 values at each full-size pixel centre
 * (block centre of bin j at f·j + (f − 1)/2) after [1 2 1] smoothing, kept where it reaches 0.5, so the edge is
 * smooth, not blocky.
 */
export function upsampleMask(small: Mask, f: number, width: number, height: number): Mask {
  const up = smoothUpsampled(smooth121(small), small.width, small.height, f, { x0: 0, y0: 0, x1: width, y1: height });
  const out = new Uint8Array(width * height);
  for (let i = 0; i < out.length; i++) out[i] = up[i] >= 0.5 ? 1 : 0;
  return { width, height, data: out };
}

/**
 * The binned mask after [1 2 1] smoothing (`sd`, sw × sh), bilinearly interpolated at the full-size pixel centres of
 * `rect` (0..1; the result is rect's size, row-major). Where the four binned values around a run of pixels are equal
 * (most of the image: all 0 outside, all 1 inside), the interpolation gives that value exactly, so the run is filled
 * with it; a pixel's value does not depend on the rectangle it is computed in.
 */
export function smoothUpsampled(sd: Float32Array, sw: number, sh: number, f: number, rect: PixelBox): Float32Array {
  const rw = rect.x1 - rect.x0;
  const out = new Float32Array(rw * (rect.y1 - rect.y0));
  const x0 = new Int32Array(rw);
  const x1 = new Int32Array(rw);
  const fx = new Float64Array(rw);
  for (let j = 0; j < rw; j++) {
    const u = Math.min(sw - 1, Math.max(0, (rect.x0 + j - (f - 1) / 2) / f));
    x0[j] = Math.floor(u);
    x1[j] = Math.min(sw - 1, x0[j] + 1);
    fx[j] = u - x0[j];
  }
  // Runs of pixels that share x0 (and so x1): x0 never decreases along a row.
  const runStart: number[] = [];
  for (let j = 0; j < rw; j++) if (j === 0 || x0[j] !== x0[j - 1]) runStart.push(j);
  runStart.push(rw);
  for (let y = rect.y0; y < rect.y1; y++) {
    const v = Math.min(sh - 1, Math.max(0, (y - (f - 1) / 2) / f));
    const r0 = Math.floor(v) * sw;
    const r1 = Math.min(sh - 1, Math.floor(v) + 1) * sw;
    const fy = v - Math.floor(v);
    const o = (y - rect.y0) * rw;
    for (let k = 0; k + 1 < runStart.length; k++) {
      const xs = runStart[k];
      const xe = runStart[k + 1];
      const a = x0[xs];
      const b = x1[xs];
      const c = sd[r0 + a];
      if (c === sd[r0 + b] && c === sd[r1 + a] && c === sd[r1 + b]) {
        if (c !== 0) out.fill(c, o + xs, o + xe);
        continue;
      }
      for (let x = xs; x < xe; x++) {
        const top = sd[r0 + a] + (sd[r0 + b] - sd[r0 + a]) * fx[x];
        const bottom = sd[r1 + a] + (sd[r1 + b] - sd[r1 + a]) * fx[x];
        out[o + x] = top + (bottom - top) * fy;
      }
    }
  }
  return out;
}

/** Bounding box (binned pixels, [x0, x1) × [y0, y1)) of the values strictly between 0 and 1; null when none. */
export function fractionalBox(sd: Float32Array, sw: number, sh: number): PixelBox | null {
  let x0 = sw; let y0 = sh; let x1 = -1; let y1 = -1;
  for (let y = 0; y < sh; y++) {
    for (let x = 0; x < sw; x++) {
      const v = sd[y * sw + x];
      if (!(v > 0 && v < 1)) continue;
      if (x < x0) x0 = x;
      if (x > x1) x1 = x;
      if (y < y0) y0 = y;
      y1 = y;
    }
  }
  return x1 < 0 ? null : { x0, y0, x1: x1 + 1, y1: y1 + 1 };
}

/**
 * Full-size pixels that can lie in the upsampled band (0 < up < 1), grown by marginPx and clipped to the image.
 * Smoothed with [1 2 1] on both axes, a binned 1 has no 0 among its eight neighbours and a 0 no 1 (each one's
 * window holds the other), so four binned values around a full-size pixel that are all 0 or 1 are all equal: the
 * pixel's value is then 0 or 1. Band pixels therefore interpolate a fractional binned value; a pixel's four binned
 * neighbours are columns x0 and x0 + 1 with x0 = ⌊(x − (f − 1)/2)/f⌋ (clamped), so x0 ≥ fx0 − 1 and x0 < fx1 hold
 * for x in [f·(fx0 − 1), f·(fx1 + 1)), and likewise for rows.
 */
export function bandReach(frac: PixelBox, f: number, width: number, height: number, marginPx: number): PixelBox {
  const m = Math.ceil(marginPx);
  return {
    x0: Math.max(0, f * (frac.x0 - 1) - m), y0: Math.max(0, f * (frac.y0 - 1) - m),
    x1: Math.min(width, f * (frac.x1 + 1) + m), y1: Math.min(height, f * (frac.y1 + 1) + m),
  };
}

/**
 * Segment the embryo from all channels of a projected stack (same size): returns the filled largest region.
 * Two stages: a coarse SNR mask (strong smoothing, low threshold) finds where the embryo is; near its edge the
 * outline is then placed where a lightly smoothed channel falls to edgeFraction of its own local maximum, so a very
 * bright end is not pushed outwards. Each channel is judged on its own so a step inside one channel (an expression
 * boundary) does not cut the embryo; the coarse mask's deep interior is kept as is. Images with a long side over
 * 384 px are segmented binned (see SegmentOptions.binFactor), the mask is upsampled and its edge band is decided
 * again by the same edge rule at full resolution (refineEdge).
 */
export function segmentEmbryo(channels: readonly Plane[], options: SegmentOptions = {}): Mask {
  const o = checkSegmentOptions(options);
  if (channels.length === 0) throw new Error('segmentEmbryo needs at least one channel');
  const { width, height } = channels[0];
  const bin = o.binFactor ?? autoBinFactor(width, height);
  if (bin === 1) return segmentAtScale(channels, o);
  // Pixel-sized options shrink with the image; the binned image is small, so its coarse stage runs at full scale.
  const small = segmentAtScale(channels.map((c) => binMean(c, bin)), {
    ...o, coarseSigmaPx: o.coarseSigmaPx / bin, fineSigmaPx: o.fineSigmaPx / bin, localRadiusPx: o.localRadiusPx / bin,
    coarseDownsample: 1, binFactor: 1,
  });
  // The upsampled mask is needed only where its edge band can lie and the crop around it reaches (refineEdge).
  const sd = smooth121(small);
  const frac = fractionalBox(sd, small.width, small.height);
  const whole = { x0: 0, y0: 0, x1: width, y1: height };
  const reach = frac ? bandReach(frac, bin, width, height, refineMarginPx(o)) : whole;
  const up = smoothUpsampled(sd, small.width, small.height, bin, reach);
  const band = bandBox(up, reach.x1 - reach.x0, reach.y1 - reach.y0, 0);
  if (band === null) {
    // Without band pixels, the mask is the upsampled one over the whole image (reach may not cover all of it).
    const all = reach === whole ? up : smoothUpsampled(sd, small.width, small.height, bin, whole);
    const out = new Uint8Array(width * height);
    for (let i = 0; i < out.length; i++) out[i] = all[i] >= 1 ? 1 : 0;
    return fillHoles(largestComponent({ width, height, data: out }));
  }
  // bandReach holds the crop around the band by construction; should it not, the whole image is used.
  const box = cropBox(band, reach, refineMarginPx(o), width, height);
  if (box.x0 < reach.x0 || box.y0 < reach.y0 || box.x1 > reach.x1 || box.y1 > reach.y1) {
    const all = smoothUpsampled(sd, small.width, small.height, bin, whole);
    return refineEdge(all, whole, cropBox(bandBox(all, width, height, 0) as PixelBox, whole, refineMarginPx(o), width, height), channels, o);
  }
  return refineEdge(up, reach, box, channels, o);
}

/** The crop refineEdge works in: the band's bounding box (given within `reach`) grown by marginPx, clipped to the
 *  image (image coordinates). */
function cropBox(band: PixelBox, reach: PixelBox, marginPx: number, width: number, height: number): PixelBox {
  const m = Math.ceil(marginPx);
  return {
    x0: Math.max(0, band.x0 + reach.x0 - m), y0: Math.max(0, band.y0 + reach.y0 - m),
    x1: Math.min(width, band.x1 + reach.x0 + m), y1: Math.min(height, band.y1 + reach.y0 + m),
  };
}

/** Margin (px) of the crop around the edge band in which refineEdge decides the edge again. */
function refineMarginPx(o: Required<SegmentOptions>): number {
  return Math.round(o.localRadiusPx) + 4 * o.fineSigmaPx + REFINE_RING_PX;
}

/**
 * Full-size mask from the smoothed, upsampled binned mask `up` (0..1), given over the rectangle `reach` that holds
 * every band pixel (0 < up < 1) and the crop `box` around them (cropBox; image coordinates): the edge rule runs on
 * that crop, wide enough that the smoothing and the local-maximum window reach no crop border from a band pixel,
 * and that a ring of background sets the noise level as in the whole image. Pixels where `up` is 0 or 1 keep that
 * value; in the band between (within about a block of the binned edge) the full-resolution edge rule of
 * nearLocalLevel decides, so the outline sits where it would without binning. The largest region is kept and its holes filled.
 */
function refineEdge(up: Float32Array, reach: PixelBox, box: PixelBox, channels: readonly Plane[], o: Required<SegmentOptions>): Mask {
  const { width, height } = channels[0];
  const rw = reach.x1 - reach.x0;
  const out = new Uint8Array(width * height);
  // The whole region lies inside the box (its edge band does) and the box's rim is background (or the image
  // border), so cleaning up the crop alone gives the same mask as cleaning up the whole frame.
  const cw = box.x1 - box.x0;
  const ch = box.y1 - box.y0;
  const crop = new Uint8Array(cw * ch);
  const bandCount = cropInterior(up, rw, box.x0 - reach.x0, box.y0 - reach.y0, cw, ch, crop);
  // Only band pixels consult the edge rule, so it runs there alone.
  const at = new Int32Array(bandCount);
  cropBandPixels(up, rw, box.x0 - reach.x0, box.y0 - reach.y0, cw, ch, at);
  const keep = nearLocalLevelAt(channels, at, o, box);
  copyAt(keep, at, crop);
  const clean = fillHoles(largestComponent(open({ width: cw, height: ch, data: crop }, 1.5))).data;
  for (let y = 0; y < ch; y++) out.set(clean.subarray(y * cw, (y + 1) * cw), (y + box.y0) * width + box.x0);
  return { width, height, data: out };
}

/** crop[y·cw + x] = 1 where up (the full frame, `width` wide) is ≥ 1 at (x0 + x, y0 + y); returns the number of
 *  band pixels (0 < up < 1) in the crop. */
function cropInterior(up: Float32Array, width: number, x0: number, y0: number, cw: number, ch: number, crop: Uint8Array): number {
  let bandCount = 0;
  for (let y = 0; y < ch; y++) {
    for (let x = 0; x < cw; x++) {
      const u = up[(y + y0) * width + x + x0];
      if (u >= 1) crop[y * cw + x] = 1;
      else if (u > 0) bandCount++;
    }
  }
  return bandCount;
}

/** Crop indices of the band pixels (0 < up < 1), row-major, into at. */
function cropBandPixels(up: Float32Array, width: number, x0: number, y0: number, cw: number, ch: number, at: Int32Array): void {
  for (let y = 0, k = 0; y < ch; y++) {
    for (let x = 0; x < cw; x++) {
      const u = up[(y + y0) * width + x + x0];
      if (u > 0 && u < 1) at[k++] = y * cw + x;
    }
  }
}

/** dst[at[k]] = src[at[k]] for every k. */
function copyAt(src: Uint8Array, at: Int32Array, dst: Uint8Array): void {
  for (let k = 0; k < at.length; k++) dst[at[k]] = src[at[k]];
}

/** Indices of the pixels in `near` but not in `deep`, ascending. */
function ringPixels(near: Uint8Array, deep: Uint8Array): Int32Array {
  let n = 0;
  for (let i = 0; i < near.length; i++) n += near[i] & (deep[i] ^ 1);
  const at = new Int32Array(n);
  for (let i = 0, k = 0; k < n; i++) if (near[i] && !deep[i]) at[k++] = i;
  return at;
}

/** data[i] = 1 where deep[i], or near[i] and keep[i]; else 0. */
function deepOrNearKept(deep: Uint8Array, near: Uint8Array, keep: Uint8Array, data: Uint8Array): void {
  for (let i = 0; i < data.length; i++) {
    data[i] = deep[i] || (near[i] && keep[i]) ? 1 : 0;
  }
}

/** segmentEmbryo at the channels' own scale (checked options). */
function segmentAtScale(channels: readonly Plane[], o: Required<SegmentOptions>): Mask {
  const { width, height } = channels[0];
  const factor = o.coarseDownsample ?? (width * height > 500_000 ? 2 : 1);
  const coarse = coarseAtScale(channels, o.coarseSigmaPx, factor);
  // The coarse edge may sit up to ~2 coarse sigmas inside a dim end and ~3 outside a bright end; square windows
  // suffice for these margins and cost far less than distance maps.
  const near = squareDilate(coarse, 2 * o.coarseSigmaPx).data;
  const deep = squareErode(coarse, Math.max(2 * o.localRadiusPx, 3 * o.coarseSigmaPx)).data;
  // The edge rule decides only between the deep interior and the near zone; it is evaluated there alone.
  const keep = nearLocalLevelAt(channels, ringPixels(near, deep), o);
  const data = new Uint8Array(width * height);
  deepOrNearKept(deep, near, keep, data);
  const filled = fillHoles(largestComponent({ width, height, data }));
  return fillHoles(largestComponent(open(filled, 1.5)));
}

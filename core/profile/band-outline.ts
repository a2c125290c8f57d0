// Polygons of the sampled region, for drawing the band (or strip) over the image.
import type { ApAxis, Detection, ImagePoint } from '../model';
import type { AnalysisSettings } from '../settings';
import { distanceInside } from '../image';
import { axisFrame, maskContours } from '../geometry';
import type { PreparedSampling } from './prepare';
import { binIndices } from './bin';
import { sideFilter } from './measure';

/** Corners of the axis strip: anterior-left, posterior-left, posterior-right, anterior-right (px). */
function stripPolygon(axis: ApAxis, halfWidthPx: number): ImagePoint[] {
  const f = axisFrame(axis);
  const at = (p: ImagePoint, s: number): ImagePoint => ({ x: p.x + s * halfWidthPx * f.nx, y: p.y + s * halfWidthPx * f.ny });
  return [at(axis.anterior, 1), at(axis.posterior, 1), at(axis.posterior, -1), at(axis.anterior, -1)];
}

/** Band pixel positions from a detection (when no prepared sampling is at hand). */
function bandFromDetection(detection: Detection, edgeDepthPx: number): { xs: Float32Array; ys: Float32Array; width: number; height: number } {
  const { width, height, data } = detection.mask;
  const depth = distanceInside(detection.mask);
  const xs: number[] = [];
  const ys: number[] = [];
  for (let i = 0; i < data.length; i++) if (data[i] && depth[i] - 0.5 <= edgeDepthPx) { xs.push(i % width); ys.push(Math.floor(i / width)); }
  return { xs: Float32Array.from(xs), ys: Float32Array.from(ys), width, height };
}

/**
 * Closed polygons (px) around the pixels that measureEmbryo samples along `axis`: for the axis strip one rectangle;
 * for the edge band the contours of the band pixels on the chosen side (outer and inner rings; fill even-odd).
 * Takes a PreparedSampling, or a Detection plus the pixel size (µm/px; null = settings taken as px).
 */
export function sampleBandOutline(source: PreparedSampling | Detection, axis: ApAxis, settings: AnalysisSettings, pixelSizeUm: number | null = null): ImagePoint[][] {
  const px = 'band' in source ? source.pixelSizeUm : pixelSizeUm;
  const toPx = (um: number): number => (px ? um / px : um);
  if (settings.profile.mode === 'axis') return [stripPolygon(axis, toPx(settings.profile.axisWidthUm) / 2)];
  const band = 'band' in source
    ? { xs: source.band.xs, ys: source.band.ys, width: source.width, height: source.height }
    : bandFromDetection(source, toPx(settings.profile.edgeDepthUm));
  const bins = binIndices(band.xs, band.ys, axis, 1, sideFilter(settings));
  const data = new Uint8Array(band.width * band.height);
  for (let k = 0; k < bins.length; k++) if (bins[k] >= 0) data[band.ys[k] * band.width + band.xs[k]] = 1;
  return maskContours({ width: band.width, height: band.height, data }).filter((c) => c.length >= 3);
}

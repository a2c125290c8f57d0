// Polygons of the sampled region, for drawing the band (or strip) over the image.
import type { ApAxis, ImagePoint } from '../model';
import type { AnalysisSettings } from '../settings';
import type { PreparedSampling } from './samplers';

/**
 * Closed polygons (px) around the pixels that measureEmbryo samples along `axis`, drawn by the sampler the sampling
 * was prepared for (the axis strip: one rectangle; the edge band: the contours of its pixels on the chosen side, outer
 * and inner rings; fill even-odd).
 */
export function sampleBandOutline(prepared: PreparedSampling, axis: ApAxis, settings: AnalysisSettings): ImagePoint[][] {
  return prepared.sampler.outline(prepared, axis, settings);
}

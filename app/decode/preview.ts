// The first picture of a stack while it loads: one slice of the first channel, as floats, before any projection.
import type { StackPreview } from '../../core/contract';
import { openStackForAnalysis } from './open-for-analysis';
import { isZarrPath, openZarrFirstPicture } from './open-zarr-stack';

/**
 * The view a first picture should fill when the caller does not say (px): about a window's image area. A lower
 * OME-Zarr level at least this big is shown first (fitted to the window like the stack), then the full resolution.
 */
export const FIRST_PICTURE_VIEW_PX = Object.freeze({ width: 960, height: 720 });

/** One raw slice shown while a stack loads, with where it sits in the stack (the contract's StackPreview). */
export type PreviewPlane = StackPreview;

/**
 * The middle slice of the first channel at time point `t` (0 when out of range). Why the middle: in a stack taken
 * through an embryo it usually cuts the embryo near its widest section, so the preview already shows the embryo's
 * outline; it is a single slice, not the projection the analysis uses, and the window says so.
 */
export async function readPreviewPlane(path: string, label: string, t = 0, viewPx: { width: number; height: number } = FIRST_PICTURE_VIEW_PX): Promise<PreviewPlane> {
  // An OME-Zarr pyramid gives its coarsest level that still fills the view; everything else its full resolution.
  const low = (await isZarrPath(path)) ? await openZarrFirstPicture(path, label, viewPx.width, viewPx.height).catch(() => null) : null;
  const opened = low ?? await openStackForAnalysis(path, label);
  try {
    const { sizeZ, sizeC, sizeT } = opened.info;
    const z = Math.floor(sizeZ / 2);
    const plane = await opened.source.readPlane(z, 0, Number.isInteger(t) && t >= 0 && t < sizeT ? t : 0);
    return { width: plane.width, height: plane.height, data: Float32Array.from(plane.data), z, c: 0, sizeZ, sizeC };
  } finally {
    await opened.source.close();
  }
}

// The first picture of a stack while it loads: one slice of the first channel, as floats, before any projection.
import { openStackForAnalysis } from './open-for-analysis';

/** One raw slice shown while a stack loads, with where it sits in the stack. */
export interface PreviewPlane {
  readonly width: number;
  readonly height: number;
  readonly data: Float32Array;
  /** The slice shown (0-based) and the stack's slice and channel counts. */
  readonly z: number;
  readonly c: number;
  readonly sizeZ: number;
  readonly sizeC: number;
}

/**
 * The middle slice of the first channel at time point `t` (0 when out of range). Why the middle: in a stack taken
 * through an embryo it usually cuts the embryo near its widest section, so the preview already shows the embryo's
 * outline; it is a single slice, not the projection the analysis uses, and the window says so.
 */
export async function readPreviewPlane(path: string, label: string, t = 0): Promise<PreviewPlane> {
  const opened = await openStackForAnalysis(path, label);
  try {
    const { sizeZ, sizeC, sizeT } = opened.info;
    const z = Math.floor(sizeZ / 2);
    const plane = await opened.source.readPlane(z, 0, Number.isInteger(t) && t >= 0 && t < sizeT ? t : 0);
    return { width: plane.width, height: plane.height, data: Float32Array.from(plane.data), z, c: 0, sizeZ, sizeC };
  } finally {
    await opened.source.close();
  }
}

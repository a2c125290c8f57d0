// Flat-field and background-image corrections: raw → (raw − background image) / flat, per channel and pixel.
// Both are per-pixel linear maps that do not change with z, so they commute with the mean, max and single-slice
// projections (max because the flat is positive), and with the sum when the background image is counted once per
// summed plane; they are therefore applied once, to the projection, instead of to every plane.
import type { Plane, ProjectedStack } from '../model';

/** One correction image: a plane per channel, with the file it came from (for messages). */
export interface CorrectionImage {
  /** File name as the user gave it; starts every message about the image. */
  readonly label: string;
  readonly width: number;
  readonly height: number;
  readonly channels: readonly Float32Array[];
}

/** The corrections applied to every stack of an analysis (either may be absent). */
export interface ImageCorrections {
  /** Flat field normalised to mean 1 per channel (see normaliseFlatField). */
  readonly flat: CorrectionImage | null;
  /** Background image (camera offset, stray light, a secondary-only or null staining), subtracted per channel. */
  readonly background: CorrectionImage | null;
}

/**
 * A flat field from one plane per channel: each channel divided by its own mean, so it only redistributes intensity.
 * Throws a one-line message naming the file when a channel has a pixel ≤ 0 or not finite (division would fail there).
 */
export function normaliseFlatField(label: string, planes: readonly Plane[]): CorrectionImage {
  if (planes.length === 0) throw new Error(`${label}: the flat-field image has no channels`);
  const { width, height } = planes[0];
  const channels = planes.map((p, c) => {
    let sum = 0;
    let bad = 0;
    for (let i = 0; i < p.data.length; i++) {
      const v = p.data[i];
      if (v > 0 && Number.isFinite(v)) sum += v;
      else bad++;
    }
    if (bad > 0) throw new Error(`${label}: channel ${c + 1} of the flat-field image has ${bad} pixel(s) ≤ 0 or not finite; a flat field must be positive everywhere`);
    const mean = sum / p.data.length;
    return Float32Array.from(p.data, (v) => v / mean);
  });
  return { label, width, height, channels };
}

/** A background image from one plane per channel, used as is (same units as the stack's samples). */
export function backgroundImage(label: string, planes: readonly Plane[]): CorrectionImage {
  if (planes.length === 0) throw new Error(`${label}: the background image has no channels`);
  return { label, width: planes[0].width, height: planes[0].height, channels: planes.map((p) => Float32Array.from(p.data)) };
}

/** Why `image` cannot correct a sizeX × sizeY stack of sizeC channels (one line naming both), or null when it can. */
export function correctionMismatch(image: CorrectionImage, role: string, sizeX: number, sizeY: number, sizeC: number): string | null {
  if (image.width !== sizeX || image.height !== sizeY) {
    return `the ${role} ${image.label} is ${image.width}×${image.height} px but the stack is ${sizeX}×${sizeY} px`;
  }
  if (image.channels.length !== sizeC) {
    return `the ${role} ${image.label} has ${image.channels.length} channel(s) but the stack has ${sizeC}`;
  }
  return null;
}

/** out = (p − k·b) / f per pixel (b or f may be absent); out may be p itself (each pixel is read before it is written). */
function correctPlane(p: Float32Array, b: Float32Array | null, k: number, f: Float32Array | null, out: Float32Array): Float32Array {
  for (let i = 0; i < p.length; i++) out[i] = (p[i] - (b ? k * b[i] : 0)) / (f ? f[i] : 1);
  return out;
}

/**
 * The projection corrected: (projection − planes·background) / flat per channel, where `planesSummed` is how many
 * planes a sum projection added up (1 for mean, max and slice). New planes, or the projection's own arrays overwritten
 * when `inPlace` (a caller that owns them: a movie's reused projection arrays). Throws the one-line mismatch message
 * when an image does not fit the stack.
 */
export function applyImageCorrections(projected: ProjectedStack, corrections: ImageCorrections, planesSummed: number, inPlace = false): ProjectedStack {
  const { flat, background } = corrections;
  if (!flat && !background) return projected;
  const { width, height } = projected.channels[0] ?? { width: 0, height: 0 };
  const n = projected.channels.length;
  for (const [image, role] of [[background, 'background image'], [flat, 'flat-field image']] as const) {
    const why = image ? correctionMismatch(image, role, width, height, n) : null;
    if (why !== null) throw new Error(why);
  }
  const channels: Plane[] = projected.channels.map((p, c) => ({
    width: p.width, height: p.height,
    data: correctPlane(p.data, background?.channels[c] ?? null, planesSummed, flat?.channels[c] ?? null, inPlace ? p.data : new Float32Array(p.data.length)),
  }));
  // The corrected values are no longer the decoded samples.
  const { rawPlanes: _dropped, ...rest } = projected;
  return { ...rest, channels };
}

/**
 * The planes of one slice (one per channel) as the corrections make them, (p − b)/f, for scoring the automatic slice
 * choice on what the analysis will see; the planes as they are when there is no correction or an image does not fit
 * (the projection's correction then fails with the mismatch message).
 */
export function correctedSlicePlanes(planes: readonly Plane[], corrections: ImageCorrections | null | undefined): readonly Plane[] {
  if (!corrections || (!corrections.flat && !corrections.background) || planes.length === 0) return planes;
  const { flat, background } = corrections;
  const { width, height } = planes[0];
  for (const image of [flat, background]) if (image && correctionMismatch(image, 'image', width, height, planes.length) !== null) return planes;
  return planes.map((p, c) => ({ width, height, data: correctPlane(p.data, background ? background.channels[c] : null, 1, flat ? flat.channels[c] : null, new Float32Array(p.data.length)) }));
}

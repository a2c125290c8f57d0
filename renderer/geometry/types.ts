// Branded coordinate types: the compiler refuses to mix screen (CSS pixel) and image (pixel) positions.
// Image convention: x = column, y = row, 0-based, pixel centres at integers.

/** A point in image pixel coordinates (pixel centres at integers). */
export type ImagePt = { readonly x: number; readonly y: number; readonly _space: 'image' };
/** A point in canvas CSS pixels, origin at the canvas's top-left corner. */
export type ScreenPt = { readonly x: number; readonly y: number; readonly _space: 'screen' };

/** Make an image-space point (pixels). */
export const imagePt = (x: number, y: number): ImagePt => ({ x, y }) as ImagePt;
/** Make a screen-space point (CSS pixels). */
export const screenPt = (x: number, y: number): ScreenPt => ({ x, y }) as ScreenPt;

/**
 * How the image sits on the canvas: screen = (image + 0.5) * zoom + offset, so the outer edge of pixel 0
 * (image −0.5) lands on offsetX. zoom is screen px per image px.
 */
export interface ViewTransform {
  readonly zoom: number;
  readonly offsetX: number;
  readonly offsetY: number;
}

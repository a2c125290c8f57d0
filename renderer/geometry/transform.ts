// Conversions between image pixels and canvas CSS pixels, plus zoom and fit helpers.
import type { ImagePt, ScreenPt, ViewTransform } from './types';
import { imagePt, screenPt } from './types';

/** Smallest and largest zoom (screen px per image px). */
export const ZOOM_MIN = 1 / 32;
export const ZOOM_MAX = 64;

/** Image point (px) → screen point (CSS px). */
export function imageToScreen(view: ViewTransform, p: ImagePt): ScreenPt {
  return screenPt((p.x + 0.5) * view.zoom + view.offsetX, (p.y + 0.5) * view.zoom + view.offsetY);
}

/** Screen point (CSS px) → image point (px, fractional). */
export function screenToImage(view: ViewTransform, p: ScreenPt): ImagePt {
  return imagePt((p.x - view.offsetX) / view.zoom - 0.5, (p.y - view.offsetY) / view.zoom - 0.5);
}

/** Clamp a zoom factor to [ZOOM_MIN, ZOOM_MAX]. */
export function clampZoom(zoom: number): number {
  return Math.min(ZOOM_MAX, Math.max(ZOOM_MIN, zoom));
}

/** Zoom by `factor` keeping the image point under `anchor` (screen) fixed. */
export function zoomAt(view: ViewTransform, anchor: ScreenPt, factor: number): ViewTransform {
  const zoom = clampZoom(view.zoom * factor);
  const under = screenToImage(view, anchor);
  return { zoom, offsetX: anchor.x - (under.x + 0.5) * zoom, offsetY: anchor.y - (under.y + 0.5) * zoom };
}

/** Move the view by a screen delta (CSS px). */
export function panBy(view: ViewTransform, dxScreen: number, dyScreen: number): ViewTransform {
  return { ...view, offsetX: view.offsetX + dxScreen, offsetY: view.offsetY + dyScreen };
}

/** The transform that shows a whole widthPx × heightPx image centred in a canvasW × canvasH box (CSS px). */
export function fitToWindow(widthPx: number, heightPx: number, canvasW: number, canvasH: number): ViewTransform {
  if (widthPx <= 0 || heightPx <= 0 || canvasW <= 0 || canvasH <= 0) return { zoom: 1, offsetX: 0, offsetY: 0 };
  const zoom = clampZoom(Math.min(canvasW / widthPx, canvasH / heightPx));
  return { zoom, offsetX: (canvasW - widthPx * zoom) / 2, offsetY: (canvasH - heightPx * zoom) / 2 };
}

/** The pixel (column, row) containing an image point, or null outside a widthPx × heightPx image. */
export function pixelUnder(p: ImagePt, widthPx: number, heightPx: number): { col: number; row: number } | null {
  const col = Math.round(p.x);
  const row = Math.round(p.y);
  if (col < 0 || row < 0 || col >= widthPx || row >= heightPx) return null;
  return { col, row };
}

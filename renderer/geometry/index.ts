// Public surface of the renderer's pure geometry: branded points, view transforms, scale bar (axis math is core/geometry's).
export type { ImagePt, ScreenPt, ViewTransform } from './types';
export { imagePt, screenPt } from './types';
export { imageToScreen, screenToImage, zoomAt, panBy, fitToWindow, clampZoom, pixelUnder, ZOOM_MIN, ZOOM_MAX } from './transform';
export { chooseScaleBar } from './scaleBar';

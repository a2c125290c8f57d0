// Public surface of the renderer's pure geometry: branded points, view transforms, axis positions, scale bar.
export type { ImagePt, ScreenPt, ViewTransform } from './types';
export { imagePt, screenPt } from './types';
export { imageToScreen, screenToImage, zoomAt, panBy, fitToWindow, clampZoom, pixelUnder, ZOOM_MIN, ZOOM_MAX } from './transform';
export { axisFraction, pointAtFraction, axisLeftNormal, distancePx } from './axis';
export { chooseScaleBar } from './scaleBar';

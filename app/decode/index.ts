// Public surface of app/decode: sharp decoding with geotiff fallback; OME-Zarr folders through core/zarr.
export { createSharpPlaneSource, sharpDecodesExactly } from './sharp-decoder';
export { openStackForAnalysis, withDecoderFallback, type OpenedStack } from './open-for-analysis';
export { isZarrPath, openZarrStack } from './open-zarr-stack';

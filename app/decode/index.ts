// Public surface of app/decode: sharp decoding with geotiff fallback.
export { createSharpPlaneSource, sharpDecodesExactly } from './sharp-decoder';
export { openStackForAnalysis, withDecoderFallback, type OpenedStack } from './open-for-analysis';

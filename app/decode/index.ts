// Public surface of app/decode: the direct decode path with every codec, sharp, and the geotiff fallback;
// OME-Zarr folders through core/zarr.
export { createSharpPlaneSource, limitDecoderThreads, loadSharp, sharpDecodesExactly } from './sharp-decoder';
export { openStackForAnalysis, withDecoderFallback, type OpenedStack, type OpenForAnalysisOptions } from './open-for-analysis';
export { APP_CHUNK_CODECS, decodeLzmaChunk, xzDeclaredSize } from './lzma-codec';
export { isZarrPath, openZarrStack, openZarrFirstPicture } from './open-zarr-stack';
export { readPreviewPlane, type PreviewPlane } from './preview';

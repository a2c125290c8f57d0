// Public surface of core/zarr: OME-Zarr (NGFF 0.4 / 0.5 on Zarr v2 / v3) metadata and lazy plane reading via zarrita.
export { ZarrError, type ZarrErrorCode } from './errors';
export { parseNgffGroup, type NgffAxis, type NgffImage, type NgffGroup } from './ngff';
export { assignAxisRoles, impliedAxes, type AxisRoles } from './axes';
export { micrometresPerSpaceUnit, secondsPerTimeUnit } from './units';
export { arrayStorage, type ArrayStorage } from './array-meta';
export { createChunkPlaneSource, type ChunkedArray, type DecodedChunk, type ChunkPlaneOptions } from './plane-reader';
export { readJson, trackMissingChunks, isMetadataKey, MAX_METADATA_BYTES, type ZarrStore } from './store';
export { openOmeZarr, firstPictureLevel, type OpenedZarr, type OpenZarrOptions, type ZarrDetails } from './open-zarr';
export { describeZarr } from './describe';
export { guardZarrCodecs, declaredBloscBytes, declaredZstdBytes, type BoundedInflate } from './decode-guard';
export { decodeBloscLz4, unshuffleBytes } from './blosc-lz4';

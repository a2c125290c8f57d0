// Public surface of core/io: file access for the pure-TS readers (the only core folder that may use node:fs).
export { openFileByteSource, type FileByteSource } from './file-byte-source';
export { openStackFile, readStackInfoFromFile, type OpenStackOptions } from './open-stack';
export { inflateChunk, inflateChunkAuto, NODE_CHUNK_CODECS } from './node-codecs';
export { openZarrFolderStore, isFolder, type ZarrFolderStoreOptions } from './zarr-folder-store';
export { readBloscChunkFile } from './blosc-chunk-file';
export { openRegularFile, specialFileKind } from './open-regular';
export { inflateZarrChunk } from './zarr-inflate';

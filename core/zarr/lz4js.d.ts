// Types for lz4js (pure-JS LZ4), of which Eggline uses only the block decoder.
declare module 'lz4js' {
  /** Decodes the LZ4 block src[sIndex, sIndex + sLength) into dst from dIndex; returns the index after the last byte written. */
  export function decompressBlock(src: Uint8Array, dst: Uint8Array, sIndex: number, sLength: number, dIndex: number): number;
}

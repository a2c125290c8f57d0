// The part of lz4js (pure-JS LZ4) the tests use as a second LZ4 block reader (the package ships no type declarations).
declare module 'lz4js' {
  /** Decodes the LZ4 block src[sIndex, sIndex + sLength) into dst from dIndex; returns the index after the last byte written. */
  export function decompressBlock(src: Uint8Array, dst: Uint8Array, sIndex: number, sLength: number, dIndex: number): number;
}

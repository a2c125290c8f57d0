// The part of lzma-native's API Eggline uses (the package ships no type declarations).
declare module 'lzma-native' {
  interface DecompressOptions {
    /** Largest memory liblzma may use, in bytes. */
    memlimit?: number;
  }
  /** Decodes an .xz (or .lzma) buffer with liblzma. */
  export function decompress(input: Buffer, options?: DecompressOptions): Promise<Buffer>;
  const lzma: { decompress: typeof decompress };
  export default lzma;
}

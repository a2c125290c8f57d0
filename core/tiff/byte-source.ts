// Random access to the bytes of a file, so large stacks are never loaded whole.

/** Reads byte ranges of one file; `read` returns fewer bytes than asked only at the end of the file. */
export interface ByteSource {
  /** File size in bytes. */
  readonly size: number;
  /** Bytes [offset, offset + length), clipped to the file size. */
  read(offset: number, length: number): Promise<Uint8Array>;
  /** Optional: reads bytes from `offset` into `target` (clipped at the end of the file) and returns how many. */
  readInto?(offset: number, target: Uint8Array): Promise<number>;
}

/** A ByteSource over bytes already in memory (tests, generated files). */
export function memoryByteSource(bytes: Uint8Array): ByteSource {
  return {
    size: bytes.length,
    read: async (offset: number, length: number) => {
      const start = Math.min(Math.max(0, offset), bytes.length);
      return bytes.subarray(start, Math.min(bytes.length, start + Math.max(0, length)));
    },
  };
}

// PackBits run-length decoding (TIFF 6.0 §9), written straight into the chunk's output buffer.

/**
 * Decodes PackBits `input` into `out` and returns the number of bytes written. Never writes past `out.length`:
 * a run that would overflow is cut there and decoding stops (a damaged stream cannot grow the output).
 */
export function decodePackBits(input: Uint8Array, out: Uint8Array): number {
  let ip = 0;
  let op = 0;
  const outLength = out.length;
  while (ip < input.length && op < outLength) {
    const n = input[ip++];
    if (n < 128) {
      // Literal run of n + 1 bytes.
      const end = Math.min(ip + n + 1, input.length);
      const count = Math.min(end - ip, outLength - op);
      out.set(input.subarray(ip, ip + count), op);
      op += count;
      ip = end;
    } else if (n > 128) {
      // Replicate the next byte 257 − n times (−1…−127 as a signed byte).
      if (ip >= input.length) break;
      const value = input[ip++];
      const count = Math.min(257 - n, outLength - op);
      out.fill(value, op, op + count);
      op += count;
    }
    // n === 128 (−128) is a no-op.
  }
  return op;
}

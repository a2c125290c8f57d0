// Undoing the TIFF predictors on a decoded chunk in place (TIFF 6.0 §14; Adobe Photoshop TIFF Technical Note 3).

/** Swaps the bytes of every `bytesPerSample`-byte value in place (file byte order ↔ little-endian host). */
export function swapBytesInPlace(bytes: Uint8Array, bytesPerSample: number): void {
  const n = bytes.length - (bytes.length % bytesPerSample);
  if (bytesPerSample === 2) {
    for (let i = 0; i < n; i += 2) { const a = bytes[i]; bytes[i] = bytes[i + 1]; bytes[i + 1] = a; }
  } else if (bytesPerSample === 4) {
    for (let i = 0; i < n; i += 4) {
      const a = bytes[i]; const b = bytes[i + 1];
      bytes[i] = bytes[i + 3]; bytes[i + 1] = bytes[i + 2]; bytes[i + 2] = b; bytes[i + 3] = a;
    }
  } else if (bytesPerSample === 8) {
    for (let i = 0; i < n; i += 8) bytes.subarray(i, i + 8).reverse();
  }
}

/**
 * Predictor 2 on values already in host order: each row's differences summed back along the row, sample by sample
 * (`stride` interleaved samples per pixel), modulo 2^bits — the unsigned view of the right width wraps by itself.
 * Rows are `rowValues` values long; a short last strip is handled by its length.
 */
export function undoHorizontalDifferencing(bytes: Uint8Array, bytesPerSample: number, rowValues: number, stride: number): void {
  const count = Math.floor(bytes.length / bytesPerSample);
  if (bytesPerSample === 1) accumulateRows(bytes, count, rowValues, stride);
  else if (bytesPerSample === 2) accumulateRows(new Uint16Array(bytes.buffer, bytes.byteOffset, count), count, rowValues, stride);
  else if (bytesPerSample === 4) accumulateRows(new Uint32Array(bytes.buffer, bytes.byteOffset, count), count, rowValues, stride);
  else accumulateRows64(new BigUint64Array(bytes.buffer, bytes.byteOffset, count), count, rowValues, stride);
}

function accumulateRows(v: Uint8Array | Uint16Array | Uint32Array, count: number, rowValues: number, stride: number): void {
  for (let row = 0; row + rowValues <= count; row += rowValues) {
    const end = row + rowValues;
    for (let i = row + stride; i < end; i++) v[i] += v[i - stride];
  }
}

function accumulateRows64(v: BigUint64Array, count: number, rowValues: number, stride: number): void {
  for (let row = 0; row + rowValues <= count; row += rowValues) {
    for (let i = row + stride; i < row + rowValues; i++) v[i] = BigInt.asUintN(64, v[i] + v[i - stride]);
  }
}

/**
 * Predictor 3 (floating point): per row, bytes were split into planes by significance (most significant first) and
 * then differenced byte by byte with `stride` samples per pixel. Undone into host (little-endian) order, whatever
 * the file's byte order, as libtiff's fpAcc does. `scratch` holds at least one row.
 */
export function undoFloatingPointPredictor(bytes: Uint8Array, bytesPerSample: number, rowValues: number, stride: number, scratch: Uint8Array): void {
  const rowBytes = rowValues * bytesPerSample;
  for (let row = 0; row + rowBytes <= bytes.length; row += rowBytes) {
    const end = row + rowBytes;
    for (let i = row + stride; i < end; i++) bytes[i] = (bytes[i] + bytes[i - stride]) & 0xff;
    scratch.set(bytes.subarray(row, end));
    for (let k = 0; k < rowValues; k++) {
      const at = row + k * bytesPerSample;
      for (let b = 0; b < bytesPerSample; b++) bytes[at + b] = scratch[(bytesPerSample - 1 - b) * rowValues + k];
    }
  }
}

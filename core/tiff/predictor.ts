// Undoing the horizontal differencing predictor (TIFF 6.0 §14, Predictor = 2) in the file's byte order.

/** How a decoded strip or tile is laid out. */
export interface PredictorLayout {
  /** Width of a strip (the image width) or tile, in pixels. */
  readonly widthPx: number;
  readonly bitsPerSample: number;
  /** Interleaved samples per pixel in this block (1 for PlanarConfiguration 2). */
  readonly stride: number;
  readonly littleEndian: boolean;
}

/**
 * Returns a copy of `block` with each row's differences summed back, sample by sample, modulo 2^bits.
 * Values are read and written in the file's byte order (libtiff tif_predict.c does the same after swapping),
 * so big-endian 16- and 32-bit data come out right. A short last strip is handled row by row.
 */
export function undoHorizontalPredictor(block: ArrayBuffer, layout: PredictorLayout): ArrayBuffer {
  const out = block.slice(0);
  const bytes = layout.bitsPerSample / 8;
  if (![1, 2, 4, 8].includes(bytes)) throw new Error(`horizontal predictor with ${layout.bitsPerSample}-bit samples is not supported`);
  const rowValues = layout.widthPx * layout.stride;
  const rows = Math.floor(out.byteLength / (rowValues * bytes));
  const view = new DataView(out);
  const le = layout.littleEndian;
  for (let r = 0; r < rows; r++) {
    const base = r * rowValues * bytes;
    for (let i = layout.stride; i < rowValues; i++) {
      const at = base + i * bytes;
      const prev = at - layout.stride * bytes;
      if (bytes === 1) view.setUint8(at, (view.getUint8(at) + view.getUint8(prev)) & 0xff);
      else if (bytes === 2) view.setUint16(at, (view.getUint16(at, le) + view.getUint16(prev, le)) & 0xffff, le);
      else if (bytes === 4) view.setUint32(at, (view.getUint32(at, le) + view.getUint32(prev, le)) >>> 0, le);
      else view.setBigUint64(at, BigInt.asUintN(64, view.getBigUint64(at, le) + view.getBigUint64(prev, le)), le);
    }
  }
  return out;
}

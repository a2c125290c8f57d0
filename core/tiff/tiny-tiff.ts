// Test helper: TIFF bytes built entry by entry in any byte order and flavour, and in-place patches of
// classic little-endian files, so tests can make exact and deliberately broken files. Not part of index.ts.

/** One entry to write: values are encoded with the field type; `raw` overrides them with exact bytes. */
export interface TinyEntry {
  readonly tag: number;
  readonly type: number;
  readonly values?: readonly (number | bigint)[];
  readonly raw?: Uint8Array;
  readonly count?: number;
}

/** Size of one value of a field type. */
function typeSize(type: number): number {
  return ({ 1: 1, 2: 1, 3: 2, 4: 4, 5: 8, 6: 1, 7: 1, 8: 2, 9: 4, 10: 8, 11: 4, 12: 8, 13: 4, 16: 8, 17: 8, 18: 8 } as Record<number, number>)[type] ?? 1;
}

/** Encodes values of one entry (RATIONAL values come in numerator/denominator pairs). */
function encodeValues(e: TinyEntry, le: boolean): Uint8Array {
  if (e.raw) return e.raw;
  const vals = e.values ?? [];
  const size = typeSize(e.type);
  const n = e.type === 5 || e.type === 10 ? vals.length / 2 : vals.length;
  const out = new Uint8Array(n * size);
  const v = new DataView(out.buffer);
  const step = e.type === 5 || e.type === 10 ? 4 : size;
  vals.forEach((x, i) => {
    const at = i * step;
    switch (e.type) {
      case 1: case 2: case 7: v.setUint8(at, Number(x)); break;
      case 6: v.setInt8(at, Number(x)); break;
      case 3: v.setUint16(at, Number(x), le); break;
      case 8: v.setInt16(at, Number(x), le); break;
      case 4: case 13: case 5: v.setUint32(at, Number(x), le); break;
      case 9: case 10: v.setInt32(at, Number(x), le); break;
      case 11: v.setFloat32(at, Number(x), le); break;
      case 12: v.setFloat64(at, Number(x), le); break;
      case 17: v.setBigInt64(at, BigInt(x), le); break;
      default: v.setBigUint64(at, BigInt(x), le);
    }
  });
  return out;
}

/** A one-IFD TIFF (or BigTIFF) whose IFD sits right after the header, followed by `tail` bytes. */
export function tinyTiff(entries: readonly TinyEntry[], opts: { littleEndian?: boolean; bigTiff?: boolean; tail?: Uint8Array; nextIfd?: number } = {}): Uint8Array {
  const le = opts.littleEndian ?? true;
  const big = opts.bigTiff ?? false;
  const headerBytes = big ? 16 : 8;
  const slot = big ? 8 : 4;
  const entryBytes = big ? 20 : 12;
  const countBytes = big ? 8 : 2;
  const tableBytes = countBytes + entries.length * entryBytes + slot;
  const values = entries.map((e) => encodeValues(e, le));
  let extraAt = headerBytes + tableBytes;
  const extraOffsets = values.map((v) => { if (v.length <= slot) return 0; const at = extraAt; extraAt += v.length + (v.length & 1); return at; });
  const tail = opts.tail ?? new Uint8Array(0);
  const out = new Uint8Array(extraAt + tail.length);
  const view = new DataView(out.buffer);
  out[0] = out[1] = le ? 0x49 : 0x4d;
  view.setUint16(2, big ? 43 : 42, le);
  if (big) { view.setUint16(4, 8, le); view.setBigUint64(8, BigInt(headerBytes), le); } else view.setUint32(4, headerBytes, le);
  const put = (at: number, x: number) => (big ? view.setBigUint64(at, BigInt(x), le) : view.setUint32(at, x, le));
  if (big) view.setBigUint64(headerBytes, BigInt(entries.length), le); else view.setUint16(headerBytes, entries.length, le);
  entries.forEach((e, i) => {
    const at = headerBytes + countBytes + i * entryBytes;
    view.setUint16(at, e.tag, le);
    view.setUint16(at + 2, e.type, le);
    const count = e.count ?? values[i].length / typeSize(e.type);
    if (big) view.setBigUint64(at + 4, BigInt(count), le); else view.setUint32(at + 4, count, le);
    if (values[i].length <= slot) out.set(values[i], at + 4 + slot);
    else put(at + 4 + slot, extraOffsets[i]);
  });
  put(headerBytes + countBytes + entries.length * entryBytes, opts.nextIfd ?? 0);
  values.forEach((v, i) => { if (extraOffsets[i]) out.set(v, extraOffsets[i]); });
  out.set(tail, extraAt);
  return out;
}

/** File offsets of IFD `ifdIndex` and of its entry for `tag` in a classic little-endian TIFF. */
export function findEntry(bytes: Uint8Array, tag: number, ifdIndex = 0): { ifdOffset: number; entryOffset: number } {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.length);
  let ifd = view.getUint32(4, true);
  for (let i = 0; i < ifdIndex; i++) ifd = view.getUint32(ifd + 2 + view.getUint16(ifd, true) * 12, true);
  const n = view.getUint16(ifd, true);
  for (let i = 0; i < n; i++) {
    if (view.getUint16(ifd + 2 + i * 12, true) === tag) return { ifdOffset: ifd, entryOffset: ifd + 2 + i * 12 };
  }
  throw new Error(`tag ${tag} not in IFD ${ifdIndex}`);
}

/** A copy of a classic LE TIFF with the inline SHORT/LONG value of `tag` in IFD `ifdIndex` replaced. */
export function patchInlineValue(bytes: Uint8Array, tag: number, value: number, ifdIndex = 0): Uint8Array {
  const out = bytes.slice();
  const view = new DataView(out.buffer);
  const { entryOffset } = findEntry(out, tag, ifdIndex);
  if (view.getUint16(entryOffset + 2, true) === 3) view.setUint16(entryOffset + 8, value, true);
  else view.setUint32(entryOffset + 8, value, true);
  return out;
}

/** A copy with the uint32 at `offset` replaced (little-endian). */
export function patchUint32(bytes: Uint8Array, offset: number, value: number): Uint8Array {
  const out = bytes.slice();
  new DataView(out.buffer).setUint32(offset, value, true);
  return out;
}

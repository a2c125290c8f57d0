// Typed tag values (TIFF 6.0 §2 field types; BigTIFF LONG8/SLONG8/IFD8).
import type { ByteSource } from './byte-source';
import { TiffError } from './errors';
import type { TiffHeader } from './header';
import type { Ifd, IfdEntry } from './ifd';
import { fieldTypeSize } from './tags';

/** A decoded tag value. RATIONALs are float64 quotients, with their uint32 (or int32) parts kept. */
export type TagValue =
  | { readonly kind: 'ascii'; readonly text: string }
  | { readonly kind: 'numbers'; readonly values: readonly number[] }
  | { readonly kind: 'rationals'; readonly values: readonly number[]; readonly numerators: readonly number[]; readonly denominators: readonly number[] }
  | { readonly kind: 'bytes'; readonly bytes: Uint8Array };

/** Loads the raw bytes of an entry's value (inline, or from its offset after a range check). */
async function entryBytes(source: ByteSource, entry: IfdEntry, fileLabel: string): Promise<Uint8Array> {
  const length = entry.count * fieldTypeSize(entry.type);
  if (entry.inline) return entry.inline.subarray(0, length);
  if (entry.valueOffset >= source.size || length > source.size - entry.valueOffset) {
    throw new TiffError('bad-offset', fileLabel,
      `tag ${entry.tag} value (${length} bytes at offset ${entry.valueOffset}) runs past the end of the file (${source.size} bytes)`);
  }
  const bytes = await source.read(entry.valueOffset, length);
  if (bytes.length < length) throw new TiffError('truncated', fileLabel, `file ends inside the value of tag ${entry.tag}`);
  return bytes;
}

/** Decodes the numeric values of an entry of any integer or float type. */
function decodeNumbers(view: DataView, type: number, count: number, le: boolean): number[] {
  const out = new Array<number>(count);
  const size = fieldTypeSize(type);
  for (let i = 0; i < count; i++) {
    const at = i * size;
    switch (type) {
      case 1: case 7: out[i] = view.getUint8(at); break;
      case 6: out[i] = view.getInt8(at); break;
      case 3: out[i] = view.getUint16(at, le); break;
      case 8: out[i] = view.getInt16(at, le); break;
      case 4: case 13: out[i] = view.getUint32(at, le); break;
      case 9: out[i] = view.getInt32(at, le); break;
      case 11: out[i] = view.getFloat32(at, le); break;
      case 12: out[i] = view.getFloat64(at, le); break;
      case 17: out[i] = Number(view.getBigInt64(at, le)); break;
      default: out[i] = Number(view.getBigUint64(at, le)); // 16 LONG8, 18 IFD8
    }
  }
  return out;
}

/** Decodes RATIONAL (5, unsigned) or SRATIONAL (10) pairs; the quotient is computed in float64. */
function decodeRationals(view: DataView, signed: boolean, count: number, le: boolean): TagValue {
  const numerators: number[] = [];
  const denominators: number[] = [];
  for (let i = 0; i < count; i++) {
    numerators.push(signed ? view.getInt32(i * 8, le) : view.getUint32(i * 8, le));
    denominators.push(signed ? view.getInt32(i * 8 + 4, le) : view.getUint32(i * 8 + 4, le));
  }
  const values = numerators.map((n, i) => (denominators[i] === 0 ? Number.NaN : n / denominators[i]));
  return { kind: 'rationals', values, numerators, denominators };
}

/** Decodes ASCII as UTF-8 (OME-XML is UTF-8) up to the first NUL. */
function decodeAscii(bytes: Uint8Array): string {
  const end = bytes.indexOf(0);
  return new TextDecoder('utf-8').decode(end >= 0 ? bytes.subarray(0, end) : bytes);
}

/** Reads and decodes one tag of an IFD, or null when the IFD lacks it. */
export async function readTag(source: ByteSource, header: TiffHeader, ifd: Ifd, tag: number, fileLabel: string): Promise<TagValue | null> {
  const entry = ifd.entries.get(tag);
  if (!entry || fieldTypeSize(entry.type) === 0) return null;
  const bytes = await entryBytes(source, entry, fileLabel);
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.length);
  const le = header.littleEndian;
  if (entry.type === 2) return { kind: 'ascii', text: decodeAscii(bytes) };
  if (entry.type === 7) return { kind: 'bytes', bytes: bytes.slice() };
  if (entry.type === 5 || entry.type === 10) return decodeRationals(view, entry.type === 10, entry.count, le);
  return { kind: 'numbers', values: decodeNumbers(view, entry.type, entry.count, le) };
}

/** All numeric values of a tag (rationals as quotients), or null when absent or text. */
export async function readNumbers(source: ByteSource, header: TiffHeader, ifd: Ifd, tag: number, fileLabel: string): Promise<readonly number[] | null> {
  const value = await readTag(source, header, ifd, tag, fileLabel);
  if (!value) return null;
  if (value.kind === 'numbers' || value.kind === 'rationals') return value.values;
  if (value.kind === 'bytes') return Array.from(value.bytes);
  return null;
}

/** The first numeric value of a tag, or `fallback` when absent. */
export async function readNumber(source: ByteSource, header: TiffHeader, ifd: Ifd, tag: number, fileLabel: string, fallback: number): Promise<number> {
  const values = await readNumbers(source, header, ifd, tag, fileLabel);
  return values && values.length > 0 ? values[0] : fallback;
}

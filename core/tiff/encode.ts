// Byte layout of a little-endian classic TIFF: header, strips, then one IFD per image (TIFF 6.0 §2, §8).
import { zlibSync } from 'fflate';
import type { PixelArray } from '../model';
import { Tag } from './tags';

/** One image (IFD) to encode; samples are interleaved (chunky) when samplesPerPixel > 1. */
export interface EncodeImage {
  readonly widthPx: number;
  readonly heightPx: number;
  readonly samplesPerPixel: number;
  readonly data: PixelArray;
  readonly description?: string;
  /** Pixels per unit as [numerator, denominator], with ResolutionUnit (2 inch, 3 cm). */
  readonly resolution?: { readonly x: [number, number]; readonly y: [number, number]; readonly unit: 2 | 3 };
  /** 1 none, 8 Deflate (zlib stream). */
  readonly compression: 1 | 8;
}

interface Entry { tag: number; type: number; values: readonly number[] | Uint8Array }

/** BitsPerSample and SampleFormat of a typed array. */
export function sampleFormatOf(data: PixelArray): { bits: number; format: 1 | 2 | 3 } {
  if (data instanceof Float32Array) return { bits: 32, format: 3 };
  if (data instanceof Float64Array) return { bits: 64, format: 3 };
  const signed = data instanceof Int8Array || data instanceof Int16Array || data instanceof Int32Array;
  return { bits: data.BYTES_PER_ELEMENT * 8, format: signed ? 2 : 1 };
}

/** Little-endian bytes of a typed array (copied, so the caller's array is never shared). */
function littleEndianBytes(data: PixelArray): Uint8Array {
  const bytes = new Uint8Array(data.buffer, data.byteOffset, data.byteLength).slice();
  if (new Uint8Array(new Uint16Array([1]).buffer)[0] === 1) return bytes;
  const size = data.BYTES_PER_ELEMENT;
  for (let i = 0; i < bytes.length; i += size) bytes.subarray(i, i + size).reverse();
  return bytes;
}

/** Splits an image into strips of about 64 KB, compressed if asked. */
function makeStrips(image: EncodeImage): { rowsPerStrip: number; strips: Uint8Array[] } {
  const bytes = littleEndianBytes(image.data);
  const rowBytes = image.widthPx * image.samplesPerPixel * image.data.BYTES_PER_ELEMENT;
  const rowsPerStrip = Math.max(1, Math.min(image.heightPx, Math.floor(65536 / rowBytes)));
  const strips: Uint8Array[] = [];
  for (let row = 0; row < image.heightPx; row += rowsPerStrip) {
    const raw = bytes.subarray(row * rowBytes, Math.min(image.heightPx, row + rowsPerStrip) * rowBytes);
    strips.push(image.compression === 8 ? zlibSync(raw) : raw);
  }
  return { rowsPerStrip, strips };
}

/** The tag entries of one image, sorted by tag as TIFF 6.0 §2 requires. */
function imageEntries(image: EncodeImage, rowsPerStrip: number, offsets: number[], counts: number[]): Entry[] {
  const { bits, format } = sampleFormatOf(image.data);
  const spp = image.samplesPerPixel;
  const entries: Entry[] = [
    { tag: Tag.NewSubfileType, type: 4, values: [0] },
    { tag: Tag.ImageWidth, type: 4, values: [image.widthPx] },
    { tag: Tag.ImageLength, type: 4, values: [image.heightPx] },
    { tag: Tag.BitsPerSample, type: 3, values: new Array<number>(spp).fill(bits) },
    { tag: Tag.Compression, type: 3, values: [image.compression] },
    { tag: Tag.PhotometricInterpretation, type: 3, values: [1] }, // BlackIsZero: grey levels
    { tag: Tag.StripOffsets, type: 4, values: offsets },
    { tag: Tag.SamplesPerPixel, type: 3, values: [spp] },
    { tag: Tag.RowsPerStrip, type: 4, values: [rowsPerStrip] },
    { tag: Tag.StripByteCounts, type: 4, values: counts },
    { tag: Tag.PlanarConfiguration, type: 3, values: [1] },
    { tag: Tag.SampleFormat, type: 3, values: new Array<number>(spp).fill(format) },
  ];
  if (spp > 1) entries.push({ tag: 338, type: 3, values: new Array<number>(spp - 1).fill(0) }); // ExtraSamples: unspecified
  if (image.description !== undefined) entries.push({ tag: Tag.ImageDescription, type: 2, values: new TextEncoder().encode(`${image.description}\0`) });
  if (image.resolution) {
    entries.push({ tag: Tag.XResolution, type: 5, values: image.resolution.x }, { tag: Tag.YResolution, type: 5, values: image.resolution.y },
      { tag: Tag.ResolutionUnit, type: 3, values: [image.resolution.unit] });
  }
  return entries.sort((a, b) => a.tag - b.tag);
}

/** Bytes of one entry's value. */
function valueBytes(entry: Entry): Uint8Array {
  if (entry.values instanceof Uint8Array) return entry.values;
  const size = entry.type === 3 ? 2 : 4;
  const out = new Uint8Array(entry.values.length * size);
  const view = new DataView(out.buffer);
  entry.values.forEach((v, i) => (size === 2 ? view.setUint16(i * 2, v, true) : view.setUint32(i * 4, v, true)));
  return out;
}

/** Serialises one IFD at `offset` (entries, next pointer, then out-of-line values). */
function ifdBytes(entries: Entry[], offset: number, nextOffset: number): Uint8Array {
  const values = entries.map(valueBytes);
  const tableBytes = 2 + entries.length * 12 + 4;
  const extra = values.reduce((sum, v) => sum + (v.length > 4 ? v.length + (v.length & 1) : 0), 0);
  const out = new Uint8Array(tableBytes + extra);
  const view = new DataView(out.buffer);
  view.setUint16(0, entries.length, true);
  let valueAt = tableBytes;
  entries.forEach((e, i) => {
    const at = 2 + i * 12;
    const count = e.values instanceof Uint8Array ? e.values.length : e.type === 5 ? e.values.length / 2 : e.values.length;
    view.setUint16(at, e.tag, true);
    view.setUint16(at + 2, e.type, true);
    view.setUint32(at + 4, count, true);
    if (values[i].length <= 4) {
      out.set(values[i], at + 8);
    } else {
      view.setUint32(at + 8, offset + valueAt, true);
      out.set(values[i], valueAt);
      valueAt += values[i].length + (values[i].length & 1);
    }
  });
  view.setUint32(2 + entries.length * 12, nextOffset, true);
  return out;
}

/**
 * encodeTiff piece by piece: each image is taken from `images` only when the previous one's strips are written, and
 * every piece goes to `write(bytes, position)` (position = byte offset in the file; the 8-byte header comes last, at
 * position 0, once the first IFD's offset is known). Returns the file's length. Only one image's pixels are held at a
 * time, so a file larger than memory can be written to disk. Throws before writing the IFDs when the file would
 * exceed 4 GB.
 */
export function encodeTiffPieces(images: Iterable<EncodeImage>, write: (bytes: Uint8Array, position: number) => void): number {
  let at = 8;
  const layouts: Entry[][] = [];
  for (const image of images) {
    const { rowsPerStrip, strips } = makeStrips(image);
    const offsets: number[] = [];
    for (const strip of strips) {
      offsets.push(at);
      write(strip, at);
      at += strip.length;
      if (at & 1) { write(new Uint8Array(1), at); at += 1; } // keep offsets on word boundaries
    }
    layouts.push(imageEntries(image, rowsPerStrip, offsets, strips.map((s) => s.length)));
  }
  const firstIfd = at;
  const sizes = layouts.map((entries) => ifdBytes(entries, 0, 0).length);
  if (at + sizes.reduce((sum, n) => sum + n, 0) > 0xffffffff) throw new Error('image data exceeds 4 GB, too large for a classic TIFF');
  layouts.forEach((entries, i) => {
    const next = i + 1 < layouts.length ? at + sizes[i] : 0;
    write(ifdBytes(entries, at, next), at);
    at += sizes[i];
  });
  const header = new Uint8Array(8);
  const view = new DataView(header.buffer);
  view.setUint16(0, 0x4949, false); // "II"
  view.setUint16(2, 42, true);
  view.setUint32(4, firstIfd, true);
  write(header, 0);
  return at;
}

/** A complete little-endian TIFF holding `images` in order, one IFD each. */
export function encodeTiff(images: readonly EncodeImage[]): Uint8Array {
  const pieces: { bytes: Uint8Array; position: number }[] = [];
  const length = encodeTiffPieces(images, (bytes, position) => pieces.push({ bytes, position }));
  const out = new Uint8Array(length);
  for (const { bytes, position } of pieces) out.set(bytes, position);
  return out;
}

// The 8-byte TIFF header (TIFF 6.0 §2) or the 16-byte BigTIFF header (BigTIFF design).
import type { ByteSource } from './byte-source';
import { TiffError } from './errors';

/** Byte order, flavour and first IFD offset of a TIFF or BigTIFF file. */
export interface TiffHeader {
  readonly littleEndian: boolean;
  readonly bigTiff: boolean;
  /** Byte offset of IFD 0. */
  readonly firstIfdOffset: number;
}

/** Hex dump of the first bytes, for "not a TIFF" messages. */
function firstBytesHex(bytes: Uint8Array): string {
  return Array.from(bytes.subarray(0, 4), (b) => b.toString(16).toUpperCase().padStart(2, '0')).join(' ');
}

/** Reads and checks the header; throws TiffError ('empty', 'not-tiff', 'truncated', 'bad-offset'). */
export async function readTiffHeader(source: ByteSource, fileLabel: string): Promise<TiffHeader> {
  if (source.size === 0) throw new TiffError('empty', fileLabel, 'empty file (0 bytes)');
  const bytes = await source.read(0, 16);
  const order = String.fromCharCode(bytes[0] ?? 0, bytes[1] ?? 0);
  if (order !== 'II' && order !== 'MM') {
    throw new TiffError('not-tiff', fileLabel, `not a TIFF file (first bytes are ${firstBytesHex(bytes)})`);
  }
  if (bytes.length < 8) {
    throw new TiffError('truncated', fileLabel, `file ends inside the TIFF header (${bytes.length} bytes)`);
  }
  const littleEndian = order === 'II';
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.length);
  const version = view.getUint16(2, littleEndian);
  if (version === 42) {
    return checkFirstOffset(source, fileLabel, { littleEndian, bigTiff: false, firstIfdOffset: view.getUint32(4, littleEndian) }, 8);
  }
  if (version !== 43) {
    throw new TiffError('not-tiff', fileLabel, `not a TIFF file (byte order ${order} but version ${version}, expected 42 or 43)`);
  }
  if (bytes.length < 16) {
    throw new TiffError('truncated', fileLabel, `file ends inside the BigTIFF header (${bytes.length} bytes)`);
  }
  const offsetSize = view.getUint16(4, littleEndian);
  if (offsetSize !== 8 || view.getUint16(6, littleEndian) !== 0) {
    throw new TiffError('not-tiff', fileLabel, `not a valid BigTIFF file (offset size ${offsetSize}, expected 8)`);
  }
  const first = Number(view.getBigUint64(8, littleEndian));
  return checkFirstOffset(source, fileLabel, { littleEndian, bigTiff: true, firstIfdOffset: first }, 16);
}

/** IFD 0 must exist and lie after the header, inside the file. */
function checkFirstOffset(source: ByteSource, fileLabel: string, header: TiffHeader, headerBytes: number): TiffHeader {
  const offset = header.firstIfdOffset;
  if (offset === 0) throw new TiffError('empty', fileLabel, 'contains no images (first IFD offset is 0)');
  if (source.size <= headerBytes) {
    throw new TiffError('truncated', fileLabel, `file ends after the TIFF header (${source.size} bytes)`);
  }
  if (offset < headerBytes || offset >= source.size) {
    throw new TiffError('bad-offset', fileLabel, `first IFD offset ${offset} is outside the file (${source.size} bytes)`);
  }
  return header;
}

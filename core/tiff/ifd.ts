// Image File Directories: entry lists and the chain that links them (TIFF 6.0 §2; BigTIFF design).
import type { ByteSource } from './byte-source';
import { TiffError } from './errors';
import { readTiffHeader, type TiffHeader } from './header';
import { checkTagCounts } from './tag-counts';
import { fieldTypeSize } from './tags';

/** One 12-byte (TIFF) or 20-byte (BigTIFF) directory entry. */
export interface IfdEntry {
  readonly tag: number;
  /** TIFF field type code (1 BYTE … 12 DOUBLE, 16 LONG8, 17 SLONG8, 18 IFD8). */
  readonly type: number;
  readonly count: number;
  /** The value bytes when they fit in the entry, else null. */
  readonly inline: Uint8Array | null;
  /** File offset of the value when it does not fit in the entry. */
  readonly valueOffset: number;
}

/** A parsed IFD: where it is, its entries by tag, and the next IFD's offset (0 = last). */
export interface Ifd {
  readonly index: number;
  readonly offset: number;
  readonly entries: ReadonlyMap<number, IfdEntry>;
  readonly nextOffset: number;
}

/** Reads an unsigned integer of 2, 4 or 8 bytes as a JS number. */
function readUint(view: DataView, at: number, bytes: number, le: boolean): number {
  if (bytes === 2) return view.getUint16(at, le);
  if (bytes === 4) return view.getUint32(at, le);
  return Number(view.getBigUint64(at, le));
}

/** Reads IFD number `index` at `offset`; throws TiffError on offsets outside the file or a cut IFD. */
export async function readIfd(source: ByteSource, header: TiffHeader, offset: number, index: number, fileLabel: string): Promise<Ifd> {
  const le = header.littleEndian;
  const countBytes = header.bigTiff ? 8 : 2;
  const entryBytes = header.bigTiff ? 20 : 12;
  const pointerBytes = header.bigTiff ? 8 : 4;
  if (offset >= source.size) {
    throw new TiffError('bad-offset', fileLabel, `IFD ${index} offset ${offset} is past the end of the file (${source.size} bytes)`);
  }
  const countRaw = await source.read(offset, countBytes);
  if (countRaw.length < countBytes) throw new TiffError('truncated', fileLabel, `file ends inside IFD ${index} (offset ${offset})`);
  const count = readUint(new DataView(countRaw.buffer, countRaw.byteOffset, countBytes), 0, countBytes, le);
  if (count === 0) throw new TiffError('bad-offset', fileLabel, `IFD ${index} at offset ${offset} has no entries`);
  const blockBytes = count * entryBytes + pointerBytes;
  const fits = blockBytes <= source.size - offset - countBytes;
  // A cut file ends inside a sensible IFD; a garbage pointer lands on a huge "count" that no real writer uses.
  if (count > 65535 || (!fits && count > 4096)) {
    throw new TiffError('bad-offset', fileLabel, `IFD ${index} at offset ${offset} claims ${count} entries, more than the file can hold`);
  }
  if (!fits) throw new TiffError('truncated', fileLabel, `file ends inside IFD ${index} (offset ${offset})`);
  const block = await source.read(offset + countBytes, blockBytes);
  if (block.length < blockBytes) throw new TiffError('truncated', fileLabel, `file ends inside IFD ${index} (offset ${offset})`);
  const ifd = parseIfdBlock(block, header, count, offset, index);
  checkTagCounts(ifd, source.size, fileLabel);
  return ifd;
}

/**
 * An IFD's entries kept as the IFD's own bytes (one small copy) and decoded when asked for. Why: a file of 65,535
 * planes held 65,535 Maps of entry objects for the whole analysis (about 2 KiB of heap each), and the garbage
 * collector spent seconds walking them; this keeps one byte array and a tag index per IFD. The first entry of a
 * repeated tag wins, as before.
 */
class IfdEntryMap implements ReadonlyMap<number, IfdEntry> {
  readonly #bytes: Uint8Array;
  readonly #tags: Uint16Array;
  readonly #at: Uint16Array | Uint32Array;
  readonly #le: boolean;
  readonly #big: boolean;

  constructor(bytes: Uint8Array, count: number, le: boolean, big: boolean) {
    this.#bytes = bytes;
    this.#le = le;
    this.#big = big;
    const entryBytes = big ? 20 : 12;
    const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.length);
    const tags: number[] = [];
    const at: number[] = [];
    const seen = new Set<number>();
    for (let i = 0; i < count; i++) {
      const tag = view.getUint16(i * entryBytes, le);
      if (seen.has(tag)) continue;
      seen.add(tag);
      tags.push(tag);
      at.push(i * entryBytes);
    }
    this.#tags = Uint16Array.from(tags);
    this.#at = count * entryBytes < 65536 ? Uint16Array.from(at) : Uint32Array.from(at);
  }

  get size(): number { return this.#tags.length; }

  #entry(k: number): IfdEntry {
    const bytes = this.#bytes;
    const at = this.#at[k];
    const slotBytes = this.#big ? 8 : 4;
    const view = new DataView(bytes.buffer, bytes.byteOffset + at, 4 + 2 * slotBytes);
    const type = view.getUint16(2, this.#le);
    const n = readUint(view, 4, slotBytes, this.#le);
    const slot = 4 + slotBytes;
    const valueBytes = n * fieldTypeSize(type); // unknown types: 0 bytes, never read
    const inline = valueBytes <= slotBytes ? bytes.subarray(at + slot, at + slot + slotBytes) : null;
    const valueOffset = inline ? 0 : readUint(view, slot, slotBytes, this.#le);
    return { tag: this.#tags[k], type, count: n, inline, valueOffset };
  }

  #find(tag: number): number {
    const tags = this.#tags;
    for (let k = 0; k < tags.length; k++) if (tags[k] === tag) return k;
    return -1;
  }

  get(tag: number): IfdEntry | undefined {
    const k = this.#find(tag);
    return k < 0 ? undefined : this.#entry(k);
  }

  has(tag: number): boolean { return this.#find(tag) >= 0; }

  forEach(fn: (value: IfdEntry, key: number, map: ReadonlyMap<number, IfdEntry>) => void, thisArg?: unknown): void {
    for (let k = 0; k < this.#tags.length; k++) fn.call(thisArg, this.#entry(k), this.#tags[k], this);
  }

  *entries(): MapIterator<[number, IfdEntry]> {
    for (let k = 0; k < this.#tags.length; k++) yield [this.#tags[k], this.#entry(k)];
  }

  *keys(): MapIterator<number> {
    for (let k = 0; k < this.#tags.length; k++) yield this.#tags[k];
  }

  *values(): MapIterator<IfdEntry> {
    for (let k = 0; k < this.#tags.length; k++) yield this.#entry(k);
  }

  [Symbol.iterator](): MapIterator<[number, IfdEntry]> { return this.entries(); }
}

/** Splits an IFD's bytes into entries; values that fit in the entry are kept inline. */
function parseIfdBlock(block: Uint8Array, header: TiffHeader, count: number, offset: number, index: number): Ifd {
  const le = header.littleEndian;
  const entryBytes = header.bigTiff ? 20 : 12;
  const slotBytes = header.bigTiff ? 8 : 4;
  const view = new DataView(block.buffer, block.byteOffset, block.length);
  const entries = new IfdEntryMap(block.slice(0, count * entryBytes), count, le, header.bigTiff);
  const nextOffset = readUint(view, count * entryBytes, slotBytes, le);
  return { index, offset, entries, nextOffset };
}

/** Walks the main IFD chain from IFD 0; guards against loops, offsets past the end and absurd lengths. */
export async function readIfdChain(source: ByteSource, header: TiffHeader, fileLabel: string, maxIfds = 1_000_000): Promise<Ifd[]> {
  const ifds: Ifd[] = [];
  const seen = new Set<number>();
  let offset = header.firstIfdOffset;
  while (offset !== 0) {
    if (seen.has(offset)) {
      throw new TiffError('ifd-loop', fileLabel, `IFD chain loops back to offset ${offset} after ${ifds.length} IFDs`);
    }
    if (ifds.length >= maxIfds) throw new TiffError('too-large', fileLabel, `more than ${maxIfds} IFDs in the chain`);
    seen.add(offset);
    const ifd = await readIfd(source, header, offset, ifds.length, fileLabel);
    ifds.push(ifd);
    offset = ifd.nextOffset;
  }
  return ifds;
}

/** The header and main IFD chain of a file, read on the first call and shared by later ones (a plane source's view). */
export function lazyIfdChain(source: ByteSource, fileLabel: string): () => Promise<{ header: TiffHeader; ifds: Ifd[] }> {
  let chain: Promise<{ header: TiffHeader; ifds: Ifd[] }> | null = null;
  return () => (chain ??= readTiffHeader(source, fileLabel).then(async (header) => ({ header, ifds: await readIfdChain(source, header, fileLabel) })));
}

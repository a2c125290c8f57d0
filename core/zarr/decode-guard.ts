// Keeps a damaged chunk from making a decoder allocate more than the chunk can hold. Blosc and Zstandard streams
// declare their decoded size in a header, which is checked before decoding; zlib and gzip streams declare none, so
// they are decoded by an inflater that stops at the chunk's size when the caller supplies one (node:zlib in core/io).
import * as zarr from 'zarrita';
import { decodeBloscLz4 } from './blosc-lz4';

/** Decoded size a Blosc stream declares (its header's nbytes), or null when the stream is too short to say. */
export function declaredBloscBytes(bytes: Uint8Array): number | null {
  // Source: Blosc 1 format — 16-byte header: version, versionlz, flags, typesize, nbytes (u32 LE), blocksize, cbytes.
  if (bytes.length < 16) return null;
  return new DataView(bytes.buffer, bytes.byteOffset, 16).getUint32(4, true);
}

/** Decoded size a Zstandard frame declares (Frame_Content_Size), or null when it does not declare one. */
export function declaredZstdBytes(bytes: Uint8Array): number | null {
  // Source: RFC 8878 §3.1.1 — magic 0xFD2FB528, Frame_Header_Descriptor, optional Window_Descriptor and
  // Dictionary_ID, then Frame_Content_Size of 0, 1, 2, 4 or 8 bytes (the 2-byte form is offset by 256).
  if (bytes.length < 6 || bytes[0] !== 0x28 || bytes[1] !== 0xb5 || bytes[2] !== 0x2f || bytes[3] !== 0xfd) return null;
  const fhd = bytes[4];
  const singleSegment = (fhd >> 5) & 1;
  const fcsFlag = fhd >> 6;
  const dictBytes = [0, 1, 2, 4][fhd & 3];
  const fcsBytes = fcsFlag === 0 ? singleSegment : [0, 2, 4, 8][fcsFlag];
  if (fcsBytes === 0) return null;
  const at = 5 + (singleSegment ? 0 : 1) + dictBytes;
  if (bytes.length < at + fcsBytes) return null;
  let size = 0;
  for (let i = fcsBytes - 1; i >= 0; i--) size = size * 256 + bytes[at + i];
  return fcsBytes === 2 ? size + 256 : size;
}

/** Bounded inflater: decodes a zlib or gzip stream, failing once the output would pass `maxBytes`. */
export type BoundedInflate = (bytes: Uint8Array, maxBytes: number, format: 'zlib' | 'gzip') => Uint8Array;

const BYTES: Record<string, number> = { int8: 1, uint8: 1, bool: 1, int16: 2, uint16: 2, float16: 2, int32: 4, uint32: 4, float32: 4, int64: 8, uint64: 8, float64: 8 };

type Entry = { fromConfig: (config: unknown, meta: { dataType: string; shape: number[] }) => { decode(b: Uint8Array): unknown } };
type Loader = () => Promise<Entry>;

/** Wraps a registry entry so each codec it makes checks (or bounds) a stream before decoding it. */
function guarded(load: Loader, check: (bytes: Uint8Array, maxBytes: number) => Uint8Array | null): Loader {
  return async () => {
    const entry = await load();
    return {
      ...entry,
      fromConfig(config, meta) {
        const codec = entry.fromConfig(config, meta);
        const maxBytes = meta.shape.reduce((a, b) => a * b, 1) * (BYTES[meta.dataType] ?? 8);
        const wrapped = Object.create(codec) as typeof codec;
        wrapped.decode = (bytes: Uint8Array) => check(bytes, maxBytes) ?? codec.decode(bytes);
        return wrapped;
      },
    };
  };
}

/** Throws when a declared size passes the chunk's bytes. */
function refuseDeclared(declared: number | null, maxBytes: number, codec: string): null {
  if (declared !== null && declared > maxBytes) throw new Error(`${codec} stream declares ${declared} bytes, more than the chunk's ${maxBytes}`);
  return null;
}

const headerChecked = new WeakSet<object>();
const inflateBounded = new WeakSet<object>();

/**
 * Installs the size checks in zarrita's codec registry (its documented extension point; each part once per
 * registry): Blosc and Zstandard headers checked (Blosc-LZ4 then decoded in TypeScript), zlib and gzip through
 * `inflate` when given.
 */
export function guardZarrCodecs(inflate?: BoundedInflate): void {
  const registry = zarr.registry as unknown as Map<string, Loader>;
  if (!headerChecked.has(registry)) { headerChecked.add(registry); guardHeaders(registry); }
  if (inflate && !inflateBounded.has(registry)) { inflateBounded.add(registry); boundInflate(registry, inflate); }
}

/** Blosc and Zstandard codecs that refuse a stream declaring more bytes than the chunk holds. */
function guardHeaders(registry: Map<string, Loader>): void {
  for (const name of ['blosc', 'numcodecs.blosc']) {
    const load = registry.get(name);
    // LZ4 inside Blosc (the common case) is decoded in TypeScript, the rest by numcodecs (see blosc-lz4.ts).
    if (load) registry.set(name, guarded(load, (b, max) => refuseDeclared(declaredBloscBytes(b), max, 'Blosc') ?? decodeBloscLz4(b)));
  }
  for (const name of ['zstd', 'numcodecs.zstd']) {
    const load = registry.get(name);
    if (load) registry.set(name, guarded(load, (b, max) => refuseDeclared(declaredZstdBytes(b), max, 'Zstandard')));
  }
}

/** zlib and gzip codecs decoded by `inflate`, which stops at the chunk's size. */
function boundInflate(registry: Map<string, Loader>, inflate: BoundedInflate): void {
  for (const [name, format] of [['zlib', 'zlib'], ['numcodecs.zlib', 'zlib'], ['gzip', 'gzip'], ['numcodecs.gzip', 'gzip']] as const) {
    const load = registry.get(name);
    if (load) registry.set(name, guarded(load, (b, max) => inflate(b, max, format)));
  }
}

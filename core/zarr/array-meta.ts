// A readable summary of a zarr array's storage (codecs, chunk key separator) from its raw .zarray or zarr.json.

type Json = Record<string, unknown>;

/** How the array's chunks are stored, for `inspect` and for checking codecs before any chunk is read. */
export interface ArrayStorage {
  readonly zarrFormat: 2 | 3;
  /** Codec chain as text, e.g. "blosc (lz4, level 5, byte shuffle)" or "bytes (little) → zstd (level 3)". */
  readonly codecs: string;
  /** Names to look up in zarrita's codec registry (v2 names carry the "numcodecs." prefix zarrita gives them). */
  readonly codecNames: readonly string[];
  /** Separator between chunk indices in chunk keys ("." or "/"). */
  readonly separator: string;
  /**
   * How chunk keys start inside the array's folder ("" for Zarr v2 and v3's "v2" encoding, "c" + separator for v3's
   * default encoding) when every chunk is one Blosc stream of little-endian (or 1-byte) values in C order: such
   * chunks can be decoded outside zarrita (BloscChunkReader). Null for any other codec chain or layout.
   */
  readonly bloscKeyPrefix: string | null;
}

const SHUFFLE = ['no shuffle', 'byte shuffle', 'bit shuffle'];

/** "blosc (lz4, level 5, byte shuffle)", "zlib (level 1)", "zstd (level 3)", or the bare id. */
function describeCodec(id: string, config: Json): string {
  const parts: string[] = [];
  if (typeof config.cname === 'string') parts.push(config.cname);
  const level = config.clevel ?? config.level;
  if (typeof level === 'number') parts.push(`level ${level}`);
  if (typeof config.shuffle === 'number') parts.push(SHUFFLE[config.shuffle] ?? `shuffle ${config.shuffle}`);
  if (typeof config.shuffle === 'string') parts.push(config.shuffle === 'noshuffle' ? 'no shuffle' : config.shuffle);
  if (typeof config.endian === 'string') parts.push(config.endian);
  return parts.length > 0 ? `${id} (${parts.join(', ')})` : id;
}

const isObject = (v: unknown): v is Json => typeof v === 'object' && v !== null && !Array.isArray(v);

/** Storage summary of a Zarr v2 .zarray document. */
function v2Storage(meta: Json): ArrayStorage {
  const filters = Array.isArray(meta.filters) ? meta.filters.filter(isObject) : [];
  const chain = [...filters, ...(isObject(meta.compressor) ? [meta.compressor] : [])];
  const ids = chain.map((c) => String(c.id));
  // Source: Zarr storage specification version 2 — dtype "<" little-endian, "|" not applicable (1 byte); order "C".
  const plainBlosc = filters.length === 0 && isObject(meta.compressor) && meta.compressor.id === 'blosc'
    && meta.order === 'C' && typeof meta.dtype === 'string' && /^[<|]/.test(meta.dtype);
  return {
    zarrFormat: 2,
    codecs: chain.length === 0 ? 'none' : chain.map((c) => describeCodec(String(c.id), c)).join(' → '),
    codecNames: ids.filter((id) => id !== 'fixedscaleoffset').map((id) => `numcodecs.${id}`),
    separator: typeof meta.dimension_separator === 'string' ? meta.dimension_separator : '.',
    bloscKeyPrefix: plainBlosc ? '' : null,
  };
}

/** Codecs of a v3 chain, with the inner chain of a sharding codec. */
function v3Codecs(list: unknown): { text: string[]; names: string[] } {
  const text: string[] = [];
  const names: string[] = [];
  for (const c of Array.isArray(list) ? list.filter(isObject) : []) {
    const name = String(c.name);
    const config = isObject(c.configuration) ? c.configuration : {};
    if (name === 'sharding_indexed') {
      const inner = v3Codecs(config.codecs);
      const shape = Array.isArray(config.chunk_shape) ? ` ${config.chunk_shape.join('×')}` : '';
      text.push(`sharding (inner chunks${shape}: ${inner.text.join(' → ')})`);
      names.push(...inner.names, ...v3Codecs(config.index_codecs).names);
    } else {
      text.push(describeCodec(name, config));
      names.push(name);
    }
  }
  return { text, names };
}

/** Storage summary of a Zarr v3 zarr.json array document. */
function v3Storage(meta: Json): ArrayStorage {
  const { text, names } = v3Codecs(meta.codecs);
  const encoding = isObject(meta.chunk_key_encoding) ? meta.chunk_key_encoding : {};
  const config = isObject(encoding.configuration) ? encoding.configuration : {};
  const fallback = encoding.name === 'v2' ? '.' : '/';
  const separator = typeof config.separator === 'string' ? config.separator : fallback;
  // Source: Zarr v3.0 core specification — codecs "bytes" (endian little, or absent for 1-byte types) then "blosc";
  // chunk key encoding "default" gives "c" + separator + indices, "v2" the indices alone.
  const list = Array.isArray(meta.codecs) ? meta.codecs.filter(isObject) : [];
  const bytes = list[0];
  const bytesConfig = bytes && isObject(bytes.configuration) ? bytes.configuration : {};
  const plainBlosc = list.length === 2 && bytes.name === 'bytes' && (bytesConfig.endian === undefined || bytesConfig.endian === 'little')
    && list[1].name === 'blosc' && (encoding.name === 'default' || encoding.name === 'v2');
  return {
    zarrFormat: 3,
    codecs: text.length === 0 ? 'none' : text.join(' → '),
    codecNames: names,
    separator,
    bloscKeyPrefix: plainBlosc ? (encoding.name === 'v2' ? '' : `c${separator}`) : null,
  };
}

/** Storage summary of an array's raw metadata (.zarray for v2, zarr.json for v3). */
export function arrayStorage(meta: Json, zarrFormat: 2 | 3): ArrayStorage {
  return zarrFormat === 2 ? v2Storage(meta) : v3Storage(meta);
}

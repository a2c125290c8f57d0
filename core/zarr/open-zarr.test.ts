import { describe, expect, it } from 'vitest';
import { openOmeZarr } from './open-zarr';
import type { ZarrStore } from './store';

const enc = (v: unknown) => new TextEncoder().encode(typeof v === 'string' ? v : JSON.stringify(v));

/** A store over an in-memory map of keys to bytes (keys start with "/"). */
function memoryStore(entries: Record<string, unknown>): ZarrStore & { entries: Map<string, Uint8Array> } {
  const map = new Map(Object.entries(entries).map(([k, v]) => [k, v instanceof Uint8Array ? v : enc(v)]));
  return { entries: map, async get(key) { return map.get(key); } };
}

/** NGFF 0.4 attributes for (c, y, x) with µm units and a 0.5 µm pixel (demo data). */
const attrs04 = (extra: Record<string, unknown> = {}) => ({
  multiscales: [{
    version: '0.4',
    axes: [{ name: 'c', type: 'channel' }, { name: 'y', type: 'space', unit: 'micrometer' }, { name: 'x', type: 'space', unit: 'micrometer' }],
    datasets: [{ path: '0', coordinateTransformations: [{ type: 'scale', scale: [1, 0.5, 0.5] }] }],
  }],
  omero: { channels: [{ label: 'gradient' }, { label: 'boundary' }] },
  ...extra,
});

/** Raw little-endian bytes of one uint16 chunk of `n` values, value k at element k (demo data). */
const rawChunk = (n: number, offset = 0) => new Uint8Array(Uint16Array.from({ length: n }, (_, i) => offset + i).buffer);

/** Demo data: a Zarr v2 store of shape (2, 4, 6) uint16 with (1, 4, 6) chunks and no compressor. */
function v2Store(overrides: Record<string, unknown> = {}, zarray: Record<string, unknown> = {}): ZarrStore & { entries: Map<string, Uint8Array> } {
  return memoryStore({
    '/.zgroup': { zarr_format: 2 },
    '/.zattrs': attrs04(),
    '/0/.zarray': { zarr_format: 2, shape: [2, 4, 6], chunks: [1, 4, 6], dtype: '<u2', compressor: null, fill_value: 7, order: 'C', filters: null, ...zarray },
    '/0/0.0.0': rawChunk(24),
    '/0/1.0.0': rawChunk(24, 100),
    ...overrides,
  });
}

describe('openOmeZarr', () => {
  it('reads a small NGFF 0.4 store: sizes, channel labels, pixel size, planes', async () => {
    const { info, source, details, warnings } = await openOmeZarr(v2Store(), 'a.ome.zarr');
    expect([info.sizeX, info.sizeY, info.sizeZ, info.sizeC, info.sizeT, info.sampleType]).toEqual([6, 4, 1, 2, 1, 'uint16']);
    expect(info.channelNames).toEqual(['gradient', 'boundary']);
    expect(info.pixelSize).toEqual({ xUm: 0.5, yUm: 0.5, zUm: null, source: 'ome-zarr' });
    expect(info.compression).toBe('none');
    expect(details).toMatchObject({ zarrFormat: 2, ngffVersion: '0.4', chunks: [1, 4, 6], separator: '.', timeStepS: null });
    expect(Array.from((await source.readPlane(0, 1, 0)).data)).toEqual(Array.from({ length: 24 }, (_, i) => 100 + i));
    expect(warnings).toEqual([]);
  });

  it('converts nanometres and reads a pixel size without a unit as unknown, with a warning', async () => {
    const nm = attrs04();
    nm.multiscales[0].axes[1].unit = 'nanometer';
    nm.multiscales[0].axes[2].unit = 'nanometer';
    nm.multiscales[0].datasets[0].coordinateTransformations[0].scale = [1, 325, 325];
    expect((await openOmeZarr(v2Store({ '/.zattrs': nm }), 'a')).info.pixelSize).toMatchObject({ xUm: 0.325, source: 'ome-zarr' });
    const none = attrs04();
    delete (none.multiscales[0].axes[1] as { unit?: string }).unit;
    delete (none.multiscales[0].axes[2] as { unit?: string }).unit;
    const opened = await openOmeZarr(v2Store({ '/.zattrs': none }), 'b.ome.zarr');
    expect(opened.info.pixelSize).toEqual({ xUm: null, yUm: null, zUm: null, source: 'unknown' });
    expect(opened.warnings).toEqual(['b.ome.zarr: NGFF scale given without a unit on the x/y axes; pixel size unknown']);
  });

  it('reads a missing chunk as the fill value and says how many chunks were missing', async () => {
    // Source: Zarr v2 specification §chunks — "missing chunks" are read as the array's fill_value.
    const store = v2Store();
    store.entries.delete('/0/1.0.0');
    const { source, warnings } = await openOmeZarr(store, 'a.ome.zarr');
    expect(Array.from((await source.readPlane(0, 1, 0)).data)).toEqual(new Array(24).fill(7));
    expect(warnings).toEqual(['a.ome.zarr: 1 chunk(s) missing (first 0/1.0.0); read as the fill value']);
  });

  it('opens the one image of a bioformats2raw collection and refuses several', async () => {
    const inner = Object.fromEntries([...v2Store().entries].map(([k, v]) => [`/0${k}`, v]));
    const one = memoryStore({ '/.zgroup': { zarr_format: 2 }, '/.zattrs': { 'bioformats2raw.layout': 3 }, ...inner });
    const opened = await openOmeZarr(one, 'c.zarr');
    expect(opened.details.arrayPath).toBe('0/0');
    expect(Array.from((await opened.source.readPlane(0, 0, 0)).data).slice(0, 3)).toEqual([0, 1, 2]);
    const two = memoryStore({ '/.zgroup': { zarr_format: 2 }, '/.zattrs': { 'bioformats2raw.layout': 3 }, ...inner, '/1/.zgroup': { zarr_format: 2 } });
    await expect(openOmeZarr(two, 'c.zarr')).rejects.toThrow('c.zarr: holds several images (bioformats2raw collection); collections are not read yet');
  });

  it('gives one line naming the store for missing or malformed metadata', async () => {
    const cases: [ZarrStore, string | RegExp][] = [
      [memoryStore({}), 'a.ome.zarr: has no zarr.json, .zattrs or .zgroup: not a Zarr store'],
      [memoryStore({ '/.zgroup': { zarr_format: 2 } }), 'a.ome.zarr: has no .zattrs (no NGFF metadata): not an OME-Zarr image'],
      [memoryStore({ '/.zarray': { zarr_format: 2 } }), 'a.ome.zarr: is a single Zarr array without NGFF metadata: not an OME-Zarr image'],
      [memoryStore({ '/zarr.json': { zarr_format: 3, node_type: 'array' } }), 'a.ome.zarr: is a single Zarr array without NGFF metadata: not an OME-Zarr image'],
      [memoryStore({ '/zarr.json': { zarr_format: 2, node_type: 'group' } }), 'a.ome.zarr: zarr.json does not say zarr_format 3'],
      [v2Store({ '/.zattrs': '{"multiscales": [' }), /^a\.ome\.zarr: \.zattrs is not valid JSON \(.+\)$/],
      [memoryStore({ '/zarr.json': 'not json' }), /^a\.ome\.zarr: zarr\.json is not valid JSON \(.+\)$/],
      [v2Store({ '/.zattrs': [1, 2] }), 'a.ome.zarr: .zattrs is not a JSON object'],
      [v2Store({ '/.zattrs': { other: 1 } }), 'a.ome.zarr: has no NGFF "multiscales" metadata: not an OME-Zarr image'],
      [memoryStore({ '/.zattrs': attrs04() }), 'a.ome.zarr: the full-resolution array "0" is missing (no 0/.zarray)'],
      [v2Store({ '/0/.zarray': '{"shape": ' }), /^a\.ome\.zarr: 0\/\.zarray is not valid JSON/],
    ];
    for (const [store, message] of cases) await expect(openOmeZarr(store, 'a.ome.zarr')).rejects.toThrow(message);
  });

  it('refuses codecs, sample types and shapes it cannot read, before reading any chunk', async () => {
    const cases: [Record<string, unknown>, string][] = [
      [{ compressor: { id: 'lzma', preset: 6 } }, 'a.ome.zarr: array "0" uses codec lzma, which Eggline cannot decode'],
      [{ dtype: '<i8' }, 'a.ome.zarr: sample type int64 is not supported (8, 16 or 32-bit integers, 32 or 64-bit floats)'],
      [{ shape: [2, 4, 6, 1] , chunks: [1, 4, 6, 1] }, 'a.ome.zarr: NGFF declares 3 axes but the array has 4 dimensions'],
      [{ shape: [2, 4, -6] }, 'a.ome.zarr: shape [2, 4, -6] must be positive whole numbers'],
      [{ chunks: [1, 4] }, 'a.ome.zarr: chunk shape has 2 dimensions, the array 3'],
      [{ shape: [2, 400000, 600000], chunks: [1, 64, 64] }, 'a.ome.zarr: one plane of 600000×400000 uint16 pixels needs 480000000000 bytes, over the 1073741824-byte limit'],
      [{ chunks: [1, 40000, 60000] }, 'a.ome.zarr: one chunk (1×40000×60000 uint16) needs 4800000000 bytes decoded, over the 1073741824-byte limit'],
      [{ shape: [200000, 4, 6] }, 'a.ome.zarr: declares 200000 planes per time point, over the limit of 100000'],
    ];
    for (const [zarray, message] of cases) await expect(openOmeZarr(v2Store({}, zarray), 'a.ome.zarr')).rejects.toThrow(message);
  });

  it('names the chunk that does not decode, and one whose size disagrees with the chunk shape', async () => {
    // Demo data: a Blosc chunk that is not a Blosc stream; a raw chunk cut short.
    const blosc = v2Store({ '/0/0.0.0': new Uint8Array([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]) }, { compressor: { id: 'blosc', cname: 'lz4', clevel: 5, shuffle: 1 } });
    const a = await openOmeZarr(blosc, 'a.ome.zarr');
    await expect(a.source.readPlane(0, 0, 0)).rejects.toMatchObject({ code: 'decode' });
    // numcodecs' Blosc returns no bytes for a stream it cannot read; the size check names the chunk then.
    await expect(a.source.readPlane(0, 0, 0)).rejects.toThrow(/^a\.ome\.zarr: chunk \(0, 0, 0\) (cannot be decoded: |decodes to 0 values, expected 24)/);
    const short = await openOmeZarr(v2Store({ '/0/0.0.0': rawChunk(10) }), 'b.ome.zarr');
    await expect(short.source.readPlane(0, 0, 0)).rejects.toThrow(/^b\.ome\.zarr: chunk \(0, 0, 0\) (cannot be decoded|decodes to 10 values, expected 24)/);
  });
});

describe('decoded-size guards', () => {
  it('refuses a Blosc chunk whose header declares more bytes than the chunk holds, before decoding', async () => {
    // Source: Blosc 1 format — nbytes (u32 little-endian) at byte 4 of the 16-byte header. Demo data: a header
    // declaring 1 GB for a 48-byte chunk.
    const header = new Uint8Array(32);
    header.set([2, 1, 1, 2]);
    new DataView(header.buffer).setUint32(4, 1e9, true);
    new DataView(header.buffer).setUint32(12, 32, true);
    const store = v2Store({ '/0/0.0.0': header }, { compressor: { id: 'blosc', cname: 'lz4', clevel: 5, shuffle: 1 } });
    const { source } = await openOmeZarr(store, 'a.ome.zarr');
    await expect(source.readPlane(0, 0, 0)).rejects.toThrow('a.ome.zarr: chunk (0, 0, 0) cannot be decoded: Blosc stream declares 1000000000 bytes, more than the chunk\'s 48');
  });

  it('reads the decoded size a Zstandard frame declares', async () => {
    const { declaredZstdBytes, declaredBloscBytes } = await import('./decode-guard');
    // Source: RFC 8878 §3.1.1.1 — single-segment frame with a 1-byte Frame_Content_Size (FHD 0x20), and a frame with
    // a 4-byte size (FHD 0x80, window descriptor present). Demo data for the values.
    expect(declaredZstdBytes(Uint8Array.from([0x28, 0xb5, 0x2f, 0xfd, 0x20, 48, 0]))).toBe(48);
    expect(declaredZstdBytes(Uint8Array.from([0x28, 0xb5, 0x2f, 0xfd, 0x80, 0x58, 0x00, 0xca, 0x9a, 0x3b]))).toBe(1e9);
    expect(declaredZstdBytes(Uint8Array.from([0x28, 0xb5, 0x2f, 0xfd, 0x00, 0x58]))).toBeNull();
    expect(declaredZstdBytes(Uint8Array.from([1, 2, 3, 4, 5, 6]))).toBeNull();
    expect(declaredBloscBytes(new Uint8Array(8))).toBeNull();
  });
});

describe('time axis', () => {
  it('gives each time point its time from the NGFF time scale and unit', async () => {
    // Source: NGFF 0.4 multiscales example — time axis "t" in "millisecond" with scale 0.1 (0.1 ms per time point).
    const attrs = {
      multiscales: [{
        version: '0.4',
        axes: [{ name: 't', type: 'time', unit: 'millisecond' }, { name: 'y', type: 'space', unit: 'micrometer' }, { name: 'x', type: 'space', unit: 'micrometer' }],
        datasets: [{ path: '0', coordinateTransformations: [{ type: 'scale', scale: [1, 0.5, 0.5] }] }],
        coordinateTransformations: [{ type: 'scale', scale: [0.1, 1, 1] }],
      }],
    };
    const { info, details } = await openOmeZarr(v2Store({ '/.zattrs': attrs }), 'a.ome.zarr');
    expect(info.sizeT).toBe(2);
    expect(details.timeStepS).toBeCloseTo(1e-4, 15);
    expect(info.time?.source).toBe('ome-zarr');
    expect(Array.from(info.time!.timesS!)).toEqual([0, details.timeStepS]);
  });
});

// Writes OME-Zarr (NGFF 0.5, Zarr v3) stores with zarrita from the planes of a stack, one store per codec chain,
// key separator or axis layout. Used by the tests (test/zarr) beside the Zarr v2 stores Python's zarr writes.
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import * as zarr from 'zarrita';

/** A stack as planes in (c, z) order: planes[c * sizeZ + z], each sizeX × sizeY, uint16. */
export interface V3Source {
  readonly sizeX: number;
  readonly sizeY: number;
  readonly sizeZ: number;
  readonly sizeC: number;
  readonly planes: readonly Uint16Array[];
  readonly pixelSizeUm: number;
  readonly zStepUm: number;
  readonly channels: readonly string[];
}

interface V3Case {
  readonly codecs: zarr.CodecMetadata[];
  readonly separator: '.' | '/';
  /** 'tczyx' (5-D) or 'czyx' (no time axis). */
  readonly layout: 'tczyx' | 'czyx';
  /** Chunk shape over y and x (planes are chunked one z and one channel at a time). */
  readonly tileYX: readonly [number, number] | null;
}

const LE = { name: 'bytes', configuration: { endian: 'little' } };

/** The v3 stores written: name → codec chain, chunk key separator and layout. */
export const V3_CASES: Readonly<Record<string, V3Case>> = {
  'v3-bytes': { codecs: [LE], separator: '/', layout: 'tczyx', tileYX: null },
  'v3-bytes-big-endian': { codecs: [{ name: 'bytes', configuration: { endian: 'big' } }], separator: '/', layout: 'tczyx', tileYX: null },
  'v3-blosc-lz4': { codecs: [LE, { name: 'blosc', configuration: { cname: 'lz4', clevel: 5, shuffle: 'shuffle', typesize: 2, blocksize: 0 } }], separator: '/', layout: 'tczyx', tileYX: null },
  'v3-zstd-dot': { codecs: [LE, { name: 'zstd', configuration: { level: 3, checksum: false } }], separator: '.', layout: 'tczyx', tileYX: [64, 64] },
  'v3-blosc-zstd-czyx': { codecs: [LE, { name: 'blosc', configuration: { cname: 'zstd', clevel: 3, shuffle: 'bitshuffle', typesize: 2, blocksize: 0 } }], separator: '/', layout: 'czyx', tileYX: [50, 70] },
};

/** NGFF 0.5 group attributes for one image with one level. */
function ngffAttributes(names: string, src: V3Source): Record<string, unknown> {
  const unit: Record<string, string> = { t: 'second', z: 'micrometer', y: 'micrometer', x: 'micrometer' };
  const type: Record<string, string> = { t: 'time', c: 'channel' };
  const scale: Record<string, number> = { t: 1, c: 1, z: src.zStepUm, y: src.pixelSizeUm, x: src.pixelSizeUm };
  return {
    ome: {
      version: '0.5',
      multiscales: [{
        name: 'demo',
        axes: [...names].map((n) => ({ name: n, type: type[n] ?? 'space', ...(unit[n] ? { unit: unit[n] } : {}) })),
        datasets: [{ path: '0', coordinateTransformations: [{ type: 'scale', scale: [...names].map((n) => scale[n]) }] }],
      }],
      omero: { channels: src.channels.map((label) => ({ label, color: 'FFFFFF', window: { start: 0, end: 65535, min: 0, max: 65535 } })) },
    },
  };
}

/** Writes one v3 store `<out>/<name>.ome.zarr`; returns its path. */
export async function writeV3Store(src: V3Source, out: string, name: string): Promise<string> {
  const spec = V3_CASES[name];
  const store = new Map<string, Uint8Array>();
  const root = zarr.root(store);
  const names = spec.layout;
  await zarr.create(root, { attributes: ngffAttributes(names, src) });
  const shape = names === 'tczyx' ? [1, src.sizeC, src.sizeZ, src.sizeY, src.sizeX] : [src.sizeC, src.sizeZ, src.sizeY, src.sizeX];
  const [ty, tx] = spec.tileYX ?? [src.sizeY, src.sizeX];
  const chunkShape = [...shape.slice(0, -2).map(() => 1), ty, tx];
  const array = await zarr.create(root.resolve('0'), {
    shape, chunkShape, dtype: 'uint16', codecs: spec.codecs, chunkSeparator: spec.separator, dimensionNames: [...names],
  });
  const data = new Uint16Array(src.sizeC * src.sizeZ * src.sizeX * src.sizeY);
  src.planes.forEach((p, i) => data.set(p, i * p.length));
  const stride = [...shape.keys()].map((d) => shape.slice(d + 1).reduce((a, b) => a * b, 1));
  await zarr.set(array, null, { data, shape, stride });
  const path = join(out, `${name}.ome.zarr`);
  for (const [key, value] of store) {
    const file = join(path, ...key.split('/').filter((p) => p !== ''));
    mkdirSync(dirname(file), { recursive: true });
    writeFileSync(file, value);
  }
  return path;
}

// Seeded damaged copies of small stacks, one mutation each: the generator behind the fuzz test and `npm run fuzz`.
import { createRng, type Rng } from '../../core/stats';
import { writeOmeTiff, writePlainTiff } from '../../core/tiff';

/** Every kind of damage made. */
export const MUTATION_KINDS = [
  'bit-flips', 'tag-entry-overwritten', 'inflated-count', 'wrong-strip-offset', 'truncated', 'ifd-loop', 'garbled-description',
] as const;
export type MutationKind = (typeof MUTATION_KINDS)[number];

/** Demo data: a plain two-plane 40×30 uint16 TIFF and a 2-channel × 2-slice OME-TIFF (Deflate), both tiny. */
export function baseFixtures(): Uint8Array[] {
  const plane = (n: number) => ({ width: 40, height: 30, data: Uint16Array.from({ length: 1200 }, (_, i) => (n * 977 + i * 13) % 4000) });
  return [
    writePlainTiff([plane(0), plane(1)]),
    writeOmeTiff([0, 1, 2, 3].map(plane), { sizeZ: 2, sizeC: 2, sizeT: 1, dimensionOrder: 'XYZCT', channelNames: ['g', 'b'], physicalSizeXUm: 1 }),
  ];
}

const int = (rng: Rng, n: number): number => Math.floor(rng.uniform() * n);

/** IFD entries of a classic little-endian TIFF: file offset of each 12-byte entry, over the whole chain (max 64 IFDs). */
function entryOffsets(b: Uint8Array): number[] {
  const v = new DataView(b.buffer, b.byteOffset, b.length);
  const out: number[] = [];
  let ifd = v.getUint32(4, true);
  for (let k = 0; k < 64 && ifd > 0 && ifd + 2 <= b.length; k++) {
    const n = v.getUint16(ifd, true);
    for (let i = 0; i < n && ifd + 2 + i * 12 + 12 <= b.length; i++) out.push(ifd + 2 + i * 12);
    const next = ifd + 2 + n * 12;
    ifd = next + 4 <= b.length ? v.getUint32(next, true) : 0;
  }
  return out;
}

/** One damaged copy of `base` of the given kind (TIFF 6.0 §2 layout: 12-byte entries of tag, type, count, value). */
export function mutate(base: Uint8Array, kind: MutationKind, rng: Rng): Uint8Array {
  const b = base.slice();
  const v = new DataView(b.buffer);
  const entries = entryOffsets(b);
  const entry = entries[int(rng, entries.length)];
  const tagOf = (at: number): number => v.getUint16(at, true);
  switch (kind) {
    case 'bit-flips': for (let i = 0; i < 1 + int(rng, 8); i++) { const at = int(rng, b.length); b[at] ^= 1 << int(rng, 8); } return b;
    case 'tag-entry-overwritten': for (let i = 0; i < 12; i++) b[entry + i] = int(rng, 256); return b;
    case 'inflated-count': v.setUint32(entry + 4, [2 ** 31 - 1, 2 ** 32 - 1, 65536, 1_000_000][int(rng, 4)], true); return b;
    case 'wrong-strip-offset': {
      const strips = entries.filter((e) => tagOf(e) === 273 || tagOf(e) === 279);
      const at = strips[int(rng, strips.length)] ?? entry;
      v.setUint32(at + 8, [0, b.length - 3, b.length + 1000, int(rng, b.length), 2 ** 32 - 1][int(rng, 5)], true);
      return b;
    }
    case 'truncated': return b.slice(0, int(rng, b.length));
    case 'ifd-loop': {
      const first = v.getUint32(4, true);
      const n = v.getUint16(first, true);
      v.setUint32(first + 2 + n * 12, first, true);
      return b;
    }
    case 'garbled-description': {
      const desc = entries.find((e) => tagOf(e) === 270);
      if (desc === undefined) { b[int(rng, b.length)] ^= 0xff; return b; }
      const at = v.getUint32(desc + 8, true);
      const len = v.getUint32(desc + 4, true);
      for (let i = 0; i < Math.min(len, 64); i++) { const p = at + int(rng, len); if (p < b.length) b[p] = int(rng, 256); }
      return b;
    }
  }
}

/** `count` damaged files cycling through every kind and both fixtures, from `seed`: name, kind and bytes. */
export function* mutants(count: number, seed: number): Generator<{ name: string; kind: MutationKind; bytes: Uint8Array }> {
  const rng = createRng(seed);
  const bases = baseFixtures();
  for (let i = 0; i < count; i++) {
    const kind = MUTATION_KINDS[i % MUTATION_KINDS.length];
    yield { name: `m${String(i).padStart(5, '0')}-${kind}.tif`, kind, bytes: mutate(bases[Math.floor(i / MUTATION_KINDS.length) % bases.length], kind, rng) };
  }
}

import { describe, expect, it } from 'vitest';
import { memoryByteSource } from './byte-source';
import { readTiffHeader } from './header';
import { readIfdChain } from './ifd';
import { readTag } from './tag-value';
import { tinyTiff, type TinyEntry } from './tiny-tiff';

// Source: TIFF 6.0 §2 (field types 1–12, byte order applies to every value); BigTIFF design (LONG8/SLONG8/IFD8, 20-byte entries).
const ENTRIES: TinyEntry[] = [
  { tag: 256, type: 3, values: [33] },
  { tag: 257, type: 4, values: [70000] },
  { tag: 258, type: 3, values: [16, 16, 16] },
  { tag: 270, type: 2, values: [...new TextEncoder().encode('h\u00e9llo'), 0] },
  { tag: 282, type: 5, values: [4294967295, 139586] },
  { tag: 283, type: 10, values: [-3, 4] },
  { tag: 300, type: 8, values: [-2, 5] },
  { tag: 301, type: 9, values: [-70000] },
  { tag: 302, type: 11, values: [0.5] },
  { tag: 303, type: 12, values: [-1.25, 1e-300] },
  { tag: 304, type: 6, values: [-7] },
  { tag: 305, type: 7, values: [1, 2, 3, 4, 5] },
];

const BIG_ENTRIES: TinyEntry[] = [
  ...ENTRIES,
  { tag: 310, type: 16, values: [2n ** 40n + 3n] },
  { tag: 311, type: 17, values: [-(2n ** 35n)] },
];

async function tagsOf(bytes: Uint8Array) {
  const source = memoryByteSource(bytes);
  const header = await readTiffHeader(source, 't.tif');
  const [ifd] = await readIfdChain(source, header, 't.tif');
  return (tag: number) => readTag(source, header, ifd, tag, 't.tif');
}

describe('readTag', () => {
  for (const littleEndian of [true, false]) {
    for (const bigTiff of [false, true]) {
      it(`decodes every field type (${littleEndian ? 'II' : 'MM'}, ${bigTiff ? 'BigTIFF' : 'classic'})`, async () => {
        const tag = await tagsOf(tinyTiff(bigTiff ? BIG_ENTRIES : ENTRIES, { littleEndian, bigTiff }));
        expect(await tag(256)).toEqual({ kind: 'numbers', values: [33] });
        expect(await tag(257)).toEqual({ kind: 'numbers', values: [70000] });
        expect(await tag(258)).toEqual({ kind: 'numbers', values: [16, 16, 16] });
        expect(await tag(270)).toEqual({ kind: 'ascii', text: 'h\u00e9llo' });
        // Source: note on tifffile output (4294967295/139586 px/cm = 0.325 µm): numerators above 2³¹ read unsigned.
        const res = await tag(282);
        expect(res).toMatchObject({ kind: 'rationals', numerators: [4294967295], denominators: [139586] });
        expect(res?.kind === 'rationals' && res.values[0]).toBe(4294967295 / 139586);
        expect(await tag(283)).toMatchObject({ kind: 'rationals', values: [-0.75], numerators: [-3], denominators: [4] });
        expect(await tag(300)).toEqual({ kind: 'numbers', values: [-2, 5] });
        expect(await tag(301)).toEqual({ kind: 'numbers', values: [-70000] });
        expect(await tag(302)).toEqual({ kind: 'numbers', values: [0.5] });
        expect(await tag(303)).toEqual({ kind: 'numbers', values: [-1.25, 1e-300] });
        expect(await tag(304)).toEqual({ kind: 'numbers', values: [-7] });
        expect(await tag(305)).toEqual({ kind: 'bytes', bytes: new Uint8Array([1, 2, 3, 4, 5]) });
        expect(await tag(999)).toBeNull();
        if (bigTiff) {
          expect(await tag(310)).toEqual({ kind: 'numbers', values: [2 ** 40 + 3] });
          expect(await tag(311)).toEqual({ kind: 'numbers', values: [-(2 ** 35)] });
        }
      });
    }
  }

  it('rejects a value whose offset runs past the end of the file', async () => {
    // Demo data: a 3-SHORT BitsPerSample pointing beyond a 100-byte file.
    const bytes = tinyTiff([{ tag: 258, type: 3, values: [16, 16, 16] }]);
    const view = new DataView(bytes.buffer);
    view.setUint32(8 + 2 + 8, 5000, true);
    const tag = await tagsOf(bytes);
    await expect(tag(258)).rejects.toMatchObject({ code: 'bad-offset', message: expect.stringMatching(/^t\.tif: tag 258 value/) });
  });
});

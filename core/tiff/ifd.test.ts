import { describe, expect, it } from 'vitest';
import { memoryByteSource } from './byte-source';
import { readTiffHeader } from './header';
import { readIfdChain } from './ifd';
import { patchUint32, tinyTiff } from './tiny-tiff';

const entries = [{ tag: 256, type: 3, values: [4] }, { tag: 257, type: 3, values: [2] }];

async function chain(bytes: Uint8Array, label = 'c.tif') {
  const source = memoryByteSource(bytes);
  return readIfdChain(source, await readTiffHeader(source, label), label);
}

describe('readIfdChain', () => {
  // Source: TIFF 6.0 §2 (IFD = 2-byte count, 12-byte entries, 4-byte next offset; 0 ends the chain).
  it('reads one IFD with inline values', async () => {
    const ifds = await chain(tinyTiff(entries));
    expect(ifds).toHaveLength(1);
    expect(ifds[0].offset).toBe(8);
    expect(ifds[0].nextOffset).toBe(0);
    expect([...ifds[0].entries.keys()]).toEqual([256, 257]);
  });

  it('stops an IFD chain that loops back on itself', async () => {
    // Demo data: the next-IFD pointer of IFD 0 points at IFD 0.
    await expect(chain(tinyTiff(entries, { nextIfd: 8 }), 'loop.tif')).rejects.toMatchObject({
      code: 'ifd-loop', message: 'loop.tif: IFD chain loops back to offset 8 after 1 IFDs',
    });
  });

  it('rejects a next-IFD offset past the end of the file', async () => {
    const bytes = tinyTiff(entries, { nextIfd: 99999 });
    await expect(chain(bytes, 'p.tif')).rejects.toMatchObject({
      code: 'bad-offset', message: `p.tif: IFD 1 offset 99999 is past the end of the file (${bytes.length} bytes)`,
    });
  });

  it('rejects an absurd entry count and an IFD cut short', async () => {
    const absurd = tinyTiff(entries).slice();
    new DataView(absurd.buffer).setUint16(8, 60000, true);
    await expect(chain(absurd, 'n.tif')).rejects.toMatchObject({ code: 'bad-offset', message: 'n.tif: IFD 0 at offset 8 claims 60000 entries, more than the file can hold' });
    const cut = tinyTiff(entries, { tail: new Uint8Array(40) }).subarray(0, 20);
    await expect(chain(cut, 'cut.tif')).rejects.toMatchObject({ code: 'truncated', message: 'cut.tif: file ends inside IFD 0 (offset 8)' });
  });

  it('reads a chain of IFDs (patched next pointer to a second copy)', async () => {
    const one = tinyTiff(entries);
    const two = new Uint8Array(one.length + 30);
    two.set(one);
    two.set(one.subarray(8, 8 + 30), one.length); // IFD bytes again at the end
    const linked = patchUint32(two, 8 + 2 + 24, one.length);
    const ifds = await chain(linked);
    expect(ifds.map((i) => i.offset)).toEqual([8, one.length]);
  });

  it('keeps the first entry of a repeated tag and reads entries alike in every byte order and flavour', async () => {
    // Source: TIFF 6.0 §2 (entries of 12 bytes, values of 4 bytes or less inline) and the BigTIFF design (20-byte
    // entries, 8-byte inline slot); which of two entries with one tag wins is our choice (the first), from memory
    // also libtiff's when it warns about a duplicate. Demo data.
    const twice = [{ tag: 256, type: 3, values: [4] }, { tag: 257, type: 4, values: [70000] }, { tag: 256, type: 3, values: [9] }];
    for (const opts of [{}, { littleEndian: false }, { bigTiff: true }, { bigTiff: true, littleEndian: false }]) {
      const [ifd] = await chain(tinyTiff(twice, opts));
      expect(ifd.entries.size).toBe(2);
      expect([...ifd.entries.keys()]).toEqual([256, 257]);
      const width = ifd.entries.get(256)!;
      expect({ type: width.type, count: width.count, valueOffset: width.valueOffset }).toEqual({ type: 3, count: 1, valueOffset: 0 });
      const le = opts.littleEndian ?? true;
      expect(new DataView(width.inline!.buffer, width.inline!.byteOffset).getUint16(0, le)).toBe(4);
      expect(new DataView(ifd.entries.get(257)!.inline!.buffer, ifd.entries.get(257)!.inline!.byteOffset).getUint32(0, le)).toBe(70000);
      expect(ifd.entries.has(258)).toBe(false);
      expect(ifd.entries.get(258)).toBeUndefined();
      expect([...ifd.entries.values()].map((e) => e.tag)).toEqual([256, 257]);
    }
  });
});


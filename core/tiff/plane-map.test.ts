import { describe, expect, it } from 'vitest';
import type { OmeTiffData } from './ome';
import { mapOmePlanes, sequentialPlaneMap } from './plane-map';

const td = (p: Partial<OmeTiffData>): OmeTiffData => ({ ifd: undefined, firstZ: 0, firstC: 0, firstT: 0, planeCount: undefined, fileName: null, ...p });
const counts = { sizeZ: 3, sizeC: 2, sizeT: 1 };

describe('mapOmePlanes', () => {
  // Source: OME-TIFF specification (empty TiffData: IFD 0 is Z0-C0-T0, later IFDs follow DimensionOrder; extra IFDs ignored).
  it('maps an empty TiffData in XYZCT and XYCZT order; extra IFDs are ignored', () => {
    // planeIfd layout: slot = (t·C + c)·Z + z → [c0z0, c0z1, c0z2, c1z0, c1z1, c1z2]
    expect(Array.from(mapOmePlanes('XYZCT', counts, [], 8, 'a'))).toEqual([0, 1, 2, 3, 4, 5]);
    expect(Array.from(mapOmePlanes('XYCZT', counts, [td({})], 6, 'a'))).toEqual([0, 2, 4, 1, 3, 5]);
  });

  // Source: ome.xsd TiffData (IFD default 0; FirstZ/C/T default 0; PlaneCount 1 when IFD is given).
  it('applies several TiffData elements with IFD, FirstZ/FirstC and PlaneCount', () => {
    const map = mapOmePlanes('XYZCT', counts, [
      td({ ifd: 5, planeCount: 3 }), // c0 z0..2 in IFDs 5,6,7
      td({ ifd: 0, firstC: 1 }), // PlaneCount defaults to 1: c1 z0 in IFD 0
      td({ ifd: 1, firstZ: 1, firstC: 1, planeCount: 2 }), // c1 z1..2 in IFDs 1,2
    ], 8, 'a');
    expect(Array.from(map)).toEqual([5, 6, 7, 0, 1, 2]);
  });

  it('rejects gaps, IFDs past the chain and multi-file sets with exact messages', () => {
    expect(() => mapOmePlanes('XYZCT', counts, [td({ ifd: 0, planeCount: 5 })], 8, 'g.ome.tif'))
      .toThrow('g.ome.tif: OME TiffData gives no IFD for plane z=2, c=1, t=0');
    expect(() => mapOmePlanes('XYZCT', counts, [td({ ifd: 3, planeCount: 6 })], 6, 'g.ome.tif'))
      .toThrow('g.ome.tif: OME TiffData refers to IFD 6 but the file has 6 IFDs');
    expect(() => mapOmePlanes('XYZCT', counts, [], 4, 'g.ome.tif')).toThrow('g.ome.tif: OME TiffData gives no IFD for plane z=1, c=1, t=0');
    // Source: OME-TIFF specification (multi-file sets: TiffData/UUID@FileName names the file holding the planes).
    const twoFiles = [td({ ifd: 0, planeCount: 3, fileName: 'g.ome.tif' }), td({ ifd: 0, planeCount: 3, firstC: 1, fileName: 'part2.ome.tif' })];
    expect(() => mapOmePlanes('XYZCT', counts, twoFiles, 6, 'dir/g.ome.tif'))
      .toThrow('dir/g.ome.tif: multi-file OME-TIFF sets are not supported (planes stored in part2.ome.tif)');
    // A single FileName (even after the file was renamed) is this file.
    expect(Array.from(mapOmePlanes('XYZCT', counts, [td({ fileName: 'old-name.ome.tif' })], 6, 'dir/g.ome.tif'))).toEqual([0, 1, 2, 3, 4, 5]);
    expect(() => mapOmePlanes('XYZCT', counts, [td({ firstZ: 3 })], 6, 'g.ome.tif')).toThrow(/FirstZ=3 .* is out of range$/);
  });
});

describe('sequentialPlaneMap', () => {
  // Source: ImageJ hyperstack convention (channel fastest, then slice, then frame) — from memory.
  it('maps a list of IFDs in XYCZT order', () => {
    expect(Array.from(sequentialPlaneMap('XYCZT', { sizeZ: 2, sizeC: 2, sizeT: 1 }, [10, 11, 12, 13]))).toEqual([10, 12, 11, 13]);
  });
});

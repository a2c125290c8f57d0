// Which IFD holds plane (z, c, t): OME TiffData rules (OME-TIFF spec; ome.xsd TiffData).
import type { DimensionOrder } from '../model';
import { planeCoordinates, planeNumber, planeSlot, type PlaneCounts } from './dimension-order';
import { TiffError } from './errors';
import type { OmeTiffData } from './ome';

/** Plane-to-IFD map in file order: planeIfd[planeSlot(z,c,t)] = start IFD + plane number (no OME needed). */
export function sequentialPlaneMap(order: DimensionOrder, counts: PlaneCounts, ifds: readonly number[]): Int32Array {
  const total = counts.sizeZ * counts.sizeC * counts.sizeT;
  const map = new Int32Array(total);
  for (let n = 0; n < total; n++) {
    const { z, c, t } = planeCoordinates(order, counts, n);
    map[planeSlot(counts, z, c, t)] = ifds[n];
  }
  return map;
}

/** The last path component of a label, to compare with TiffData UUID@FileName. */
function baseName(label: string): string {
  return label.split(/[\\/]/).pop() ?? label;
}

/** Applies the TiffData elements (an empty list acts like one empty <TiffData/>); throws TiffError('bad-ome') on gaps. */
export function mapOmePlanes(order: DimensionOrder, counts: PlaneCounts, tiffData: readonly OmeTiffData[], ifdCount: number, fileLabel: string): Int32Array {
  const total = counts.sizeZ * counts.sizeC * counts.sizeT;
  const map = new Int32Array(total).fill(-1);
  const elements: readonly OmeTiffData[] = tiffData.length > 0 ? tiffData
    : [{ ifd: undefined, firstZ: 0, firstC: 0, firstT: 0, planeCount: undefined, fileName: null }];
  // Files get renamed after writing, so one FileName for every TiffData means "this file"; several mean a set.
  const names = [...new Set(elements.map((td) => td.fileName).filter((n): n is string => n !== null))];
  if (names.length > 1) {
    const others = names.filter((n) => n !== baseName(fileLabel));
    throw new TiffError('unsupported', fileLabel, `multi-file OME-TIFF sets are not supported (planes stored in ${others.join(', ')})`);
  }
  for (const td of elements) applyTiffData(map, order, counts, td, ifdCount, fileLabel);
  const missing = map.indexOf(-1);
  if (missing >= 0) {
    const z = missing % counts.sizeZ;
    const c = Math.floor(missing / counts.sizeZ) % counts.sizeC;
    const t = Math.floor(missing / (counts.sizeZ * counts.sizeC));
    throw new TiffError('bad-ome', fileLabel, `OME TiffData gives no IFD for plane z=${z}, c=${c}, t=${t}`);
  }
  return map;
}

/** One TiffData: PlaneCount IFDs from IFD, starting at plane (FirstZ, FirstC, FirstT) in DimensionOrder. */
function applyTiffData(map: Int32Array, order: DimensionOrder, counts: PlaneCounts, td: OmeTiffData, ifdCount: number, fileLabel: string): void {
  const total = map.length;
  const firstIfd = td.ifd ?? 0;
  const inRange = (v: number, size: number) => Number.isInteger(v) && v >= 0 && v < size;
  if (!inRange(td.firstZ, counts.sizeZ) || !inRange(td.firstC, counts.sizeC) || !inRange(td.firstT, counts.sizeT) || !inRange(firstIfd, Infinity)) {
    throw new TiffError('bad-ome', fileLabel, `OME TiffData IFD=${firstIfd} FirstZ=${td.firstZ} FirstC=${td.firstC} FirstT=${td.firstT} is out of range`);
  }
  // Schema defaults: PlaneCount is 1 when IFD is given, else every IFD in the file.
  const count = td.planeCount ?? (td.ifd !== undefined ? 1 : ifdCount - firstIfd);
  const start = planeNumber(order, counts, td.firstZ, td.firstC, td.firstT);
  for (let k = 0; k < count && start + k < total; k++) {
    const ifd = firstIfd + k;
    if (ifd >= ifdCount) {
      throw new TiffError('bad-ome', fileLabel, `OME TiffData refers to IFD ${ifd} but the file has ${ifdCount} IFDs`);
    }
    const { z, c, t } = planeCoordinates(order, counts, start + k);
    map[planeSlot(counts, z, c, t)] = ifd;
  }
}

// Time of each time point of a stack: OME Plane/@DeltaT (per plane), else Pixels/@TimeIncrement, else ImageJ's
// finterval, else a step the user gives; the source is recorded like the pixel size's.
import type { PlaneSource, StackInfo, TimeAxis } from '../model';
import type { ImageJDescription } from './imagej';
import type { OmeImage } from './ome';

/** The time axis when nothing says: no values. */
export const UNKNOWN_TIME: TimeAxis = Object.freeze({ timesS: null, source: 'unknown' as const });

/** Evenly spaced times 0, step, 2·step, … for `count` time points. */
export function evenTimes(count: number, stepS: number): Float64Array {
  return Float64Array.from({ length: count }, (_, t) => t * stepS);
}

/**
 * The time axis of a stack for analysis: the file's when it has one, else `timeStepS` from the user ('user'), else
 * unknown. A user step beside file times is ignored with a warning, as a user pixel size is.
 */
export function resolveTimeAxis(info: StackInfo, timeStepS: number | null, warnings: string[] = []): TimeAxis {
  const fromFile = info.time && info.time.timesS !== null ? info.time : null;
  if (fromFile) {
    if (timeStepS !== null && info.sizeT > 1) warnings.push(`time step ${timeStepS} s ignored: the file gives the times (${fromFile.source})`);
    return fromFile;
  }
  if (timeStepS !== null) return { timesS: evenTimes(info.sizeT, timeStepS), source: 'user' };
  return UNKNOWN_TIME;
}

/**
 * A plain multi-page TIFF read as time points instead of Z slices (the user says the pages are frames, e.g. with a
 * time step): sizeT takes sizeZ's place. Files that already have time points or that are OME are returned as they are.
 */
export function pagesAsTimePoints(info: StackInfo): StackInfo {
  if (info.isOme || info.sizeT > 1 || info.sizeZ === 1) return info;
  const { sizeZ: pages, sizeC } = info;
  const planeIfd = new Int32Array(pages * sizeC);
  // Old slot (z, c, 0) = c·pages + z; new slot (0, c, t) = t·sizeC + c.
  for (let t = 0; t < pages; t++) for (let c = 0; c < sizeC; c++) planeIfd[t * sizeC + c] = info.planeIfd[c * pages + t];
  return { ...info, sizeZ: 1, sizeT: pages, planeIfd, time: info.time ?? UNKNOWN_TIME };
}

/**
 * A file and its plane source read with pagesAsTimePoints: the source then serves plane (z 0, c, t) from the file's
 * page (z = t, c), since a source checks and maps planes by the file's own layout. Files pagesAsTimePoints leaves as
 * they are keep their source.
 */
export function pagesAsTimePointsWithSource(info: StackInfo, source: PlaneSource): { info: StackInfo; source: PlaneSource } {
  const frames = pagesAsTimePoints(info);
  if (frames === info) return { info, source };
  return {
    info: frames,
    source: {
      readPlane: (z, c, t, into) => (z === 0 ? source.readPlane(t, c, 0, into)
        : Promise.reject(new RangeError(`plane (z=${z}, c=${c}, t=${t}) is outside the stack (Z 1, C ${frames.sizeC}, T ${frames.sizeT})`))),
      close: () => source.close(),
    },
  };
}

/**
 * OME time axis: Plane/@DeltaT when every time point has one and they increase (relative to the first), else
 * Pixels/@TimeIncrement, else unknown. Warns when DeltaT is present but unusable.
 */
export function omeTimeAxis(ome: OmeImage, warnings: string[]): TimeAxis {
  if (ome.sizeT <= 1) return UNKNOWN_TIME;
  const d = ome.planeDeltaTS;
  if (d) {
    let ok = Number.isFinite(d[0]);
    for (let t = 1; t < d.length && ok; t++) ok = Number.isFinite(d[t]) && d[t] > d[t - 1];
    if (ok) return { timesS: d.map((v) => v - d[0]), source: 'ome-plane' };
    warnings.push('OME Plane DeltaT is missing for some time points or does not increase; not used');
  }
  if (ome.timeIncrementS !== null) return { timesS: evenTimes(ome.sizeT, ome.timeIncrementS), source: 'ome-increment' };
  return UNKNOWN_TIME;
}

/** ImageJ hyperstack time axis: frames × finterval (seconds), else unknown. */
export function imagejTimeAxis(imagej: ImageJDescription | null, sizeT: number): TimeAxis {
  if (sizeT <= 1 || !imagej || imagej.frameIntervalS === null) return UNKNOWN_TIME;
  return { timesS: evenTimes(sizeT, imagej.frameIntervalS), source: 'imagej' };
}

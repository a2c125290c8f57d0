// Human-readable summary of a StackInfo, one fact per line (for the inspect command).
import type { StackInfo } from '../model';
import { planeSlot } from './dimension-order';

/** Formats a µm value without float noise. */
function um(value: number | null): string {
  return value === null ? '?' : `${Number(value.toPrecision(6))} µm`;
}

/** Lines describing dims, channels, pixel size and its source, compression, sample type and the plane map. */
export function describeStack(info: StackInfo): string[] {
  const kind = `${info.isOme ? 'OME-TIFF' : 'TIFF'}${info.bigTiff ? ' (BigTIFF)' : ''}, byte order ${info.byteOrder}`;
  const lines = [
    `format: ${kind}, ${info.ifdCount} IFD${info.ifdCount === 1 ? '' : 's'}`,
    `dimensions: X ${info.sizeX} × Y ${info.sizeY} × Z ${info.sizeZ} × C ${info.sizeC} × T ${info.sizeT} (order ${info.dimensionOrder})`,
    `channels: ${info.channelNames.map((n, c) => `${c + 1}=${n}`).join(', ')} (1-based, as in --gradient-channel)`,
    `pixel size: ${info.pixelSize.xUm === null ? 'unknown' : `${um(info.pixelSize.xUm)} × ${um(info.pixelSize.yUm)}`}` +
      `${info.pixelSize.zUm !== null ? `, z step ${um(info.pixelSize.zUm)}` : ''} (source: ${info.pixelSize.source})`,
    ...timeLines(info),
    `sample type: ${info.sampleType}${info.samplesPerPixel > 1 ? `, ${info.samplesPerPixel} samples per pixel` : ''}`,
    `compression: ${info.compression}`,
    ...planeMapLines(info),
  ];
  return [...lines, ...info.warnings.map((w) => `warning: ${w}`)];
}

/** "time points: …" for movies: count, spacing or range, and where the times came from. */
function timeLines(info: StackInfo): string[] {
  if (info.sizeT <= 1) return [];
  const times = info.time?.timesS ?? null;
  if (!times) return [`time points: ${info.sizeT}, times unknown (give --time-step S)`];
  const last = times[times.length - 1];
  const step = last / (times.length - 1);
  const even = times.every((v, t) => Math.abs(v - t * step) <= 1e-6 * Math.max(1, last));
  const span = `${Number(last.toPrecision(6))} s`;
  return [`time points: ${info.sizeT}, ${even ? `every ${Number(step.toPrecision(6))} s` : 'unevenly spaced'}, 0 to ${span} (source: ${info.time!.source})`];
}

/** "plane map: t0 c0: IFD 0..2" lines, one per (t, c), compressed into ranges when consecutive. */
function planeMapLines(info: StackInfo): string[] {
  const lines: string[] = [];
  for (let t = 0; t < info.sizeT; t++) {
    for (let c = 0; c < info.sizeC; c++) {
      const ifds = Array.from({ length: info.sizeZ }, (_, z) => info.planeIfd[planeSlot(info, z, c, t)]);
      const consecutive = ifds.every((v, i) => i === 0 || v === ifds[i - 1] + 1);
      const list = consecutive && ifds.length > 1 ? `${ifds[0]}..${ifds[ifds.length - 1]}` : ifds.join(', ');
      lines.push(`plane map: t${t} c${c} z0..${info.sizeZ - 1} → IFD ${list}`);
    }
  }
  // Long time series: the first lines show the pattern; the rest would only scroll.
  return lines.length <= 12 ? lines : [...lines.slice(0, 10), `plane map: … ${lines.length - 10} more (t, c) pairs`];
}

/** The facts of `eggline inspect --json` (keys documented in the README; `schema`/`version` name the layout). */
export interface StackFactsJson {
  readonly schema: 'eggline-inspect';
  readonly version: 1;
  readonly format: 'TIFF' | 'OME-TIFF' | 'OME-Zarr';
  readonly bigTiff: boolean;
  readonly byteOrder: 'II' | 'MM' | null;
  readonly ifdCount: number | null;
  readonly sizeX: number;
  readonly sizeY: number;
  readonly sizeZ: number;
  readonly sizeC: number;
  readonly sizeT: number;
  readonly dimensionOrder: string;
  readonly channels: readonly { readonly index: number; readonly name: string }[];
  readonly pixelSizeXUm: number | null;
  readonly pixelSizeYUm: number | null;
  readonly pixelSizeSource: string;
  readonly zStepUm: number | null;
  readonly timeIncrementS: number | null;
  readonly timesS: readonly number[] | null;
  readonly timeSource: string | null;
  readonly sampleType: string;
  readonly samplesPerPixel: number;
  readonly compression: string;
  readonly compressionCode: number | null;
  readonly planeMap: readonly { readonly t: number; readonly c: number; readonly ifds: readonly number[] }[] | null;
  readonly warnings: readonly string[];
}

/** The same facts as describeStack as one JSON-ready object (plane map in full, channels 1-based). */
export function stackFacts(info: StackInfo, format: StackFactsJson['format'] = info.isOme ? 'OME-TIFF' : 'TIFF'): StackFactsJson {
  const times = info.time?.timesS ?? null;
  const tiff = format !== 'OME-Zarr';
  const planeMap: { t: number; c: number; ifds: number[] }[] = [];
  if (tiff) {
    for (let t = 0; t < info.sizeT; t++) {
      for (let c = 0; c < info.sizeC; c++) planeMap.push({ t, c, ifds: Array.from({ length: info.sizeZ }, (_, z) => info.planeIfd[planeSlot(info, z, c, t)]) });
    }
  }
  return {
    schema: 'eggline-inspect', version: 1, format,
    bigTiff: tiff && info.bigTiff, byteOrder: tiff ? info.byteOrder : null, ifdCount: tiff ? info.ifdCount : null,
    sizeX: info.sizeX, sizeY: info.sizeY, sizeZ: info.sizeZ, sizeC: info.sizeC, sizeT: info.sizeT, dimensionOrder: info.dimensionOrder,
    channels: info.channelNames.map((name, c) => ({ index: c + 1, name })),
    pixelSizeXUm: info.pixelSize.xUm, pixelSizeYUm: info.pixelSize.yUm, pixelSizeSource: info.pixelSize.source, zStepUm: info.pixelSize.zUm,
    timeIncrementS: times && times.length > 1 ? times[times.length - 1] / (times.length - 1) : null,
    timesS: times ? Array.from(times) : null, timeSource: info.time?.source ?? null,
    sampleType: info.sampleType, samplesPerPixel: info.samplesPerPixel,
    compression: info.compression, compressionCode: info.compressionCode ?? null,
    planeMap: tiff ? planeMap : null, warnings: [...info.warnings],
  };
}

// Human-readable summary of an opened OME-Zarr image, one fact per line (for the inspect command).
import type { StackInfo } from '../model';
import type { ZarrDetails } from './open-zarr';

/** Formats a number without float noise. */
const num = (v: number): string => `${Number(v.toPrecision(6))}`;

/** Lines with the same facts `inspect` gives for TIFF, plus the store's axes, chunk shape and codecs. */
export function describeZarr(info: StackInfo, details: ZarrDetails): string[] {
  const px = info.pixelSize;
  const axes = details.axes.map((a, d) => `${a.name}${a.type ? ` (${a.type}${a.unit ? `, ${a.unit}` : ''})` : ''} ${details.shape[d]}`);
  const lines = [
    `format: OME-Zarr (NGFF ${details.ngffVersion}, Zarr v${details.zarrFormat}), full-resolution array "${details.arrayPath}" of ${details.levels} level${details.levels === 1 ? '' : 's'}`,
    `dimensions: X ${info.sizeX} × Y ${info.sizeY} × Z ${info.sizeZ} × C ${info.sizeC} × T ${info.sizeT}`,
    `axes: ${axes.join(', ')}`,
    `channels: ${info.channelNames.map((n, c) => `${c + 1}=${n}`).join(', ')} (1-based, as in --gradient-channel)`,
    `pixel size: ${px.xUm === null ? 'unknown' : `${num(px.xUm)} µm × ${num(px.yUm ?? px.xUm)} µm`}` +
      `${px.zUm !== null ? `, z step ${num(px.zUm)} µm` : ''} (source: ${px.source})`,
    ...(details.timeStepS !== null ? [`time step: ${num(details.timeStepS)} s`] : []),
    `sample type: ${info.sampleType}`,
    `chunk shape: ${details.chunks.join(' × ')} (chunk key separator "${details.separator}")`,
    `codecs: ${details.codecs}`,
  ];
  return [...lines, ...info.warnings.map((w) => `warning: ${w}`)];
}

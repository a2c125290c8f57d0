// Hyperstack sizes and calibration from an ImageJ-style ImageDescription ("ImageJ=…\nchannels=2\nslices=5…").
import { secondsPerUnit } from './time-units';

/** What an ImageJ-style description declares; fields are null when absent. */
export interface ImageJDescription {
  readonly images: number | null;
  readonly channels: number | null;
  readonly slices: number | null;
  readonly frames: number | null;
  /** µm per resolution unit when unit= names a length in micrometres (micron, um, µm), else null. */
  readonly unitUm: number | null;
  /** Z spacing in the description's unit, converted to µm when the unit is known. */
  readonly spacingUm: number | null;
  /** Time between frames: finterval in tunit (default seconds), in seconds; null when absent or not positive. */
  readonly frameIntervalS: number | null;
}

/** Parses "key=value" lines of a description starting with "ImageJ="; null for other text. */
export function parseImageJDescription(description: string): ImageJDescription | null {
  if (!description.startsWith('ImageJ=')) return null;
  const fields = new Map<string, string>();
  for (const line of description.split(/\r?\n/)) {
    const eq = line.indexOf('=');
    if (eq > 0) fields.set(line.slice(0, eq).trim(), line.slice(eq + 1).trim());
  }
  const int = (key: string) => {
    const v = Number(fields.get(key));
    return Number.isInteger(v) && v > 0 ? v : null;
  };
  const unit = (fields.get('unit') ?? '').replace(/\\u00B5/g, '\u00B5');
  const unitUm = ['micron', 'microns', 'um', '\u00B5m', '\u03BCm'].includes(unit) ? 1 : unit === 'nm' ? 1e-3 : unit === 'mm' ? 1e3 : null;
  const spacing = Number(fields.get('spacing'));
  const finterval = Number(fields.get('finterval'));
  const tunit = secondsPerUnit((fields.get('tunit') ?? 's').replace(/\\u00B5/g, '\u00B5'));
  return {
    images: int('images'), channels: int('channels'), slices: int('slices'), frames: int('frames'),
    unitUm,
    spacingUm: unitUm !== null && Number.isFinite(spacing) && spacing > 0 ? spacing * unitUm : null,
    frameIntervalS: tunit !== null && Number.isFinite(finterval) && finterval > 0 ? finterval * tunit : null,
  };
}

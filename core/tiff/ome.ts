// OME-XML from the ImageDescription of IFD 0 (OME-TIFF spec; schema 2016-06 ome.xsd).
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import type { DimensionOrder } from '../model';
import { isDimensionOrder } from './dimension-order';
import { TiffError } from './errors';
import { secondsPerUnit } from './time-units';
import { micrometresPerUnit } from './units';

/** One TiffData element; undefined attributes take the schema defaults later. */
export interface OmeTiffData {
  readonly ifd: number | undefined;
  readonly firstZ: number;
  readonly firstC: number;
  readonly firstT: number;
  readonly planeCount: number | undefined;
  /** UUID@FileName when the planes live in another file of a multi-file set. */
  readonly fileName: string | null;
}

/** The parts of the first OME Image that Eggline uses. */
export interface OmeImage {
  readonly dimensionOrder: DimensionOrder;
  readonly type: string;
  readonly sizeX: number;
  readonly sizeY: number;
  readonly sizeZ: number;
  readonly sizeC: number;
  readonly sizeT: number;
  /** Physical sizes in µm; null when absent or given in a unit that is not a length (e.g. 'pixel'). */
  readonly physicalSizeXUm: number | null;
  readonly physicalSizeYUm: number | null;
  readonly physicalSizeZUm: number | null;
  readonly channelNames: readonly string[];
  readonly channelSamples: readonly number[];
  readonly tiffData: readonly OmeTiffData[];
  /** Pixels/@TimeIncrement in seconds, or null when absent or not a time. */
  readonly timeIncrementS: number | null;
  /** Per time point, the earliest Plane/@DeltaT in seconds among its planes (NaN where none); null without any. */
  readonly planeDeltaTS: Float64Array | null;
  readonly imageCount: number;
  readonly warnings: readonly string[];
}

/** True when an ImageDescription looks like OME-XML. */
export function looksLikeOmeXml(description: string): boolean {
  return /<(\w+:)?OME[\s>]/.test(description);
}

type Node = Record<string, unknown>;

const parser = new XMLParser({
  ignoreAttributes: false,
  attributeNamePrefix: '@_',
  removeNSPrefix: true,
  parseAttributeValue: false,
  isArray: (name) => ['Image', 'Channel', 'TiffData', 'Plane'].includes(name),
});

/** Parses OME-XML; throws TiffError('bad-ome') when it is malformed or lacks required Pixels attributes. */
export function parseOmeXml(xml: string, fileLabel: string): OmeImage {
  const valid = XMLValidator.validate(xml);
  if (valid !== true) {
    throw new TiffError('bad-ome', fileLabel, `OME-XML is not well-formed (line ${valid.err.line}: ${valid.err.msg})`);
  }
  const doc = parser.parse(xml) as Node;
  const ome = doc.OME as Node | undefined;
  const images = (ome?.Image as Node[] | undefined) ?? [];
  const pixels = images[0]?.Pixels as Node | undefined;
  if (!pixels) throw new TiffError('bad-ome', fileLabel, 'OME-XML has no Image/Pixels element');
  return readPixels(pixels, images.length, fileLabel);
}

/** A required positive-integer attribute of Pixels. */
function sizeAttr(pixels: Node, name: string, fileLabel: string): number {
  const raw = pixels[`@_${name}`];
  const value = Number(raw);
  if (raw === undefined || !Number.isInteger(value) || value < 1) {
    throw new TiffError('bad-ome', fileLabel, `OME-XML Pixels ${name} is ${raw === undefined ? 'missing' : `"${String(raw)}"`}`);
  }
  return value;
}

/** Reads the Pixels element: sizes, order, type, physical sizes, channels, TiffData. */
function readPixels(pixels: Node, imageCount: number, fileLabel: string): OmeImage {
  const warnings: string[] = [];
  if (imageCount > 1) warnings.push(`file holds ${imageCount} OME images; reading the first`);
  const order = String(pixels['@_DimensionOrder'] ?? '');
  if (!isDimensionOrder(order)) throw new TiffError('bad-ome', fileLabel, `OME-XML DimensionOrder "${order}" is not one of the six orders`);
  const channels = (pixels.Channel as Node[] | undefined) ?? [];
  const sizeT = sizeAttr(pixels, 'SizeT', fileLabel);
  return {
    dimensionOrder: order,
    type: String(pixels['@_Type'] ?? ''),
    sizeX: sizeAttr(pixels, 'SizeX', fileLabel),
    sizeY: sizeAttr(pixels, 'SizeY', fileLabel),
    sizeZ: sizeAttr(pixels, 'SizeZ', fileLabel),
    sizeC: sizeAttr(pixels, 'SizeC', fileLabel),
    sizeT,
    physicalSizeXUm: physicalSize(pixels, 'X', warnings),
    physicalSizeYUm: physicalSize(pixels, 'Y', warnings),
    physicalSizeZUm: physicalSize(pixels, 'Z', warnings),
    channelNames: channels.map((ch) => String(ch['@_Name'] ?? '')),
    channelSamples: channels.map((ch) => Number(ch['@_SamplesPerPixel'] ?? 1)),
    tiffData: ((pixels.TiffData as Node[] | undefined) ?? []).map(readTiffData),
    timeIncrementS: timeIncrement(pixels, warnings),
    planeDeltaTS: planeDeltaT((pixels.Plane as Node[] | undefined) ?? [], sizeT, warnings),
    imageCount,
    warnings,
  };
}

/** PhysicalSize{axis} in µm (unit default µm); warns and returns null for 'pixel' or unknown units. */
function physicalSize(pixels: Node, axis: string, warnings: string[]): number | null {
  const raw = pixels[`@_PhysicalSize${axis}`];
  if (raw === undefined) return null;
  const unit = String(pixels[`@_PhysicalSize${axis}Unit`] ?? '\u00B5m');
  const value = Number(raw);
  const scale = micrometresPerUnit(unit);
  if (scale === null) {
    warnings.push(`OME PhysicalSize${axis} unit "${unit}" is not a length; ignored`);
    return null;
  }
  if (!Number.isFinite(value) || value <= 0) {
    warnings.push(`OME PhysicalSize${axis} "${String(raw)}" is not a positive number; ignored`);
    return null;
  }
  return value * scale;
}

/** A TiffData element with its optional attributes. */
function readTiffData(node: Node | string): OmeTiffData {
  const el: Node = typeof node === 'object' && node !== null ? node : {};
  const opt = (name: string) => (el[`@_${name}`] === undefined ? undefined : Number(el[`@_${name}`]));
  const uuid = el.UUID as Node | string | undefined;
  const fileName = typeof uuid === 'object' && uuid !== null && uuid['@_FileName'] !== undefined ? String(uuid['@_FileName']) : null;
  return {
    ifd: opt('IFD'),
    firstZ: opt('FirstZ') ?? 0,
    firstC: opt('FirstC') ?? 0,
    firstT: opt('FirstT') ?? 0,
    planeCount: opt('PlaneCount'),
    fileName,
  };
}

/** A time attribute in seconds with its unit attribute (default s); null, with a warning, when not a time. */
function seconds(node: Node, name: string, warnings: string[]): number | null {
  const raw = node[`@_${name}`];
  if (raw === undefined) return null;
  const unit = String(node[`@_${name}Unit`] ?? 's');
  const scale = secondsPerUnit(unit);
  const value = Number(raw);
  if (scale === null || !Number.isFinite(value)) {
    warnings.push(`OME ${name} "${String(raw)}" ${unit} is not a time; ignored`);
    return null;
  }
  return value * scale;
}

/** Pixels/@TimeIncrement (with TimeIncrementUnit) in seconds when positive. */
function timeIncrement(pixels: Node, warnings: string[]): number | null {
  const s = seconds(pixels, 'TimeIncrement', warnings);
  return s !== null && s > 0 ? s : null;
}

/**
 * The earliest Plane/@DeltaT of each time point, in seconds (one pass over the Plane elements, so movies with
 * thousands of planes cost time linear in their number); null when no Plane has a DeltaT.
 */
function planeDeltaT(planes: readonly Node[], sizeT: number, warnings: string[]): Float64Array | null {
  const out = new Float64Array(sizeT).fill(NaN);
  let any = false;
  const before = warnings.length;
  for (const plane of planes) {
    const t = Number(plane['@_TheT'] ?? 0);
    if (!(Number.isInteger(t) && t >= 0 && t < sizeT)) continue;
    const s = seconds(plane, 'DeltaT', warnings);
    if (s === null) continue;
    any = true;
    if (!(out[t] <= s)) out[t] = s;
  }
  // One bad unit would otherwise repeat on every plane.
  if (warnings.length > before + 1) warnings.splice(before + 1, warnings.length - before - 1, `… and ${warnings.length - before - 1} more Plane DeltaT values ignored`);
  return any ? out : null;
}

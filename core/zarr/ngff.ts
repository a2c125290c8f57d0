// NGFF (OME-Zarr) image metadata from a group's attributes: versions 0.4 (top-level keys) and 0.5 (under "ome").
import { ZarrError } from './errors';

/** One NGFF axis; type and unit are null when the file does not give them. */
export interface NgffAxis {
  readonly name: string;
  readonly type: string | null;
  readonly unit: string | null;
}

/** What Eggline takes from an NGFF image group. */
export interface NgffImage {
  /** NGFF version as written ("0.4", "0.5"), or "unknown". */
  readonly version: string;
  /** Axes in array order; null for NGFF 0.1/0.2 files, which have none. */
  readonly axes: readonly NgffAxis[] | null;
  /** Path of the full-resolution array (the first dataset, as NGFF orders them finest first). */
  readonly datasetPath: string;
  /** Paths of every resolution level, full resolution first (levels whose path is missing or leaves the store are left out). */
  readonly levelPaths: readonly string[];
  /** Number of resolution levels. */
  readonly levels: number;
  /** Scale of the full-resolution array per axis (dataset scale × multiscale scale), or null when none is given. */
  readonly scale: readonly number[] | null;
  /** omero channel labels in channel order ('' where a channel has none). */
  readonly channelNames: readonly string[];
  readonly warnings: readonly string[];
}

/** An image group, or a collection (bioformats2raw layout) whose images sit in numbered subgroups. */
export type NgffGroup = { readonly kind: 'image'; readonly image: NgffImage } | { readonly kind: 'collection' };

type Json = Record<string, unknown>;

const isObject = (v: unknown): v is Json => typeof v === 'object' && v !== null && !Array.isArray(v);

/** The NGFF keys of a group: under "ome" for 0.5 and later, at the top level before. */
function ngffKeys(attrs: Json): { keys: Json; version: string | null } {
  if (isObject(attrs.ome)) {
    const ome = attrs.ome;
    return { keys: ome, version: typeof ome.version === 'string' ? ome.version : null };
  }
  return { keys: attrs, version: null };
}

/** Axes from NGFF ≥ 0.4 objects or 0.3 strings; null when absent. */
function parseAxes(raw: unknown, label: string): NgffAxis[] | null {
  if (raw === undefined) return null;
  if (!Array.isArray(raw) || raw.length === 0) throw new ZarrError('bad-metadata', label, 'NGFF "axes" is not a list of axes');
  return raw.map((a, i) => {
    if (typeof a === 'string') return { name: a, type: null, unit: null };
    if (!isObject(a) || typeof a.name !== 'string') throw new ZarrError('bad-metadata', label, `NGFF axis ${i + 1} has no name`);
    // "units" appears in some published examples; NGFF names the key "unit".
    const unit = typeof a.unit === 'string' ? a.unit : typeof a.units === 'string' ? a.units : null;
    return { name: a.name, type: typeof a.type === 'string' ? a.type : null, unit };
  });
}

/** Paths of the datasets in order, stopping before the first one without a usable path. */
function levelPathsOf(datasets: readonly unknown[]): string[] {
  const paths: string[] = [];
  for (const d of datasets) {
    if (!isObject(d) || typeof d.path !== 'string' || d.path === '' || d.path.split('/').some((part) => part === '..')) break;
    paths.push(d.path);
  }
  return paths;
}

/** The "scale" of a coordinateTransformations list, checked to have one finite positive entry per axis; null if none. */
function scaleOf(raw: unknown, axisCount: number | null, where: string, label: string): number[] | null {
  if (raw === undefined) return null;
  if (!Array.isArray(raw)) throw new ZarrError('bad-metadata', label, `${where} coordinateTransformations is not a list`);
  const scale = raw.find((t) => isObject(t) && t.type === 'scale') as Json | undefined;
  if (!scale) return null;
  const values = scale.scale;
  if (!Array.isArray(values) || !values.every((v) => typeof v === 'number' && Number.isFinite(v) && v > 0)) {
    throw new ZarrError('bad-metadata', label, `${where} scale must be a list of positive numbers`);
  }
  if (axisCount !== null && values.length !== axisCount) {
    throw new ZarrError('bad-metadata', label, `${where} scale has ${values.length} values for ${axisCount} axes`);
  }
  return values as number[];
}

/** omero channel labels ('' for a channel without one). */
function channelLabels(omero: unknown): string[] {
  if (!isObject(omero) || !Array.isArray(omero.channels)) return [];
  return omero.channels.map((ch) => (isObject(ch) && typeof ch.label === 'string' ? ch.label.trim() : ''));
}

/** Refuse the NGFF layouts that hold several images. */
function refuseMultiImage(keys: Json, label: string): void {
  if (keys.plate !== undefined) throw new ZarrError('unsupported', label, 'is an OME-Zarr plate (several wells and fields); plates are not read yet');
  if (keys.well !== undefined) throw new ZarrError('unsupported', label, 'is an OME-Zarr well (several fields of view); wells are not read yet');
}

/**
 * Reads the NGFF metadata of a group's attributes. Throws ZarrError for plates and wells ('unsupported'), for groups
 * without multiscales ('not-ome') and for malformed multiscales ('bad-metadata').
 */
export function parseNgffGroup(attrs: unknown, label: string): NgffGroup {
  if (!isObject(attrs)) throw new ZarrError('bad-metadata', label, 'group attributes are not a JSON object');
  const { keys, version: omeVersion } = ngffKeys(attrs);
  refuseMultiImage(keys, label);
  const multiscales = keys.multiscales;
  if (multiscales === undefined) {
    if (keys['bioformats2raw.layout'] !== undefined) return { kind: 'collection' };
    throw new ZarrError('not-ome', label, 'has no NGFF "multiscales" metadata: not an OME-Zarr image');
  }
  if (!Array.isArray(multiscales) || multiscales.length === 0 || !isObject(multiscales[0])) {
    throw new ZarrError('bad-metadata', label, 'NGFF "multiscales" is not a list of images');
  }
  const ms = multiscales[0];
  const warnings: string[] = [];
  if (multiscales.length > 1) warnings.push(`${label}: ${multiscales.length} multiscale images in one group; the first is read`);
  const axes = parseAxes(ms.axes, label);
  const datasets = ms.datasets;
  if (!Array.isArray(datasets) || datasets.length === 0) throw new ZarrError('bad-metadata', label, 'NGFF multiscales has no datasets');
  const first = datasets[0];
  if (!isObject(first) || typeof first.path !== 'string' || first.path === '') {
    throw new ZarrError('bad-metadata', label, 'the first NGFF dataset has no path');
  }
  if (first.path.split('/').some((part) => part === '..')) throw new ZarrError('bad-metadata', label, `NGFF dataset path "${first.path}" leaves the store`);
  const n = axes?.length ?? null;
  const datasetScale = scaleOf(first.coordinateTransformations, n, 'dataset', label);
  const globalScale = scaleOf(ms.coordinateTransformations, n, 'multiscales', label);
  const scale = datasetScale && globalScale && datasetScale.length === globalScale.length
    ? datasetScale.map((s, i) => s * globalScale[i])
    : datasetScale ?? globalScale;
  const version = omeVersion ?? (typeof ms.version === 'string' ? ms.version : 'unknown');
  return {
    kind: 'image',
    image: { version, axes, datasetPath: first.path, levelPaths: levelPathsOf(datasets), levels: datasets.length, scale, channelNames: channelLabels(keys.omero), warnings },
  };
}

// Project a stack over Z per channel, reading plane by plane (a stack is never held whole; at most two planes are).
import type { PixelSize, PixelSizeSource, Plane, PlaneSource, ProjectedStack, ProjectionMethod, RawPlane, SampleType, StackInfo } from '../model';
import type { AnalysisSettings } from '../settings';
import { createProjector, projectOnePlane } from './projector';
import type { Projector } from './projector';
import { toFloatPlane } from './plane-convert';
import { correctedSlicePlanes, type ImageCorrections } from './corrections';
import type { PlaneArrays } from './plane-arrays';

/**
 * Score used to pick a slice automatically: the variance of the plane's pixel values, summed over channels.
 * Why: the in-focus mid-section shows the largest embryo section with the sharpest edges, so it has the most
 * contrast; out-of-focus slices are blurred and their variance drops.
 */
export function chooseSliceScore(planes: readonly (RawPlane | Plane)[]): number {
  let score = 0;
  for (const p of planes) {
    let s = 0;
    let s2 = 0;
    const d = p.data;
    for (let i = 0; i < d.length; i++) { s += d[i]; s2 += d[i] * d[i]; }
    const m = s / d.length;
    score += s2 / d.length - m * m;
  }
  return score;
}

/** Pixel size to use: the file's, else the user's fallback, else unknown (with warnings). */
function resolvePixelSize(px: PixelSize, fallbackUm: number | null, warnings: string[]): { um: number | null; source: PixelSizeSource } {
  if (px.xUm !== null && px.xUm > 0 && px.source !== 'unknown' && px.source !== 'user') {
    if (px.yUm !== null && Math.abs(px.yUm - px.xUm) > 0.01 * px.xUm) {
      warnings.push(`pixel size differs in x (${px.xUm} µm) and y (${px.yUm} µm); x is used for both`);
    }
    return { um: px.xUm, source: px.source };
  }
  if (fallbackUm !== null && fallbackUm > 0) return { um: fallbackUm, source: 'user' };
  if (px.xUm !== null && px.xUm > 0) return { um: px.xUm, source: px.source };
  warnings.push('pixel size unknown: lengths are in pixels and µm values are left empty');
  return { um: null, source: 'unknown' };
}

/** Read one plane (into `into` when the source can) and check it has the declared size. */
async function readChecked(source: PlaneSource, info: StackInfo, z: number, c: number, t: number, into?: RawPlane['data']): Promise<RawPlane> {
  const p = await source.readPlane(z, c, t, into);
  if (p.width !== info.sizeX || p.height !== info.sizeY || p.data.length !== info.sizeX * info.sizeY) {
    throw new Error(`plane z=${z} c=${c} t=${t} is ${p.width}×${p.height}, expected ${info.sizeX}×${info.sizeY}`);
  }
  return p;
}

/** Check the time and slice indices against the stack's size (exact messages). */
function checkIndices(info: StackInfo, settings: AnalysisSettings): void {
  if (!Number.isInteger(settings.timeIndex) || settings.timeIndex < 0 || settings.timeIndex >= info.sizeT) {
    throw new Error(`time index ${settings.timeIndex} is out of range (the file has ${info.sizeT} time point(s))`);
  }
  const z = settings.sliceIndex;
  if (settings.projection === 'slice' && z !== null && (!Number.isInteger(z) || z < 0 || z >= info.sizeZ)) {
    throw new Error(`slice index ${z} is out of range (the file has ${info.sizeZ} slice(s))`);
  }
}

/** Automatic slice: keep only the best-scoring z (all channels) while streaming through the stack. With corrections,
 *  each slice is scored as the flat field and background image make it (the planes kept are the raw ones; the
 *  projection is corrected afterwards, as for every projection). */
async function bestSlice(info: StackInfo, source: PlaneSource, t: number, corrections: ImageCorrections | null): Promise<{ planes: Plane[]; z: number }> {
  let best: Plane[] = [];
  let bestZ = 0;
  let bestScore = -Infinity;
  for (let z = 0; z < info.sizeZ; z++) {
    const planes: RawPlane[] = [];
    for (let c = 0; c < info.sizeC; c++) planes.push(await readChecked(source, info, z, c, t));
    const score = corrections ? chooseSliceScore(correctedSlicePlanes(planes.map(toFloatPlane), corrections)) : chooseSliceScore(planes);
    if (score > bestScore) { bestScore = score; bestZ = z; best = planes.map(toFloatPlane); }
  }
  return { planes: best, z: bestZ };
}

/**
 * Read planes 0..count-1 in order and hand each to `use`, starting the read of plane i+1 before `use(i)` runs.
 * Why: decoders (sharp/libvips, file reads) work off the JS thread, so the next plane decodes while this one is
 * accumulated; at most two planes are held. A failed prefetch is reported in order, never as an unhandled rejection.
 */
export async function readAhead(count: number, read: (i: number) => Promise<RawPlane>, use: (i: number, plane: RawPlane) => void): Promise<void> {
  let next: Promise<RawPlane> | null = count > 0 ? read(0) : null;
  for (let i = 0; i < count; i++) {
    const current = next as Promise<RawPlane>;
    next = i + 1 < count ? read(i + 1) : null;
    // Keep a later rejection from surfacing as unhandled when `current` fails first; it is still awaited in turn.
    next?.catch(() => undefined);
    use(i, await current);
  }
}

/** Replace NaN and ±Infinity by 0 in place (the planes are our own copies); returns how many were replaced. */
function clearNonFinite(planes: readonly Plane[]): number {
  let count = 0;
  for (const p of planes) {
    const d = p.data;
    for (let i = 0; i < d.length; i++) if (!Number.isFinite(d[i])) { d[i] = 0; count++; }
  }
  return count;
}

/** 8- and 16-bit integer samples: a projection of one such plane holds its values exactly (see projectOnePlane). */
const EXACT_IN_FLOAT32: ReadonlySet<SampleType> = new Set(['uint8', 'int8', 'uint16', 'int16']);

/** projectOnePlane(plane, method, out), made when its `data` is first read (then kept). */
function lazyOnePlane(plane: RawPlane, method: ProjectionMethod, out: Float32Array | undefined): Plane {
  let data: Float32Array | null = null;
  return {
    width: plane.width,
    height: plane.height,
    get data(): Float32Array {
      data ??= projectOnePlane(plane, method, out).data;
      return data;
    },
  };
}

/**
 * Project every channel of a stack over Z at settings.timeIndex with settings.projection, reading one plane at a time.
 * 'slice' uses settings.sliceIndex, or, when null, the slice with the highest contrast (see chooseSliceScore), scored
 * on the planes as `corrections` (flat field, background image) make them; the projection itself is returned
 * uncorrected (applyImageCorrections does that). `into` (one array of sizeX·sizeY values per channel), when given,
 * receives the projections (a movie reuses its arrays at every time point) except for an automatic slice. `planes`,
 * when given, are the arrays the planes are decoded into (slot c for a channel's one plane; slots 0 and 1 in turn
 * when channels have several): then a projection of one 8- or 16-bit plane per channel also gives those planes as
 * `rawPlanes` (valid until `planes` serve the next projection). With `lazy` (and such raw planes), each channel's
 * floats are converted from its plane only when its `data` is first read: a caller that reads the raw planes alone
 * (a movie's time point within a known embryo) never pays for the conversion, and one that reads `data` gets the
 * same values, as long as it does so before `planes` serve the next projection. Rejects with a one-line message on
 * bad indices or planes of the wrong size.
 */
export async function projectStack(info: StackInfo, source: PlaneSource, settings: AnalysisSettings, corrections: ImageCorrections | null = null,
  into: readonly Float32Array[] | null = null, planes: PlaneArrays | null = null, lazy = false): Promise<ProjectedStack> {
  checkIndices(info, settings);
  const warnings: string[] = [];
  const px = resolvePixelSize(info.pixelSize, settings.pixelSizeUm, warnings);
  const t = settings.timeIndex;
  const names = Array.from({ length: info.sizeC }, (_, c) => info.channelNames[c] || `C${c + 1}`);
  let channels: Plane[];
  let sliceIndex: number | null = null;
  let rawPlanes: RawPlane[] | undefined;
  if (settings.projection === 'slice' && settings.sliceIndex === null) {
    const best = await bestSlice(info, source, t, corrections);
    channels = best.planes;
    sliceIndex = best.z;
  } else {
    const zs = settings.projection === 'slice' ? [settings.sliceIndex as number] : Array.from({ length: info.sizeZ }, (_, z) => z);
    // One plane per channel (a chosen slice, or a stack of one slice): its projection is a conversion of that plane.
    const one: Plane[] = [];
    const projectors: Projector[] = zs.length === 1 ? [] : names.map((_, c) => createProjector(info.sizeX, info.sizeY, settings.projection, into?.[c] ?? null));
    // Planes in file order (by IFD; stable, so each channel still gets its slices in z order): the file is read
    // front to back, which disks like and which lets the batch hash the bytes as they are decoded.
    const order = zs.flatMap((z) => names.map((_, c) => ({ z, c, ifd: info.planeIfd[(t * info.sizeC + c) * info.sizeZ + z] ?? 0 })))
      .sort((a, b) => a.ifd - b.ifd);
    const read: RawPlane[] = [];
    const convertLater = lazy && planes !== null && EXACT_IN_FLOAT32.has(info.sampleType);
    const add = zs.length === 1
      ? (c: number, plane: RawPlane) => {
        one[c] = convertLater ? lazyOnePlane(plane, settings.projection, into?.[c]) : projectOnePlane(plane, settings.projection, into?.[c]);
        read[c] = plane;
      }
      : (c: number, plane: RawPlane) => projectors[c].add(plane);
    // At most two planes are held at once (readAhead), so several planes per channel take slots 0 and 1 in turn.
    const slot = (i: number): number => (zs.length === 1 ? order[i].c : i % 2);
    const intoAt = (i: number) => planes?.at(slot(i), info.sampleType, info.sizeX * info.sizeY);
    await readAhead(order.length, (i) => readChecked(source, info, order[i].z, order[i].c, t, intoAt(i)), (i, plane) => add(order[i].c, plane));
    channels = zs.length === 1 ? one : projectors.map((p, c) => p.result(into?.[c]));
    if (planes && zs.length === 1 && EXACT_IN_FLOAT32.has(info.sampleType)) rawPlanes = read;
    if (settings.projection === 'slice') sliceIndex = settings.sliceIndex;
  }
  // One NaN would spread through every later filter, so non-finite values (float files) become 0 here; projections
  // of integer samples are always finite, so they skip the pass.
  const floatSamples = info.sampleType === 'float32' || info.sampleType === 'float64';
  const bad = floatSamples ? clearNonFinite(channels) : 0;
  if (bad > 0) warnings.push(`${bad} projected pixel value(s) were NaN or infinite and were set to 0`);
  return { channels, channelNames: names, pixelSizeUm: px.um, pixelSizeSource: px.source, projection: settings.projection, sliceIndex, warnings, ...(rawPlanes ? { rawPlanes } : {}) };
}

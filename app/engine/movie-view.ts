// A movie analysed over time for the window: the batch's own analysis of the file (app/batch/timelapse-pass), its
// tables for that file, the figures' data, and each time point's projection shrunk for the time slider.
import type { MovieFrame, MovieRequestOptions, MovieView, ProjectDoc } from '../../core/contract';
import type { Detection, Plane, ProjectedStack } from '../../core/model';
import type { Estimate } from '../../core/timelapse';
import { analyseMovieAtPath, movieFigureData, movieTables, type MovieHooks } from '../batch/timelapse-pass';

/** Longest side of a frame sent to the window (px), and the most floats all frames together may hold (24 MiB). */
export const FRAME_MAX_SIDE_PX = 320;
export const FRAME_BUDGET_FLOATS = 6 * 1024 * 1024;

/**
 * The whole-number factor each frame is shrunk by: the smallest f ≥ 1 with the longer side ≤ maxSidePx / … and all
 * frames (channels × time points of ⌈w/f⌉ × ⌈h/f⌉ floats) within budgetFloats.
 */
export function frameShrinkFactor(widthPx: number, heightPx: number, channels: number, frames: number,
  maxSidePx = FRAME_MAX_SIDE_PX, budgetFloats = FRAME_BUDGET_FLOATS): number {
  let f = Math.max(1, Math.ceil(Math.max(widthPx, heightPx) / maxSidePx));
  while (f < Math.max(widthPx, heightPx) && Math.ceil(widthPx / f) * Math.ceil(heightPx / f) * channels * frames > budgetFloats) f += 1;
  return f;
}

/** Mean of each f × f block (edge blocks average the pixels they hold; NaN pixels are left out, all-NaN gives NaN). */
export function shrinkPlane(plane: Plane, f: number): Plane {
  const w = Math.ceil(plane.width / f), h = Math.ceil(plane.height / f);
  const sum = new Float64Array(w * h), count = new Uint32Array(w * h);
  shrinkInto(plane.data, plane.width, plane.height, f, w, sum, count);
  const data = new Float32Array(w * h);
  for (let i = 0; i < data.length; i++) data[i] = count[i] > 0 ? sum[i] / count[i] : NaN;
  return { width: w, height: h, data };
}

/** The pixel loop of shrinkPlane: block sums and counts. */
function shrinkInto(src: ArrayLike<number>, width: number, height: number, f: number, w: number, sum: Float64Array, count: Uint32Array): void {
  for (let y = 0; y < height; y++) {
    const row = Math.floor(y / f) * w;
    for (let x = 0; x < width; x++) {
      const v = src[y * width + x];
      if (v !== v) continue;
      const k = row + Math.floor(x / f);
      sum[k] += v; count[k] += 1;
    }
  }
}

/** The embryo's mask, outline and axis only (a detector's other fields, e.g. its pixel sizes, stay behind). */
export function plainDetection(d: Detection): Detection {
  return { mask: d.mask, outline: d.outline, axis: d.axis, eggLengthUm: d.eggLengthUm, eggWidthUm: d.eggWidthUm, warnings: d.warnings };
}

/** Plain copy of an estimate (value and interval). */
function est(e: Estimate): { value: number; ciLow: number; ciHigh: number } {
  return { value: e.value, ciLow: e.ciLow, ciHigh: e.ciHigh };
}

/** Options of the batch's time pass from the window's request: every time point unless the project's entry for the
 *  file names its own (the time pass reads it from the project, as the batch does). */
function passOptions(o: MovieRequestOptions) {
  return { selection: { kind: 'all' as const }, axisPerTime: o.axisPerTime, timeStepS: o.timeStepS, tauRangeEl: o.tauRangeEl, baselineFrames: o.baselineFrames };
}

/**
 * Analyse the movie at `path` (project key `file`) at every time point with the project's settings and hand edits,
 * exactly as `eggline batch` does, and shape the outcome for the window. Rejects with a one-line message naming the
 * file (AbortError when `signal` aborts).
 */
export async function buildMovieView(
  path: string, file: string, doc: ProjectDoc, options: MovieRequestOptions,
  hooks: Pick<MovieHooks, 'onTimePoint' | 'signal'> = {},
): Promise<MovieView> {
  const frames: MovieFrame[] = [];
  let channelNames: readonly string[] = [];
  let factor = 0;
  const onProjected = (k: number, p: ProjectedStack, total: number): void => {
    const first = p.channels[0];
    if (factor === 0) factor = frameShrinkFactor(first.width, first.height, p.channels.length, total);
    channelNames = p.channelNames;
    const shrunk = p.channels.map((c) => shrinkPlane(c, factor));
    frames[k] = { width: shrunk[0].width, height: shrunk[0].height, scale: factor, channels: shrunk.map((c) => c.data as Float32Array) };
  };
  let detection: Detection | null = null;
  let movieSizeT = 0;
  const onDetection = (d: Detection): void => { detection = plainDetection(d); };
  const m = await analyseMovieAtPath(path, file, doc.settings, doc, passOptions(options), { ...hooks, onProjected, onDetection, onInfo: (info) => { movieSizeT = info.sizeT; } });
  const s = m.summary;
  const d = movieFigureData(m);
  const list = (a: ArrayLike<number>): number[] => Array.from(a);
  return {
    path, file, sizeT: Math.max(movieSizeT, m.timeIndices.length), timeIndices: [...m.timeIndices], timesS: m.timesS ? list(m.timesS) : null,
    timeSource: m.timeSource ?? null, channelNames, results: m.results, frames: m.timeIndices.map((_, k) => frames[k] ?? null), detection,
    lambda: d.lambda, steadyLambdaEl: d.steadyLambdaEl ?? null,
    kymograph: d.kymograph && {
      xEl: list(d.kymograph.xEl), timesS: list(d.kymograph.timesS), values: d.kymograph.values.map(list),
      tracks: (d.kymograph.tracks ?? []).map((t) => ({ label: t.label, kind: t.kind, xEl: list(t.xEl) })),
    },
    accumulation: d.accumulation && {
      xEl: list(d.accumulation.xEl), tauS: list(d.accumulation.tauS), ciLowS: list(d.accumulation.ciLowS), ciHighS: list(d.accumulation.ciHighS),
      fit: d.accumulation.fit ?? null,
    },
    model: s.model && {
      rangeEl: s.model.rangeEl, tau0S: est(s.model.tau0S), kPerS: est(s.model.kPerS), dUm2PerS: est(s.model.dUm2PerS),
      lambdaTauEl: est(s.model.lambdaTauEl), lambdaEl: est(s.model.lambdaEl), agreement: s.model.agreement, reading: s.model.reading,
    },
    note: s.note, warnings: s.warnings, tables: movieTables([m]),
  };
}

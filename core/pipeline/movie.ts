// One movie end to end: the embryo's axis found once (on the mean over a sample of time points) or per time point,
// then every chosen time point analysed as a single stack with its own background. Never throws for bad data.
import { errorResult, withTimePoint, type ApAxis, type EmbryoResult, type HandEdits, type PlaneSource, type Plane, type ProjectedStack, type StackInfo } from '../model';
import type { AnalysisSettings } from '../settings';
import { reusedPlaneArrays, type ImageCorrections } from '../image';
import { detectEmbryo, type EmbryoDetection } from '../geometry';
import { analyseStack, correctedProjection } from './analyse';
import { samplingWithin } from '../profile';
import { prefetchingSource } from './prefetch';

/** Per-movie options of analyseMovie. */
export interface MovieOptions {
  readonly fileLabel: string;
  readonly handEdits?: HandEdits | null;
  /** The hand edits and settings in force at one time point (a time point's own edits over the file's); when given,
   *  they replace handEdits and settings at that time point. */
  readonly editsAt?: (t: number) => { readonly handEdits: HandEdits | null; readonly settings: AnalysisSettings };
  /** Time points to analyse (0-based, in order). */
  readonly timeIndices: readonly number[];
  /** Find the axis at every time point (embryos that drift) instead of once for the movie. */
  readonly axisPerTime?: boolean;
  /** Time points averaged to find the axis once; default 8, spread evenly over the movie. */
  readonly axisSampleCount?: number;
  /** Told after each analysed time point: how many are done of how many (the window's progress). */
  readonly onTimePoint?: (done: number, total: number) => void;
  /** Told each time point's Z projection (k = position in timeIndices, of total); it lives only during the call
   *  (its arrays are reused for the next time point), so copy what you keep. */
  readonly onProjected?: (k: number, projected: ProjectedStack, total: number) => void;
  /** Told the embryo found once for the movie (not with axisPerTime), before the first time point is analysed. */
  readonly onDetection?: (detection: EmbryoDetection) => void;
  /** Checked before each time point; when aborted, analyseMovie rejects with an AbortError naming the file. */
  readonly signal?: { readonly aborted: boolean } | null;
  /** Flat field and background image applied to every time point's projection. */
  readonly corrections?: ImageCorrections | null;
}

/** How long a movie's time points may run without giving the event loop a turn when the run can be cancelled. */
const YIELD_EVERY_MS = 25;

/** The error a cancelled movie analysis rejects with. */
function cancelled(fileLabel: string): Error {
  return Object.assign(new Error(`${fileLabel}: analysis over time cancelled`), { name: 'AbortError' });
}

/** The results per analysed time point (same order as timeIndices) and the movie's axis (null with axisPerTime). */
export interface MovieAnalysis {
  readonly timeIndices: readonly number[];
  readonly results: readonly EmbryoResult[];
  readonly movieAxis: ApAxis | null;
}

/** Up to `count` time points spread evenly over 0 … sizeT − 1, always including the last. */
export function axisSampleTimes(sizeT: number, count: number): number[] {
  if (sizeT <= count) return Array.from({ length: sizeT }, (_, t) => t);
  return Array.from({ length: count }, (_, i) => Math.round(((i + 1) * (sizeT - 1)) / count));
}

/** Adds each channel of `next` into `sum` (same sizes). */
function addInto(sum: Float32Array, next: Float32Array): void {
  for (let i = 0; i < sum.length; i++) sum[i] += next[i];
}

/** True when two settings differ at most in their time index and fit range. */
function sameButFitRange(a: AnalysisSettings, b: AnalysisSettings): boolean {
  const rest = (s: AnalysisSettings) => JSON.stringify({ ...s, timeIndex: 0, fitRangeEl: null });
  return rest(a) === rest(b);
}

/** Most bytes of sampled projections kept for their own time points' analysis (the rest are read again). */
const KEEP_PROJECTIONS_BYTES = 128 * 2 ** 20;

/**
 * The mean over sampled time points of the Z projections, and the projections of those time points in `keep`
 * (while they fit in KEEP_PROJECTIONS_BYTES), so their analysis does not read their planes again.
 */
async function projectSampled(info: StackInfo, source: PlaneSource, settings: AnalysisSettings, times: readonly number[], keep: ReadonlySet<number>, corrections: ImageCorrections | null = null,
  stop: (() => void) | null = null): Promise<{ mean: ProjectedStack; kept: Map<number, ProjectedStack> }> {
  let first: ProjectedStack | null = null;
  let sums: Float32Array[] = [];
  const kept = new Map<number, ProjectedStack>();
  let keptBytes = 0;
  for (const t of times) {
    // stop() throws once the run is cancelled: before each sampled time point's planes are read.
    stop?.();
    const p = await correctedProjection(info, source, { ...settings, timeIndex: t }, corrections);
    if (!first) { first = p; sums = p.channels.map((c) => Float32Array.from(c.data)); } else p.channels.forEach((c, i) => addInto(sums[i], c.data));
    const bytes = p.channels.reduce((n, c) => n + c.data.byteLength, 0);
    if (keep.has(t) && keptBytes + bytes <= KEEP_PROJECTIONS_BYTES) { kept.set(t, p); keptBytes += bytes; }
  }
  if (!first) throw new Error('no time points to project');
  const channels: Plane[] = first.channels.map((c, i) => ({ width: c.width, height: c.height, data: sums[i].map((v) => v / times.length) }));
  const { rawPlanes: _notTheMean, ...rest } = first;
  return { mean: { ...rest, channels }, kept };
}

/**
 * The mean over sampled time points of the Z projections: the embryo as it sits through the movie, gradient formed
 * or not (a live embryo barely moves, and a frame before production shows no gradient to orient the axis by).
 */
export async function projectOverTime(info: StackInfo, source: PlaneSource, settings: AnalysisSettings, times: readonly number[]): Promise<ProjectedStack> {
  return (await projectSampled(info, source, settings, times, new Set())).mean;
}

/**
 * Analyse the chosen time points of a movie. Unless axisPerTime, the embryo (mask and axis) is found once on
 * projectOverTime — a live embryo barely moves — and every time point is projected, given its own background and
 * measured within that mask, along the hand axis when there is one. With axisPerTime every time point is segmented
 * on its own. Errors become results with status 'error' naming the file and time point; only cancelling (options.signal)
 * makes it reject.
 */
export async function analyseMovie(info: StackInfo, source: PlaneSource, settings: AnalysisSettings, options: MovieOptions): Promise<MovieAnalysis> {
  const { fileLabel, timeIndices } = options;
  const bad = timeIndices.find((t) => !(Number.isInteger(t) && t >= 0 && t < info.sizeT));
  if (bad !== undefined) {
    const r = errorResult(fileLabel, `time point ${bad} is outside the movie (T = ${info.sizeT})`);
    return { timeIndices, results: timeIndices.map((t) => withTimePoint(r, t, info.time?.timesS?.[t] ?? null)), movieAxis: null };
  }
  let detection: EmbryoDetection | null = null;
  let kept = new Map<number, ProjectedStack>();
  if (options.signal?.aborted) throw cancelled(fileLabel);
  let lastYieldMs = Date.now();
  if (!options.axisPerTime) {
    const stop = options.signal ? () => { if (options.signal?.aborted) throw cancelled(fileLabel); } : null;
    try {
      const sampled = await projectSampled(info, source, settings, axisSampleTimes(info.sizeT, options.axisSampleCount ?? 8), new Set(timeIndices), options.corrections ?? null, stop);
      kept = sampled.kept;
      detection = detectEmbryo(sampled.mean, settings);
      options.onDetection?.(detection);
    } catch (e) {
      if (e instanceof Error && e.name === 'AbortError' && options.signal?.aborted) throw e;
      const r = errorResult(fileLabel, `embryo over time: ${e instanceof Error ? e.message : String(e)}`);
      return { timeIndices, results: timeIndices.map((t) => withTimePoint(r, t, info.time?.timesS?.[t] ?? null)), movieAxis: null };
    }
  }
  const results: EmbryoResult[] = [];
  // One embryo for the whole movie: what depends on its mask alone is prepared once (samplingWithin).
  const prepare = detection ? samplingWithin(detection) : undefined;
  // One set of projection arrays serves every time point: nothing keeps a time point's projection past its analysis.
  const projectionBuffers = Array.from({ length: info.sizeC }, () => new Float32Array(info.sizeX * info.sizeY));
  // Likewise the decoded planes: every time point's are read into the same arrays.
  const planeArrays = reusedPlaneArrays();
  const edits = timeIndices.map((t) => options.editsAt?.(t));
  const settingsAt = timeIndices.map((t, k) => ({ ...(edits[k]?.settings ?? settings), timeIndex: t }));
  // A kept projection serves only settings that differ from the movie's in the fit range alone.
  const keptFor = timeIndices.map((t, k) => (kept.has(t) && sameButFitRange(settingsAt[k], settings) ? kept.get(t) : undefined));
  kept.clear();
  // The time points whose planes are read, each read while the one before it is analysed.
  const reading = prefetchingSource(source, info, timeIndices.filter((_, k) => keptFor[k] === undefined));
  try {
    for (let k = 0; k < timeIndices.length; k++) {
      // Reads and inflates may all finish synchronously, so give the event loop a turn now and then: a cancel (or a
      // progress message) from the caller must get through while the movie runs.
      if (options.signal && Date.now() - lastYieldMs >= YIELD_EVERY_MS) {
        await new Promise<void>((resolve) => setTimeout(resolve, 0));
        lastYieldMs = Date.now();
      }
      if (options.signal?.aborted) throw cancelled(fileLabel);
      const at = edits[k];
      const onProjected = options.onProjected ? (p: ProjectedStack) => options.onProjected!(k, p, timeIndices.length) : undefined;
      const projected = keptFor[k];
      keptFor[k] = undefined;
      results.push(await analyseStack(info, reading, settingsAt[k], { fileLabel, handEdits: at ? at.handEdits : options.handEdits ?? null, detection, onProjected, projected, prepare, corrections: options.corrections ?? null, projectionBuffers, planeArrays, lazyProjection: detection !== null }));
      options.onTimePoint?.(k + 1, timeIndices.length);
    }
  } finally {
    // No read started ahead outlives the analysis (the caller closes the file next).
    await reading.settle();
  }
  const hand = options.handEdits?.axis ?? null;
  return { timeIndices, results, movieAxis: hand ? { ...hand, source: 'hand' } : detection?.axis ?? null };
}

// The stack the Embryo view shows: one time point projected over Z, with the embryo the batch measures it in. For a
// movie (a plain multi-page file too, when a time step reads its pages as frames) that embryo is found once on the
// projection over time, by the batch's own movie analysis, and kept per file and settings, so stepping to another
// time point reads only that time point's planes.
import { promises as fs } from 'node:fs';
import type { StackTimeOptions } from '../../core/contract';
import type { Detection, PlaneSource, ProjectedStack, StackInfo } from '../../core/model';
import { analyseMovie, applyImageCorrections, detectEmbryo, projectStack, type ImageCorrections } from '../../core/pipeline';
import { timePointForFile, type AnalysisSettings } from '../../core/settings';
import { resolveTimeAxis } from '../../core/tiff';
import { inputFolderOf, loadImageCorrections } from '../batch/correction-images';
import { asMovie } from '../batch/timelapse-pass';
import { openStackForAnalysis } from '../decode';
import type { ViewData } from './engine';
import { plainDetection } from './movie-view';
import { placeholderDetection } from './placeholder-detection';

/** Movies whose embryo is kept (a mask of one byte per pixel each). */
const KEPT_EMBRYOS = 4;

/** Something that says whether the caller still wants the answer. */
type Signal = { readonly aborted: boolean } | null;

/** The error a load rejects with once its signal is aborted (the window asked for another time point or file). */
export function viewCancelled(label: string): Error {
  return Object.assign(new Error(`${label}: loading cancelled (another view was asked for)`), { name: 'AbortError' });
}

/** `source` that refuses to read another plane once `signal` is aborted, so a stale load stops within one plane. */
function stoppable(source: PlaneSource, signal: Signal, label: string): PlaneSource {
  if (signal === null) return source;
  return {
    readPlane: (z, c, t, into) => (signal.aborted ? Promise.reject(viewCancelled(label)) : source.readPlane(z, c, t, into)),
    close: () => source.close(),
  };
}

/** The file's time points as the batch's time pass reads them: with a time step, a plain multi-page file's pages
 *  become frames and get the step's times (the file's own times win, as in the batch). */
export function viewOfTime(opened: { info: StackInfo; source: PlaneSource }, timeStepS: number | null, warnings: string[]): { info: StackInfo; source: PlaneSource } {
  const movie = asMovie(opened, timeStepS);
  if (movie.info.sizeT <= 1 || timeStepS === null) return movie;
  const axis = resolveTimeAxis(movie.info, timeStepS, warnings);
  return axis.timesS === null ? movie : { ...movie, info: { ...movie.info, time: { timesS: axis.timesS, source: axis.source } } };
}

/** The projection of the settings' time point with the flat field and background image applied, as the batch makes it. */
async function projectTimePoint(info: StackInfo, source: PlaneSource, settings: AnalysisSettings, corrections: ImageCorrections | null): Promise<ProjectedStack> {
  const raw = await projectStack(info, source, settings, corrections);
  return corrections ? applyImageCorrections(raw, corrections, settings.projection === 'sum' ? info.sizeZ : 1) : raw;
}

/** A projection without the decoded planes a projection may carry for the background (the window measures on the
 *  channels, and the planes' arrays may be reused). */
function withoutRawPlanes(p: ProjectedStack): ProjectedStack {
  const { rawPlanes: _planes, ...rest } = p;
  return rest;
}

/** The embryo of one time point alone; a placeholder (the user can set the axis by hand) when none is found. */
function detectOrPlaceholder(projected: ProjectedStack, settings: AnalysisSettings, label: string): Detection {
  try {
    return detectEmbryo(projected, settings);
  } catch (e) {
    return placeholderDetection(projected, label, e instanceof Error ? e.message : String(e));
  }
}

/** What the movie's embryo depends on: the file's bytes, the settings but its time point and fit range, the time step. */
async function embryoKey(path: string, settings: AnalysisSettings, timeStepS: number | null): Promise<string> {
  const st = await fs.stat(path);
  return JSON.stringify([path, st.size, st.mtimeMs, { ...settings, timeIndex: 0, fitRangeEl: null }, timeStepS]);
}

/**
 * The movie's embryo found by the batch's own movie analysis (on the mean projection of time points sampled over the
 * movie), with the projection of the shown time point it made on the way; a placeholder with the reason when no
 * embryo is found over time. Once `signal` is aborted it stops at the movie analysis's next check and rejects with
 * viewCancelled (never with the movie analysis's own cancel error).
 */
export async function embryoOverTime(info: StackInfo, source: PlaneSource, settings: AnalysisSettings, label: string, corrections: ImageCorrections | null,
  signal: Signal): Promise<{ detection: Detection; projected: ProjectedStack | null; found: boolean }> {
  let detection: Detection | null = null;
  let projected: ProjectedStack | null = null;
  const m = await analyseMovie(info, source, settings, {
    fileLabel: label, timeIndices: [settings.timeIndex], corrections,
    onDetection: (d) => { detection = plainDetection(d); },
    // The projection lives only during this call (its arrays are reused): keep a copy of its channels.
    onProjected: (_k, p) => { projected = withoutRawPlanes({ ...p, channels: p.channels.map((c) => ({ ...c, data: Float32Array.from(c.data) })) }); },
    signal,
  }).catch((e: unknown) => { throw signal?.aborted ? viewCancelled(label) : e; });
  if (signal?.aborted) throw viewCancelled(label);
  if (detection !== null) return { detection, projected, found: true };
  const own = projected ?? await projectTimePoint(info, source, settings, corrections);
  return { detection: placeholderDetection(own, label, m.results[0]?.error ?? 'no embryo found over time'), projected: own, found: false };
}

/** A loadForView that keeps the last few movies' embryos (state of this loader only, not of the module). */
export function createViewLoader(): (path: string, label: string, settings: AnalysisSettings, time?: StackTimeOptions | null, signal?: Signal) => Promise<ViewData> {
  const embryos = new Map<string, Detection>();
  const keep = (key: string, d: Detection): void => {
    embryos.delete(key);
    embryos.set(key, d);
    while (embryos.size > KEPT_EMBRYOS) embryos.delete(embryos.keys().next().value as string);
  };
  return async (path, label, asked, time = null, signal = null) => {
    const opened = await openStackForAnalysis(path, label);
    try {
      const warnings: string[] = [...opened.warnings];
      const timed = time === null ? opened : viewOfTime(opened, time.timeStepS, warnings);
      const info = timed.info;
      // A time point past the file's last shows its last (a single stack's only one), as the batch analyses it.
      const at = timePointForFile(asked.timeIndex, info.sizeT, label);
      const settings = at.tIndex === asked.timeIndex ? asked : { ...asked, timeIndex: at.tIndex };
      if (at.warning !== null) warnings.push(at.warning);
      const source = stoppable(timed.source, signal, label);
      // The flat field and background image, as the batch applies them (relative paths from the folder of the file list).
      const corrections = await loadImageCorrections(settings, inputFolderOf(path, label));
      if (signal?.aborted) throw viewCancelled(label);
      let projected: ProjectedStack | null = null;
      let detection: Detection | null = null;
      if (time !== null && !time.axisPerTime && info.sizeT > 1) {
        const key = await embryoKey(path, settings, time.timeStepS);
        const kept = embryos.get(key);
        if (kept !== undefined) detection = kept;
        else {
          const over = await embryoOverTime(info, source, settings, label, corrections, signal);
          ({ detection, projected } = over);
          if (over.found) keep(key, over.detection);
        }
        // The answer's arrays may be moved to another thread: the kept mask stays here.
        detection = { ...detection, mask: { ...detection.mask, data: detection.mask.data.slice() } };
      }
      projected ??= await projectTimePoint(info, source, settings, corrections);
      if (signal?.aborted) throw viewCancelled(label);
      detection ??= detectOrPlaceholder(projected, settings, label);
      return { info, projected: { ...withoutRawPlanes(projected), warnings: [...projected.warnings, ...warnings] }, detection };
    } finally {
      await opened.source.close();
    }
  };
}

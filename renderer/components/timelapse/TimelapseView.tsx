// The time-lapse view of one movie: how to analyse it over time (as the batch does, in the app), progress and
// cancel; then a time slider with play/pause, the image and the profile at the shown time point (earlier profiles
// faded behind), the kymograph, λ over time and τ(x) with the model line, and the model's numbers in plain words.
import { useEffect, useMemo, useRef, useState } from 'react';
import type { EgglineApi, MovieRequestOptions, MovieView } from '../../../core/contract';
import type { StackInfo } from '../../../core/model';
import { parseTimeSelection, parseTimeStepS, selectTimeIndices, timePointsForMovie, timeSelectionText, type TimeSelection } from '../../../core/settings';
import { FieldFrame } from '../settings/SettingField';
import { valueWithCi } from '../../../core/figures';
import type { MovieState } from '../../hooks/useMovie';
import { useElementSize } from '../../hooks/useElementSize';
import { fmt } from '../../ui/format';
import { MenuButton } from '../MenuButton';
import { FrameImage } from './FrameImage';
import { kymographAt, lambdaAt, profileAt, tauFigure, timeLabel } from './movieFigures';
import { MOVIE_EXPORT_LABELS, movieExport, type MovieExportCommand } from './movieExports';

/** Props of the time-lapse view. */
export interface TimelapseViewProps {
  readonly api: EgglineApi | null;
  /** The shown file (project key and path), or null. */
  readonly file: { readonly name: string; readonly path: string } | null;
  /** The shown file's stack as read (time points, where its times come from); null while it loads. */
  readonly info: StackInfo | null;
  readonly movie: MovieState;
  /** What an analysis would be made from now (settings, this file's edits, the options): any text that changes when
   *  they change; an outcome made from another is shown as out of date. */
  readonly basis: string;
  /** The run options (the batch's --axis-per-time, --tau-range, --baseline-frames), kept while tabs change. */
  readonly options: MovieRequestOptions;
  readonly onOptions: (o: MovieRequestOptions) => void;
  /** The file's own time points to analyse ('all', 'K', 'A:B'; null: all) and time step (s; null: the file's times). */
  readonly movieTime: { readonly time: string | null; readonly timeStepS: number | null };
  /** Change them (saved in the project; the analysis runs again). */
  readonly onMovieTime: (time: string | null, timeStepS: number | null) => void;
  /** Analyse the file over time with the options and the project as they are now. */
  readonly onAnalyse: () => void;
  readonly onCancel: () => void;
  /** The shown time point (0-based index in the file), shared with the Embryo view. */
  readonly tIndex: number;
  /** The shown time point changed (its 0-based index in the file). */
  readonly onTimePoint: (tIndex: number) => void;
  readonly setMessage: (m: string | null) => void;
}

/** Where a movie's times come from, in words. */
export function timeSourceText(source: string | null | undefined): string {
  switch (source) {
    case 'ome-plane': return 'the file (OME Plane DeltaT)';
    case 'ome-increment': return 'the file (OME TimeIncrement)';
    case 'imagej': return 'the file (ImageJ frame interval)';
    case 'ome-zarr': return 'the file (OME-Zarr time scale)';
    case 'user': return 'you (the time step below)';
    default: return 'nowhere: unknown (give a time step)';
  }
}

/** The file's own times, when it gives them (then a time step is not used); times made from the user's time step (a
 *  file loaded with it) are not the file's. */
function fileTimeSource(info: StackInfo | null): string | null {
  return info?.time && info.time.timesS !== null && info.time.source !== 'user' ? info.time.source : null;
}

/** The time points to analyse and the time step: the --time and --time-step flags' rules and wording. */
function MovieTimeFields({ movieTime, info, disabled, onChange }: {
  movieTime: TimelapseViewProps['movieTime']; info: StackInfo | null; disabled: boolean; onChange: TimelapseViewProps['onMovieTime'];
}) {
  const timeValue = movieTime.time ?? 'all';
  const stepValue = movieTime.timeStepS === null ? '' : String(movieTime.timeStepS);
  const [timeText, setTimeText] = useState(timeValue);
  const [stepText, setStepText] = useState(stepValue);
  const [timeError, setTimeError] = useState<string | null>(null);
  const [stepError, setStepError] = useState<string | null>(null);
  useEffect(() => { setTimeText(timeValue); setTimeError(null); }, [timeValue]);
  useEffect(() => { setStepText(stepValue); setStepError(null); }, [stepValue]);
  const own = fileTimeSource(info);
  const commitTime = (): void => {
    try {
      const sel = parseTimeSelection(timeText, 'time points');
      const sizeT = info === null ? null : Math.max(info.sizeT, movieTime.timeStepS !== null && !info.isOme && info.sizeT === 1 ? info.sizeZ : 1);
      // As the batch: a time point past the end is the last one, a range is cut at the end (the line below says
      // so). A range wholly past the end would analyse nothing of this file, for which the field is: refused.
      if (sel.kind === 'range' && sizeT !== null && sizeT > 1 && selectTimeIndices(sel, sizeT).length === 0) {
        setTimeError(`time points: time point ${sel.first} is outside the movie (T = ${sizeT}, time points 0 to ${sizeT - 1})`);
        return;
      }
      setTimeError(null);
      const text = timeSelectionText(sel);
      if (text !== timeValue) onChange(text === 'all' ? null : text, movieTime.timeStepS);
    } catch (e) { setTimeError((e as Error).message); }
  };
  const commitStep = (): void => {
    try {
      const step = stepText.trim() === '' ? null : parseTimeStepS(stepText, 'time step');
      setStepError(null);
      if (step !== movieTime.timeStepS) onChange(movieTime.time, step);
    } catch (e) { setStepError((e as Error).message); }
  };
  return (
    <>
      <FieldFrame label="time points" help="Time points to analyse, 0-based as eggline batch --time takes them: all, one time point K, or a range A:B (both ends included). Saved for this file in the project; the batch uses it too."
        error={timeError} testId="movie-time">
        <input type="text" value={timeText} disabled={disabled} data-testid="movie-time" aria-invalid={timeError !== null} placeholder="all, K or A:B" size={7}
          onChange={(e) => setTimeText(e.target.value)} onBlur={commitTime} onKeyDown={(e) => { if (e.key === 'Enter') commitTime(); }} />
      </FieldFrame>
      <FieldFrame label="time step (s)" help={own !== null ? `The file gives its own times (${timeSourceText(own)}); a time step is used only for files that give none.`
        : 'Seconds between time points, as eggline batch --time-step: for files that give no times (a plain multi-page file is then read as frames). Saved for this file in the project.'}
        error={stepError} testId="movie-time-step">
        <input type="text" inputMode="decimal" value={stepText} disabled={disabled || (own !== null && stepValue === '')} data-testid="movie-time-step" aria-invalid={stepError !== null}
          placeholder={own !== null ? 'from file' : 'none'} size={5}
          onChange={(e) => setStepText(e.target.value)} onBlur={commitStep} onKeyDown={(e) => { if (e.key === 'Enter') commitStep(); }} />
      </FieldFrame>
    </>
  );
}

/** Milliseconds between frames while playing. */
const PLAY_STEP_MS = 350;

/** A figure drawn at its box's size (white paper, as in the report). */
function Figure({ draw, testId, label, k }: { draw: (box: { widthPx: number; heightPx: number }) => string | null; testId: string; label: string; k?: number }) {
  const ref = useRef<HTMLDivElement>(null);
  const { width, height } = useElementSize(ref);
  const svg = useMemo(() => (width > 0 && height > 0 ? draw({ widthPx: width, heightPx: height }) : null), [draw, width, height]);
  return (
    <div className="tl-cell figure" ref={ref} data-testid={testId} data-t={k} aria-label={label}>
      {svg === null ? (width > 0 ? <p className="muted tl-empty">{label}: not available for this movie</p> : null)
        : <div className="tl-svg" dangerouslySetInnerHTML={{ __html: svg }} />}
    </div>
  );
}

/** "value (low to high)" of an estimate at its interval's precision; '—' when not measured. */
function estimateText(e: { value: number; ciLow: number; ciHigh: number }, scale = 1): string {
  if (!Number.isFinite(e.value)) return '—';
  const r = valueWithCi(e.value * scale, e.ciLow * scale, e.ciHigh * scale, { style: 'words' });
  return r.ci === 'n/a' ? r.value : `${r.value} (${r.ci})`;
}

/** The numbers of the shown time point and of the model fit, with the plain reading and the warnings. */
function MovieNumbers({ view, k }: { view: MovieView; k: number }) {
  const fit = view.results[k]?.gradientFit ?? null;
  const m = view.model;
  const minutes = view.timesS !== null;
  return (
    <div className="tl-cell tl-numbers panel" data-testid="movie-numbers">
      <h3>This time point</h3>
      <table><tbody>
        <tr><th>λ (x/EL)</th><td data-testid="movie-lambda-now" data-value={fit?.lambdaEl ?? ''}>{fit ? estimateText({ value: fit.lambdaEl, ciLow: fit.lambdaCiLowUm * fit.lambdaEl / fit.lambdaUm, ciHigh: fit.lambdaCiHighUm * fit.lambdaEl / fit.lambdaUm }) : '—'}</td></tr>
        <tr><th>λ (µm)</th><td>{fit ? estimateText({ value: fit.lambdaUm, ciLow: fit.lambdaCiLowUm, ciHigh: fit.lambdaCiHighUm }) : '—'}</td></tr>
        <tr><th>R²</th><td>{fmt(fit?.r2 ?? null, 3)}</td></tr>
        {!fit && view.results[k]?.error && <tr><th>not fitted</th><td className="warn">{view.results[k].error}</td></tr>}
      </tbody></table>
      <h3>Approach to steady state{m ? ` (τ fit over x/EL ${m.rangeEl[0]}–${m.rangeEl[1]})` : ''}</h3>
      {m ? (
        <>
          <table><tbody>
            <tr><th>τ₀ ({minutes ? 'min' : 's'})</th><td data-testid="movie-tau0" data-value={m.tau0S.value}>{estimateText(m.tau0S, 1 / 60)}</td></tr>
            <tr><th>k = 1/(2τ₀) (1/min)</th><td data-testid="movie-k" data-value={m.kPerS.value}>{estimateText(m.kPerS, 60)}</td></tr>
            <tr><th>D = k·λ² (µm²/s)</th><td data-testid="movie-d" data-value={m.dUm2PerS.value}>{estimateText(m.dUm2PerS)}</td></tr>
            <tr><th>λ_τ from τ(x) (x/EL)</th><td data-testid="movie-lambda-tau" data-value={m.lambdaTauEl.value}>{estimateText(m.lambdaTauEl)}</td></tr>
            <tr><th>steady-state λ (x/EL)</th><td data-testid="movie-lambda-steady" data-value={m.lambdaEl.value}>{estimateText(m.lambdaEl)}</td></tr>
            <tr><th>λ_τ and λ</th><td data-testid="movie-agreement" className={m.agreement === 'differ' ? 'warn' : ''}>{m.agreement === 'agree' ? 'agree within the 95% interval' : m.agreement === 'differ' ? 'differ' : 'cannot be compared'}</td></tr>
          </tbody></table>
          <p className="tl-reading" data-testid="movie-reading">{m.reading}</p>
        </>
      ) : <p className="muted" data-testid="movie-note">{view.note ?? 'no model fit'}</p>}
      {view.warnings.length > 0 && <ul className="warnings" data-testid="movie-warnings">{view.warnings.map((w) => <li key={w}>{w}</li>)}</ul>}
      <p className="muted small" data-testid="movie-time-source" data-source={view.timeSource ?? ''}>Research software: these numbers support your judgement; check the kymograph and the fits. Times from {timeSourceText(view.timeSource)}.</p>
    </div>
  );
}

/** Options of the analysis (the batch's time flags), edited before a run. */
function RunOptions({ options, onChange, disabled }: { options: MovieRequestOptions; onChange: (o: MovieRequestOptions) => void; disabled: boolean }) {
  const num = (v: string, fallback: number) => (Number.isFinite(Number(v)) && v.trim() !== '' ? Number(v) : fallback);
  return (
    <>
      <label title="Find the embryo and its axis at every time point (embryos that drift); by default once, on the mean over the movie. A hand-set axis applies to every time point.">
        <input type="checkbox" data-testid="movie-axis-per-time" checked={options.axisPerTime} disabled={disabled} onChange={(e) => onChange({ ...options, axisPerTime: e.target.checked })} /> axis at every time point
      </label>
      <label title="x/EL range of the straight-line fit τ(x) = τ₀(1 + x/λ_τ)">τ fit x/EL
        <input type="number" step={0.05} min={0} max={1} value={options.tauRangeEl[0]} disabled={disabled} aria-label="τ fit range start (x/EL)"
          onChange={(e) => onChange({ ...options, tauRangeEl: [num(e.target.value, options.tauRangeEl[0]), options.tauRangeEl[1]] })} />–
        <input type="number" step={0.05} min={0} max={1} value={options.tauRangeEl[1]} disabled={disabled} aria-label="τ fit range end (x/EL)"
          onChange={(e) => onChange({ ...options, tauRangeEl: [options.tauRangeEl[0], num(e.target.value, options.tauRangeEl[1])] })} />
      </label>
      <label title="Frames imaged before production starts; their mean is the zero of τ(x)">frames before production
        <input type="number" step={1} min={0} value={options.baselineFrames} disabled={disabled} aria-label="frames before production"
          onChange={(e) => onChange({ ...options, baselineFrames: Math.max(0, Math.round(num(e.target.value, options.baselineFrames))) })} />
      </label>
    </>
  );
}

/** The time points a saved selection (as --time takes it) analyses in a movie of sizeT time points (null: unknown),
 *  in words: what was asked, or what is analysed of it when the movie ends first (as the batch cuts it). */
function chosenTimesText(time: string, sizeT: number | null): string {
  const of = sizeT === null ? '' : ` of ${sizeT}`;
  const asked = time.includes(':') ? `Time points ${time.replace(':', ' to ')} (0-based)${of}` : `Time point ${time} (0-based)${of}`;
  let sel: TimeSelection;
  try { sel = parseTimeSelection(time); } catch { return asked; }
  if (sizeT === null) return asked;
  const { tIndices: picked, warning } = timePointsForMovie(sel, sizeT, '');
  if (warning === null) return asked;
  if (picked.length === 0) return `No time point (${time} asked for lies past the movie's end, time points 0 to ${sizeT - 1})`;
  const got = picked.length === 1 ? `Time point ${picked[0]}` : `Time points ${picked[0]} to ${picked[picked.length - 1]}`;
  return `${got} (0-based)${of} (${time} asked for, past the movie's end)`;
}

/** One line: which time points are (to be) analysed and where their times come from. */
export function timesLine(info: StackInfo | null, view: MovieView | null, t: TimelapseViewProps['movieTime']): string {
  const sizeT = view?.sizeT ?? (info !== null && info.sizeT > 1 ? info.sizeT : null);
  const which = t.time === null ? (sizeT === null ? 'Every time point' : `All ${sizeT} time points`) : chosenTimesText(t.time, sizeT);
  const source = view !== null ? view.timeSource : fileTimeSource(info) ?? (t.timeStepS !== null ? 'user' : null);
  const step = t.timeStepS !== null && source === 'user' ? `, ${t.timeStepS} s apart` : '';
  return `${which}; times from ${timeSourceText(source)}${step}.`;
}

/** The time-lapse view. */
export function TimelapseView(p: TimelapseViewProps) {
  const { options, movie } = p;
  const [playing, setPlaying] = useState(false);
  const [exportMenu, setExportMenu] = useState(false);
  const view = movie.view !== null && p.file !== null && movie.view.file === p.file.name ? movie.view : null;
  const n = view?.timeIndices.length ?? 0;
  const running = movie.status === 'running';
  const stale = view !== null && movie.basis !== null && movie.basis !== p.basis;
  // The shown time point is the window's (the Embryo view follows it); k is its place among the analysed ones.
  const found = view === null ? -1 : view.timeIndices.indexOf(p.tIndex);
  const k = Math.max(0, found);
  const kRef = useRef(k);
  kRef.current = k;
  const setK = (next: number | ((i: number) => number)): void => {
    if (view === null) return;
    const i = Math.max(0, Math.min(n - 1, typeof next === 'function' ? next(kRef.current) : next));
    kRef.current = i;
    p.onTimePoint(view.timeIndices[i]);
  };
  // A new outcome stops playing (the window moves the shown time point to its first when it was not analysed).
  useEffect(() => { setPlaying(false); }, [view]);
  // Playing advances one time point per step and stops at the last.
  useEffect(() => {
    if (!playing || n === 0) return;
    const id = setInterval(() => {
      if (kRef.current + 1 >= n) { setPlaying(false); return; }
      setK(kRef.current + 1);
    }, PLAY_STEP_MS);
    return () => clearInterval(id);
  }, [playing, n, view]);
  const togglePlay = () => {
    if (n === 0) return;
    if (!playing && k >= n - 1) setK(0);
    setPlaying((v) => !v);
  };
  const step = (d: number) => { setPlaying(false); setK((i) => Math.max(0, Math.min(n - 1, i + d))); };
  // Arrows step, Space plays, Home/End go to the ends; caught before the editor's own keys (capture phase).
  const keys = useRef({ step, togglePlay, n });
  keys.current = { step, togglePlay, n };
  useEffect(() => {
    if (view === null) return;
    const down = (e: KeyboardEvent) => {
      const t = e.target as HTMLElement | null;
      const typing = t !== null && (t.tagName === 'TEXTAREA' || t.tagName === 'SELECT' || (t.tagName === 'INPUT' && (t as HTMLInputElement).type !== 'range'));
      if (typing || e.ctrlKey || e.metaKey || e.altKey || t?.closest('.menu-list')) return;
      const c = keys.current;
      if (e.key === 'ArrowRight' || e.key === 'ArrowLeft') c.step((e.key === 'ArrowRight' ? 1 : -1) * (e.shiftKey ? 5 : 1));
      else if (e.key === 'Home') c.step(-c.n);
      else if (e.key === 'End') c.step(c.n);
      else if (e.key === ' ' && t?.tagName !== 'BUTTON') c.togglePlay();
      else return;
      e.preventDefault();
      e.stopPropagation();
    };
    window.addEventListener('keydown', down, true);
    return () => window.removeEventListener('keydown', down, true);
  }, [view]);

  const draws = useMemo(() => (view === null ? null : {
    profile: (b: { widthPx: number; heightPx: number }) => profileAt(view, k, b),
    kymograph: (b: { widthPx: number; heightPx: number }) => kymographAt(view, k, b),
    lambda: (b: { widthPx: number; heightPx: number }) => lambdaAt(view, k, b),
    tau: (b: { widthPx: number; heightPx: number }) => tauFigure(view, b),
  }), [view, k]);

  if (p.file === null) return <section className="timelapse" data-testid="timelapse-view"><p className="muted tl-hint">Open a folder and choose a movie in the file list.</p></section>;
  const pages = p.info !== null && p.info.sizeT === 1 && !p.info.isOme && p.info.sizeZ > 1;
  const oneFrame = p.info !== null && p.info.sizeT === 1 && view === null && !(pages && p.movieTime.timeStepS !== null);
  const exportItems = (Object.keys(MOVIE_EXPORT_LABELS) as MovieExportCommand[]).map((c) => ({
    id: c, label: MOVIE_EXPORT_LABELS[c], testId: `movie-export-${c}`,
    onSelect: () => { if (view !== null && p.api !== null) void movieExport(p.api, view, k, c, p.setMessage); },
  }));
  return (
    <section className="timelapse" data-testid="timelapse-view">
      <div className="tl-head">
        <h3 title={p.file.name}>Over time: {p.file.name}</h3>
        {oneFrame ? (
          <>
            <span className="muted" data-testid="movie-one-frame">This file has one time point; the view over time needs a movie (OME-TIFF with SizeT &gt; 1, an ImageJ hyperstack with frames, or OME-Zarr with a t axis){pages ? ', or a time step to read its pages as frames' : ''}.</span>
            {pages && <MovieTimeFields movieTime={p.movieTime} info={p.info} disabled={running} onChange={p.onMovieTime} />}
          </>
        ) : (
          <>
            <MovieTimeFields movieTime={p.movieTime} info={p.info} disabled={false} onChange={p.onMovieTime} />
            <RunOptions options={options} onChange={p.onOptions} disabled={running} />
            {running ? (
              <>
                <progress max={Math.max(1, movie.total)} value={movie.done} data-testid="movie-progress" />
                <span className="muted" data-testid="movie-progress-text">{movie.total > 0 ? `time point ${movie.done} of ${movie.total}` : 'finding the embryo over the movie…'}{movie.file !== p.file.name ? ` (${movie.file})` : ''}</span>
                <button data-testid="movie-cancel" onClick={p.onCancel}>Cancel</button>
              </>
            ) : (
              <button className="primary" data-testid="movie-analyse" disabled={p.info === null}
                title="Analyse the chosen time points with the current settings and hand edits, as the batch does"
                onClick={p.onAnalyse}>{view === null ? 'Analyse over time' : 'Analyse again'}</button>
            )}
            <MenuButton label="Export ▾" items={exportItems} open={exportMenu} onOpen={setExportMenu} disabled={view === null} testId="movie-export" alignRight />
          </>
        )}
      </div>
      {movie.file === p.file.name && movie.status === 'error' && <p className="error tl-hint" data-testid="movie-error">{movie.error}</p>}
      {stale && !running && <p className="tl-hint tl-stale" data-testid="movie-stale">The settings, this file&apos;s hand edits or the options above changed after this analysis: the figures show the analysis as it was. Analyse again to update them.</p>}
      {movie.file === p.file.name && movie.status === 'cancelled' && <p className="muted tl-hint" data-testid="movie-cancelled">Cancelled; nothing was kept. Analyse again to start over.</p>}
      <p className="muted tl-hint tl-times" data-testid="movie-times">{timesLine(p.info, view, p.movieTime)}</p>
      {view === null && !running && !oneFrame && movie.status !== 'error' && <p className="muted tl-hint">Each time point gets its own projection, background, profile and fit along one axis for the movie; then λ over time, the kymograph and the local accumulation time τ(x) with the synthesis–diffusion–degradation model&apos;s test. The batch writes the same numbers to timecourse.csv and model_fit.csv.</p>}
      {view !== null && draws !== null && (
        <>
          <div className="tl-time" role="group" aria-label="time">
            <button data-testid="movie-play" aria-pressed={playing} title="Play or pause (Space)" onClick={togglePlay}>{playing ? '❚❚ Pause' : '▶ Play'}</button>
            <button title="Previous time point (←)" aria-label="previous time point" onClick={() => step(-1)} disabled={k === 0}>◀</button>
            <input type="range" min={0} max={Math.max(0, n - 1)} step={1} value={k} data-testid="movie-slider" aria-label="time point"
              aria-valuetext={timeLabel(view, k)} onChange={(e) => { setPlaying(false); setK(Number(e.target.value)); }} />
            <button title="Next time point (→)" aria-label="next time point" onClick={() => step(1)} disabled={k >= n - 1}>▶</button>
            <span className="tl-label" data-testid="movie-time-label" data-k={k}>{timeLabel(view, k)}</span>
          </div>
          <div className="tl-grid">
            <FrameImage view={view} k={k} />
            <Figure draw={draws.profile} testId="movie-profile" label="profile at this time point" k={k} />
            <Figure draw={draws.kymograph} testId="movie-kymograph" label="kymograph" k={k} />
            <Figure draw={draws.lambda} testId="movie-lambda" label="decay length over time" k={k} />
            <Figure draw={draws.tau} testId="movie-tau" label="local accumulation time τ(x)" />
            <MovieNumbers view={view} k={k} />
          </div>
        </>
      )}
    </section>
  );
}

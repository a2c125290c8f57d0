// The time-lapse view of one movie: how to analyse it over time (as the batch does, in the app), progress and
// cancel; then a time slider with play/pause, the image and the profile at the shown time point (earlier profiles
// faded behind), the kymograph, λ over time and τ(x) with the model line, and the model's numbers in plain words.
import { useEffect, useMemo, useRef, useState } from 'react';
import type { EgglineApi, MovieRequestOptions, MovieView } from '../../../core/contract';
import { valueWithCi } from '../../../core/figures';
import type { MovieState } from '../../hooks/useMovie';
import { DEFAULT_MOVIE_OPTIONS } from '../../hooks/useMovie';
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
  /** Time points of the shown file as its stack reports them; null while it loads. */
  readonly sizeT: number | null;
  readonly movie: MovieState;
  /** The shared settings and this file's hand edits as they are now (any text that changes when they change). */
  readonly basis: string;
  readonly onAnalyse: (options: MovieRequestOptions, basis: string) => void;
  readonly onCancel: () => void;
  /** The shown time point changed (its 0-based index in the file). */
  readonly onTimePoint: (tIndex: number) => void;
  readonly setMessage: (m: string | null) => void;
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
      <p className="muted small">Research software: these numbers support your judgement; check the kymograph and the fits. Times from {view.timeSource ?? 'nowhere (unknown)'}.</p>
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

/** The time-lapse view. */
export function TimelapseView(p: TimelapseViewProps) {
  const [options, setOptions] = useState<MovieRequestOptions>(DEFAULT_MOVIE_OPTIONS);
  const [k, setK] = useState(0);
  const [playing, setPlaying] = useState(false);
  const [exportMenu, setExportMenu] = useState(false);
  const { movie } = p;
  const view = movie.view !== null && p.file !== null && movie.view.file === p.file.name ? movie.view : null;
  const n = view?.timeIndices.length ?? 0;
  const running = movie.status === 'running';
  const basis = JSON.stringify([p.basis, options]);
  const stale = view !== null && movie.basis !== null && movie.basis !== basis;
  // A new outcome starts at the first time point.
  useEffect(() => { setK(0); setPlaying(false); }, [view]);
  useEffect(() => { if (view !== null && view.timeIndices[k] !== undefined) p.onTimePoint(view.timeIndices[k]); }, [view, k]);
  // Playing advances one time point per step and stops at the last.
  useEffect(() => {
    if (!playing || n === 0) return;
    const id = setInterval(() => setK((i) => {
      if (i + 1 >= n) { setPlaying(false); return i; }
      return i + 1;
    }), PLAY_STEP_MS);
    return () => clearInterval(id);
  }, [playing, n]);
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
  const oneFrame = p.sizeT === 1 && view === null;
  const exportItems = (Object.keys(MOVIE_EXPORT_LABELS) as MovieExportCommand[]).map((c) => ({
    id: c, label: MOVIE_EXPORT_LABELS[c], testId: `movie-export-${c}`,
    onSelect: () => { if (view !== null && p.api !== null) void movieExport(p.api, view, k, c, p.setMessage); },
  }));
  return (
    <section className="timelapse" data-testid="timelapse-view">
      <div className="tl-head">
        <h3 title={p.file.name}>Over time: {p.file.name}</h3>
        {oneFrame ? <span className="muted" data-testid="movie-one-frame">This file has one time point; the view over time needs a movie (OME-TIFF with SizeT &gt; 1, an ImageJ hyperstack with frames, or OME-Zarr with a t axis).</span> : (
          <>
            <RunOptions options={options} onChange={setOptions} disabled={running} />
            {running ? (
              <>
                <progress max={Math.max(1, movie.total)} value={movie.done} data-testid="movie-progress" />
                <span className="muted" data-testid="movie-progress-text">{movie.total > 0 ? `time point ${movie.done} of ${movie.total}` : 'finding the embryo over the movie…'}{movie.file !== p.file.name ? ` (${movie.file})` : ''}</span>
                <button data-testid="movie-cancel" onClick={p.onCancel}>Cancel</button>
              </>
            ) : (
              <button className="primary" data-testid="movie-analyse" disabled={p.sizeT === null}
                title="Analyse every time point with the current settings and hand edits, as the batch does"
                onClick={() => p.onAnalyse(options, basis)}>{view === null ? 'Analyse over time' : 'Analyse again'}</button>
            )}
            <MenuButton label="Export ▾" items={exportItems} open={exportMenu} onOpen={setExportMenu} disabled={view === null} testId="movie-export" alignRight />
          </>
        )}
      </div>
      {movie.file === p.file.name && movie.status === 'error' && <p className="error tl-hint" data-testid="movie-error">{movie.error}</p>}
      {stale && <p className="tl-hint tl-stale" data-testid="movie-stale">The settings, this file&apos;s hand edits or the options above changed after this analysis: the figures show the analysis as it was. Analyse again to update them.</p>}
      {movie.file === p.file.name && movie.status === 'cancelled' && <p className="muted tl-hint" data-testid="movie-cancelled">Cancelled; nothing was kept. Analyse again to start over.</p>}
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

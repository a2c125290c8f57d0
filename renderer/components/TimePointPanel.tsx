// The shown time point of a movie in the Embryo view: which one it is, a slider and steps to any other (before or
// after the analysis over time),
// whether hand edits of the axis, landmarks and fit range apply to every time point or to this one alone, and a way
// back to the file's edits at this time point.
import type { MovieView, TimePointEdits } from '../../core/contract';
import { movieTimeUnit } from '../../core/figures';
import type { StackInfo } from '../../core/model';
import type { EditorAction, EditScope } from '../state';
import { fmt } from '../ui/format';

/** "t = 80 min" for time point t: the analysed movie's times, else the file's own; null when unknown. The unit follows
 *  the movie's span, as in the Over time view. */
export function shownTimeText(view: MovieView | null, info: StackInfo | null, t: number): string | null {
  const k = view === null ? -1 : view.timeIndices.indexOf(t);
  let valueS: number, spanS: number;
  if (view !== null && k >= 0 && view.timesS !== null) {
    valueS = view.timesS[k]; spanS = view.timesS[view.timesS.length - 1] - view.timesS[0];
  } else if (info?.time?.timesS && t < info.time.timesS.length) {
    const ts = info.time.timesS;
    valueS = ts[t] - ts[0]; spanS = ts[ts.length - 1] - ts[0];
  } else return null;
  const { unit, perS } = movieTimeUnit(spanS);
  return `t = ${fmt(valueS * perS, 3)} ${unit}`;
}

/** Props of the panel. */
export interface TimePointPanelProps {
  /** The shown time point (0-based) and the movie's number of time points. */
  readonly tIndex: number;
  readonly sizeT: number;
  /** The time of the shown time point in words ("t = 80 min"), or null when unknown. */
  readonly timeText: string | null;
  /** The time points analysed over time (empty before the movie is analysed over time). */
  readonly analysed: readonly number[];
  /** True while the image and numbers still show another time point (the new one is loading). */
  readonly loading: boolean;
  readonly scope: EditScope;
  /** The shown time point's own edits, or null. */
  readonly own: TimePointEdits | null;
  readonly dispatch: (a: EditorAction) => void;
}

/** Names of the fields a time point has of its own, in words. */
export function ownFieldsText(own: TimePointEdits): string {
  const names = [own.axis !== undefined ? 'axis' : null, own.landmarks !== undefined ? 'landmarks' : null, own.fitRangeEl !== undefined ? 'fit range' : null]
    .filter((n): n is string => n !== null);
  return names.length <= 1 ? names.join('') : `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

/** The panel (shown for movies only). */
export function TimePointPanel(p: TimePointPanelProps) {
  const go = (t: number) => { if (Number.isInteger(t) && t >= 0 && t < p.sizeT) p.dispatch({ type: 'showTimePoint', tIndex: t }); };
  const notAnalysed = p.analysed.length > 0 && !p.analysed.includes(p.tIndex);
  return (
    <section className="panel time-point" data-testid="time-point-panel" aria-label="time point">
      <h3>Time point</h3>
      <div className="tp-row">
        <button aria-label="previous time point" title="Previous time point" disabled={p.tIndex <= 0} onClick={() => go(p.tIndex - 1)}>◀</button>
        <span data-testid="embryo-time-label" data-t={p.tIndex}>{p.tIndex + 1} of {p.sizeT}{p.timeText ? ` · ${p.timeText}` : ''}{p.loading ? ' · loading…' : ''}</span>
        <button aria-label="next time point" title="Next time point" disabled={p.tIndex >= p.sizeT - 1} onClick={() => go(p.tIndex + 1)}>▶</button>
      </div>
      <input type="range" className="tp-slider" data-testid="embryo-time-slider" aria-label="time point" min={0} max={p.sizeT - 1} step={1}
        value={Math.min(p.tIndex, p.sizeT - 1)} onChange={(e) => go(Number(e.target.value))} />
      {notAnalysed && <p className="muted small" data-testid="time-point-not-analysed">Not among the time points analysed over time.</p>}
      <fieldset className="tp-scope">
        <legend>Moving the axis, landmarks or fit range changes</legend>
        <label title="The file's edits: they hold at every time point that has none of its own">
          <input type="radio" name="edit-scope" data-testid="edit-scope-file" checked={p.scope === 'file'} onChange={() => p.dispatch({ type: 'setEditScope', scope: 'file' })} /> every time point
        </label>
        <label title="Edits of this time point alone, saved with it in the project; the batch uses them there">
          <input type="radio" name="edit-scope" data-testid="edit-scope-time-point" checked={p.scope === 'timePoint'} onChange={() => p.dispatch({ type: 'setEditScope', scope: 'timePoint' })} /> this time point only
        </label>
      </fieldset>
      {p.own !== null && (
        <p className="tp-own" data-testid="time-point-own">
          This time point has its own {ownFieldsText(p.own)}.{' '}
          <button data-testid="clear-time-point" title="Drop this time point's own edits; the file's apply here again (Ctrl+Z takes it back)"
            onClick={() => p.dispatch({ type: 'clearTimePointEdits' })}>Use the file&apos;s edits here</button>
        </p>
      )}
    </section>
  );
}

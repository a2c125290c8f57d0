// Channel display: one channel or merged, colour, display range (histogram + auto), Z slider and projection.
import type { Dispatch } from 'react';
import type { Plane, ProjectionMethod } from '../../core/model';
import type { EditorAction, EditorState } from '../state';
import { autoDisplayRange } from '../view';
import { fmt } from '../ui/format';
import { Histogram } from './Histogram';

/** Props of the display panel. */
export interface ChannelPanelProps {
  readonly state: EditorState;
  readonly dispatch: Dispatch<EditorAction>;
  readonly planes: readonly Plane[];
  readonly names: readonly string[];
  readonly sizeZ: number;
  /** Shown Z slice, or null for the projection. */
  readonly zSlice: number | null;
  readonly onZSlice: (z: number | null) => void;
}

const PROJECTIONS: ProjectionMethod[] = ['max', 'mean', 'sum', 'slice'];

/** The display panel. */
export function ChannelPanel({ state, dispatch, planes, names, sizeZ, zSlice, onZSlice }: ChannelPanelProps) {
  const { display } = state;
  const active = display.active;
  const d = display.channels[active];
  const plane = planes[active];
  return (
    <section className="panel channel-panel">
      <h3>Display</h3>
      <div className="chips">
        <button className={display.mode === 'merged' ? 'on' : ''} onClick={() => dispatch({ type: 'setDisplayMode', mode: 'merged' })}>merged</button>
        {names.map((n, i) => (
          <button key={i} className={display.mode === 'single' && active === i ? 'on' : ''} style={{ borderColor: display.channels[i]?.colour }}
            onClick={() => dispatch({ type: 'setDisplayMode', mode: 'single', active: i })}>{n}</button>
        ))}
      </div>
      {d !== undefined && plane !== undefined && (
        <div className="channel-range">
          <div className="row">
            <label>range of
              <select value={active} onChange={(e) => dispatch({ type: 'setDisplayMode', mode: display.mode, active: Number(e.target.value) })}>
                {names.map((n, i) => <option key={i} value={i}>{n}</option>)}
              </select>
            </label>
            <input type="color" value={d.colour} title="channel colour" onChange={(e) => dispatch({ type: 'setChannelDisplay', index: active, patch: { colour: e.target.value } })} />
            <button onClick={() => { const [low, high] = autoDisplayRange(plane); dispatch({ type: 'setChannelDisplay', index: active, patch: { low, high } }); }}>auto</button>
          </div>
          <Histogram plane={plane} low={d.low} high={d.high} colour={d.colour} onChange={(low, high) => dispatch({ type: 'setChannelDisplay', index: active, patch: { low, high } })} />
          <div className="row muted small"><span data-testid="display-low">low {fmt(d.low, 4)}</span><span data-testid="display-high">high {fmt(d.high, 4)}</span></div>
        </div>
      )}
      <div className="row">
        <label>projection
          <select value={state.doc.settings.projection} onChange={(e) => dispatch({ type: 'setSetting', patch: { projection: e.target.value as ProjectionMethod } })}>
            {PROJECTIONS.map((p) => <option key={p} value={p}>{p}</option>)}
          </select>
        </label>
      </div>
      {sizeZ > 1 && (
        <div className="row">
          <label className="grow">Z {zSlice === null ? 'projection' : `${zSlice + 1} / ${sizeZ}`}
            <input type="range" min={-1} max={sizeZ - 1} value={zSlice ?? -1} data-testid="z-slider"
              onChange={(e) => { const z = Number(e.target.value); onZSlice(z < 0 ? null : z); }} />
          </label>
        </div>
      )}
    </section>
  );
}

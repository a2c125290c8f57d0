// Every setting the batch uses, saved in the project: channels and roles, projection, profile, background, fit, boundaries.
import type { Dispatch } from 'react';
import type { BoundaryMethod } from '../../core/model';
import type { AnalysisSettings, ChannelRef } from '../../core/settings';
import type { EditorAction } from '../state';
import { NumberField } from './NumberField';

/** Props: settings, channel names of the shown file, dispatch. */
export interface SettingsPanelProps {
  readonly settings: AnalysisSettings;
  readonly channelNames: readonly string[];
  readonly dispatch: Dispatch<EditorAction>;
}

const METHODS: BoundaryMethod[] = ['logistic', 'half-max', 'threshold'];

/** The settings form. */
export function SettingsPanel({ settings: s, channelNames, dispatch }: SettingsPanelProps) {
  const set = (patch: Partial<AnalysisSettings>) => dispatch({ type: 'setSetting', patch });
  const setProfile = (patch: Partial<AnalysisSettings['profile']>) => set({ profile: { ...s.profile, ...patch } });
  const names = channelNames.length > 0 ? channelNames : ['1', '2', '3'];
  const refIndex = (r: ChannelRef) => (typeof r === 'number' ? r : names.indexOf(r) + 1);
  const boundarySet = new Set(s.boundaryChannels.map(refIndex));
  return (
    <section className="panel settings" data-testid="settings">
      <h3>Analysis settings <span className="muted">shared by all files · saved in the project</span></h3>
      <fieldset><legend>Channels</legend>
        <label className="field"><span>gradient</span>
          <select value={refIndex(s.gradientChannel)} data-testid="gradient-channel" onChange={(e) => set({ gradientChannel: Number(e.target.value) })}>
            {names.map((n, i) => <option key={i} value={i + 1}>{i + 1}: {n}</option>)}
          </select></label>
        <div className="field"><span>boundaries</span><div className="checks">
          {names.map((n, i) => (
            <label key={i}><input type="checkbox" data-testid={`boundary-channel-${i + 1}`} checked={boundarySet.has(i + 1)} onChange={(e) => {
              const next = new Set(boundarySet); if (e.target.checked) next.add(i + 1); else next.delete(i + 1);
              set({ boundaryChannels: [...next].sort((a, b) => a - b) });
            }} />{n}</label>
          ))}</div></div>
        <label className="field"><span>anterior</span>
          <select value={s.anterior} onChange={(e) => set({ anterior: e.target.value as AnalysisSettings['anterior'] })}>
            <option value="auto">auto (gradient high)</option><option value="high">high end</option><option value="low">low end</option>
          </select></label>
        <NumberField label="pixel size µm (fallback)" value={s.pixelSizeUm} min={1e-4} nullable onCommit={(v) => set({ pixelSizeUm: v })} />
      </fieldset>
      <fieldset><legend>Z</legend>
        <label className="field"><span>projection</span>
          <select value={s.projection} onChange={(e) => set({ projection: e.target.value as AnalysisSettings['projection'] })}>
            {['max', 'mean', 'sum', 'slice'].map((p) => <option key={p}>{p}</option>)}
          </select></label>
        {s.projection === 'slice' && <NumberField label="slice (0-based, empty = auto)" value={s.sliceIndex} min={0} integer nullable onCommit={(v) => set({ sliceIndex: v })} />}
        <NumberField label="time point (0-based)" value={s.timeIndex} min={0} integer onCommit={(v) => set({ timeIndex: v ?? 0 })} />
      </fieldset>
      <fieldset><legend>Profile</legend>
        <label className="field"><span>sample</span>
          <select value={s.profile.mode} data-testid="profile-mode" onChange={(e) => setProfile({ mode: e.target.value as 'edge' | 'axis' })}>
            <option value="edge">edge band</option><option value="axis">axis strip</option>
          </select></label>
        {s.profile.mode === 'edge' ? <>
          <label className="field"><span>edge</span>
            <select value={s.profile.edgeSide} onChange={(e) => setProfile({ edgeSide: e.target.value as 'dorsal' | 'ventral' | 'both' })}>
              <option value="both">both</option><option value="dorsal">dorsal</option><option value="ventral">ventral</option>
            </select></label>
          <label className="field"><span>dorsal is</span>
            <select value={s.profile.dorsalSide} onChange={(e) => setProfile({ dorsalSide: e.target.value as 'left' | 'right' })}>
              <option value="left">left of A→P</option><option value="right">right of A→P</option>
            </select></label>
          <NumberField label="depth µm" value={s.profile.edgeDepthUm} min={0.1} max={500} onCommit={(v) => setProfile({ edgeDepthUm: v ?? 12 })} testId="edge-depth" />
        </> : <NumberField label="strip width µm" value={s.profile.axisWidthUm} min={0.1} max={5000} onCommit={(v) => setProfile({ axisWidthUm: v ?? 20 })} />}
        <NumberField label="bins" value={s.profile.binCount} min={10} max={1000} integer onCommit={(v) => setProfile({ binCount: v ?? 100 })} />
      </fieldset>
      <fieldset><legend>Background</legend>
        <label className="field"><span>method</span>
          <select value={s.background.mode} onChange={(e) => set({ background: { ...s.background, mode: e.target.value as 'outside' | 'region' | 'none' } })}>
            <option value="outside">outside the embryo</option><option value="region">rectangle</option><option value="none">none</option>
          </select></label>
        {s.background.mode === 'region' && (['x', 'y', 'width', 'height'] as const).map((k) => (
          <NumberField key={k} label={`${k} px`} value={s.background.regionPx?.[k] ?? 0} min={k === 'width' || k === 'height' ? 1 : 0} integer
            onCommit={(v) => set({ background: { ...s.background, regionPx: { ...(s.background.regionPx ?? { x: 0, y: 0, width: 20, height: 20 }), [k]: v ?? 0 } } })} />
        ))}
      </fieldset>
      <fieldset><legend>Fit and boundaries</legend>
        <NumberField label="fit from x/EL" value={s.fitRangeEl[0]} min={0} max={1} onCommit={(v) => set({ fitRangeEl: [v ?? 0, s.fitRangeEl[1]] })} />
        <NumberField label="fit to x/EL" value={s.fitRangeEl[1]} min={0} max={1} onCommit={(v) => set({ fitRangeEl: [s.fitRangeEl[0], v ?? 1] })} />
        <div className="field"><span>methods</span><div className="checks">
          {METHODS.map((m) => (
            <label key={m}><input type="checkbox" checked={s.boundaryMethods.includes(m)} onChange={(e) => set({
              boundaryMethods: e.target.checked ? [...s.boundaryMethods, m] : s.boundaryMethods.filter((x) => x !== m) })} />{m}</label>
          ))}</div></div>
        {s.boundaryMethods.includes('threshold') && <NumberField label="threshold (fraction)" value={s.boundaryThresholdFraction} min={0} max={1} onCommit={(v) => set({ boundaryThresholdFraction: v ?? 0.5 })} />}
      </fieldset>
    </section>
  );
}

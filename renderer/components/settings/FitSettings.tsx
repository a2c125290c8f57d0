// The exponential fit's range, the boundary search window and the boundary methods.
import type { BoundaryMethod } from '../../../core/model';
import { useEffect, useState } from 'react';
import { channelWindowFromText, fieldProblem, settingSpec, type ChannelWindow } from '../../../core/settings';
import { RangeSetting } from './RangeSetting';
import { FieldFrame, NumberSetting, type SettingFieldProps } from './SettingField';

/** Fit range, boundary methods and the threshold of the threshold method. */
export function FitSettings({ settings: s, onChange }: SettingFieldProps) {
  const methods = settingSpec('boundaryMethods');
  const all = ['logistic', 'half-max', 'threshold'] as const;
  const toggle = (m: BoundaryMethod, on: boolean): void => {
    const next = on ? [...s.boundaryMethods, m] : s.boundaryMethods.filter((x) => x !== m);
    if (next.length > 0) onChange({ boundaryMethods: next });
  };
  return (
    <fieldset><legend>Fit and boundaries</legend>
      <RangeSetting settingKey="fitRangeEl" settings={s} onChange={onChange} />
      <RangeSetting settingKey="boundarySearchEl" settings={s} onChange={onChange} />
      <ChannelWindowsSetting settings={s} onChange={onChange} />
      <div className="field" title={methods.help}><span>{methods.label}</span><div className="checks">
        {all.map((m) => (
          <label key={m}><input type="checkbox" data-testid={`boundary-method-${m}`} checked={s.boundaryMethods.includes(m)}
            disabled={s.boundaryMethods.length === 1 && s.boundaryMethods.includes(m)} onChange={(e) => toggle(m, e.target.checked)} />{m}</label>
        ))}</div></div>
      {s.boundaryMethods.includes('threshold') && <NumberSetting settingKey="boundaryThresholdFraction" settings={s} onChange={onChange} />}
    </fieldset>
  );
}

/** "2=0.2,0.6; late=0.1,0.5": the per-channel windows as the field shows them. */
function windowsText(windows: readonly ChannelWindow[]): string {
  return windows.map((w) => `${w.channel}=${w.rangeEl[0]},${w.rangeEl[1]}`).join('; ');
}

/** Per-channel boundary windows as one text field (entries CH=A,B separated by ";"; empty = none). */
function ChannelWindowsSetting({ settings: s, onChange }: SettingFieldProps) {
  const spec = settingSpec('boundaryWindows');
  const [text, setText] = useState(windowsText(s.boundaryWindows));
  const [error, setError] = useState<string | null>(null);
  useEffect(() => { setText(windowsText(s.boundaryWindows)); setError(null); }, [s.boundaryWindows]);
  const commit = (): void => {
    const parts = text.split(';').map((p) => p.trim()).filter((p) => p !== '');
    const windows = parts.map(channelWindowFromText);
    const bad = parts.find((_, i) => windows[i] === undefined);
    const problem = bad !== undefined ? `"${bad}" must be ${spec.flagRule ?? spec.rule}` : fieldProblem('boundaryWindows', windows);
    setError(problem);
    if (problem === null) onChange({ boundaryWindows: windows as ChannelWindow[] });
  };
  return (
    <FieldFrame label={spec.label} help={`${spec.help}; entries CH=A,B separated by ";"`} error={error} testId="channel-window">
      <input type="text" value={text} data-testid="channel-window" aria-invalid={error !== null} placeholder="e.g. 2=0.2,0.6"
        onChange={(e) => setText(e.target.value)} onBlur={commit} onKeyDown={(e) => { if (e.key === 'Enter') commit(); }} />
    </FieldFrame>
  );
}

// The exponential fit's range, the boundary search window and the boundary methods.
import type { BoundaryMethod } from '../../../core/model';
import { settingSpec } from '../../../core/settings';
import { RangeSetting } from './RangeSetting';
import { NumberSetting, type SettingFieldProps } from './SettingField';

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
      <div className="field" title={methods.help}><span>{methods.label}</span><div className="checks">
        {all.map((m) => (
          <label key={m}><input type="checkbox" data-testid={`boundary-method-${m}`} checked={s.boundaryMethods.includes(m)}
            disabled={s.boundaryMethods.length === 1 && s.boundaryMethods.includes(m)} onChange={(e) => toggle(m, e.target.checked)} />{m}</label>
        ))}</div></div>
      {s.boundaryMethods.includes('threshold') && <NumberSetting settingKey="boundaryThresholdFraction" settings={s} onChange={onChange} />}
    </fieldset>
  );
}

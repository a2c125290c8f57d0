// The exponential fit's range and the boundary methods.
import type { BoundaryMethod } from '../../../core/model';
import { settingSpec } from '../../../core/settings';
import { FitRangeSetting } from './FitRangeSetting';
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
      <FitRangeSetting settings={s} onChange={onChange} />
      <div className="field" title={methods.help}><span>{methods.label}</span><div className="checks">
        {all.map((m) => (
          <label key={m}><input type="checkbox" data-testid={`boundary-method-${m}`} checked={s.boundaryMethods.includes(m)}
            disabled={s.boundaryMethods.length === 1 && s.boundaryMethods.includes(m)} onChange={(e) => toggle(m, e.target.checked)} />{m}</label>
        ))}</div></div>
      {s.boundaryMethods.includes('threshold') && <NumberSetting settingKey="boundaryThresholdFraction" settings={s} onChange={onChange} />}
    </fieldset>
  );
}

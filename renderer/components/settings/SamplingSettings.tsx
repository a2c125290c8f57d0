// Z projection and time point, how the profile is sampled (edge band or axis strip) and the background.
import { useEffect, useState } from 'react';
import { PROFILE_SAMPLERS } from '../../../core/profile';
import { fieldProblem, settingSpec } from '../../../core/settings';
import { ChoiceSetting, FieldFrame, FileSetting, NumberSetting, valueFromText, type SettingFieldProps } from './SettingField';

/** Z projection, slice and time point. */
export function ProjectionSettings({ settings: s, onChange }: SettingFieldProps) {
  return (
    <fieldset><legend>Z and time</legend>
      {/* Leaving "slice" clears the slice number: a slice number with another projection is refused by the rules. */}
      <ChoiceSetting settingKey="projection" settings={s} onChange={onChange} extra={(v) => (v === 'slice' ? {} : { sliceIndex: null })} />
      {s.projection === 'slice' && <NumberSetting settingKey="sliceIndex" settings={s} onChange={onChange} />}
      <NumberSetting settingKey="timeIndex" settings={s} onChange={onChange} />
    </fieldset>
  );
}

/** Friendlier option labels of choice settings, by setting key. */
const OPTION_NAMES: Readonly<Record<string, Readonly<Record<string, string>>>> = {
  'profile.mode': Object.fromEntries(PROFILE_SAMPLERS.map((m) => [m.mode, m.label])),
  'profile.dorsalSide': { left: 'left of A→P', right: 'right of A→P' },
  'profile.edgeSide': { dorsal: 'dorsal', ventral: 'ventral', both: 'both (pooled)', each: 'each side apart' },
};

/** The profile: sampler, the settings of the chosen sampler, and the bins. */
export function ProfileSettings({ settings: s, onChange }: SettingFieldProps) {
  const own = PROFILE_SAMPLERS.find((m) => m.mode === s.profile.mode)?.settingKeys ?? [];
  return (
    <fieldset><legend>Profile</legend>
      <ChoiceSetting settingKey="profile.mode" settings={s} onChange={onChange} names={OPTION_NAMES['profile.mode']} />
      {own.map((key) => (settingSpec(key).kind === 'choice'
        ? <ChoiceSetting key={key} settingKey={key} settings={s} onChange={onChange} names={OPTION_NAMES[key]} />
        : <NumberSetting key={key} settingKey={key} settings={s} onChange={onChange} />))}
      <NumberSetting settingKey="profile.binCount" settings={s} onChange={onChange} />
    </fieldset>
  );
}

/** Background subtraction; a rectangle gets a default when "region" is chosen, so the rules are met at once. */
export function BackgroundSettings({ settings: s, onChange }: SettingFieldProps) {
  const region = s.background.regionPx;
  return (
    <fieldset><legend>Background</legend>
      <ChoiceSetting settingKey="background.mode" settings={s} onChange={onChange}
        names={{ outside: 'outside the embryo', region: 'rectangle', none: 'none' }}
        extra={(v) => (v === 'region' && region === null ? { background: { mode: 'region', regionPx: { x: 0, y: 0, width: 20, height: 20 } } } : {})} />
      {s.background.mode === 'region' && region !== null && (['x', 'y', 'width', 'height'] as const).map((k) => (
        <RegionNumber key={k} part={k} settings={s} onChange={onChange} />
      ))}
      <FileSetting settingKey="backgroundImageFile" settings={s} onChange={onChange} />
      <FileSetting settingKey="flatFieldFile" settings={s} onChange={onChange} />
    </fieldset>
  );
}

/** One number of the background rectangle, checked with the rectangle's rule. */
function RegionNumber({ part, settings: s, onChange }: SettingFieldProps & { part: 'x' | 'y' | 'width' | 'height' }) {
  const region = s.background.regionPx ?? { x: 0, y: 0, width: 20, height: 20 };
  const [text, setText] = useState(String(region[part]));
  const [error, setError] = useState<string | null>(null);
  useEffect(() => { setText(String(region[part])); setError(null); }, [region[part]]);
  const commit = (): void => {
    const next = { ...region, [part]: valueFromText(text, false) };
    const problem = fieldProblem('background.regionPx', next);
    setError(problem === null ? null : `${part}: ${problem}`);
    if (problem === null) onChange({ background: { regionPx: next } });
  };
  return (
    <FieldFrame label={`${part} px`} help={settingSpec('background.regionPx').help} error={error} testId={`background-region-${part}`}>
      <input type="text" inputMode="numeric" value={text} onChange={(e) => setText(e.target.value)} onBlur={commit}
        onKeyDown={(e) => { if (e.key === 'Enter') commit(); }} />
    </FieldFrame>
  );
}

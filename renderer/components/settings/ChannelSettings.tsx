// Channels and their roles: the gradient channel, the boundary channels, which end is anterior, the fallback pixel size.
import { settingSpec, type ChannelRef } from '../../../core/settings';
import { ChoiceSetting, FieldFrame, NumberSetting, type SettingFieldProps } from './SettingField';

/** The channels fieldset; `channelNames` are the shown file's (numbers when it has none). */
export function ChannelSettings({ settings: s, onChange, channelNames }: SettingFieldProps & { channelNames: readonly string[] }) {
  const names = channelNames.length > 0 ? channelNames : ['1', '2', '3'];
  const refIndex = (r: ChannelRef) => (typeof r === 'number' ? r : names.indexOf(r) + 1);
  const boundarySet = new Set(s.boundaryChannels.map(refIndex));
  const gradient = settingSpec('gradientChannel');
  const boundary = settingSpec('boundaryChannels');
  return (
    <fieldset><legend>Channels</legend>
      <FieldFrame label={gradient.label} help={gradient.help} error={null} testId="gradient-channel">
        <select value={refIndex(s.gradientChannel)} data-testid="gradient-channel" onChange={(e) => onChange({ gradientChannel: Number(e.target.value) })}>
          {names.map((n, i) => <option key={i} value={i + 1}>{i + 1}: {n}</option>)}
        </select>
      </FieldFrame>
      <div className="field" title={boundary.help}><span>{boundary.label}</span><div className="checks">
        {names.map((n, i) => (
          <label key={i}><input type="checkbox" data-testid={`boundary-channel-${i + 1}`} checked={boundarySet.has(i + 1)} onChange={(e) => {
            const next = new Set(boundarySet); if (e.target.checked) next.add(i + 1); else next.delete(i + 1);
            onChange({ boundaryChannels: [...next].sort((a, b) => a - b) });
          }} />{n}</label>
        ))}</div></div>
      <ChoiceSetting settingKey="anterior" settings={s} onChange={onChange} names={{ auto: 'auto (gradient high)', high: 'high end', low: 'low end' }} />
      <NumberSetting settingKey="pixelSizeUm" settings={s} onChange={onChange} />
    </fieldset>
  );
}

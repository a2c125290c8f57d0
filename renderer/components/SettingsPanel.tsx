// Every setting the batch uses, saved in the project, one part per group (components/settings). The fields and their
// rules come from core/settings' table, so the window refuses what the command line refuses, with the same rule.
import type { Dispatch } from 'react';
import type { SettingsOverrides, AnalysisSettings } from '../../core/settings';
import type { EditorAction } from '../state';
import { BackgroundSettings, ChannelSettings, FitSettings, ProfileSettings, ProjectionSettings } from './settings';

/** Props: settings, channel names of the shown file, dispatch. */
export interface SettingsPanelProps {
  readonly settings: AnalysisSettings;
  readonly channelNames: readonly string[];
  readonly dispatch: Dispatch<EditorAction>;
  /** The window's shown time point: the time point field shows it (one state with the Embryo view's time point); a
   *  time point typed there is shown and saved as the settings' time point. */
  readonly shownTimeIndex?: number;
}

/** The settings form. */
export function SettingsPanel({ settings, channelNames, dispatch, shownTimeIndex }: SettingsPanelProps) {
  const onChange = (patch: SettingsOverrides) => dispatch({ type: 'setSetting', patch });
  return (
    <section className="panel settings" data-testid="settings">
      <h3>Analysis settings <span className="muted">shared by all files · saved in the project</span></h3>
      <ChannelSettings settings={settings} onChange={onChange} channelNames={channelNames} />
      <ProjectionSettings settings={shownTimeIndex === undefined ? settings : { ...settings, timeIndex: shownTimeIndex }} onChange={onChange} />
      <ProfileSettings settings={settings} onChange={onChange} />
      <BackgroundSettings settings={settings} onChange={onChange} />
      <FitSettings settings={settings} onChange={onChange} />
    </section>
  );
}

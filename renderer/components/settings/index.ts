// Public surface of the settings panel's parts.
export { ChannelSettings } from './ChannelSettings';
export { ProjectionSettings, ProfileSettings, BackgroundSettings } from './SamplingSettings';
export { FitSettings } from './FitSettings';
export { PANEL_SETTING_KEYS } from './panel-keys';

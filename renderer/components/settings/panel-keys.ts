// Which table rows the settings panel shows a field for: every one (a test checks this list against the table).
import { PROFILE_SAMPLERS } from '../../../core/profile';

/** Keys of core/settings' SETTINGS that the panel's parts edit. */
export const PANEL_SETTING_KEYS: readonly string[] = [
  'gradientChannel', 'boundaryChannels', 'anterior', 'pixelSizeUm', // ChannelSettings
  'projection', 'sliceIndex', 'timeIndex', // ProjectionSettings
  'profile.mode', ...new Set(PROFILE_SAMPLERS.flatMap((s) => s.settingKeys)), 'profile.binCount', // ProfileSettings (each sampler's own)
  'background.mode', 'background.regionPx', 'backgroundImageFile', 'flatFieldFile', // BackgroundSettings
  'fitRangeEl', 'boundarySearchEl', 'boundaryWindows', 'boundaryMethods', 'boundaryThresholdFraction', // FitSettings
];

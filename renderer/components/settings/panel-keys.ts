// Which table rows the settings panel shows a field for: every one (a test checks this list against the table).

/** Keys of core/settings' SETTINGS that the panel's parts edit. */
export const PANEL_SETTING_KEYS: readonly string[] = [
  'gradientChannel', 'boundaryChannels', 'anterior', 'pixelSizeUm', // ChannelSettings
  'projection', 'sliceIndex', 'timeIndex', // ProjectionSettings
  'profile.mode', 'profile.edgeSide', 'profile.dorsalSide', 'profile.edgeDepthUm', 'profile.axisWidthUm', 'profile.binCount', // ProfileSettings
  'background.mode', 'background.regionPx', // BackgroundSettings
  'fitRangeEl', 'boundarySearchEl', 'boundaryMethods', 'boundaryThresholdFraction', // FitSettings
];

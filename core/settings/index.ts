// Public surface of core/settings.
export type { AnalysisSettings, ProfileSettings, BackgroundSettings, ChannelRef, EdgeSide } from './types';
export { DEFAULT_SETTINGS } from './defaults';

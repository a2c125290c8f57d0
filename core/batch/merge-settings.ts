// Combine settings layers: defaults < config file < command-line flags (later layers win, key by key).
import type { AnalysisSettings } from '../settings';
import { BatchOptionError } from './option-error';
import type { SettingsOverrides } from './parse-flags';

/** Apply overrides in order onto a base; nested profile/background groups merge key by key. Inputs are not changed. */
export function mergeSettings(base: AnalysisSettings, ...layers: readonly SettingsOverrides[]): AnalysisSettings {
  let out: AnalysisSettings = base;
  for (const layer of layers) {
    out = {
      ...out,
      ...layer,
      profile: { ...out.profile, ...layer.profile },
      background: { ...out.background, ...layer.background },
    } as AnalysisSettings;
  }
  checkCombination(out);
  return out;
}

/** Rules that involve more than one setting, checked after merging. */
function checkCombination(s: AnalysisSettings): void {
  if (s.sliceIndex !== null && s.projection !== 'slice') {
    throw new BatchOptionError(`a slice index (${s.sliceIndex}) is set but the projection is "${s.projection}", not "slice"`);
  }
  if (s.background.mode === 'region' && s.background.regionPx === null) {
    throw new BatchOptionError('background mode "region" needs background.regionPx { x, y, width, height }');
  }
}

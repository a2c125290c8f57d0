// Validation of the sampling settings, first, with the settings table's rules and wording.
import { SettingsError, settingProblem, settingValue, type AnalysisSettings } from '../settings';

/** The settings sampling reads (the mode is checked by samplerFor, against the samplers there are). */
const SAMPLING_KEYS = ['profile.binCount', 'profile.edgeDepthUm', 'profile.axisWidthUm', 'background.mode'] as const;

/** Throw a one-line SettingsError ("profile.binCount must be a whole number from 10 to 2000 (got 0)") when a sampling
 *  setting breaks its rule in the settings table. */
export function checkSamplingSettings(settings: AnalysisSettings): void {
  for (const key of SAMPLING_KEYS) {
    const value = settingValue(settings, key);
    const problem = settingProblem(key, value, key);
    if (problem !== null) throw new SettingsError(`${problem} (got ${typeof value === 'string' ? `"${value}"` : String(value)})`);
  }
}

// Read a JSON settings file (same keys as AnalysisSettings, any subset) into validated overrides.
import { overridesFromJson, type SettingsOverrides } from '../settings';
import { BatchOptionError } from './option-error';

/** Parse settings JSON text; bad JSON or a bad setting gives a one-line message naming the file. */
export function parseConfigText(text: string, label: string): SettingsOverrides {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    throw new BatchOptionError(`${label}: not valid JSON (${(e as Error).message.split('\n')[0]})`);
  }
  return overridesFromJson(json, label);
}

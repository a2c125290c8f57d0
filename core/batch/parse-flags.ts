// The batch command's settings flags (raw strings) into overrides, through the settings table (core/settings).
import { settingSpec, settingsFromFlags, type SettingsFlags, type SettingsOverrides } from '../settings';
import { BatchOptionError } from './option-error';

export type { SettingsFlags, SettingsOverrides };

/** Validate every settings flag that was given and return the overrides (flags not given are absent). */
export function parseSettingsFlags(flags: SettingsFlags): SettingsOverrides {
  return settingsFromFlags(flags);
}

/** `--fit-range A,B` text → [a, b] with the fit range's rule from the settings table (other x/EL range flags reuse it). */
export function parseFitRange(text: string): [number, number] {
  const spec = settingSpec('fitRangeEl');
  const v = spec.fromText(text) as [number, number] | undefined;
  if (v === undefined) throw new BatchOptionError(`${spec.flag} must be ${spec.flagRule ?? spec.rule} (got "${text}")`);
  return v;
}

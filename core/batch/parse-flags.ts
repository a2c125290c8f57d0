// The batch command's settings flags (raw strings) into overrides, through the settings table (core/settings).
import { settingsFromFlags, type SettingsFlags, type SettingsOverrides } from '../settings';

export type { SettingsFlags, SettingsOverrides };

/** Validate every settings flag that was given and return the overrides (flags not given are absent). */
export function parseSettingsFlags(flags: SettingsFlags): SettingsOverrides {
  return settingsFromFlags(flags);
}

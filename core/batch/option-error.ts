// The error type for bad batch options, config files and project files: core/settings' SettingsError under the name
// the batch code has always used (one class, so every catch sees every settings problem).
export { SettingsError as BatchOptionError } from '../settings';

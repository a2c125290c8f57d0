// The error type for bad settings, options, config files and project files: one line, shown to the user as is.

/** A usage or configuration problem; `message` is one line and names the option, field or file. */
export class SettingsError extends Error {
  override name = 'BatchOptionError';
}

// The error type for bad batch options, config files and project files: one line, shown to the user as is.

/** A usage or configuration problem; `message` is one line and names the option or file. */
export class BatchOptionError extends Error {
  override name = 'BatchOptionError';
}

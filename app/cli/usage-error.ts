// Usage errors end a command with exit code 2 and a one-line message plus a hint to --help.

/** A problem with how the command was called (unknown flag, missing folder, bad value). */
export class UsageError extends Error {
  override name = 'UsageError';
  /** The command whose --help the hint points at ('' for the top level). */
  readonly command: string;

  constructor(message: string, command = '') {
    super(message);
    this.command = command;
  }
}

/** Streams a command writes to (process.stdout/stderr, or buffers in tests). */
export interface CliIo {
  readonly stdout: { write(text: string): unknown; isTTY?: boolean };
  readonly stderr: { write(text: string): unknown; isTTY?: boolean; columns?: number };
}

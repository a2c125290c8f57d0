// The one error type of the cohort step: a one-line message that names the file or option at fault.

/** Thrown for bad cohort input (sample sheet, file-name rule, options); `message` is one line for the user. */
export class CohortError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'CohortError';
  }
}

// The one error type the fitting code throws for data or fit problems (bugs stay plain Errors).

/** Why a fit failed: unusable input, no convergence, or NaN/Infinity from the model or the statistics. */
export type FitErrorCode = 'bad-input' | 'not-converged' | 'nan';

/** A fit failure with a machine-readable code and a one-line message for the user. */
export class FitError extends Error {
  readonly code: FitErrorCode;

  constructor(code: FitErrorCode, message: string) {
    super(message);
    this.name = 'FitError';
    this.code = code;
  }
}

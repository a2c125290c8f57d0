// An expected failure with its API code, thrown by the engine and the handlers alike (the handlers turn it into a value).
import type { ApiErrorCode } from '../../core/contract';

/** An expected failure with its API code; handlers throw it internally and guard() turns it into a value. */
export class ApiFailure extends Error {
  override readonly name = 'ApiFailure';
  constructor(readonly code: ApiErrorCode, message: string) {
    super(message);
  }
}

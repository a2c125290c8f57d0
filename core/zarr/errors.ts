// Errors raised while reading OME-Zarr stores: one line, starting with the store's label.

/** Why an OME-Zarr store could not be read. */
export type ZarrErrorCode =
  | 'not-zarr'
  | 'not-ome'
  | 'bad-metadata'
  | 'unsupported'
  | 'too-large'
  | 'decode'
  | 'io';

/** A clear, one-line reading error; `message` starts with the store label. */
export class ZarrError extends Error {
  readonly code: ZarrErrorCode;
  readonly file: string;

  constructor(code: ZarrErrorCode, file: string, problem: string) {
    super(`${file}: ${problem}`);
    this.name = 'ZarrError';
    this.code = code;
    this.file = file;
  }
}

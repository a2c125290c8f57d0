// Errors raised while reading TIFF files: one line, starting with the file label.

/** Why a TIFF file could not be read. */
export type TiffErrorCode =
  | 'not-tiff'
  | 'truncated'
  | 'empty'
  | 'bad-offset'
  | 'bad-tag'
  | 'ifd-loop'
  | 'too-large'
  | 'unsupported'
  | 'bad-ome'
  | 'decode'
  | 'io';

/** A clear, one-line reading error; `message` starts with the file label. */
export class TiffError extends Error {
  readonly code: TiffErrorCode;
  readonly file: string;

  constructor(code: TiffErrorCode, file: string, problem: string) {
    super(`${file}: ${problem}`);
    this.name = 'TiffError';
    this.code = code;
    this.file = file;
  }
}

// The result row for a file that could not be analysed: the one constructor every layer uses.
import type { EmbryoResult } from './index';

/** The first line of a message (later lines are detail), trimmed; empty gives 'unknown error'. */
export function oneLine(message: string): string {
  return message.trim().split(/\r?\n/)[0].trim() || 'unknown error';
}

/** An EmbryoResult with status 'error' and a one-line message that starts with the file's name. */
export function errorResult(file: string, message: string, warnings: readonly string[] = []): EmbryoResult {
  const line = oneLine(message);
  return {
    file, status: 'error', error: line.startsWith(file) ? line : `${file}: ${line}`, warnings: [...warnings],
    pixelSizeUm: null, pixelSizeSource: 'unknown', eggLengthUm: null, eggWidthUm: null, axis: null,
    gradientChannel: null, gradientProfile: null, gradientFit: null,
    boundaryProfiles: [], boundaries: [], landmarks: [], backgrounds: [],
  };
}

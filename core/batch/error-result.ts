// The result row for a file that could not be analysed.
import type { EmbryoResult } from '../model';

/** An EmbryoResult with status 'error' and a one-line message (line breaks folded into spaces). */
export function errorResult(file: string, message: string): EmbryoResult {
  return {
    file, status: 'error', error: message.replace(/\s*[\r\n]+\s*/g, ' ').trim(), warnings: [],
    pixelSizeUm: null, pixelSizeSource: 'unknown', eggLengthUm: null, eggWidthUm: null, axis: null,
    gradientChannel: null, gradientProfile: null, gradientFit: null,
    boundaryProfiles: [], boundaries: [], landmarks: [], backgrounds: [],
  };
}

// The result row for a file that could not be analysed.
import type { EmbryoResult } from '../model';
import { clipMessage } from './messages';

/** An EmbryoResult with status 'error' and a one-line message of at most 300 characters (line breaks folded into spaces). */
export function errorResult(file: string, message: string): EmbryoResult {
  return {
    file, status: 'error', error: clipMessage(message), warnings: [],
    pixelSizeUm: null, pixelSizeSource: 'unknown', eggLengthUm: null, eggWidthUm: null, axis: null,
    gradientChannel: null, gradientProfile: null, gradientFit: null,
    boundaryProfiles: [], boundaries: [], landmarks: [], backgrounds: [],
  };
}

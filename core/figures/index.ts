// Public surface of core/figures: pure functions that return standalone SVG strings (no DOM), used by the
// HTML report and by the desktop app alike.
export type { FigureOptions } from './common';
export { escapeXml, FONT_FAMILY } from './svg';
export { SERIES_COLOURS, seriesColour, PROFILE_COLOURS, SIDE_COLOURS, BOUNDARY_COLOURS, boundaryColour, TIME_MARKER_COLOUR } from './palette';
export { profileFigure, type ProfileFigureInput, type ProfileFigureOptions } from './profile-figure';
export { cohortProfilesFigure, type ProfileSeries } from './cohort-profiles-figure';
export { lambdaByConditionFigure, type StripGroup } from './lambda-figure';
export { shiftVsLnFFigure, type ShiftFigureInput, type FigureLine } from './shift-figure';
export { positionalErrorFigure, autoSigmaYMax, type SigmaSeries } from './positional-error-figure';
export { ciDecimals, fixed, sigFig, valueWithCi, plainNumber } from './number-format';
export { cohortFigures, figureSlug, type NamedFigure } from './cohort-figures';
export {
  lambdaOverTimeFigure, kymographFigure, accumulationFigure, movieTimeUnit,
  type LambdaPoint, type KymographInput, type AccumulationFigureInput,
} from './timelapse-figures';

// Public surface of the renderer's live measurement (straighten, sample, fit while the user edits).
export { prepareLive, measureLive, MAX_STRIP_SAMPLES } from './measure';
export type { LivePrepared, LiveMeasurement } from './measure';
export { straightenPlane, bilinearAt } from './straighten';
export { profileFromStrip } from './stripProfile';
export { fitProfileExponential } from './expFit';
export { halfMaxBoundary } from './halfMax';
export { landmarkPositions } from './landmarks';
export { resolveChannel } from './channels';
export { bandRows, bandSelection } from './bandSelect';
export type { ColumnBand } from './bandSelect';

// Public surface of the renderer's live measurement (core sampling and fit per edit, plus the straightened strip).
export { prepareLive, measureLive, bandOutlinesLive, MAX_STRIP_SAMPLES, MAX_STRIP_ROWS } from './measure';
export type { LivePrepared, LiveMeasurement } from './measure';

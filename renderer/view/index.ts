// Public surface of the pure drawing helpers (no DOM here).
export { CHANNEL_COLOURS, parseHexColour } from './colour';
export { compositeRgba } from './composite';
export { dataRange, histogramCounts, autoDisplayRange, displayRangeAfterKey } from './histogram';

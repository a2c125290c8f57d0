// The time points a movie's analysis covers: read by core/settings (the project file holds them per file too).
export { parseTimeSelection, selectTimeIndices, timeSelectionText, type TimeSelection } from '../settings';

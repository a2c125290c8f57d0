// Public surface of core/batch: batch settings from config + flags, output tables, results JSON, project edits.
export { BatchOptionError } from './option-error';
export { parseSettingsFlags, parseFitRange, type SettingsFlags, type SettingsOverrides } from './parse-flags';
export { parseConfigText } from './parse-config';
export { mergeSettings } from '../settings';
export {
  EMBRYO_COLUMNS, EMBRYO_MEASURE_COLUMNS, SIDE_COLUMNS, TIME_COLUMNS, BOUNDARY_COLUMNS, PROFILE_COLUMNS, LANDMARK_COLUMNS,
  embryoRow, embryoMeasureRow, sideCells, embryoResults, embryosCsv, boundariesCsv, profilesCsv, landmarksCsv, summaryBoundary, embryoProfiles,
} from './tables';
export {
  resultsToJson, resultsFromJson, resultsDocFromJson, reviveResult, jsonWithArrays, RESULTS_SCHEMA, RESULTS_SCHEMA_VERSION, RESULTS_OLD_VERSION,
  type ResultsDoc,
} from './results-json';
export {
  JOURNAL_FILE_NAME, JOURNAL_SCHEMA, JOURNAL_VERSION, journalRunLine, journalFileLine, parseJournal, normalizeResult, settingsKeyText,
  type JournalEntry, type JournalRunLine, type ParsedJournal,
} from './journal';
export { MAX_CELL_CHARS, clipMessage, collapseMessages, warningsCell, tidyMessages } from './messages';
export {
  PROJECT_FILE_NAME, projectKey, editsForFile, storedFileEdits, toHandEdits,
} from './project-edits';
export { isStackFileName, isStackFolderName, sortStackPaths } from './stack-files';
export {
  runRecordToJson, type RunRecord, type RunInput, type RunEndReason, type SoftwareVersions, type ShardInfo, type MergeInfo,
} from './run-record';
export { parseByteSize, formatByteSize, defaultMaxMemoryBytes } from './byte-size';

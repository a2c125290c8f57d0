// Public surface of core/settings: the analysis settings, their defaults, the one table that describes and checks
// them (schema.ts), merging of layers (defaults < project < config < flags) and the settings in force for a file.
export type { AnalysisSettings, ProfileSettings, BackgroundSettings, ChannelRef, ChannelWindow, EdgeSide } from './types';
export { DEFAULT_SETTINGS } from './defaults';
export {
  SETTINGS, settingSpec, flagKey, numberFromText, channelWindowFromText, RUN_SETTINGS, runSettingSpec, bytesFromText, MIN_MAX_MEMORY_BYTES, type SettingSpec, type SettingKind,
} from './schema';
export {
  settingValue, overrideOf, flagValue, settingProblem, fieldProblem, settingsProblem, applyOverrides, mergeSettings, checkCombination, combinationProblem,
  settingsFromFlags, overridesFromJson, settingsFromStored, settingsInForce, type SettingsOverrides, type SettingsFlags,
} from './check';
export { SettingsError } from './settings-error';
export type { FileEdits, ProjectCohortOptions, ProjectDoc, TimePointEdits } from './project-types';
export { checkProjectCohort, COHORT_NORMALISATIONS, equivalenceMarginProblem, lambdaPosteriorElProblem } from './project-cohort';
export { fileEditsAt } from './time-point-edits';
export { parseTimeSelection, selectTimeIndices, timeSelectionText, checkTimeStepS, parseTimeStepS, timePointForFile, timePointsForMovie, type MovieTimePoints, type TimeSelection } from './time-selection';
export { ProjectFormatError } from './project-error';
export {
  PROJECT_SCHEMA, PROJECT_VERSION, PROJECT_OLDEST_VERSION, checkProjectDoc, checkFileEdits, checkSettings, checkRangeEl, parseProjectText,
} from './project-check';

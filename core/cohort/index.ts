// Public surface of core/cohort: conditions from a sample sheet or file-name rule, per-condition statistics,
// positional error, the dosage-shift test of the threshold model, and the cohort CSV tables.
export type {
  CohortAnalysis, CohortAssignment, CohortOptions, ConditionInfo, ConditionProfile, ConditionStat, DosageFit,
  FilenameRule, MeasuredDosage, Normalisation, SlopeSummary, Observation, QuantityKind, QuantityUnit, ReferenceLambda, ResolvedCohortOptions,
  SampleRow, SampleSheet, ShiftRow, BackgroundChoiceRecord, BackgroundConditionRecord, BackgroundConditionSummary, BackgroundProfile, BackgroundRefitRow,
} from '../model';
export { CohortError } from './cohort-error';
export { checkCohortOptions } from './options';
export { parseSampleSheet } from './sample-sheet';
export { sheetFromFilenameRule } from './filename-rule';
export { assignConditions, sheetRowLookup } from './assign';
export { observationsOf, boundaryQuantity, landmarkQuantity, quantityLabel, EGG_LENGTH_QUANTITY } from './observations';
export { describeSample } from './describe';
export type { SampleSummary } from '../model';
export { conditionStats } from './condition-stats';
export { welchDifference, type MeanDifference } from './welch';
export { referenceLambda, shiftRows, ratioWithCi, slopeRatio, twoGradientShiftEl, positionQuantities, type RatioInterval } from './dosage-test';
export { dosageFits, lambdaTrend, measuredDosages, conditionMeansLine } from './dosage-fit';
export { gridEl, interpolateOnGrid, normaliseProfile, centralSlope, conditionProfile } from './profiles';
export { analyseCohort, type CohortRunOptions } from './analyse';
export { splitByChoice, applyBackgroundCondition, jackknifeSe, type BackgroundSplit } from './background-condition';
export { backgroundConditionOf, backgroundProfile, backgroundProfiles, BACKGROUND_CONDITION_RULE, ROLE_COLUMN, type BackgroundChoice } from './background-profile';
export { NO_BACKGROUND_CONDITION } from '../model';
export { backgroundProfileCsv, backgroundRefitCsv, backgroundConditionsCsv, backgroundRecordJson, backgroundChoiceJson } from './background-tables';
export { refitEmbryo, subtractProfile, refitWindowOf, type RefitSettings } from './background-refit';
export { conditionsCsv, shiftsCsv, dosageFitCsv, positionalErrorCsv, covariatesCsv, ADJUSTED_METHOD, COVARIATE_COLUMNS } from './tables';
export { parseCovariateRequest, covariateColumns, covariateAdjustment, type CovariateAdjustment } from './covariates';
export type { AdjustedDosageFit, CovariateRequest, CovariateTerm, CovariateUsed } from '../model';
export { makeDemoCohort, type DemoCohortSpec } from './demo-cohort';
export { conditionReliability, fitRangesUsed, lambdaPositionCorrelation, LAMBDA_RELATIVE_SE_LIMIT } from './reliability';
export type { ConditionReliability, FitRangeUse, SideDifferenceRow } from '../model';
export { SIDE_DIFFERENCE_QUANTITY, SIDE_DIFFERENCE_COLUMNS, sideObservations, sideDifferences, sideDifferencesCsv } from './sides';

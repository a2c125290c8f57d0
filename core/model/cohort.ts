// Data types of the cohort step (shared by core/cohort, the API contract and the window).
// Positions along the AP axis are x/EL (0 = anterior pole, 1 = posterior pole).
import type { EmbryoResult } from './index';

/** n, mean, SD (n − 1), SEM and two-sided t CI at `level`; SD/SEM/CI are NaN when n < 2. */
export interface SampleSummary {
  readonly n: number;
  readonly mean: number;
  readonly sd: number;
  readonly sem: number;
  readonly ciLow: number;
  readonly ciHigh: number;
  /** Chi-square interval of the SD at the same level (normal data); NaN when n < 2. */
  readonly sdCiLow: number;
  readonly sdCiHigh: number;
  readonly median: number;
}

/** How gradient profiles are scaled before averaging: none, divided by the fitted amplitude A, to [0, 1], or aligned
 *  to the condition's mean profile by a fitted scale and offset. */
export type Normalisation = 'none' | 'amplitude' | 'minmax' | 'scale-offset';

/** Unit of a cohort quantity: x/EL (or λ as a fraction of EL), micrometres, or arbitrary intensity units. */
export type QuantityUnit = 'EL' | 'um' | 'a.u.';

/** What a quantity measures; boundaries and landmarks are positions that enter the dosage test. */
export type QuantityKind = 'lambda' | 'amplitude' | 'egg-length' | 'boundary' | 'landmark' | 'side-difference';

/** One row of a sample sheet. */
export interface SampleRow {
  readonly file: string;
  readonly condition: string;
  /** Dosage relative to the reference (the reference has 1), null when not given. */
  readonly dosage: number | null;
  /** Free columns, by header name. */
  readonly extra: Readonly<Record<string, string>>;
  /** 1-based line in the sheet (0 for rows made by a file-name rule). */
  readonly line: number;
}

/** A parsed sample sheet (or the rows a file-name rule produced). */
export interface SampleSheet {
  /** Name shown in messages (the sheet's file name, or "file-name rule"). */
  readonly source: string;
  readonly rows: readonly SampleRow[];
}

/** Assign conditions from file names: a regex with a named group `condition` (and optionally `dosage`). */
export interface FilenameRule {
  readonly pattern: string | RegExp;
  /** Dosage per condition name, used when the pattern has no `dosage` group. */
  readonly dosages?: Readonly<Record<string, number>>;
}

/** One condition of the cohort. */
export interface ConditionInfo {
  readonly name: string;
  /** Dosage as given in the sheet (null when unknown). */
  readonly dosage: number | null;
  /** Dosage factor relative to the reference, f = dosage / dosage(reference); null when unknown. */
  readonly factor: number | null;
}

/** Embryos grouped by condition, in the order conditions first appear in the sheet. */
export interface CohortAssignment {
  readonly groups: readonly { readonly condition: ConditionInfo; readonly embryos: readonly EmbryoResult[] }[];
  /** Name of the reference condition, or null when none could be chosen (then no dosage test). */
  readonly reference: string | null;
  readonly warnings: readonly string[];
}

/** One measured value of one embryo. */
export interface Observation {
  readonly file: string;
  readonly condition: string;
  /** ln f of the embryo's condition (null when the dosage is unknown). */
  readonly lnF: number | null;
  /** Machine-friendly key: `lambda`, `amplitude`, `egg_length`, `boundary:<channel>:<method>` or `landmark:<name>`
   *  (quantityLabel turns it into text for people). */
  readonly quantity: string;
  readonly kind: QuantityKind;
  readonly unit: QuantityUnit;
  readonly value: number;
}

/** Summary of one quantity in one condition; `sd` of a boundary or landmark is its positional error. */
export interface ConditionStat extends SampleSummary {
  readonly condition: string;
  readonly dosage: number | null;
  readonly quantity: string;
  readonly kind: QuantityKind;
  readonly unit: QuantityUnit;
}

/** The λ (x/EL) the threshold-model prediction uses, measured on the reference condition. */
export interface ReferenceLambda {
  readonly condition: string;
  readonly n: number;
  readonly lambdaEl: number;
  readonly seEl: number;
  readonly ciLowEl: number;
  readonly ciHighEl: number;
  readonly dof: number;
}

/** Observed and predicted boundary shift of one quantity in one non-reference condition (all in x/EL). */
export interface ShiftRow {
  readonly quantity: string;
  readonly condition: string;
  readonly dosage: number | null;
  readonly lnF: number | null;
  readonly nReference: number;
  readonly nCondition: number;
  readonly observedShiftEl: number;
  readonly ciLow: number;
  readonly ciHigh: number;
  readonly predictedShiftEl: number | null;
  readonly predictedCiLow: number | null;
  readonly predictedCiHigh: number | null;
  readonly predictedTwoGradientEl: number | null;
  /** λ_local·ln f, with λ_local the decay length of the reference's mean profile where the position sits. */
  readonly predictedLocalShiftEl: number | null;
  readonly ratio: number | null;
  readonly ratioCiLow: number | null;
  readonly ratioCiHigh: number | null;
  /** Fieller's interval of the ratio (null ends when unbounded, g ≥ 1) and its g = t²·CV² of the prediction. */
  readonly ratioFiellerLow: number | null;
  readonly ratioFiellerHigh: number | null;
  readonly fiellerG: number | null;
  /** Two-sided p-value of ratio = 1 (the threshold model's prediction) and its Holm adjustment over every row. */
  readonly pRatio: number | null;
  readonly pRatioHolm: number | null;
}

/** A slope with its standard error, interval and t-test against zero (see core/stats SlopeEstimate). */
export interface SlopeSummary {
  readonly slope: number;
  readonly slopeSe: number;
  readonly intercept: number;
  readonly ciLow: number;
  readonly ciHigh: number;
  /** Degrees of freedom of the interval's t quantile (NaN: normal quantile). */
  readonly dof: number;
  readonly pSlope: number;
}

/**
 * Regression of one position (x/EL) on ln f. The primary fit ('condition-means') takes each condition's mean as one
 * observation, since dosage is set per condition and embryos of one condition share staining, session and stage
 * (t on k − 2 degrees of freedom); with only two dosages it falls back to all embryos ('embryos-hc3').
 */
export interface DosageFit {
  readonly quantity: string;
  readonly method: 'condition-means' | 'embryos-hc3';
  readonly slopeEl: number;
  readonly slopeSeEl: number;
  readonly ciLow: number;
  readonly ciHigh: number;
  readonly interceptEl: number;
  readonly r2: number;
  /** Embryos with a known dosage. */
  readonly n: number;
  /** Conditions (dosages) in the fit. */
  readonly conditions: number;
  /** Degrees of freedom of the slope's t interval. */
  readonly dof: number;
  readonly pSlope: number;
  /** Lack-of-fit F test of linearity in ln f (within-condition pure error), when ≥ 3 dosages have replicates. */
  readonly lackOfFit: { readonly f: number; readonly df1: number; readonly df2: number; readonly p: number } | null;
  /** All embryos by least squares with HC3 (heteroscedasticity-consistent) standard errors. */
  readonly embryosHc3: SlopeSummary | null;
  /** Condition means weighted by 1/(SEM² + τ²), τ² the between-condition variance (Knapp–Hartung interval). */
  readonly randomIntercept: (SlopeSummary & { readonly tau2: number }) | null;
  /** Position on the measured ln(amplitude ratio to the reference) by York's errors-in-both-variables fit. */
  readonly measured: SlopeSummary | null;
  /** λ of the reference (x/EL): the slope the threshold model predicts. */
  readonly predictedSlopeEl: number | null;
  /** 1 / (1/λ_A + 1/λ_P) when a posterior gradient is given, else null. */
  readonly predictedTwoGradientSlopeEl: number | null;
  /** Present only when covariates were asked for: the condition-means line after adjusting each embryo's position to
   *  the covariates' overall mean, with their coefficients estimated within conditions. */
  readonly adjusted?: AdjustedDosageFit;
  /** The local decay length (x/EL) at the reference's mean position: the slope predicted there; null if not readable. */
  readonly localLambdaEl: number | null;
  /** Its jackknife standard error over the reference embryos (x/EL); null if not computable. */
  readonly localLambdaSeEl: number | null;
}

/** A covariate asked for: a free column of the sample sheet; `auto` is numeric when every value is a number. */
export interface CovariateRequest {
  readonly column: string;
  readonly kind: 'auto' | 'numeric' | 'categorical';
}

/** A covariate as used: its kind, and for a categorical one its levels in sheet order, the first being the base. */
export interface CovariateUsed {
  readonly column: string;
  readonly kind: 'numeric' | 'categorical';
  readonly levels: readonly string[];
  readonly baseLevel: string | null;
}

/** One coefficient of the within-condition covariate fit (x/EL per unit of the column, or per level vs the base). */
export interface CovariateTerm {
  readonly covariate: string;
  /** The column for a numeric covariate, `column=level` for a level of a categorical one. */
  readonly term: string;
  readonly kind: 'numeric' | 'categorical';
  readonly level: string | null;
  readonly baseLevel: string | null;
  readonly coefficientEl: number;
  readonly seEl: number;
  readonly ciLow: number;
  readonly ciHigh: number;
  /** n − conditions − terms. */
  readonly dof: number;
  readonly p: number;
  /** The term's mean over the embryos used: positions are adjusted to it. */
  readonly meanValue: number;
}

/** The covariate-adjusted condition-means line of one position quantity. */
export interface AdjustedDosageFit extends SlopeSummary {
  readonly covariates: readonly string[];
  readonly r2: number;
  /** Embryos with every covariate given. */
  readonly n: number;
  readonly conditions: number;
  /** The slope's SE with the coefficients taken as known (slopeSe adds their estimation error). */
  readonly slopeSeMeansOnly: number;
  readonly terms: readonly CovariateTerm[];
}

/** The measured dosage of a condition: its mean amplitude A over the reference's, with the SE of its logarithm. */
export interface MeasuredDosage {
  readonly condition: string;
  readonly nominalFactor: number | null;
  readonly amplitudeRatio: number;
  readonly lnRatio: number;
  readonly lnRatioSe: number;
}

/** Mean gradient profile of one condition on the common x/EL grid; NaN marks grid points without data. */
export interface ConditionProfile {
  readonly condition: string;
  readonly dosage: number | null;
  /** How the embryos' profiles were scaled before averaging. */
  readonly normalisation: Normalisation;
  readonly xEl: Float64Array;
  readonly mean: Float64Array;
  /** SD across embryos at each grid point. */
  readonly sd: Float64Array;
  /** Measurement noise of one embryo's bin mean (√ mean of pixel SD²/n), same scale. */
  readonly sdNoise: Float64Array;
  /** SD across embryos with that noise subtracted in variance (σC used for σx). */
  readonly sdBetween: Float64Array;
  /** Number of embryos contributing at each grid point. */
  readonly n: Float64Array;
  /** Slope of the mean profile, intensity per unit x/EL (central difference). */
  readonly slopePerEl: Float64Array;
  /** Positional error implied by the gradient, σx = σC / |dC̄/dx| (first-order error propagation, the delta method),
   *  in x/EL and in µm (mean egg length);
   *  NaN where the slope is not resolved (change across the window within 2 SE of zero). */
  readonly sigmaXEl: Float64Array;
  /** Chi-square interval of σx (x/EL) from the number of embryos; the slope's uncertainty is not included. */
  readonly sigmaXCiLowEl: Float64Array;
  readonly sigmaXCiHighEl: Float64Array;
  readonly sigmaXUm: Float64Array;
  readonly meanEggLengthUm: number | null;
  readonly embryoCount: number;
}

/** Options of the cohort analysis (validated by checkCohortOptions). */
export interface CohortOptions {
  /** Reference condition; default: the condition with dosage 1. */
  readonly reference?: string | null;
  /** Profile normalisation before averaging; default 'none'. */
  readonly normalisation?: Normalisation;
  /** Decay length of an opposing posterior gradient (x/EL) for the two-gradient prediction; default none. */
  readonly lambdaPosteriorEl?: number | null;
  /** Spacing of the common x/EL grid; default 0.01. */
  readonly gridStepEl?: number;
  /** Half-width h of the central difference for dC̄/dx, x/EL; default 0.04 (for an exponential the slope is
   *  overestimated by sinh(h/λ)/(h/λ) − 1 ≈ (h/λ)²/6, 0.7% at λ = 0.2 EL). */
  readonly slopeHalfWidthEl?: number;
  /** Confidence level of every interval; default 0.95. */
  readonly level?: number;
  /** Equivalence margin m for the ratio observed/predicted: equivalence to 1 is shown when the (1 − 2α) interval
   *  lies inside [1 − m, 1 + m] (two one-sided tests); default none. */
  readonly equivalenceMargin?: number | null;
  /** A condition of the sheet (e.g. a null or secondary-only staining) whose mean profile is subtracted from every
   *  other embryo's profile before λ and the boundaries are fitted again; its embryos are not compared. The word
   *  `none` (NO_BACKGROUND_CONDITION) subtracts nothing, even when the sheet's `role` column marks a condition (whose
   *  rows then stay out of the comparison). Default (null): the condition whose rows say `background` in the sheet's
   *  `role` column, else none. */
  readonly backgroundCondition?: string | null;
  /** Free columns of the sample sheet that adjust the dosage regression (`column`, `column:numeric` or
   *  `column:categorical`); default none. */
  readonly covariates?: readonly string[];
  /** Who gave `backgroundCondition`, as the record states it (e.g. `--background-condition`, the project's cohort
   *  entry); default `--background-condition`. */
  readonly backgroundConditionNamedBy?: string;
}

/** The value of `backgroundCondition` (flag, project, window) that asks for no background condition. */
export const NO_BACKGROUND_CONDITION = 'none';

/** Which background rule the cohort step used and why (present whenever a condition was named, the word `none`
 *  was given, or the sheet's role column marks a condition). */
export interface BackgroundChoiceRecord {
  /** 'option': a condition named by the caller; 'sheet': the one the role column marks; 'none': nothing subtracted. */
  readonly rule: 'option' | 'sheet' | 'none';
  /** The condition subtracted; null with rule 'none'. */
  readonly condition: string | null;
  /** With rule 'none': the condition the role column marks, left out of the comparison and not subtracted; else null. */
  readonly setAside: string | null;
  /** The set-aside condition's embryos (files) in the results; empty when none. */
  readonly setAsideFiles: readonly string[];
  /** Who made the choice: `--background-condition`, the project's cohort entry, or the sample sheet's role column. */
  readonly namedBy: string;
  /** The rule in force and why, one sentence. */
  readonly why: string;
}

/** Options with every default filled in. */
export interface ResolvedCohortOptions {
  readonly reference: string | null;
  readonly normalisation: Normalisation;
  readonly lambdaPosteriorEl: number | null;
  readonly gridStepEl: number;
  readonly slopeHalfWidthEl: number;
  readonly level: number;
  readonly equivalenceMargin: number | null;
}

/** Everything the cohort step computes. */
export interface CohortAnalysis {
  readonly options: ResolvedCohortOptions;
  readonly conditions: readonly ConditionInfo[];
  readonly reference: string | null;
  readonly referenceLambda: ReferenceLambda | null;
  readonly observations: readonly Observation[];
  readonly stats: readonly ConditionStat[];
  readonly shifts: readonly ShiftRow[];
  readonly dosageFits: readonly DosageFit[];
  /** Amplitude ratio of each condition to the reference (empty without amplitudes or a reference). */
  readonly measuredDosages: readonly MeasuredDosage[];
  /** λ (x/EL) of the condition means against ln f: the threshold model assumes dosage leaves λ unchanged. */
  readonly lambdaTrend: SlopeSummary | null;
  /** Per condition: usable and imprecise λ fits, median λ, detection counts of each position. */
  readonly reliability: readonly ConditionReliability[];
  /** The x/EL fit ranges the embryos' λ fits used, most used first. */
  readonly fitRanges: readonly FitRangeUse[];
  /** Free columns of the sample sheet (e.g. stage, batch), by header name. */
  readonly sheetColumns: readonly string[];
  /** Present only when covariates were asked for: each as used. */
  readonly covariates?: readonly CovariateUsed[];
  readonly profiles: readonly ConditionProfile[];
  readonly warnings: readonly string[];
  /** Present only when a background condition was subtracted: then every λ, amplitude and boundary above is the
   *  refitted, background-subtracted value (see BackgroundConditionRecord). */
  readonly backgroundCondition?: BackgroundConditionRecord;
  /** Which background rule was used and why; absent when no condition was named, `none` was not asked for and the
   *  sheet marks none (then nothing was subtracted and nothing set aside). */
  readonly backgroundChoice?: BackgroundChoiceRecord;
  /** Per condition, the mean paired difference λ_dorsal − λ_ventral of embryos measured on each side (--edge-side
   *  each); empty or absent when none was. */
  readonly sideDifferences?: readonly SideDifferenceRow[];
}

/**
 * One condition's mean of its embryos' paired differences λ_dorsal − λ_ventral: the t interval from the spread between
 * embryos, and the one-sample t test of a zero mean with its Holm adjustment across conditions.
 */
export interface SideDifferenceRow {
  readonly condition: string;
  readonly dosage: number | null;
  /** Embryos with a difference (both sides' fits decaying). */
  readonly n: number;
  readonly meanEl: number;
  readonly sdEl: number;
  readonly semEl: number;
  readonly ciLowEl: number;
  readonly ciHighEl: number;
  /** The same in µm (embryos with a pixel size; NaN when none). */
  readonly nUm: number;
  readonly meanUm: number;
  readonly ciLowUm: number;
  readonly ciHighUm: number;
  /** Two-sided p of mean = 0 (t test on n − 1 dof; NaN for n < 2) and Holm's adjustment over the conditions. */
  readonly p: number;
  readonly pHolm: number;
}

/** The mean profile of one channel over the background condition's embryos, on the batch's x/EL bins. */
export interface BackgroundProfile {
  readonly channel: string;
  readonly xEl: Float64Array;
  /** Mean over the background embryos of their (already background-subtracted) bin means; NaN where none has data. */
  readonly mean: Float64Array;
  /** SD between the background embryos (n − 1), and its standard error SD/√n; NaN when n < 2. */
  readonly sd: Float64Array;
  readonly se: Float64Array;
  /** Background embryos with data in the bin. */
  readonly n: Float64Array;
}

/** One quantity of one embryo before and after the background condition's profile was subtracted. */
export interface BackgroundRefitRow {
  readonly file: string;
  readonly condition: string;
  readonly quantity: string;
  readonly unit: QuantityUnit;
  readonly before: number | null;
  readonly after: number | null;
  /** The refit's own standard error (λ, amplitude, a boundary's position where its method gives one), else null. */
  readonly seFit: number | null;
  /** Jackknife SE over the background embryos: how much `after` moves with the background's own noise; null with
   *  fewer than two background embryos. */
  readonly seBackground: number | null;
}

/** Per condition and quantity: the mean before and after, and the jackknife SE of the mean after from the
 *  background's own noise (shared by every condition; not part of the between-embryo CI). */
export interface BackgroundConditionSummary {
  readonly condition: string;
  readonly quantity: string;
  readonly unit: QuantityUnit;
  readonly n: number;
  readonly meanBefore: number;
  readonly meanAfter: number;
  readonly seBackground: number | null;
  /** SEM of the values after (the spread between embryos), and √(SEM² + seBackground²) with its interval at the
   *  cohort's level on Welch–Satterthwaite degrees of freedom; NaN when either part is missing. */
  readonly seBetween: number;
  readonly seCombined: number;
  readonly ciLow: number;
  readonly ciHigh: number;
}

/** What subtracting a background condition did: the condition, its embryos, its profiles and every refitted value. */
export interface BackgroundConditionRecord {
  readonly condition: string;
  /** Where the name came from: the --background-condition option (or the project's entry), or the sheet's role column. */
  readonly source: 'option' | 'sheet';
  /** Who named it, as written in background_condition.json (see BackgroundChoiceRecord.namedBy). */
  readonly namedBy?: string;
  /** The background condition's embryos (files), in sheet order. */
  readonly files: readonly string[];
  /** The rule in one sentence. */
  readonly rule: string;
  readonly profiles: readonly BackgroundProfile[];
  readonly refits: readonly BackgroundRefitRow[];
  readonly summaries: readonly BackgroundConditionSummary[];
}

/** Reliability summary of one condition (see core/cohort reliability). */
export interface ConditionReliability {
  readonly condition: string;
  readonly embryos: number;
  /** Embryos with a fitted λ. */
  readonly lambdaFitted: number;
  /** Of those, how many have SE(λ)/|λ| above the limit (25%). */
  readonly lambdaImprecise: number;
  readonly lambdaMeanEl: number;
  readonly lambdaMedianEl: number;
  /** Per position quantity: embryos in which it was found (of `embryos`). */
  readonly detected: Readonly<Record<string, number>>;
}

/** An x/EL fit range and how many embryos used it. */
export interface FitRangeUse {
  readonly startEl: number;
  readonly endEl: number;
  readonly embryos: number;
}

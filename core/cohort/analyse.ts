// The cohort step end to end (pure): assignment → observations → per-condition statistics → dosage test → profiles.
import { embryoResults, NO_BACKGROUND_CONDITION, type BackgroundChoiceRecord, type EmbryoResult } from '../model';
import { assignConditions } from './assign';
import { conditionStats } from './condition-stats';
import { dosageFits, lambdaTrend, measuredDosages } from './dosage-fit';
import { localLambdaWithSe } from './local-lambda';
import { conditionReliability, fitRangesUsed } from './reliability';
import { notDecayingFits, observationsOf } from './observations';
import { checkCohortOptions } from './options';
import { conditionProfile } from './profiles';
import type { CohortAnalysis, CohortAssignment, CohortOptions, ConditionProfile, Observation, ResolvedCohortOptions, SampleSheet } from '../model';
import { positionQuantities, referenceLambda, shiftRows } from './dosage-test';
import { meanOf } from './stats-local';
import { sideDifferences } from './sides';
import { applyBackgroundCondition, splitByChoice } from './background-condition';
import { backgroundConditionOf } from './background-profile';
import type { RefitSettings } from './background-refit';
import { CohortError } from './cohort-error';
import { covariateAdjustment, parseCovariateRequest } from './covariates';
import { DEFAULT_SETTINGS } from '../settings';

/** Options of analyseCohort: the cohort options, and the batch's settings a background-condition refit uses (the
 *  boundary search and the shared fit range; default: the built-in settings, with a warning). */
export interface CohortRunOptions extends CohortOptions {
  readonly refitSettings?: RefitSettings | null;
}

/**
 * Analyse a cohort of embryo results with a sample sheet; throws CohortError for bad sheets or options. Results may be
 * keyed by (file, time point): each embryo counts once, with its file's highest time point (a movie's last analysed
 * one; embryoResults).
 */
export function analyseCohort(keyed: readonly EmbryoResult[], fullSheet: SampleSheet, options: CohortRunOptions = {}): CohortAnalysis {
  const opts = checkCohortOptions(options);
  if (options.covariates !== undefined && !(Array.isArray(options.covariates) && options.covariates.every((c) => typeof c === 'string'))) {
    throw new CohortError('covariates must be a list of sample-sheet column names');
  }
  const covariateRequests = (options.covariates ?? []).map(parseCovariateRequest);
  const given = options.backgroundCondition ?? null;
  if (given !== null && given.trim() === '') throw new CohortError('backgroundCondition must be a non-empty condition name');
  // A background condition (null or secondary-only staining) leaves the comparison; its profile is subtracted below.
  // With `none`, nothing is subtracted and a condition the role column marks only leaves the comparison.
  const choice = backgroundConditionOf(fullSheet, given, options.backgroundConditionNamedBy);
  const { split, subtract } = splitByChoice(embryoResults(keyed), fullSheet, choice);
  if (split !== null && split.condition === opts.reference) {
    throw new CohortError(subtract ? `${fullSheet.source}: "${split.condition}" cannot be both the reference and the background condition`
      : `${fullSheet.source}: "${split.condition}" is marked background in the role column, so it cannot be the reference; unmark it or choose another reference`);
  }
  const sheet = split?.sheet ?? fullSheet;
  const results = split?.results ?? embryoResults(keyed);
  const assigned = assignConditions(results, sheet, opts.reference);
  const warnings = [...assigned.warnings, ...(split?.warnings ?? [])];
  if (choice?.rule === 'none' && fullSheet.rows.some((r) => r.condition === NO_BACKGROUND_CONDITION)) {
    warnings.push(`${fullSheet.source}: a condition is named "${NO_BACKGROUND_CONDITION}"; the background choice "${NO_BACKGROUND_CONDITION}" means no background condition, so it is compared like the others`);
  }
  let assignment = assigned;
  let background: ReturnType<typeof applyBackgroundCondition>['record'] | null = null;
  if (split !== null && subtract) {
    if (!options.refitSettings) warnings.push(`no batch settings were given; the boundaries after subtracting "${split.condition}" were searched with the built-in settings`);
    const applied = applyBackgroundCondition(assigned.groups, split, options.refitSettings ?? DEFAULT_SETTINGS, opts.level);
    assignment = { ...assigned, groups: applied.groups };
    background = applied.record;
    if (split.embryos.length < 2) warnings.push(`background condition "${split.condition}" has one embryo: the background's own noise cannot be estimated, and it adds to every embryo's`);
  }
  const backgroundChoice: BackgroundChoiceRecord | null = choice === null ? null : {
    rule: choice.rule, condition: choice.name, setAside: choice.setAside, setAsideFiles: subtract ? [] : split?.embryos.map((e) => e.file) ?? [], namedBy: choice.namedBy, why: choice.why,
  };
  const flat = notDecayingFits(assignment.groups.flatMap((g) => g.embryos));
  if (flat.length > 0) {
    warnings.push(`λ left out of the statistics for ${flat.length} embryo${flat.length === 1 ? '' : 's'} whose fit is not a decaying gradient: ${flat.join(', ')}`);
  }
  const conditions = assignment.groups.map((g) => g.condition);
  const observations = assignment.groups.flatMap((g) => g.embryos.flatMap((e) => observationsOf(e, g.condition)));
  const stats = conditionStats(observations, conditions, opts.level);
  const reference = assignment.reference;
  const lambda = reference !== null ? referenceLambda(observations, reference, opts.level) : null;
  if (reference !== null && lambda === null) warnings.push(`reference "${reference}" has no fitted λ; no predicted shifts`);
  const rawShifts = reference !== null ? shiftRows(observations, conditions, reference, lambda, opts.lambdaPosteriorEl, opts.level) : [];
  const measured = reference !== null ? measuredDosages(observations, reference, new Map(conditions.map((c) => [c.name, c.factor]))) : [];
  const rawFits = reference !== null ? dosageFits(observations, lambda, opts.lambdaPosteriorEl, measured, opts.level) : [];
  const local = localLambdas(assignment.groups, reference, observations, opts);
  // Covariates (asked for only): their coefficients within conditions, positions adjusted, the same means line.
  const adjustment = covariateRequests.length > 0 && reference !== null ? covariateAdjustment(observations, sheet, covariateRequests, opts.level) : null;
  if (covariateRequests.length > 0 && reference === null) warnings.push('covariates were given but there is no reference condition, so no dosage regression to adjust');
  if (adjustment) warnings.push(...adjustment.warnings);
  const fits = rawFits.map((f) => {
    const adjusted = adjustment?.fits.get(f.quantity);
    return { ...f, ...(adjusted ? { adjusted } : {}), localLambdaEl: local.get(f.quantity)?.lambdaEl ?? null, localLambdaSeEl: local.get(f.quantity)?.seEl ?? null };
  });
  const shifts = rawShifts.map((s) => {
    const l = local.get(s.quantity);
    return { ...s, predictedLocalShiftEl: l !== undefined && s.lnF !== null ? l.lambdaEl * s.lnF : null };
  });
  if (background !== null && observations.some((o) => o.kind === 'side-difference')) {
    warnings.push('the dorsal − ventral differences of λ are those of the batch: the background condition\'s profile was not subtracted from each side');
  }
  const profiles: ConditionProfile[] = [];
  for (const g of assignment.groups) {
    const r = conditionProfile(g.embryos, g.condition, opts);
    warnings.push(...r.warnings);
    if (r.profile) profiles.push(r.profile);
  }
  return { options: opts, conditions, reference, referenceLambda: lambda, observations, stats, shifts, dosageFits: fits,
    measuredDosages: measured, lambdaTrend: lambdaTrend(observations, opts.level),
    reliability: conditionReliability(assignment.groups, observations),
    fitRanges: fitRangesUsed(assignment.groups.flatMap((g) => g.embryos)),
    sheetColumns: [...new Set(sheet.rows.flatMap((r) => Object.keys(r.extra)))], profiles, warnings,
    ...(adjustment ? { covariates: adjustment.used } : {}),
    sideDifferences: sideDifferences(observations, conditions, opts.level),
    ...(background !== null ? { backgroundCondition: background } : {}), ...(backgroundChoice !== null ? { backgroundChoice } : {}) };
}

/** λ_local (x/EL) and its jackknife SE per position quantity at the reference's mean position (finite λ only). */
function localLambdas(
  groups: CohortAssignment['groups'], reference: string | null, observations: readonly Observation[], opts: ResolvedCohortOptions,
): Map<string, { lambdaEl: number; seEl: number | null }> {
  const out = new Map<string, { lambdaEl: number; seEl: number | null }>();
  const ref = groups.find((g) => g.condition.name === reference);
  if (!ref) return out;
  const quantities = positionQuantities(observations);
  const means = quantities.map((q) => meanOf(observations.filter((o) => o.condition === reference && o.quantity === q && o.unit === 'EL').map((o) => o.value)));
  const values = localLambdaWithSe(ref.embryos, ref.condition, means, opts);
  quantities.forEach((q, i) => {
    const v = values[i];
    if (Number.isFinite(v.lambdaEl)) out.set(q, { lambdaEl: v.lambdaEl, seEl: Number.isFinite(v.seEl) ? v.seEl : null });
  });
  return out;
}

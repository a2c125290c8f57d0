// The cohort step end to end (pure): assignment → observations → per-condition statistics → dosage test → profiles.
import type { EmbryoResult } from '../model';
import { assignConditions } from './assign';
import { conditionStats } from './condition-stats';
import { dosageFits, lambdaTrend, measuredDosages } from './dosage-fit';
import { referenceLambda, shiftRows } from './dosage-test';
import { conditionReliability, fitRangesUsed } from './reliability';
import { observationsOf } from './observations';
import { checkCohortOptions } from './options';
import { conditionProfile } from './profiles';
import type { CohortAnalysis, CohortOptions, ConditionProfile, SampleSheet } from '../model';

/** Analyse a cohort of embryo results with a sample sheet; throws CohortError for bad sheets or options. */
export function analyseCohort(results: readonly EmbryoResult[], sheet: SampleSheet, options: CohortOptions = {}): CohortAnalysis {
  const opts = checkCohortOptions(options);
  const assignment = assignConditions(results, sheet, opts.reference);
  const warnings = [...assignment.warnings];
  const conditions = assignment.groups.map((g) => g.condition);
  const observations = assignment.groups.flatMap((g) => g.embryos.flatMap((e) => observationsOf(e, g.condition)));
  const stats = conditionStats(observations, conditions, opts.level);
  const reference = assignment.reference;
  const lambda = reference !== null ? referenceLambda(observations, reference, opts.level) : null;
  if (reference !== null && lambda === null) warnings.push(`reference "${reference}" has no fitted λ; no predicted shifts`);
  const shifts = reference !== null ? shiftRows(observations, conditions, reference, lambda, opts.lambdaPosteriorEl, opts.level) : [];
  const measured = reference !== null ? measuredDosages(observations, reference, new Map(conditions.map((c) => [c.name, c.factor]))) : [];
  const fits = reference !== null ? dosageFits(observations, lambda, opts.lambdaPosteriorEl, measured, opts.level) : [];
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
    sheetColumns: [...new Set(sheet.rows.flatMap((r) => Object.keys(r.extra)))], profiles, warnings };
}

// The background condition in the cohort step: its embryos are taken out of the comparison, their mean profile per
// channel is subtracted from every other embryo's profile, and λ, amplitude and boundaries are fitted again. The
// background's own noise is carried by a jackknife over its embryos (leave one out, subtract, fit again): the SE of
// each refitted value and of each condition's mean (Efron & Tibshirani, An Introduction to the Bootstrap, 1993,
// ch. 11, from memory: SE² = (k − 1)/k · Σ (θ₍ᵢ₎ − θ̄₍·₎)²).
import type { EmbryoResult } from '../model';
import { assignConditions } from './assign';
import { backgroundProfiles, BACKGROUND_CONDITION_RULE, type BackgroundChoice } from './background-profile';
import { refitEmbryo, type RefitSettings } from './background-refit';
import { CohortError } from './cohort-error';
import { observationsOf } from './observations';
import { tQuantileOf } from './stats-local';
import type {
  BackgroundConditionRecord, BackgroundConditionSummary, BackgroundProfile, BackgroundRefitRow, CohortAssignment, ConditionInfo, Observation, SampleSheet,
} from '../model';

/** The sheet and results without the background condition (or, with rule 'none', the condition the role column
 *  marks), and that condition's name, source and embryos. */
export interface BackgroundSplit {
  readonly sheet: SampleSheet;
  readonly results: readonly EmbryoResult[];
  readonly condition: string;
  readonly source: 'option' | 'sheet';
  readonly embryos: readonly EmbryoResult[];
  readonly warnings: readonly string[];
  /** Who named the condition (see BackgroundChoice.namedBy). */
  readonly namedBy?: string;
}

/** Take one condition's rows out of the sheet and its embryos out of the results. Throws CohortError (one line) when
 *  it is the only condition. */
function splitCondition(results: readonly EmbryoResult[], sheet: SampleSheet, name: string, source: 'option' | 'sheet', subtracted: boolean): BackgroundSplit {
  const rows = sheet.rows.filter((r) => r.condition === name);
  const rest = sheet.rows.filter((r) => r.condition !== name);
  if (rest.length === 0) {
    throw new CohortError(subtracted ? `${sheet.source}: background condition "${name}" is the only condition; there is nothing to subtract it from`
      : `${sheet.source}: "${name}", marked background in the role column, is the only condition; there is nothing to compare`);
  }
  const own = assignConditions(results, { source: sheet.source, rows });
  const embryos = own.groups[0]?.embryos ?? [];
  const taken = new Set(embryos);
  const missing = own.warnings.filter((w) => w.startsWith(`${sheet.source}: no analysed result for `));
  return { sheet: { source: sheet.source, rows: rest }, results: results.filter((r) => !taken.has(r)), condition: name, source, embryos, warnings: missing };
}

/** The split a background choice asks for: the subtracted condition's (rules 'option', 'sheet'), or with rule 'none'
 *  the role column's condition set aside (not subtracted); null split when there is nothing to take out. */
export function splitByChoice(results: readonly EmbryoResult[], sheet: SampleSheet, choice: BackgroundChoice | null): { choice: BackgroundChoice | null; split: BackgroundSplit | null; subtract: boolean } {
  if (choice === null) return { choice, split: null, subtract: false };
  if (choice.rule === 'none') {
    return { choice, split: choice.setAside === null ? null : splitCondition(results, sheet, choice.setAside, 'sheet', false), subtract: false };
  }
  return { choice, split: { ...splitCondition(results, sheet, choice.name as string, choice.rule, true), namedBy: choice.namedBy }, subtract: true };
}

const CHANGED = new Set(['lambda', 'amplitude', 'boundary']);
const keyOf = (o: { quantity: string; unit: string }): string => `${o.quantity}\u0000${o.unit}`;

/** The quantities a refit changes (λ, amplitude, boundaries) of one embryo, by quantity and unit. */
function changedValues(r: EmbryoResult, c: ConditionInfo): Map<string, Observation> {
  return new Map(observationsOf(r, c).filter((o) => CHANGED.has(o.kind)).map((o) => [keyOf(o), o]));
}

/** Standard error the refit itself gives for one observation, or null. */
function seFitOf(r: EmbryoResult, o: Observation): number | null {
  const f = r.gradientFit;
  if (o.kind === 'lambda' && f) return o.unit === 'EL' ? f.lambdaSeEl : f.lambdaSeUm;
  if (o.kind === 'amplitude' && f) return f.amplitudeSe;
  if (o.kind === 'boundary') {
    const b = r.boundaries.find((x) => `boundary:${x.channel}:${x.method}` === o.quantity);
    const se = b?.positionSeEl ?? null;
    if (se === null) return null;
    return o.unit === 'EL' ? se : r.eggLengthUm !== null ? se * r.eggLengthUm : null;
  }
  return null;
}

/** Jackknife SE of a statistic from its leave-one-out values; null when any is missing or fewer than two. */
export function jackknifeSe(values: readonly (number | null)[]): number | null {
  const k = values.length;
  if (k < 2 || values.some((v) => v === null || !Number.isFinite(v))) return null;
  const v = values as number[];
  const m = v.reduce((s, x) => s + x, 0) / k;
  return Math.sqrt(((k - 1) / k) * v.reduce((s, x) => s + (x - m) ** 2, 0));
}

type Groups = CohortAssignment['groups'];

/**
 * The mean's interval counting both the spread between the n embryos (SEM, n − 1 degrees of freedom) and the
 * background's jackknife SE (k − 1): √(SEM² + SE²) with Welch–Satterthwaite degrees of freedom (Satterthwaite 1946,
 * Biometrics Bulletin 2:110, from memory). NaN when either part is missing.
 */
export function combinedInterval(values: readonly number[], seBackground: number | null, k: number, level: number): { seBetween: number; seCombined: number; ciLow: number; ciHigh: number } {
  const n = values.length;
  const m = n ? values.reduce((s, x) => s + x, 0) / n : NaN;
  const seBetween = n >= 2 ? Math.sqrt(values.reduce((s, x) => s + (x - m) ** 2, 0) / (n - 1) / n) : NaN;
  const a = seBetween ** 2, b = seBackground === null ? NaN : seBackground ** 2;
  const seCombined = Math.sqrt(a + b);
  const dof = (a + b) ** 2 / ((n >= 2 ? a * a / (n - 1) : NaN) + (k >= 2 ? b * b / (k - 1) : NaN));
  const t = a + b > 0 ? tQuantileOf(1 - (1 - level) / 2, dof) : 0;
  return { seBetween, seCombined, ciLow: m - t * seCombined, ciHigh: m + t * seCombined };
}

function refitGroups(groups: Groups, profiles: readonly BackgroundProfile[], settings: RefitSettings, condition: string): Groups {
  const byChannel = new Map(profiles.map((p) => [p.channel, p]));
  return groups.map((g) => ({ condition: g.condition, embryos: g.embryos.map((e) => refitEmbryo(e, byChannel, settings, condition)) }));
}

function meanOfFinite(values: readonly (number | undefined)[]): number {
  const v = values.filter((x): x is number => x !== undefined && Number.isFinite(x));
  return v.length ? v.reduce((s, x) => s + x, 0) / v.length : NaN;
}

/**
 * Subtract the background condition from every embryo of `groups` and fit again. Returns the refitted groups and the
 * record (profiles, per-embryo values before and after with their SEs, per-condition means with the background's
 * jackknife SE). Throws CohortError when the background embryos disagree or an embryo's channels or bins do not match.
 */
export function applyBackgroundCondition(groups: Groups, split: BackgroundSplit, settings: RefitSettings, level = 0.95): { groups: Groups; record: BackgroundConditionRecord } {
  const profiles = backgroundProfiles(split.condition, split.embryos);
  const refitted = refitGroups(groups, profiles, settings, split.condition);
  // Leave-one-out replicates: each background embryo left out in turn (none with a single background embryo).
  const k = split.embryos.length;
  const replicates = k < 2 ? [] : split.embryos.map((_, j) => refitGroups(groups, backgroundProfiles(split.condition, split.embryos.filter((__, i) => i !== j)), settings, split.condition));
  const refits: BackgroundRefitRow[] = [];
  const summaries: BackgroundConditionSummary[] = [];
  refitted.forEach((g, gi) => {
    const perKey = new Map<string, { before: (number | undefined)[]; after: (number | undefined)[]; reps: (number | undefined)[][]; unit: Observation['unit']; quantity: string }>();
    g.embryos.forEach((e, ei) => {
      const before = changedValues(groups[gi].embryos[ei], g.condition);
      const after = changedValues(e, g.condition);
      const reps = replicates.map((rep) => changedValues(rep[gi].embryos[ei], g.condition));
      for (const key of new Set([...after.keys(), ...before.keys()])) {
        const o = (after.get(key) ?? before.get(key)) as Observation;
        const repValues = reps.map((m) => m.get(key)?.value ?? null);
        refits.push({ file: e.file, condition: g.condition.name, quantity: o.quantity, unit: o.unit, before: before.get(key)?.value ?? null, after: after.get(key)?.value ?? null,
          seFit: after.has(key) ? seFitOf(e, o) : null, seBackground: after.has(key) ? jackknifeSe(repValues) : null });
        const s = perKey.get(key) ?? { before: [], after: [], reps: reps.map(() => []), unit: o.unit, quantity: o.quantity };
        s.before.push(before.get(key)?.value);
        s.after.push(after.get(key)?.value);
        reps.forEach((m, j) => s.reps[j].push(m.get(key)?.value));
        perKey.set(key, s);
      }
    });
    for (const s of perKey.values()) {
      const after = s.after.filter((x): x is number => x !== undefined && Number.isFinite(x));
      const repMeans = s.reps.map((r) => { const m = meanOfFinite(r); return Number.isFinite(m) ? m : null; });
      const seBackground = k < 2 ? null : jackknifeSe(repMeans);
      summaries.push({ condition: g.condition.name, quantity: s.quantity, unit: s.unit, n: after.length, meanBefore: meanOfFinite(s.before), meanAfter: meanOfFinite(s.after),
        seBackground, ...combinedInterval(after, seBackground, k, level) });
    }
  });
  return {
    groups: refitted,
    record: { condition: split.condition, source: split.source, ...(split.namedBy !== undefined ? { namedBy: split.namedBy } : {}), files: split.embryos.map((e) => e.file), rule: BACKGROUND_CONDITION_RULE, profiles, refits, summaries },
  };
}

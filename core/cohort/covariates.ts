// Covariates of the dosage regression: free columns of the sample sheet (numeric, e.g. stage in minutes; categorical,
// e.g. batch, dummy-coded against its first level in the sheet). Their coefficients are estimated within conditions
// and each position is adjusted to the covariates' overall mean before the condition-means line on ln f
// (core/stats covariateAdjustedLine). This file reads and checks the columns and turns them into terms.
import { covariateAdjustedLine, tQuantile, tTwoSidedP, WithinFitError } from '../stats';
import { CohortError } from './cohort-error';
import { sheetRowLookup } from './assign';
import { positionQuantities } from './dosage-test';
import type { AdjustedDosageFit, CovariateRequest, CovariateTerm, CovariateUsed, Observation, SampleRow, SampleSheet } from '../model';

const KINDS = ['numeric', 'categorical'] as const;

/** `column`, `column:numeric` or `column:categorical` → a request; throws CohortError for an empty name. */
export function parseCovariateRequest(text: string): CovariateRequest {
  const t = text.trim();
  const colon = t.lastIndexOf(':');
  const suffix = colon >= 0 ? t.slice(colon + 1).trim().toLowerCase() : '';
  const kind = (KINDS as readonly string[]).includes(suffix) ? suffix as CovariateRequest['kind'] : 'auto';
  const column = kind === 'auto' ? t : t.slice(0, colon).trim();
  if (column === '') throw new CohortError(`covariate "${text}": give a column of the sample sheet (e.g. stage, stage:numeric, batch:categorical)`);
  return { column, kind };
}

/** A covariate's value per sheet row: a number, a level, or null (empty cell: missing). */
interface CovariateColumn extends CovariateUsed {
  readonly valueOf: (row: SampleRow) => number | string | null;
  /** Taken as numeric without being declared so, from few whole numbers (perhaps labels such as batch 1, 2, 3). */
  readonly guessedNumericLabels: boolean;
}

const isNumber = (s: string): boolean => s.trim() !== '' && Number.isFinite(Number(s));

/** Check each requested column against the sheet (exists, numeric when declared so, not empty); throws CohortError. */
export function covariateColumns(sheet: SampleSheet, requests: readonly CovariateRequest[]): CovariateColumn[] {
  const headers = [...new Set(sheet.rows.flatMap((r) => Object.keys(r.extra)))];
  const seen = new Set<string>();
  return requests.map((req) => {
    const header = headers.find((h) => h === req.column) ?? headers.find((h) => h.toLowerCase() === req.column.toLowerCase());
    if (header === undefined) {
      throw new CohortError(`${sheet.source}: no column "${req.column}" for the covariate (free columns: ${headers.length > 0 ? headers.join(', ') : 'none'})`);
    }
    if (seen.has(header)) throw new CohortError(`${sheet.source}: covariate "${header}" is given twice`);
    seen.add(header);
    const cells = sheet.rows.map((r) => ({ row: r, text: (r.extra[header] ?? '').trim() }));
    const given = cells.filter((c) => c.text !== '');
    if (given.length === 0) throw new CohortError(`${sheet.source}: covariate "${header}" has no values`);
    const bad = given.find((c) => !isNumber(c.text));
    if (req.kind === 'numeric' && bad) {
      throw new CohortError(`${sheet.source} line ${bad.row.line}: covariate "${header}" is declared numeric but "${bad.text}" (${bad.row.file}) is not a number`);
    }
    const kind = req.kind === 'categorical' || (req.kind === 'auto' && bad) ? 'categorical' : 'numeric';
    const levels = kind === 'categorical' ? [...new Set(given.map((c) => c.text))] : [];
    const valueOf = (row: SampleRow): number | string | null => {
      const v = (row.extra[header] ?? '').trim();
      return v === '' ? null : kind === 'numeric' ? Number(v) : v;
    };
    const distinct = new Set(given.map((c) => Number(c.text)));
    const guessedNumericLabels = req.kind === 'auto' && kind === 'numeric' && distinct.size <= 4 && [...distinct].every(Number.isInteger);
    return { column: header, kind, levels, baseLevel: kind === 'categorical' ? levels[0] : null, valueOf, guessedNumericLabels };
  });
}

/** A term of the design: a numeric column, or one non-base level of a categorical column. */
interface Term { readonly column: CovariateColumn; readonly level: string | null }

function termName(t: Term): string {
  return t.level === null ? t.column.column : `${t.column.column}=${t.level}`;
}

function termValue(t: Term, v: number | string): number {
  return t.level === null ? v as number : v === t.level ? 1 : 0;
}

/** Embryos (file, condition) with every covariate's value; the rest are counted as missing. */
interface EmbryoCovariates { readonly file: string; readonly condition: string; readonly values: readonly (number | string)[] }

/**
 * The terms that can be estimated within conditions, with warnings (a level seen in one condition only; a level that
 * fills whole conditions, absorbed by them). Throws CohortError naming the column when a covariate is constant within
 * every condition: its effect cannot be told apart from the dosage's.
 */
function estimableTerms(columns: readonly CovariateColumn[], embryos: readonly EmbryoCovariates[], source: string, warnings: string[]): Term[] {
  const byCondition = new Map<string, EmbryoCovariates[]>();
  for (const e of embryos) byCondition.set(e.condition, [...(byCondition.get(e.condition) ?? []), e]);
  const varies = (value: (e: EmbryoCovariates) => number | string): boolean =>
    [...byCondition.values()].some((list) => new Set(list.map(value)).size > 1);
  const terms: Term[] = [];
  columns.forEach((column, c) => {
    if (!varies((e) => e.values[c])) {
      throw new CohortError(`${source}: covariate "${column.column}" is constant within every condition, so its effect cannot be told apart from the dosage's; leave it out`);
    }
    if (column.kind === 'numeric') { terms.push({ column, level: null }); return; }
    for (const level of column.levels.slice(1)) {
      const inConditions = [...byCondition.entries()].filter(([, list]) => list.some((e) => e.values[c] === level)).map(([name]) => name);
      if (inConditions.length === 0) continue;
      if (!varies((e) => (e.values[c] === level ? 1 : 0))) {
        warnings.push(`${source}: level "${level}" of covariate "${column.column}" fills whole conditions (${inConditions.join(', ')}); its effect is absorbed by them and not estimated`);
        continue;
      }
      if (inConditions.length === 1) {
        warnings.push(`${source}: level "${level}" of covariate "${column.column}" is seen in condition "${inConditions[0]}" only; its coefficient rests on that condition's embryos`);
      }
      terms.push({ column, level });
    }
  });
  return terms;
}

/** What the covariate step adds to the cohort: each covariate as used, the adjusted fit per quantity, warnings. */
export interface CovariateAdjustment {
  readonly used: readonly CovariateUsed[];
  readonly fits: ReadonlyMap<string, AdjustedDosageFit>;
  readonly warnings: readonly string[];
}

/**
 * Covariate-adjusted dosage fits for every position quantity (observations in x/EL with a known dosage). Embryos
 * missing a covariate are left out of the adjusted fit (with a warning); a quantity with fewer than 3 dosages, or
 * too few embryos for the terms, gets no adjusted fit (with a warning). Throws CohortError for bad columns.
 */
export function covariateAdjustment(
  observations: readonly Observation[], sheet: SampleSheet, requests: readonly CovariateRequest[], level = 0.95,
): CovariateAdjustment {
  const columns = covariateColumns(sheet, requests);
  const rowOf = sheetRowLookup(sheet);
  const warnings: string[] = [];
  for (const c of columns.filter((x) => x.guessedNumericLabels)) {
    warnings.push(`${sheet.source}: covariate "${c.column}" is taken as numeric (every value is a whole number); if its values are labels (batch 1, 2, 3), give it as ${c.column}:categorical`);
  }
  const names = columns.map((c) => c.column);
  const valuesOf = new Map<string, (number | string)[] | null>();
  const valuesFor = (file: string): (number | string)[] | null => {
    if (!valuesOf.has(file)) {
      const row = rowOf(file);
      const v = row ? columns.map((c) => c.valueOf(row)) : null;
      valuesOf.set(file, v && v.every((x) => x !== null) ? v as (number | string)[] : null);
    }
    return valuesOf.get(file) ?? null;
  };
  const embryos = new Map<string, EmbryoCovariates>();
  const missing = new Set<string>();
  for (const o of observations) {
    if (o.lnF === null) continue;
    const v = valuesFor(o.file);
    if (v === null) missing.add(o.file);
    else embryos.set(o.file, { file: o.file, condition: o.condition, values: v });
  }
  if (missing.size > 0) {
    warnings.push(`${sheet.source}: ${missing.size} embryo${missing.size === 1 ? '' : 's'} without a value of ${names.join(', ')} left out of the covariate-adjusted fit: ${[...missing].join(', ')}`);
  }
  const terms = estimableTerms(columns, [...embryos.values()], sheet.source, warnings);
  const fits = new Map<string, AdjustedDosageFit>();
  for (const quantity of positionQuantities(observations)) {
    const pts = observations.filter((o) => o.quantity === quantity && o.unit === 'EL' && o.lnF !== null && embryos.has(o.file));
    const rows = pts.map((o) => (embryos.get(o.file) as EmbryoCovariates).values);
    const z = terms.map((t) => rows.map((v) => termValue(t, v[columns.indexOf(t.column)])));
    try {
      const a = covariateAdjustedLine(pts.map((o) => o.condition), pts.map((o) => o.lnF as number), z, pts.map((o) => o.value), level);
      const w = a.within;
      const tq = tQuantile(0.5 + level / 2, w.dof);
      const termRows: CovariateTerm[] = terms.map((t, i) => ({
        covariate: t.column.column, term: termName(t), kind: t.column.kind, level: t.level, baseLevel: t.column.baseLevel,
        coefficientEl: w.beta[i], seEl: w.se[i], ciLow: w.beta[i] - tq * w.se[i], ciHigh: w.beta[i] + tq * w.se[i], dof: w.dof,
        p: tTwoSidedP(w.beta[i] / w.se[i], w.dof), meanValue: a.termMeans[i],
      }));
      fits.set(quantity, {
        slope: a.slope, slopeSe: a.slopeSe, intercept: a.intercept, ciLow: a.ciLow, ciHigh: a.ciHigh, dof: a.dof, pSlope: a.pSlope,
        covariates: names, r2: a.r2, n: pts.length, conditions: a.groupMeans.length, slopeSeMeansOnly: a.slopeSeMeansOnly, terms: termRows,
      });
    } catch (e) {
      if (e instanceof WithinFitError && e.reason === 'collinear') {
        warnings.push(`${sheet.source}: covariates ${terms.map(termName).join(', ')} are collinear within conditions for ${quantity}; no adjusted fit`);
      } else if (e instanceof WithinFitError && e.reason === 'constant') {
        warnings.push(`${sheet.source}: covariate term "${termName(terms[e.term])}" does not vary within any condition among the embryos with ${quantity}; no adjusted fit`);
      } else if (e instanceof WithinFitError || e instanceof RangeError) {
        warnings.push(`${quantity}: no covariate-adjusted fit (${pts.length} embryos over ${new Set(pts.map((o) => o.condition)).size} conditions; it needs 3 dosages and more embryos than conditions plus terms)`);
      } else throw e;
    }
  }
  return { used: columns.map(({ column, kind, levels, baseLevel }) => ({ column, kind, levels, baseLevel })), fits, warnings };
}

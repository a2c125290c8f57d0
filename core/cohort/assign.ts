// Match embryo results to sample-sheet rows and group them by condition; choose the reference condition.
import type { EmbryoResult } from '../model';
import { CohortError } from './cohort-error';
import type { CohortAssignment, ConditionInfo, SampleRow, SampleSheet } from '../model';

/** Normalise a path for matching: forward slashes, no leading "./". */
function normPath(p: string): string {
  return p.replace(/\\/g, '/').replace(/^\.\//, '');
}

function baseName(p: string): string {
  const n = normPath(p);
  return n.slice(n.lastIndexOf('/') + 1);
}

/** Find the sheet row for a result file: exact relative path first, else a unique base-name match. */
function rowFor(file: string, exact: Map<string, SampleRow>, byBase: Map<string, SampleRow[]>): SampleRow | null {
  const hit = exact.get(normPath(file));
  if (hit) return hit;
  const candidates = byBase.get(baseName(file)) ?? [];
  return candidates.length === 1 ? candidates[0] : null;
}

/** The sheet row each result file matches (as assignConditions matches them: exact path, else a unique base name). */
export function sheetRowLookup(sheet: SampleSheet): (file: string) => SampleRow | null {
  const exact = new Map<string, SampleRow>();
  const byBase = new Map<string, SampleRow[]>();
  for (const r of sheet.rows) {
    const key = normPath(r.file);
    if (exact.has(key)) continue;
    exact.set(key, r);
    byBase.set(baseName(r.file), [...(byBase.get(baseName(r.file)) ?? []), r]);
  }
  return (file) => rowFor(file, exact, byBase);
}

/** Conditions in sheet order with one dosage each; conflicting dosages are an error naming the sheet. */
function conditionsOf(sheet: SampleSheet): { name: string; dosage: number | null }[] {
  const out = new Map<string, number | null>();
  for (const r of sheet.rows) {
    if (!out.has(r.condition)) { out.set(r.condition, r.dosage); continue; }
    const known = out.get(r.condition) ?? null;
    if (r.dosage !== null && known !== null && r.dosage !== known) {
      throw new CohortError(`${sheet.source}: condition "${r.condition}" has two dosages (${known} and ${r.dosage})`);
    }
    if (known === null) out.set(r.condition, r.dosage);
  }
  return [...out].map(([name, dosage]) => ({ name, dosage }));
}

/** Reference: the one given (must exist), else the single condition with dosage 1, else none (with a warning). */
function chooseReference(
  conds: readonly { name: string; dosage: number | null }[], given: string | null, source: string, warnings: string[],
): string | null {
  if (given !== null) {
    if (!conds.some((c) => c.name === given)) {
      throw new CohortError(`${source}: reference condition "${given}" is not in the sheet (conditions: ${conds.map((c) => c.name).join(', ')})`);
    }
    return given;
  }
  const ones = conds.filter((c) => c.dosage === 1);
  if (ones.length === 1) return ones[0].name;
  if (ones.length > 1) {
    throw new CohortError(`${source}: several conditions have dosage 1 (${ones.map((c) => c.name).join(', ')}); choose the reference`);
  }
  warnings.push(`${source}: no condition has dosage 1 and no reference was given; the dosage test is skipped`);
  return null;
}

/** Group results by the sheet's conditions; results with status 'error' are left out (they are failures). */
export function assignConditions(
  results: readonly EmbryoResult[], sheet: SampleSheet, reference: string | null = null,
): CohortAssignment {
  const warnings: string[] = [];
  const exact = new Map<string, SampleRow>();
  const byBase = new Map<string, SampleRow[]>();
  for (const r of sheet.rows) {
    const key = normPath(r.file);
    if (exact.has(key)) { warnings.push(`${sheet.source}: ${r.file} is listed twice; the first row is used`); continue; }
    exact.set(key, r);
    byBase.set(baseName(r.file), [...(byBase.get(baseName(r.file)) ?? []), r]);
  }
  const conds = conditionsOf(sheet);
  const ref = chooseReference(conds, reference, sheet.source, warnings);
  const refDose = conds.find((c) => c.name === ref)?.dosage ?? null;
  const members = new Map<string, EmbryoResult[]>(conds.map((c) => [c.name, []]));
  const used = new Set<SampleRow>();
  for (const res of results) {
    if (res.status !== 'ok') continue;
    const row = rowFor(res.file, exact, byBase);
    if (!row) { warnings.push(`${res.file}: not in ${sheet.source}; left out of the cohort`); continue; }
    used.add(row);
    members.get(row.condition)?.push(res);
  }
  for (const r of exact.values()) {
    if (!used.has(r)) warnings.push(`${sheet.source}: no analysed result for ${r.file}`);
  }
  const groups = conds.map((c) => ({ condition: conditionInfo(c, refDose), embryos: members.get(c.name) ?? [] }));
  for (const g of groups) if (g.embryos.length === 0) warnings.push(`condition "${g.condition.name}" has no embryos`);
  return { groups, reference: ref, warnings };
}

function conditionInfo(c: { name: string; dosage: number | null }, refDose: number | null): ConditionInfo {
  const factor = c.dosage !== null && refDose !== null ? c.dosage / refDose : null;
  return { name: c.name, dosage: c.dosage, factor };
}

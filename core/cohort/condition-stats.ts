// Per condition and quantity: n, mean, SD, SEM and 95% t-CI. The SD of a boundary or landmark is its positional error.
import { describeSample } from './describe';
import type { ConditionInfo, ConditionStat, Observation } from '../model';

/** Summaries in condition order, then in order of first appearance of each quantity/unit. */
export function conditionStats(
  observations: readonly Observation[], conditions: readonly ConditionInfo[], level = 0.95,
): ConditionStat[] {
  const keys: { quantity: string; unit: Observation['unit']; kind: Observation['kind'] }[] = [];
  const seen = new Set<string>();
  for (const o of observations) {
    const k = `${o.quantity}\u0000${o.unit}`;
    if (!seen.has(k)) { seen.add(k); keys.push({ quantity: o.quantity, unit: o.unit, kind: o.kind }); }
  }
  const out: ConditionStat[] = [];
  for (const c of conditions) {
    for (const k of keys) {
      const values = observations
        .filter((o) => o.condition === c.name && o.quantity === k.quantity && o.unit === k.unit)
        .map((o) => o.value);
      if (values.length === 0) continue;
      out.push({ condition: c.name, dosage: c.dosage, ...k, ...describeSample(values, level) });
    }
  }
  return out;
}

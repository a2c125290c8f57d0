// Per-embryo quantities: λ (µm, EL), amplitude, egg length, each boundary (channel × method) and landmark (EL, µm).
import { notDecayingReasons } from '../stats';
import type { EmbryoResult } from '../model';
import { SIDE_DIFFERENCE_QUANTITY, sideObservations } from './sides';
import type { ConditionInfo, Observation, QuantityKind, QuantityUnit } from '../model';

// Quantity keys (the `quantity` column of the CSV files) are machine-friendly: `lambda`, `amplitude`, `egg_length`,
// `boundary:<channel>:<method>` and `landmark:<name>`. The method never contains ':', so a channel name may.

/** Quantity key of a boundary: `boundary:<channel>:<method>`, e.g. `boundary:ch2:logistic`. */
export function boundaryQuantity(channel: string, method: string): string {
  return `boundary:${channel}:${method}`;
}

/** Quantity key of a landmark: `landmark:<name>`, e.g. `landmark:furrow`. */
export function landmarkQuantity(name: string): string {
  return `landmark:${name}`;
}

/** Quantity key of the egg length (µm). */
export const EGG_LENGTH_QUANTITY = 'egg_length';

/** Readable label of a quantity key for reports and figures: `boundary in ‘ch2’ (logistic)`, `landmark ‘furrow’`. */
export function quantityLabel(quantity: string): string {
  if (quantity === 'lambda') return 'decay length λ';
  if (quantity === EGG_LENGTH_QUANTITY) return 'egg length';
  if (quantity === 'amplitude') return 'amplitude A';
  if (quantity === SIDE_DIFFERENCE_QUANTITY) return 'λ dorsal − ventral';
  if (quantity.startsWith('landmark:')) return `landmark ‘${quantity.slice('landmark:'.length)}’`;
  const last = quantity.lastIndexOf(':');
  if (quantity.startsWith('boundary:') && last > 'boundary:'.length - 1) {
    return `boundary in ‘${quantity.slice('boundary:'.length, last)}’ (${quantity.slice(last + 1)})`;
  }
  return quantity;
}

/** All finite quantities measured on one embryo, tagged with its condition and ln f. */
export function observationsOf(result: EmbryoResult, condition: ConditionInfo): Observation[] {
  const out: Observation[] = [];
  const lnF = condition.factor !== null ? Math.log(condition.factor) : null;
  const add = (quantity: string, kind: QuantityKind, unit: QuantityUnit, value: number | null | undefined): void => {
    if (value !== null && value !== undefined && Number.isFinite(value)) {
      out.push({ file: result.file, condition: condition.name, lnF, quantity, kind, unit, value });
    }
  };
  const fit = result.gradientFit;
  if (fit) {
    // A fit that does not decay has no decay length: its λ stays out of every λ statistic (listed by the cohort).
    if (notDecayingReasons(fit).length === 0) {
      add('lambda', 'lambda', 'EL', fit.lambdaEl);
      add('lambda', 'lambda', 'um', fit.lambdaUm);
    }
    add('amplitude', 'amplitude', 'a.u.', fit.amplitude);
  }
  add(EGG_LENGTH_QUANTITY, 'egg-length', 'um', result.eggLengthUm);
  const seen = new Set<string>();
  for (const b of result.boundaries) {
    const q = boundaryQuantity(b.channel, b.method);
    if (seen.has(q)) continue; // one value per embryo and quantity
    seen.add(q);
    add(q, 'boundary', 'EL', b.positionEl);
    add(q, 'boundary', 'um', b.positionUm);
  }
  for (const l of result.landmarks) {
    const q = landmarkQuantity(l.name);
    if (seen.has(q)) continue;
    seen.add(q);
    add(q, 'landmark', 'EL', l.xEl);
    add(q, 'landmark', 'um', l.xUm);
  }
  out.push(...sideObservations(result, condition.name, lnF));
  return out;
}

/** The embryos whose gradient fit is not a decaying gradient, "file (reasons)", for the cohort's warnings. */
export function notDecayingFits(results: readonly EmbryoResult[]): string[] {
  return results.flatMap((r) => {
    const reasons = r.status === 'ok' && r.gradientFit ? notDecayingReasons(r.gradientFit) : [];
    return reasons.length === 0 ? [] : [`${r.file} (${reasons.join('; ')})`];
  });
}

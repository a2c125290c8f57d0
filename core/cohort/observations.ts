// Per-embryo quantities: λ (µm, EL), amplitude, egg length, each boundary (channel × method) and landmark (EL, µm).
import type { EmbryoResult } from '../model';
import type { ConditionInfo, Observation, QuantityKind, QuantityUnit } from './types';

/** Quantity name of a boundary: `boundary <channel> <method>`. */
export function boundaryQuantity(channel: string, method: string): string {
  return `boundary ${channel} ${method}`;
}

/** Quantity name of a landmark: `landmark <name>`. */
export function landmarkQuantity(name: string): string {
  return `landmark ${name}`;
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
    add('lambda', 'lambda', 'EL', fit.lambdaEl);
    add('lambda', 'lambda', 'um', fit.lambdaUm);
    add('amplitude', 'amplitude', 'a.u.', fit.amplitude);
  }
  add('egg length', 'egg-length', 'um', result.eggLengthUm);
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
  return out;
}

// One Boundary per requested method for one profile; failures become a null position with a note, never a throw.
import type { Boundary, BoundaryMethod, Profile } from '../model';
import { thresholdCrossing, halfMaxCrossing } from './crossing';
import type { CrossingResult } from './crossing';
import { FitError } from './fit-error';
import { fitLogisticBoundary } from './logistic-boundary';

type Found = Omit<Boundary, 'channel' | 'method' | 'positionUm'>;

function fromCrossing(c: CrossingResult): Found {
  return { positionEl: c.positionEl, widthEl: null, positionSeEl: null, direction: c.direction, note: c.note };
}

function logisticBoundary(profile: Profile): Found {
  const b = fitLogisticBoundary(profile.xEl, profile.mean);
  return { positionEl: b.positionEl, widthEl: b.widthEl, positionSeEl: b.positionSeEl, direction: b.direction, note: b.note };
}

function findOne(profile: Profile, method: BoundaryMethod, thresholdFraction: number): Found {
  try {
    return findOneOrThrow(profile, method, thresholdFraction);
  } catch (e) {
    if (!(e instanceof FitError)) throw e;
    return { positionEl: null, widthEl: null, positionSeEl: null, direction: null, note: e.message };
  }
}

function findOneOrThrow(profile: Profile, method: BoundaryMethod, thresholdFraction: number): Found {
  switch (method) {
    case 'logistic':
      return logisticBoundary(profile);
    case 'half-max':
      return fromCrossing(halfMaxCrossing(profile.xEl, profile.mean));
    case 'threshold':
      return fromCrossing(thresholdCrossing(profile.xEl, profile.mean, thresholdFraction));
  }
}

/**
 * Finds the boundary in `profile` (its mean per bin) by each method. positionUm = positionEl × eggLengthUm, or
 * null when the egg length is unknown. thresholdFraction (0..1, of the robust range) is used by 'threshold'.
 * Throws FitError('bad-input') only for invalid arguments (unknown method, fraction outside (0, 1)).
 */
export function findBoundaries(
  profile: Profile, methods: readonly BoundaryMethod[], thresholdFraction: number, eggLengthUm: number | null,
): Boundary[] {
  for (const method of methods) {
    if (method !== 'logistic' && method !== 'half-max' && method !== 'threshold') {
      throw new FitError('bad-input', `findBoundaries: unknown method "${String(method)}"`);
    }
  }
  if (methods.includes('threshold') && !(thresholdFraction > 0 && thresholdFraction < 1)) {
    throw new FitError('bad-input', `findBoundaries: thresholdFraction must be between 0 and 1 (exclusive), got ${thresholdFraction}`);
  }
  const scale = eggLengthUm !== null && eggLengthUm > 0 && Number.isFinite(eggLengthUm) ? eggLengthUm : null;
  return methods.map((method) => {
    const found = findOne(profile, method, thresholdFraction);
    return {
      channel: profile.channel, method, ...found,
      positionUm: found.positionEl !== null && scale !== null ? found.positionEl * scale : null,
    };
  });
}

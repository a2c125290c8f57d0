// Access to the boundary finder of core/fit. It is looked up at run time so this folder builds before core/fit
// exports it; measureEmbryo reports a warning instead of boundaries while it is missing.
import type { Boundary, BoundaryMethod, Profile } from '../model';
import * as fit from '../fit';

/** Signature of core/fit's findBoundaries. */
export type FindBoundaries = (profile: Profile, methods: readonly BoundaryMethod[], thresholdFraction: number, eggLengthUm: number | null) => Boundary[];

/** core/fit's findBoundaries, or null when it is not available. */
export function boundaryFinder(): FindBoundaries | null {
  const f = (fit as unknown as { findBoundaries?: FindBoundaries }).findBoundaries;
  return typeof f === 'function' ? f : null;
}

// Each side of the sampled region profiled and fitted on its own, and the paired difference λ_dorsal − λ_ventral
// (the edge band with --edge-side each). The sides use the same bins, weights and fit as the main profile.
import type { ExponentialFit, Profile, SidesMeasurement } from '../model';
import { decayLengthDifference } from '../fit';
import { binWeights, filledBins, fitProfile } from './measure';

/** The two sides' profiles of the gradient channel. */
export interface SideProfiles {
  readonly dorsal: Profile;
  readonly ventral: Profile;
}

/** The weights fitProfile gave the points of `fit` (the filled bins inside its range), null when it was unweighted. */
function weightsOfFit(profile: Profile, fit: ExponentialFit): Float64Array | null {
  const p = filledBins(profile);
  const weights = binWeights(p.sd, p.n);
  if (!weights || !fit.weighted) return null;
  const [start, end] = fit.fitRangeEl;
  return weights.filter((_, i) => p.xEl[i] >= start && p.xEl[i] <= end);
}

/**
 * Fit each side over fitRangeEl (as the main profile) and the paired difference of their decay lengths. A side whose
 * fit fails gets null and a warning naming the side; the difference is then null.
 */
export function measureSides(sides: SideProfiles, axisPx: number, pixelSizeUm: number | null, fitRangeEl: readonly [number, number], warnings: string[]): SidesMeasurement {
  const fitSide = (name: 'dorsal' | 'ventral'): ExponentialFit | null => {
    const own: string[] = [];
    const fit = fitProfile(sides[name], axisPx, pixelSizeUm, fitRangeEl, own);
    warnings.push(...own.map((w) => `${name} side: ${w}`));
    return fit;
  };
  const dorsalFit = fitSide('dorsal');
  const ventralFit = fitSide('ventral');
  let difference = null;
  if (dorsalFit && ventralFit) {
    const eggLengthUm = pixelSizeUm !== null ? axisPx * pixelSizeUm : null;
    difference = decayLengthDifference(
      { fit: dorsalFit, weights: weightsOfFit(sides.dorsal, dorsalFit) },
      { fit: ventralFit, weights: weightsOfFit(sides.ventral, ventralFit) }, eggLengthUm);
    if (difference === null) warnings.push('the dorsal − ventral difference of λ could not be computed (the sides share too few bins in the fit range)');
  }
  return { dorsalProfile: sides.dorsal, ventralProfile: sides.ventral, dorsalFit, ventralFit, difference };
}

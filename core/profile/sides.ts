// Each side of the sampled region profiled and fitted on its own, and the paired difference λ_dorsal − λ_ventral
// (the edge band with --edge-side each). The sides use the same bins, weights and fit as the main profile.
import type { DecayLengthDifference, ExponentialFit, Profile, SidesMeasurement } from '../model';
import { decayLengthDifference, type SideFit } from '../fit';
import { fitProfileWeighted } from './measure';

/** The two sides' profiles of the gradient channel. */
export interface SideProfiles {
  readonly dorsal: Profile;
  readonly ventral: Profile;
  /** The two sides' profiles of the outer half of the band's depth alone (for the depth term), when sampled. */
  readonly outerHalf?: { readonly dorsal: Profile; readonly ventral: Profile };
}

/**
 * The difference with the depth term added: half the change of λ_dorsal − λ_ventral when only the outer half of
 * the band is sampled, T = |Δ − Δ_outer|/2, in quadrature with the SE, SE' = √(SE² + T²); the interval keeps its
 * t quantile (same dof). Unchanged when the outer half's difference is null.
 */
export function withDepthTerm(d: DecayLengthDifference, outer: DecayLengthDifference | null): DecayLengthDifference {
  if (outer === null || !Number.isFinite(outer.lambdaEl)) return d;
  const t = (d.ciHighEl - d.lambdaEl) / d.seEl;
  const termEl = Math.abs(d.lambdaEl - outer.lambdaEl) / 2;
  const seEl = Math.hypot(d.seEl, termEl);
  const termUm = Math.abs(d.lambdaUm - outer.lambdaUm) / 2;
  const seUm = Number.isFinite(d.seUm) ? Math.hypot(d.seUm, termUm) : NaN;
  return {
    ...d, seEl, seUm, ciLowEl: d.lambdaEl - t * seEl, ciHighEl: d.lambdaEl + t * seEl,
    ciLowUm: d.lambdaUm - t * seUm, ciHighUm: d.lambdaUm + t * seUm, depthTermEl: termEl,
  };
}

/**
 * One side's fit with the depth term added: half the change of its λ when only the outer half of the band is sampled,
 * T = |λ − λ_outer|/2, in quadrature with its SE, SE' = √(SE² + T²) (in µm and EL); the interval (µm) keeps its t
 * quantile. Unchanged when the outer half's fit is null.
 */
export function sideWithDepthTerm(fit: ExponentialFit, outer: ExponentialFit | null): ExponentialFit {
  if (outer === null || !Number.isFinite(outer.lambdaEl)) return fit;
  const termEl = Math.abs(fit.lambdaEl - outer.lambdaEl) / 2;
  const lambdaSeEl = Math.hypot(fit.lambdaSeEl, termEl);
  if (!Number.isFinite(fit.lambdaSeUm)) return { ...fit, lambdaSeEl, depthTermEl: termEl };
  const t = (fit.lambdaCiHighUm - fit.lambdaUm) / fit.lambdaSeUm;
  const lambdaSeUm = Math.hypot(fit.lambdaSeUm, Math.abs(fit.lambdaUm - outer.lambdaUm) / 2);
  return {
    ...fit, lambdaSeUm, lambdaSeEl, lambdaCiLowUm: fit.lambdaUm - t * lambdaSeUm, lambdaCiHighUm: fit.lambdaUm + t * lambdaSeUm, depthTermEl: termEl,
  };
}

/**
 * Fit each side over fitRangeEl (as the main profile) and the paired difference of their decay lengths. A side whose
 * fit fails gets null and a warning naming the side; the difference is then null.
 */
export function measureSides(sides: SideProfiles, axisPx: number, pixelSizeUm: number | null, fitRangeEl: readonly [number, number], warnings: string[]): SidesMeasurement {
  const fitSide = (name: 'dorsal' | 'ventral'): SideFit | null => {
    const own: string[] = [];
    const fit = fitProfileWeighted(sides[name], axisPx, pixelSizeUm, fitRangeEl, own);
    warnings.push(...own.map((w) => `${name} side: ${w}`));
    return fit;
  };
  const dorsal = fitSide('dorsal');
  const ventral = fitSide('ventral');
  // The outer half of the band's depth on each side (no warnings: it only sets the depth terms).
  const quiet: string[] = [];
  const outer = sides.outerHalf;
  const outerDorsal = dorsal && outer ? fitProfileWeighted(outer.dorsal, axisPx, pixelSizeUm, fitRangeEl, quiet) : null;
  const outerVentral = ventral && outer ? fitProfileWeighted(outer.ventral, axisPx, pixelSizeUm, fitRangeEl, quiet) : null;
  let difference = null;
  if (dorsal && ventral) {
    const eggLengthUm = pixelSizeUm !== null ? axisPx * pixelSizeUm : null;
    difference = decayLengthDifference(dorsal, ventral, eggLengthUm);
    if (difference === null) warnings.push('the dorsal − ventral difference of λ could not be computed (the sides share too few bins in the fit range)');
    else if (outer) difference = withDepthTerm(difference, outerDorsal && outerVentral ? decayLengthDifference(outerDorsal, outerVentral, eggLengthUm) : null);
  }
  const dorsalFit = dorsal ? (outer ? sideWithDepthTerm(dorsal.fit, outerDorsal?.fit ?? null) : dorsal.fit) : null;
  const ventralFit = ventral ? (outer ? sideWithDepthTerm(ventral.fit, outerVentral?.fit ?? null) : ventral.fit) : null;
  return { dorsalProfile: sides.dorsal, ventralProfile: sides.ventral, dorsalFit, ventralFit, difference };
}

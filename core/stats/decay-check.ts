// Whether a fitted A·exp(−x/λ)+B describes a gradient that decays along the axis. A fit can converge to a rising
// curve (λ < 0), an upside-down one (A < 0) or one so flat that its "decay length" is longer than the egg; its
// numbers are then not a decay length, and the researcher must look at the profile.
import type { ExponentialFit } from '../model';

/** Why `fit` is not a decaying gradient (empty when it is): λ ≤ 0, A ≤ 0, or λ longer than the egg (λ/EL > 1). */
export function notDecayingReasons(fit: Pick<ExponentialFit, 'lambdaEl' | 'lambdaUm' | 'amplitude'>): string[] {
  const reasons: string[] = [];
  const lambda = Number.isFinite(fit.lambdaUm) ? `${fit.lambdaUm.toFixed(1)} µm` : `${fit.lambdaEl.toFixed(3)} EL`;
  if (!(fit.lambdaEl > 0)) reasons.push(`λ = ${lambda} is not positive`);
  if (!(fit.amplitude > 0)) reasons.push(`amplitude A = ${fit.amplitude.toPrecision(3)} is not positive`);
  if (fit.lambdaEl > 1) reasons.push(`λ = ${fit.lambdaEl.toFixed(2)} EL is longer than the egg`);
  return reasons;
}

/** The warning an embryo's result carries when its gradient fit does not decay (null when it does). */
export function notDecayingWarning(channel: string, fit: Pick<ExponentialFit, 'lambdaEl' | 'lambdaUm' | 'amplitude'>): string | null {
  const reasons = notDecayingReasons(fit);
  if (reasons.length === 0) return null;
  return `the fit of ${channel} is not a decaying gradient (${reasons.join('; ')}): look at the profile; this λ is left out of cohort λ statistics`;
}

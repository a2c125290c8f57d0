// Validation of the sampling settings, first, with exact messages.
import type { AnalysisSettings } from '../settings';

/** Throw a one-line Error when a sampling setting is out of range. */
export function checkSamplingSettings(settings: AnalysisSettings): void {
  const p = settings.profile;
  if (!Number.isInteger(p.binCount) || p.binCount < 1) throw new Error(`profile.binCount must be an integer ≥ 1, got ${p.binCount}`);
  if (!(p.edgeDepthUm > 0) || !Number.isFinite(p.edgeDepthUm)) throw new Error(`profile.edgeDepthUm must be a positive number, got ${p.edgeDepthUm}`);
  if (!(p.axisWidthUm > 0) || !Number.isFinite(p.axisWidthUm)) throw new Error(`profile.axisWidthUm must be a positive number, got ${p.axisWidthUm}`);
  if (p.mode !== 'edge' && p.mode !== 'axis') throw new Error(`profile.mode must be "edge" or "axis", got "${String(p.mode)}"`);
  const m = settings.background.mode;
  if (m !== 'outside' && m !== 'region' && m !== 'none') throw new Error(`background.mode must be "outside", "region" or "none", got "${String(m)}"`);
}

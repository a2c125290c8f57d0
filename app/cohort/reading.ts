// A short plain-language reading of the dosage test, with the caveats a reader needs.
import type { CohortAnalysis, DosageFit, ShiftRow } from '../../core/cohort';

/** Number for prose: 3 significant digits, sign kept; "n/a" when not finite. */
export function prose(v: number | null | undefined, signed = false): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return 'n/a';
  const s = String(Number(v.toPrecision(3)));
  return signed && v > 0 ? `+${s}` : s;
}

function slopeSentence(fit: DosageFit, pct: number): string {
  const head = `Across ${fit.n} embryos, ${fit.quantity} moves by ${prose(fit.slopeEl)} x/EL per unit ln f (${pct}% CI ${prose(fit.ciLow)} to ${prose(fit.ciHigh)}; R² ${prose(fit.r2)}).`;
  if (fit.predictedSlopeEl === null) return `${head} No prediction: the reference has no fitted λ.`;
  const inside = fit.predictedSlopeEl >= fit.ciLow && fit.predictedSlopeEl <= fit.ciHigh;
  const verdict = inside
    ? 'which lies inside that interval: within this precision the shift is consistent with a fixed threshold on this gradient.'
    : fit.predictedSlopeEl > fit.ciHigh
      ? 'which is above that interval: the position moves less than a fixed threshold on this gradient alone predicts.'
      : 'which is below that interval: the position moves more than a fixed threshold on this gradient alone predicts.';
  let text = `${head} The threshold model with the reference λ predicts a slope of ${prose(fit.predictedSlopeEl)}, ${verdict}`;
  const relative = Math.abs(fit.slopeEl - fit.predictedSlopeEl) / Math.abs(fit.predictedSlopeEl);
  // A very precise fit can exclude the prediction by a biologically negligible margin; say how large it is.
  if (!inside && relative < 0.05) text += ` The difference is small, though (${prose(relative * 100)}% of the prediction).`;
  if (fit.predictedTwoGradientSlopeEl !== null) {
    const in2 = fit.predictedTwoGradientSlopeEl >= fit.ciLow && fit.predictedTwoGradientSlopeEl <= fit.ciHigh;
    text += ` The two-gradient reading predicts ${prose(fit.predictedTwoGradientSlopeEl)} (${in2 ? 'inside' : 'outside'} the interval).`;
  }
  return text;
}

function shiftSentence(s: ShiftRow): string {
  const dir = s.observedShiftEl > 0 ? 'posterior' : 'anterior';
  const expected = s.lnF === null || s.lnF === 0 ? '' : (s.lnF > 0) === (s.observedShiftEl > 0) ? ' (the direction the model expects)' : ' (opposite to the direction the model expects)';
  const ratio = s.ratio !== null ? `; observed/predicted ${prose(s.ratio)} (CI ${prose(s.ratioCiLow)} to ${prose(s.ratioCiHigh)})` : '';
  return `${s.condition} (f = ${prose(s.lnF !== null ? Math.exp(s.lnF) : null)}, n = ${s.nCondition} vs ${s.nReference} in the reference): moved ${prose(Math.abs(s.observedShiftEl))} x/EL ${dir}${expected}, CI ${prose(s.ciLow, true)} to ${prose(s.ciHigh, true)}; predicted ${prose(s.predictedShiftEl, true)}${ratio}.`;
}

/** Paragraphs (plain text) reading the dosage test per quantity, then the caveats. */
export function dosageReading(a: CohortAnalysis): { findings: { quantity: string; sentences: string[] }[]; caveats: string[] } {
  const pct = Math.round(a.options.level * 100);
  const quantities = [...new Set([...a.dosageFits.map((f) => f.quantity), ...a.shifts.map((s) => s.quantity)])];
  const findings = quantities.map((q) => {
    const fit = a.dosageFits.find((f) => f.quantity === q);
    return { quantity: q, sentences: [...(fit ? [slopeSentence(fit, pct)] : []), ...a.shifts.filter((s) => s.quantity === q).map(shiftSentence)] };
  });
  return { findings, caveats: caveatsFor(a, pct) };
}

function caveatsFor(a: CohortAnalysis, pct: number): string[] {
  const lam = a.referenceLambda;
  const small = a.conditions.filter((c) => (a.stats.find((s) => s.condition === c.name && s.quantity === 'lambda')?.n ?? 0) < 5).map((c) => c.name);
  const out = [
    'The threshold model assumes that the boundary reads one fixed concentration of this gradient, that a dosage change scales the amplitude only (λ unchanged), and that the profile is exponential where the boundary sits. Feedback, other inputs or saturation break these assumptions.',
    lam
      ? `λ is measured on the reference condition "${lam.condition}" (n = ${lam.n}, λ = ${prose(lam.lambdaEl)} x/EL, ${pct}% CI ${prose(lam.ciLowEl)} to ${prose(lam.ciHighEl)}) and its uncertainty is carried into the predicted shift. Check in the λ figure whether λ changes with dosage.`
      : 'No λ was measured on a reference condition, so no shift was predicted.',
    `Intervals are ${pct}% t intervals (Welch for differences between conditions). The interval of the observed/predicted ratio is a first-order approximation and is unreliable when the predicted shift is small compared with its uncertainty (f close to 1).`,
    'Positions are fractions of egg length; if egg length differs between conditions, compare the µm rows as well.',
    `Profile normalisation (${a.options.normalisation}) affects only the mean-profile and positional-error figures, not λ or positions.`,
  ];
  if (small.length > 0) out.push(`Small samples (fewer than 5 embryos with a fitted λ): ${small.join(', ')}. Treat their intervals with care.`);
  return out;
}

// A short plain-language reading of the dosage test, with the caveats a reader needs. Numbers are shown to the
// precision of their interval (see core/figures number formatting); the CSV files keep full precision.
import { quantityLabel, slopeRatio, type CohortAnalysis, type DosageFit, type ReferenceLambda, type ShiftRow } from '../../core/cohort';
import { plainNumber, sigFig, valueWithCi } from '../../core/figures';

/** Number for prose without an interval: 3 significant digits (trailing zeros kept), sign kept; "n/a" when not finite. */
export function prose(v: number | null | undefined, signed = false): string {
  return sigFig(v, 3, signed);
}

/** "value [lo, hi]" (or "value (CI lo to hi)" with style 'words') at the precision of the interval. */
export function withCi(v: number | null, lo: number | null, hi: number | null, signed = false): string {
  if (v === null || !Number.isFinite(v)) return 'n/a';
  const r = valueWithCi(v, lo, hi, { signed });
  return r.ci === 'n/a' ? r.value : `${r.value} ${r.ci}`;
}

/** How λ_eff compares with λ_ref once both uncertainties are counted (the ratio's interval vs 1). */
export function slopeVerdict(fit: DosageFit, lambda: ReferenceLambda | null, level: number): { ratio: string; verdict: string } {
  const r = slopeRatio(fit, lambda, level);
  if (r.ratio === null || r.ratioCiLow === null || r.ratioCiHigh === null) return { ratio: 'n/a', verdict: 'no prediction (no λ on the reference)' };
  const verdict = r.ratioCiLow > 1 ? 'moves more than the threshold model predicts'
    : r.ratioCiHigh < 1 ? 'moves less than the threshold model predicts'
      : 'consistent with the threshold model';
  return { ratio: withCi(r.ratio, r.ratioCiLow, r.ratioCiHigh), verdict };
}

function slopeSentence(fit: DosageFit, a: CohortAnalysis, pct: number): string {
  const slope = valueWithCi(fit.slopeEl, fit.ciLow, fit.ciHigh, { style: 'words' });
  const head = `Across ${fit.n} embryos, the ${quantityLabel(fit.quantity)} moves by ${slope.value} x/EL per unit ln f (${pct}% CI ${slope.ci}; R² ${r2Text(fit.r2)}).`;
  if (fit.predictedSlopeEl === null) return `${head} No prediction: the reference has no fitted λ.`;
  const inside = fit.predictedSlopeEl >= fit.ciLow && fit.predictedSlopeEl <= fit.ciHigh;
  const verdict = inside
    ? 'which lies inside that interval: within this precision the shift is consistent with a fixed threshold on this gradient.'
    : fit.predictedSlopeEl > fit.ciHigh
      ? 'which is above that interval: the position moves less than a fixed threshold on this gradient alone predicts.'
      : 'which is below that interval: the position moves more than a fixed threshold on this gradient alone predicts.';
  const lam = a.referenceLambda;
  const predicted = lam ? withCi(lam.lambdaEl, lam.ciLowEl, lam.ciHighEl) : prose(fit.predictedSlopeEl);
  let text = `${head} The threshold model with the reference λ predicts a slope of ${predicted}, ${verdict}`;
  const relative = Math.abs(fit.slopeEl - fit.predictedSlopeEl) / Math.abs(fit.predictedSlopeEl);
  // A very precise fit can exclude the prediction by a biologically negligible margin; say how large it is.
  if (!inside && relative < 0.05) text += ` The difference is small, though (${sigFig(relative * 100, 2)}% of the prediction).`;
  const r = slopeVerdict(fit, lam, a.options.level);
  if (r.ratio !== 'n/a') {
    const includes = r.verdict === 'consistent with the threshold model';
    text += ` Counting the uncertainty of λ_ref as well, λ_eff/λ_ref = ${r.ratio}, an interval that ${includes ? 'includes' : 'excludes'} 1.`;
  }
  if (fit.predictedTwoGradientSlopeEl !== null) {
    const in2 = fit.predictedTwoGradientSlopeEl >= fit.ciLow && fit.predictedTwoGradientSlopeEl <= fit.ciHigh;
    text += ` The two-gradient reading predicts ${sigFig(fit.predictedTwoGradientSlopeEl, 4)} (${in2 ? 'inside' : 'outside'} the interval).`;
  }
  return text;
}

/** R² with 3 significant digits, or "> 0.999" when it would round to 1.00. */
export function r2Text(r2: number): string {
  return Number.isFinite(r2) && r2 > 0.9995 && r2 < 1 ? '> 0.999' : sigFig(r2, 3);
}

function shiftSentence(s: ShiftRow): string {
  const dir = s.observedShiftEl > 0 ? 'posterior' : 'anterior';
  const expected = s.lnF === null || s.lnF === 0 ? '' : (s.lnF > 0) === (s.observedShiftEl > 0) ? ' (the direction the model expects)' : ' (opposite to the direction the model expects)';
  const obs = valueWithCi(s.observedShiftEl, s.ciLow, s.ciHigh, { signed: true, style: 'words' });
  const moved = valueWithCi(Math.abs(s.observedShiftEl), s.ciLow, s.ciHigh).value;
  const pred = s.predictedShiftEl === null ? 'n/a' : (({ value, ci }) => ci === 'n/a' ? value : `${value} (CI ${ci})`)(valueWithCi(s.predictedShiftEl, s.predictedCiLow, s.predictedCiHigh, { signed: true, style: 'words' }));
  const ratio = s.ratio !== null ? (({ value, ci }) => `; observed/predicted ${value} (CI ${ci})`)(valueWithCi(s.ratio, s.ratioCiLow, s.ratioCiHigh, { style: 'words' })) : '';
  return `${s.condition} (f = ${plainNumber(s.lnF !== null ? Math.exp(s.lnF) : null)}, n = ${s.nCondition} vs ${s.nReference} in the reference): moved ${moved} x/EL ${dir}${expected}, CI ${obs.ci}; predicted ${pred}${ratio}.`;
}

/** Paragraphs (plain text) reading the dosage test per quantity (key and readable label), then the caveats. */
export function dosageReading(a: CohortAnalysis): { findings: { quantity: string; label: string; sentences: string[] }[]; caveats: string[] } {
  const pct = Math.round(a.options.level * 100);
  const quantities = [...new Set([...a.dosageFits.map((f) => f.quantity), ...a.shifts.map((s) => s.quantity)])];
  const findings = quantities.map((q) => {
    const fit = a.dosageFits.find((f) => f.quantity === q);
    return { quantity: q, label: quantityLabel(q), sentences: [...(fit ? [slopeSentence(fit, a, pct)] : []), ...a.shifts.filter((s) => s.quantity === q).map(shiftSentence)] };
  });
  return { findings, caveats: caveatsFor(a, pct) };
}

function caveatsFor(a: CohortAnalysis, pct: number): string[] {
  const lam = a.referenceLambda;
  const small = a.conditions.filter((c) => (a.stats.find((s) => s.condition === c.name && s.quantity === 'lambda')?.n ?? 0) < 5).map((c) => c.name);
  const out = [
    'The threshold model assumes that the boundary reads one fixed concentration of this gradient, that a dosage change scales the amplitude only (λ unchanged), and that the profile is exponential where the boundary sits. Feedback, other inputs or saturation break these assumptions.',
    lam
      ? `λ is measured on the reference condition "${lam.condition}" (n = ${lam.n}, λ = ${valueWithCi(lam.lambdaEl, lam.ciLowEl, lam.ciHighEl).value} x/EL, ${pct}% CI ${valueWithCi(lam.lambdaEl, lam.ciLowEl, lam.ciHighEl, { style: 'words' }).ci}) and its uncertainty is carried into the predicted shift. Check in the λ figure whether λ changes with dosage.`
      : 'No λ was measured on a reference condition, so no shift was predicted.',
    `Intervals are ${pct}% t intervals (Welch for differences between conditions). The intervals of the ratios observed/predicted and λ_eff/λ_ref are first-order (delta-method) approximations; the former is unreliable when the predicted shift is small compared with its uncertainty (f close to 1).`,
    'Positions are fractions of egg length; if egg length differs between conditions, compare the µm rows as well.',
    `Profile normalisation (${a.options.normalisation}) affects only the mean-profile and positional-error figures, not λ or positions.`,
  ];
  if (small.length > 0) out.push(`Small samples (fewer than 5 embryos with a fitted λ): ${small.join(', ')}. Treat their intervals with care.`);
  return out;
}

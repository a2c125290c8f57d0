// A short plain-language reading of the dosage test, with the caveats a reader needs. It leads with the ratio of the
// observed to the predicted slope and its interval (both uncertainties counted); a ratio of 1 is "rejected" or "not
// rejected", never "confirmed" — equivalence is claimed only against a margin the user chose. Caveats are listed
// only when they apply. Numbers are shown to the precision of their interval; the CSV files keep full precision.
import {
  lambdaPositionCorrelation, LAMBDA_RELATIVE_SE_LIMIT, quantityLabel, slopeRatio,
  type AdjustedDosageFit, type CohortAnalysis, type DosageFit, type ReferenceLambda, type ShiftRow,
} from '../../core/cohort';
import { plainNumber, sigFig, valueWithCi } from '../../core/figures';
import { tQuantile } from '../../core/stats';

/** Number for prose without an interval: 3 significant digits (trailing zeros kept), sign kept; "n/a" when not finite. */
export function prose(v: number | null | undefined, signed = false): string {
  return sigFig(v, 3, signed);
}

/** "value [lo, hi]" at the precision of the interval. */
export function withCi(v: number | null, lo: number | null, hi: number | null, signed = false): string {
  if (v === null || !Number.isFinite(v)) return 'n/a';
  const r = valueWithCi(v, lo, hi, { signed });
  return r.ci === 'n/a' ? r.value : `${r.value} ${r.ci}`;
}

/** p-value for prose: 2 significant digits, "< 0.0001" below that. */
export function pText(p: number | null | undefined): string {
  if (p === null || p === undefined || !Number.isFinite(p)) return 'n/a';
  return p < 1e-4 ? '< 0.0001' : sigFig(p, 2);
}

/** The ratio λ_eff/λ_ref with its interval and what the test of ratio = 1 says (no verdict from a point estimate). */
export function slopeVerdict(fit: DosageFit, lambda: ReferenceLambda | null, level: number): { ratio: string; verdict: string } {
  const r = slopeRatio(fit, lambda, level);
  if (r.ratio === null || r.ratioCiLow === null || r.ratioCiHigh === null) return { ratio: 'n/a', verdict: 'no prediction (no λ on the reference)' };
  const verdict = r.ratioCiLow > 1 ? 'ratio 1 rejected: moves more than predicted'
    : r.ratioCiHigh < 1 ? 'ratio 1 rejected: moves less than predicted'
      : 'ratio 1 not rejected';
  return { ratio: withCi(r.ratio, r.ratioCiLow, r.ratioCiHigh), verdict };
}

/** Two one-sided tests at α = 1 − level: the (1 − 2α) interval of the ratio inside [1 − m, 1 + m]. */
function equivalenceSentence(fit: DosageFit, a: CohortAnalysis): string {
  const m = a.options.equivalenceMargin;
  if (m === null) return ' Not rejecting 1 does not show agreement; give an equivalence margin to test that.';
  const inner = 1 - 2 * (1 - a.options.level);
  const r = slopeRatio(fit, a.referenceLambda, inner);
  if (r.ratioCiLow === null || r.ratioCiHigh === null) return '';
  const inside = r.ratioCiLow >= 1 - m && r.ratioCiHigh <= 1 + m;
  return ` Equivalence margin ±${plainNumber(m)}: the ${Math.round(inner * 100)}% interval ${withCi(r.ratio, r.ratioCiLow, r.ratioCiHigh)} `
    + (inside ? `lies inside [${plainNumber(1 - m)}, ${plainNumber(1 + m)}], so the shift equals the prediction within that margin (two one-sided tests).`
      : `does not lie inside [${plainNumber(1 - m)}, ${plainNumber(1 + m)}], so equivalence within that margin is not shown.`);
}

/** The lead sentence: the ratio and its interval, then the test of ratio = 1. */
function ratioSentence(fit: DosageFit, a: CohortAnalysis, pct: number): string {
  const label = quantityLabel(fit.quantity);
  const r = slopeRatio(fit, a.referenceLambda, a.options.level);
  if (r.ratio === null || r.ratioCiLow === null || r.ratioCiHigh === null) return `The ${label} has no predicted shift: the reference has no fitted λ.`;
  const head = `The ${label} moves λ_eff/λ_ref = ${withCi(r.ratio, r.ratioCiLow, r.ratioCiHigh)} times the shift a fixed threshold on this gradient predicts (${pct}% CI by the delta method, the uncertainties of the slope and of the reference λ both counted; ${fiellerText(r)}).`;
  const alpha = plainNumber(1 - a.options.level);
  if (r.ratioCiLow <= 1 && r.ratioCiHigh >= 1) return `${head} A ratio of 1 is not rejected at the ${alpha} level.${equivalenceSentence(fit, a)}`;
  const way = r.ratioCiHigh < 1 ? 'less' : 'more';
  let text = `${head} A ratio of 1 is rejected at the ${alpha} level: the position moves ${way} than a fixed threshold on this gradient alone predicts.`;
  // A very precise fit can exclude 1 by a biologically negligible margin; say how large the difference is.
  if (Math.abs(r.ratio - 1) < 0.05) text += ` The difference is small, though (${sigFig(Math.abs(r.ratio - 1) * 100, 2)}% of the prediction).`;
  return text;
}

/** The slope itself, how it was fitted, and the alternatives worth a glance. */
function slopeSentence(fit: DosageFit, pct: number): string {
  const slope = valueWithCi(fit.slopeEl, fit.ciLow, fit.ciHigh, { style: 'words' });
  const how = fit.method === 'condition-means'
    ? `fitted to the ${fit.conditions} condition means (${fit.n} embryos; t on ${fit.dof} degree${fit.dof === 1 ? "" : "s"} of freedom; R² ${r2Text(fit.r2)})`
    : `fitted to all ${fit.n} embryos with heteroscedasticity-consistent (HC3) errors, since ${fit.conditions} dosages leave no degrees of freedom for the condition means`;
  let text = `Slope of position on ln f: ${slope.value} x/EL per unit ln f (${pct}% CI ${slope.ci}), ${how}.`;
  if (fit.method === 'condition-means' && fit.embryosHc3) {
    const e = fit.embryosHc3;
    text += ` Treating every embryo as a replicate of its dose (HC3 errors) would give ${valueWithCi(e.slope, e.ciLow, e.ciHigh, { style: 'words' }).ci}.`;
  }
  if (fit.lackOfFit) {
    const l = fit.lackOfFit;
    text += ` Linearity in ln f: lack-of-fit F(${l.df1}, ${l.df2}) = ${sigFig(l.f, 3)}, p = ${pText(l.p)}; `
      + (l.p < 0.05 ? 'rejected — the condition means are not on one straight line in ln f, so one slope summarises the series poorly.' : 'not rejected.');
  }
  if (fit.measured) {
    const m = fit.measured;
    text += ` Against the measured dosage (ln of the amplitude ratio to the reference, York fit with errors in both): ${valueWithCi(m.slope, m.ciLow, m.ciHigh).value} (${pct}% CI ${valueWithCi(m.slope, m.ciLow, m.ciHigh, { style: 'words' }).ci}).`;
  }
  if (fit.adjusted) text += ` ${adjustedSentence(fit.adjusted, fit, pct)}`;
  if (fit.predictedTwoGradientSlopeEl !== null) text += ` The two-gradient reading predicts a slope of ${sigFig(fit.predictedTwoGradientSlopeEl, 3)}.`;
  if (fit.localLambdaEl !== null) {
    const se = fit.localLambdaSeEl !== null ? ` ± ${sigFig(fit.localLambdaSeEl, 2)} (jackknife SE over the reference embryos)` : ' (no SE: fewer than 3 reference embryos)';
    text += ` Where it sits in the reference, the mean profile's local decay length (C̄ − B)/|dC̄/dx| is ${sigFig(fit.localLambdaEl, 3)}${se} x/EL`
      + (fit.predictedSlopeEl !== null ? ` against the fitted ${sigFig(fit.predictedSlopeEl, 3)}; a fixed threshold there would move with that local value.` : '.');
  }
  return text;
}

/** One plain sentence on the covariate-adjusted slope beside the unadjusted one, with each coefficient. */
export function adjustedSentence(adj: AdjustedDosageFit, fit: DosageFit, pct: number): string {
  const s = valueWithCi(adj.slope, adj.ciLow, adj.ciHigh, { style: 'words' });
  const terms = adj.terms.map((t) => {
    const c = valueWithCi(t.coefficientEl, t.ciLow, t.ciHigh, { signed: true, style: 'words' });
    return t.level === null ? `${t.covariate} ${c.value} x/EL per unit of ${t.covariate} (CI ${c.ci})` : `${t.covariate} ${t.level} vs ${t.baseLevel} ${c.value} x/EL (CI ${c.ci})`;
  });
  return `Adjusted for ${adj.covariates.join(' and ')} (coefficients estimated within conditions, ${adj.n} embryos; each position moved to the covariates' mean before the condition means were fitted), the slope is ${s.value} (${pct}% CI ${s.ci}, the coefficients' own uncertainty included) against ${valueWithCi(fit.slopeEl, fit.ciLow, fit.ciHigh).value} unadjusted; ${terms.join('; ')}.`;
}

/** R² with 3 significant digits, or "> 0.999" when it would round to 1.00. */
export function r2Text(r2: number): string {
  return Number.isFinite(r2) && r2 > 0.9995 && r2 < 1 ? '> 0.999' : sigFig(r2, 3);
}

/** "Fieller's CI 0.79 to 1.00, g = 0.003" (or unbounded when g ≥ 1): the ratio's interval without assuming it normal. */
export function fiellerText(r: { ratioFiellerLow: number | null; ratioFiellerHigh: number | null; fiellerG: number | null }): string {
  if (r.fiellerG === null) return "Fieller's CI n/a";
  const g = `g = ${sigFig(r.fiellerG, 2)}`;
  if (r.ratioFiellerLow === null || r.ratioFiellerHigh === null) return `Fieller's CI unbounded, ${g} ≥ 1: the prediction is not distinguishable from 0`;
  return `Fieller's CI ${valueWithCi(r.ratioFiellerLow, r.ratioFiellerLow, r.ratioFiellerHigh, { style: 'words' }).ci}, ${g}`;
}

function shiftSentence(s: ShiftRow): string {
  const dir = s.observedShiftEl > 0 ? 'posterior' : 'anterior';
  const expected = s.lnF === null || s.lnF === 0 ? '' : (s.lnF > 0) === (s.observedShiftEl > 0) ? ' (the direction the model expects)' : ' (opposite to the direction the model expects)';
  const obs = valueWithCi(s.observedShiftEl, s.ciLow, s.ciHigh, { signed: true, style: 'words' });
  const moved = valueWithCi(Math.abs(s.observedShiftEl), s.ciLow, s.ciHigh).value;
  const pred = s.predictedShiftEl === null ? 'n/a' : (({ value, ci }) => ci === 'n/a' ? value : `${value} (CI ${ci})`)(valueWithCi(s.predictedShiftEl, s.predictedCiLow, s.predictedCiHigh, { signed: true, style: 'words' }));
  const ratio = s.ratio !== null
    ? (({ value, ci }) => `; observed/predicted ${value} (CI ${ci}; ${fiellerText(s)}), p(ratio = 1) = ${pText(s.pRatio)}, Holm-adjusted ${pText(s.pRatioHolm)}`)(valueWithCi(s.ratio, s.ratioCiLow, s.ratioCiHigh, { style: 'words' }))
    : '';
  return `${s.condition} (f = ${plainNumber(s.lnF !== null ? Math.exp(s.lnF) : null)}, n = ${s.nCondition} vs ${s.nReference} in the reference): moved ${moved} x/EL ${dir}${expected}, CI ${obs.ci}; predicted ${pred}${ratio}.`;
}

/** Paragraphs (plain text) reading the dosage test per quantity (key and readable label), then the caveats. */
export function dosageReading(a: CohortAnalysis): { findings: { quantity: string; label: string; sentences: string[] }[]; caveats: string[] } {
  const pct = Math.round(a.options.level * 100);
  const quantities = [...new Set([...a.dosageFits.map((f) => f.quantity), ...a.shifts.map((s) => s.quantity)])];
  const findings = quantities.map((q) => {
    const fit = a.dosageFits.find((f) => f.quantity === q);
    const lead = fit ? [ratioSentence(fit, a, pct), slopeSentence(fit, pct)] : [];
    return { quantity: q, label: quantityLabel(q), sentences: [...lead, ...a.shifts.filter((s) => s.quantity === q).map(shiftSentence)] };
  });
  return { findings, caveats: caveatsFor(a, pct) };
}

function caveatsFor(a: CohortAnalysis, pct: number): string[] {
  const lam = a.referenceLambda;
  const out = [
    'The threshold model assumes that the boundary reads one fixed concentration of this gradient, that a dosage change scales the amplitude only (λ unchanged), and that the profile is exponential where the boundary sits. Feedback, other inputs or saturation break these assumptions.',
    lam
      ? `λ is measured on the reference condition "${lam.condition}" (n = ${lam.n}, λ = ${valueWithCi(lam.lambdaEl, lam.ciLowEl, lam.ciHighEl).value} x/EL, ${pct}% CI ${valueWithCi(lam.lambdaEl, lam.ciLowEl, lam.ciHighEl, { style: 'words' }).ci}) and its uncertainty is carried into the predicted shift.`
      : 'No λ was measured on a reference condition, so no shift was predicted.',
    ...optionalCaveats(a),
    'Positions are fractions of egg length; if egg length differs between conditions, compare the µm rows as well.',
  ];
  const small = a.conditions.filter((c) => (a.stats.find((s) => s.condition === c.name && s.quantity === 'lambda')?.n ?? 0) < 5).map((c) => c.name);
  if (small.length > 0) out.push(`Small samples (fewer than 5 embryos with a fitted λ): ${small.join(', ')}. Treat their intervals with care.`);
  return out;
}

/** Caveats that apply only to some cohorts, each checked on the numbers. */
function optionalCaveats(a: CohortAnalysis): string[] {
  return [lambdaTrendCaveat(a), replicateCaveat(a), holmCaveat(a), fiellerCaveat(a), measuredCaveat(a), stageCaveat(a),
    ...fitRangeCaveats(a), ...correlationCaveats(a), ...reliabilityCaveats(a)].filter((c): c is string => c !== null);
}

function lambdaTrendCaveat(a: CohortAnalysis): string | null {
  const t = a.lambdaTrend;
  if (!t) return null;
  const s = valueWithCi(t.slope, t.ciLow, t.ciHigh, { signed: true, style: 'words' });
  return `λ against ln f over the condition means: ${s.value} x/EL per unit ln f (CI ${s.ci}, p = ${pText(t.pSlope)}). `
    + (t.pSlope < 0.05 ? 'λ changes with dosage, which the threshold model excludes; the prediction from the reference λ is then questionable.' : 'A change of λ with dosage is not rejected as zero; with few conditions this test has little power.');
}

function replicateCaveat(a: CohortAnalysis): string | null {
  const fit = a.dosageFits[0];
  if (!fit) return null;
  return fit.method === 'condition-means'
    ? 'Embryos of one condition share genotype, staining, imaging session and stage, so they are not independent replicates of the dose: the slopes use the condition means, whose scatter about the line also carries any shared offset of a condition.'
    : 'With only two dosages the slope treats the embryos of each condition as independent replicates of the dose; shared staining, session or stage effects are not in its interval. More dosages, or more independent clutches per dosage, are needed for a condition-level interval.';
}

function holmCaveat(a: CohortAnalysis): string | null {
  const tests = a.shifts.filter((s) => s.pRatio !== null).length;
  if (tests < 2) return null;
  return `The p-values of observed/predicted = 1 are Holm-adjusted over the ${tests} tests of this report (every non-reference condition × boundary or landmark; the logistic and half-max positions of one boundary count as separate tests). The intervals are not adjusted.`;
}

/** Fieller's g = t²·CV²(λ̄): the ratio's delta-method interval needs g small (about < 0.05); g ≥ 1 makes it unbounded. */
export function fiellerG(lambda: ReferenceLambda, level: number): number {
  if (!(lambda.dof > 0) || !(lambda.lambdaEl !== 0)) return NaN;
  const t = tQuantile(0.5 + level / 2, lambda.dof);
  return (t * lambda.seEl / lambda.lambdaEl) ** 2;
}

function fiellerCaveat(a: CohortAnalysis): string | null {
  const lam = a.referenceLambda;
  if (!lam || a.shifts.every((s) => s.ratio === null)) return null;
  const g = fiellerG(lam, a.options.level);
  if (!(g > 0.05)) return null;
  return `The reference λ is imprecise relative to its size (Fieller's g = t²·CV²(λ) = ${sigFig(g, 2)}; it does not depend on f): the ratio intervals are first-order approximations and too symmetric, `
    + (g >= 1 ? 'and an exact (Fieller) interval would be unbounded.' : 'and an exact (Fieller) interval would be wider on the high side.');
}

function measuredCaveat(a: CohortAnalysis): string | null {
  const others = a.measuredDosages.filter((m) => m.condition !== a.reference && m.nominalFactor !== null);
  if (others.length === 0) return null;
  return `Dosage is nominal; the protein ratio may differ. The measured amplitude ratios to the reference are ${others.map((m) => sigFig(m.amplitudeRatio, 3)).join(' / ')} for nominal ${others.map((m) => plainNumber(m.nominalFactor)).join(' / ')} (same imaging settings assumed); the measured-dosage rows of dosage_fit.csv use them.`;
}

function stageCaveat(a: CohortAnalysis): string | null {
  if (a.sheetColumns.some((c) => c.trim().toLowerCase() === 'stage')) return null;
  return 'The sample sheet has no stage column: boundaries and gradients change during development, so the conditions must be stage-matched for their positions to be comparable.';
}

function fitRangeCaveats(a: CohortAnalysis): string[] {
  const out: string[] = [];
  const main = a.fitRanges[0];
  if (a.fitRanges.length > 1) {
    out.push(`λ was fitted over different x/EL ranges: ${a.fitRanges.map((r) => `${plainNumber(r.startEl)}–${plainNumber(r.endEl)} in ${r.embryos} embryo${r.embryos === 1 ? '' : 's'}`).join(', ')}; where the profile is not exactly exponential, λ depends on the range.`);
  }
  if (!main || a.reference === null) return out;
  for (const s of a.stats.filter((x) => x.condition === a.reference && (x.kind === 'boundary' || x.kind === 'landmark') && x.unit === 'EL')) {
    if (s.mean < main.startEl || s.mean > main.endEl) {
      out.push(`The ${quantityLabel(s.quantity)} sits at ${sigFig(s.mean, 3)} x/EL in the reference, outside the λ fit range ${plainNumber(main.startEl)}–${plainNumber(main.endEl)}: its prediction assumes the exponential continues there.`);
    }
  }
  return out;
}

function correlationCaveats(a: CohortAnalysis): string[] {
  if (a.reference === null || !a.referenceLambda) return [];
  const reference = a.reference;
  const listed = a.dosageFits.flatMap((f) => {
    const r = lambdaPositionCorrelation(a.observations, reference, f.quantity);
    return Math.abs(r) >= 0.3 ? [`the ${quantityLabel(f.quantity)} (r = ${sigFig(r, 2)})`] : [];
  });
  if (listed.length === 0) return [];
  return [`Across the reference embryos λ is correlated with ${listed.join(', ')}; the prediction and the reference positions come from the same embryos, and the ratio intervals treat them as independent.`];
}

function reliabilityCaveats(a: CohortAnalysis): string[] {
  const out: string[] = [];
  const imprecise = a.reliability.filter((r) => r.lambdaImprecise > 0);
  if (imprecise.length > 0) {
    out.push(`Imprecise λ fits (SE above ${LAMBDA_RELATIVE_SE_LIMIT * 100}% of λ): ${imprecise.map((r) => `${r.lambdaImprecise} of ${r.lambdaFitted} in ${r.condition}`).join(', ')}. They enter the means unweighted; check them in the per-embryo table.`);
  }
  const missed: string[] = [];
  for (const r of a.reliability) {
    for (const [q, n] of Object.entries(r.detected)) if (n < r.embryos) missed.push(`${quantityLabel(q)} in ${n} of ${r.embryos} embryos of ${r.condition}`);
  }
  if (missed.length > 0) out.push(`Not every position was found: ${missed.join('; ')}. A boundary missed more often in one condition can bias that condition's mean.`);
  const skewed = a.reliability.filter((r) => r.lambdaFitted >= 3 && Math.abs(r.lambdaMedianEl - r.lambdaMeanEl) > 0.05 * Math.abs(r.lambdaMeanEl));
  if (skewed.length > 0) {
    out.push(`The median λ differs from the mean by more than 5% in ${skewed.map((r) => `${r.condition} (median ${sigFig(r.lambdaMedianEl, 3)}, mean ${sigFig(r.lambdaMeanEl, 3)} x/EL)`).join(', ')}: a few embryos pull the mean.`);
  }
  return out;
}

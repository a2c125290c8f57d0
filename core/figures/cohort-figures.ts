// All figures of a cohort analysis, built from its results; the report and the desktop app call this same function.
import type { CohortAnalysis, Normalisation } from '../cohort';
import { cohortProfilesFigure } from './cohort-profiles-figure';
import { lambdaByConditionFigure } from './lambda-figure';
import { positionalErrorFigure } from './positional-error-figure';
import { shiftVsLnFFigure, type FigureLine } from './shift-figure';

/** One named figure: `name` is a file-name-safe slug, `svg` the standalone SVG text. */
export interface NamedFigure {
  readonly name: string;
  readonly title: string;
  readonly svg: string;
}

const Y_LABELS: Record<Normalisation, string> = {
  none: 'intensity (a.u., background subtracted)',
  amplitude: 'intensity ÷ fitted amplitude A',
  minmax: 'intensity, min–max scaled to [0, 1]',
};

/** File-name-safe slug of a quantity name. */
export function figureSlug(text: string): string {
  return text.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'figure';
}

/** Cohort figures: mean profiles, λ by condition, one position-vs-ln f figure per boundary/landmark, σx. */
export function cohortFigures(a: CohortAnalysis, size: { widthPx?: number; heightPx?: number } = {}): NamedFigure[] {
  const out: NamedFigure[] = [];
  const named = (name: string, title: string, svg: string): void => { out.push({ name, title, svg }); };
  const profTitle = 'Mean gradient profile by condition';
  const profSub = `line: mean across embryos; band: ± SD across embryos; normalisation: ${a.options.normalisation}`;
  named('cohort-profiles', profTitle, cohortProfilesFigure(a.profiles.map((p) => ({ label: `${p.condition} (n=${p.embryoCount})`, xEl: p.xEl, mean: p.mean, sd: p.sd })),
    { ...size, title: profTitle, subtitle: profSub, yLabel: Y_LABELS[a.options.normalisation] }));
  const lamTitle = 'Decay length λ by condition';
  named('lambda-by-condition', lamTitle, lambdaByConditionFigure(a.conditions.map((c) => {
    const s = a.stats.find((t) => t.condition === c.name && t.quantity === 'lambda' && t.unit === 'EL');
    const values = a.observations.filter((o) => o.condition === c.name && o.kind === 'lambda' && o.unit === 'EL').map((o) => o.value);
    return { label: c.name, values, mean: s?.mean ?? NaN, ciLow: s?.ciLow ?? NaN, ciHigh: s?.ciHigh ?? NaN };
  }), { ...size, title: lamTitle, unit: 'EL', level: a.options.level }));
  for (const fit of a.dosageFits) named(`shift-${figureSlug(fit.quantity)}`, `${fit.quantity}: position vs ln f`, shiftFigureFor(a, fit.quantity, size));
  const sigTitle = 'Positional error implied by the gradient';
  named('positional-error', sigTitle, positionalErrorFigure(a.profiles.map((p) => ({ label: p.condition, xEl: p.xEl, sigma: p.sigmaXEl })), { ...size, title: sigTitle }));
  return out;
}

function shiftFigureFor(a: CohortAnalysis, quantity: string, size: { widthPx?: number; heightPx?: number }): string {
  const fit = a.dosageFits.find((f) => f.quantity === quantity);
  const ref = a.stats.find((s) => s.condition === a.reference && s.quantity === quantity && s.unit === 'EL');
  const predicted: FigureLine[] = [];
  if (fit?.predictedSlopeEl != null && ref) predicted.push({ label: `predicted: slope λ_ref = ${fit.predictedSlopeEl.toFixed(3)}`, slope: fit.predictedSlopeEl, intercept: ref.mean });
  if (fit?.predictedTwoGradientSlopeEl != null && ref) predicted.push({ label: `two gradients: slope ${fit.predictedTwoGradientSlopeEl.toFixed(3)}`, slope: fit.predictedTwoGradientSlopeEl, intercept: ref.mean });
  const groups = a.conditions.filter((c) => c.factor !== null).flatMap((c) => {
    const s = a.stats.find((t) => t.condition === c.name && t.quantity === quantity && t.unit === 'EL');
    return s ? [{ label: `f=${Number((c.factor as number).toPrecision(3))}`, lnF: Math.log(c.factor as number), mean: s.mean, ciLow: s.ciLow, ciHigh: s.ciHigh }] : [];
  });
  return shiftVsLnFFigure({
    quantity,
    points: a.observations.filter((o) => o.quantity === quantity && o.unit === 'EL' && o.lnF !== null).map((o) => ({ lnF: o.lnF as number, value: o.value })),
    groups,
    fitted: fit ? { label: `fitted: slope ${fit.slopeEl.toFixed(3)} [${fit.ciLow.toFixed(3)}, ${fit.ciHigh.toFixed(3)}]`, slope: fit.slopeEl, intercept: fit.interceptEl } : null,
    predicted,
  }, { ...size, title: `${quantity}: position vs ln f` });
}

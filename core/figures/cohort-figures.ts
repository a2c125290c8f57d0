// All figures of a cohort analysis, built from its results; the report and the desktop app call this same function.
import { quantityLabel, type CohortAnalysis, type Normalisation } from '../cohort';
import { cohortProfilesFigure } from './cohort-profiles-figure';
import { lambdaByConditionFigure, type StripGroup } from './lambda-figure';
import { sigFig, valueWithCi } from './number-format';
import { positionalErrorFigure } from './positional-error-figure';
import { shiftVsLnFFigure, type FigureLine, type ShiftGroup } from './shift-figure';

/** One named figure: `name` is a file-name-safe slug, `title` a caption, `svg` the standalone SVG text. */
export interface NamedFigure {
  readonly name: string;
  readonly title: string;
  readonly svg: string;
}

type Size = { widthPx?: number; heightPx?: number };

const Y_LABELS: Record<Normalisation, string> = {
  none: 'intensity (a.u., background subtracted)',
  amplitude: 'intensity ÷ fitted amplitude A',
  minmax: 'intensity, min–max scaled to [0, 1]',
  'scale-offset': 'intensity, each embryo scaled and offset onto the mean',
};

/** File-name-safe slug of a quantity name. */
export function figureSlug(text: string): string {
  return text.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'figure';
}

function profilesFigure(a: CohortAnalysis, size: Size): NamedFigure {
  const title = 'Mean gradient profile by condition';
  const subtitle = `line: mean across embryos; band: ± SD across embryos; normalisation: ${a.options.normalisation}`;
  const series = a.profiles.map((p) => ({ label: `${p.condition} (n=${p.embryoCount})`, xEl: p.xEl, mean: p.mean, sd: p.sd }));
  return { name: 'cohort-profiles', title, svg: cohortProfilesFigure(series, { ...size, title, subtitle, yLabel: Y_LABELS[a.options.normalisation] }) };
}

function lambdaFigure(a: CohortAnalysis, size: Size): NamedFigure {
  const title = 'Decay length λ by condition';
  const groups: StripGroup[] = a.conditions.map((c) => {
    const s = a.stats.find((t) => t.condition === c.name && t.quantity === 'lambda' && t.unit === 'EL');
    const values = a.observations.filter((o) => o.condition === c.name && o.kind === 'lambda' && o.unit === 'EL').map((o) => o.value);
    return { label: c.name, values, mean: s?.mean ?? NaN, ciLow: s?.ciLow ?? NaN, ciHigh: s?.ciHigh ?? NaN };
  });
  return { name: 'lambda-by-condition', title, svg: lambdaByConditionFigure(groups, { ...size, title, unit: 'EL', level: a.options.level }) };
}

/** Predicted lines pass through the reference mean at ln f = 0 with slope λ_ref (and the two-gradient slope). */
function predictedLines(a: CohortAnalysis, quantity: string): FigureLine[] {
  const fit = a.dosageFits.find((f) => f.quantity === quantity);
  const ref = a.stats.find((s) => s.condition === a.reference && s.quantity === quantity && s.unit === 'EL');
  if (!fit || !ref) return [];
  const lines: FigureLine[] = [];
  if (fit.predictedSlopeEl !== null) {
    const lam = a.referenceLambda;
    const text = lam ? (({ value, ci }) => `${value} ${ci}`)(valueWithCi(lam.lambdaEl, lam.ciLowEl, lam.ciHighEl)) : sigFig(fit.predictedSlopeEl, 4);
    lines.push({ label: `predicted: slope λ_ref = ${text}`, slope: fit.predictedSlopeEl, intercept: ref.mean });
  }
  if (fit.predictedTwoGradientSlopeEl !== null) {
    lines.push({ label: `two gradients: slope ${sigFig(fit.predictedTwoGradientSlopeEl, 4)}`, slope: fit.predictedTwoGradientSlopeEl, intercept: ref.mean });
  }
  return lines;
}

function conditionMeans(a: CohortAnalysis, quantity: string): ShiftGroup[] {
  return a.conditions.flatMap((c) => {
    const s = a.stats.find((t) => t.condition === c.name && t.quantity === quantity && t.unit === 'EL');
    if (c.factor === null || !s) return [];
    return [{ label: `f=${Number(c.factor.toPrecision(3))}`, lnF: Math.log(c.factor), mean: s.mean, ciLow: s.ciLow, ciHigh: s.ciHigh }];
  });
}

function shiftFigure(a: CohortAnalysis, quantity: string, size: Size): NamedFigure {
  const title = `${quantityLabel(quantity)}: position vs ln f`;
  const fit = a.dosageFits.find((f) => f.quantity === quantity);
  const points = a.observations.filter((o) => o.quantity === quantity && o.unit === 'EL' && o.lnF !== null).map((o) => ({ lnF: o.lnF as number, value: o.value }));
  const slope = fit ? valueWithCi(fit.slopeEl, fit.ciLow, fit.ciHigh) : null;
  const fitted = fit && slope ? { label: `fitted: slope λ_eff = ${slope.value} ${slope.ci}`, slope: fit.slopeEl, intercept: fit.interceptEl } : null;
  const svg = shiftVsLnFFigure({ quantity: quantityLabel(quantity), points, groups: conditionMeans(a, quantity), fitted, predicted: predictedLines(a, quantity) }, { ...size, title });
  return { name: `shift-${figureSlug(quantity)}`, title, svg };
}

function sigmaFigure(a: CohortAnalysis, size: Size): NamedFigure {
  const title = 'Positional error implied by the gradient';
  const series = a.profiles.map((p) => ({ label: p.condition, xEl: p.xEl, sigma: p.sigmaXEl }));
  return { name: 'positional-error', title, svg: positionalErrorFigure(series, { ...size, title }) };
}

/** λ_dorsal − λ_ventral per embryo by condition (embryos measured with each side apart), with a line at zero. */
function sidesFigure(a: CohortAnalysis, size: Size): NamedFigure {
  const title = 'Dorsal − ventral decay length by condition';
  const groups: StripGroup[] = (a.sideDifferences ?? []).map((r) => ({
    label: r.condition, mean: r.meanEl, ciLow: r.ciLowEl, ciHigh: r.ciHighEl,
    values: a.observations.filter((o) => o.condition === r.condition && o.kind === 'side-difference' && o.unit === 'EL').map((o) => o.value),
  }));
  const svg = lambdaByConditionFigure(groups, { ...size, title, unit: 'EL', level: a.options.level, yTitle: 'λ dorsal − λ ventral (EL)', zeroLine: true });
  return { name: 'lambda-dorsal-minus-ventral', title, svg };
}

/** The background condition's mean profile per channel ± SE, when one was subtracted (none otherwise). */
function backgroundFigure(a: CohortAnalysis, size: Size): NamedFigure[] {
  const bg = a.backgroundCondition;
  if (!bg) return [];
  const title = `Background condition "${bg.condition}": mean profile subtracted`;
  const subtitle = `line: mean over its ${bg.files.length} embryo${bg.files.length === 1 ? '' : 's'}; band: ± SE between them (SD/√n)`;
  const series = bg.profiles.map((p) => ({ label: p.channel, xEl: p.xEl, mean: p.mean, sd: p.se }));
  return [{ name: 'background-condition', title, svg: cohortProfilesFigure(series, { ...size, title, subtitle, yLabel: 'intensity after each embryo\'s own background' }) }];
}

/** Cohort figures: mean profiles, λ by condition, one position-vs-ln f figure per boundary/landmark, σx, the
 *  background condition's profile when one was subtracted, and the dorsal − ventral differences when the sides were
 *  measured apart. */
export function cohortFigures(a: CohortAnalysis, size: Size = {}): NamedFigure[] {
  const sides = (a.sideDifferences ?? []).length > 0 ? [sidesFigure(a, size)] : [];
  return [profilesFigure(a, size), lambdaFigure(a, size), ...a.dosageFits.map((f) => shiftFigure(a, f.quantity, size)), sigmaFigure(a, size), ...backgroundFigure(a, size), ...sides];
}

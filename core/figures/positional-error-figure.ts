// Positional error implied by the gradient along the axis, σx(x) = σC / |dC̄/dx|, one line per condition.
// Where the gradient flattens σx grows without bound; such values are clipped at the top of a readable y range
// and marked there (▲), and the subtitle says how many were clipped and above which value.
import { quantile } from 'd3-array';
import { scaleLinear, type ScaleLinear } from 'd3-scale';
import { line } from 'd3-shape';
import { clipSvg, plotArea, subtitleExtraPx, titleSvg, xAxisSvg, yAxisSvg, type PlotArea } from './axes';
import { figureSize, stableId, type FigureOptions } from './common';
import { legendSvg } from './legend';
import { sigFig } from './number-format';
import { seriesColour } from './palette';
import { el, px, svgDocument } from './svg';

/** One condition's σx along the axis; NaN where undefined (flat gradient or < 2 embryos). */
export interface SigmaSeries {
  readonly label: string;
  readonly xEl: ArrayLike<number>;
  readonly sigma: ArrayLike<number>;
}

const DEFAULT_SUBTITLE = 'σx = σC / |dC̄/dx|, σC = SD across embryos; gaps: slope not resolved';

/** Default top of the y axis: 1.5 × the largest per-series 80th percentile of the finite values (1 when none),
 *  so the bulk of every condition stays readable while the runaway tail where the gradient is flat is clipped. */
export function autoSigmaYMax(series: readonly SigmaSeries[]): number {
  const tops = series.map((s) => {
    const finite = Array.from(s.sigma).filter((v) => Number.isFinite(v) && v >= 0);
    return finite.length > 0 ? quantile(finite, 0.8) ?? 0 : 0;
  });
  const top = 1.5 * Math.max(0, ...tops);
  return top > 0 ? top : 1;
}

/** Line (capped just above the top so it visibly runs off) and ▲ markers at the top edge for clipped points. */
function seriesMarks(s: SigmaSeries, k: number, x: ScaleLinear<number, number>, y: ScaleLinear<number, number>, area: PlotArea, top: number): string {
  const idx = Array.from({ length: s.xEl.length }, (_, i) => i);
  const ok = (i: number): boolean => Number.isFinite(s.sigma[i]) && Number.isFinite(s.xEl[i]);
  const d = line<number>().defined(ok).x((i) => x(s.xEl[i])).y((i) => y(Math.min(s.sigma[i], top * 1.1)))(idx) ?? '';
  const colour = seriesColour(k);
  const over = idx.filter((i) => ok(i) && s.sigma[i] > top);
  // Rows of markers per series (7 px apart) so conditions clipped at the same x stay distinguishable.
  const yTip = area.top + 2 + (k % 4) * 7;
  const marks = over.map((i) => {
    const cx = x(s.xEl[i]);
    return el('path', { class: 'clipped-mark', d: `M${px(cx)},${px(yTip)}L${px(cx + 3.5)},${px(yTip + 6)}L${px(cx - 3.5)},${px(yTip + 6)}Z`, fill: colour });
  });
  return el('path', { class: 'sigma-line', d, fill: 'none', stroke: colour, 'stroke-width': 2 }) + marks.join('');
}

/** SVG: σx vs x/EL; values above the y range (`yMax`, default autoSigmaYMax) are clipped and marked ▲ at the top. */
export function positionalErrorFigure(series: readonly SigmaSeries[], options: FigureOptions & { unit?: 'EL' | 'um'; yMax?: number } = {}): string {
  const unit = options.unit ?? 'EL';
  const yMax = options.yMax ?? autoSigmaYMax(series);
  const x0 = scaleLinear().domain([0, 1]);
  const y0 = scaleLinear().domain([0, yMax]).nice();
  const top = y0.domain()[1];
  const clippedCount = series.reduce((n, s) => n + Array.from(s.sigma).filter((v, i) => Number.isFinite(v) && Number.isFinite(s.xEl[i]) && v > top).length, 0);
  const clipNote = clippedCount > 0 ? `▲ at the top: ${clippedCount} value${clippedCount === 1 ? '' : 's'} above ${sigFig(top, 2)} ${unit === 'EL' ? 'EL' : 'µm'} (clipped; see positional_error.csv)` : '';
  const base = options.subtitle ?? DEFAULT_SUBTITLE;
  const subtitle = [base, clipNote].filter((t) => t !== '').join('\n');
  const { widthPx, heightPx, title } = figureSize({ ...options, subtitle }, 'Positional error implied by the gradient');
  const a = plotArea(widthPx, heightPx, { top: 52 + subtitleExtraPx(subtitle), right: 20, bottom: 52, left: 68 });
  const x = x0.range([a.left, a.left + a.width]);
  const y = y0.range([a.top + a.height, a.top]);
  const marks = series.map((s, k) => seriesMarks(s, k, x, y, a, top));
  const clip = clipSvg(a, stableId('clip-sigma', `${title}${widthPx}x${heightPx}`));
  // Top-left: where a gradient is steep (σx small) there is room; the top-right is where clipped markers sit.
  const legend = legendSvg(series.map((s, k) => ({ label: s.label, colour: seriesColour(k), shape: 'line' as const })), a.left + 6, a.top + 30, 'left');
  const yTitle = unit === 'EL' ? 'positional error σx (fraction of EL)' : 'positional error σx (µm)';
  const body = clip.def + titleSvg(a, title, subtitle) + xAxisSvg(x, a, 'position along the AP axis, x/EL (0 = anterior pole)')
    + yAxisSvg(y, a, yTitle) + clip.wrap(marks.join('')) + legend;
  return svgDocument(widthPx, heightPx, title, body);
}

// Positional error implied by the gradient along the axis, σx(x) = σC / |dC̄/dx|, one line per condition.
import { quantile } from 'd3-array';
import { scaleLinear } from 'd3-scale';
import { line } from 'd3-shape';
import { clipSvg, plotArea, titleSvg, xAxisSvg, yAxisSvg } from './axes';
import { figureSize, stableId, type FigureOptions } from './common';
import { legendSvg } from './legend';
import { seriesColour } from './palette';
import { el, svgDocument } from './svg';

/** One condition's σx along the axis; NaN where undefined (flat gradient or < 2 embryos). */
export interface SigmaSeries {
  readonly label: string;
  readonly xEl: ArrayLike<number>;
  readonly sigma: ArrayLike<number>;
}

/** Default top of the y axis: 1.5 × the 80th percentile of the finite values (1 when there are none). */
function autoYMax(series: readonly SigmaSeries[]): number {
  const finite = series.flatMap((s) => Array.from(s.sigma)).filter((v) => Number.isFinite(v) && v >= 0);
  const top = finite.length > 0 ? 1.5 * (quantile(finite, 0.8) ?? 0) : 0;
  return top > 0 ? top : 1;
}

/** SVG: σx vs x/EL; values above `yMax` run off the top (clipped). */
export function positionalErrorFigure(series: readonly SigmaSeries[], options: FigureOptions & { unit?: 'EL' | 'um'; yMax?: number } = {}): string {
  const { widthPx, heightPx, title, subtitle } = figureSize(options, 'Positional error implied by the gradient',
    'σx(x) = σC(x) / |dC̄/dx|, σC = SD across embryos; gaps: slope not resolved');
  const a = plotArea(widthPx, heightPx, { top: 52, right: 20, bottom: 52, left: 68 });
  const yMax = options.yMax ?? autoYMax(series);
  const x = scaleLinear().domain([0, 1]).range([a.left, a.left + a.width]);
  const y = scaleLinear().domain([0, yMax]).nice().range([a.top + a.height, a.top]);
  const paths = series.map((s, k) => {
    const idx = Array.from({ length: s.xEl.length }, (_, i) => i);
    // Cap far-off values just above the top so the clip hides them without huge coordinates in the file.
    const d = line<number>().defined((i) => Number.isFinite(s.sigma[i]) && Number.isFinite(s.xEl[i]))
      .x((i) => x(s.xEl[i])).y((i) => y(Math.min(s.sigma[i], yMax * 1.5)))(idx) ?? '';
    return el('path', { class: 'sigma-line', d, fill: 'none', stroke: seriesColour(k), 'stroke-width': 2 });
  });
  const clip = clipSvg(a, stableId('clip-sigma', `${title}${widthPx}x${heightPx}`));
  const legend = legendSvg(series.map((s, k) => ({ label: s.label, colour: seriesColour(k), shape: 'line' as const })), a.left + a.width - 6, a.top + 6);
  const yTitle = (options.unit ?? 'EL') === 'EL' ? 'positional error σx (fraction of EL)' : 'positional error σx (µm)';
  const body = clip.def + titleSvg(a, title, subtitle) + xAxisSvg(x, a, 'position along the AP axis, x/EL (0 = anterior pole)')
    + yAxisSvg(y, a, yTitle) + clip.wrap(paths.join('')) + legend;
  return svgDocument(widthPx, heightPx, title, body);
}

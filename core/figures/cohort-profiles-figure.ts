// Mean gradient profile per condition with an SD band (across embryos), on the common x/EL grid.
import { scaleLinear, type ScaleLinear } from 'd3-scale';
import { area, line } from 'd3-shape';
import { clipSvg, plotArea, titleSvg, xAxisSvg, yAxisSvg } from './axes';
import { figureSize, finiteExtent, stableId, type FigureOptions } from './common';
import { legendSvg } from './legend';
import { seriesColour } from './palette';
import { el, svgDocument } from './svg';

/** One condition's mean profile; NaN marks grid points without data (drawn as gaps). */
export interface ProfileSeries {
  readonly label: string;
  readonly xEl: ArrayLike<number>;
  readonly mean: ArrayLike<number>;
  readonly sd: ArrayLike<number>;
}

type Scale = ScaleLinear<number, number>;

/** Band (mean ± SD) and mean line of one series, in colour `c`. */
function seriesMarks(s: ProfileSeries, x: Scale, y: Scale, c: string): string {
  const idx = Array.from({ length: s.xEl.length }, (_, i) => i);
  const ok = (i: number): boolean => Number.isFinite(s.mean[i]) && Number.isFinite(s.xEl[i]);
  const band = area<number>().defined((i) => ok(i) && Number.isFinite(s.sd[i]))
    .x((i) => x(s.xEl[i])).y0((i) => y(s.mean[i] - s.sd[i])).y1((i) => y(s.mean[i] + s.sd[i]))(idx) ?? '';
  const mean = line<number>().defined(ok).x((i) => x(s.xEl[i])).y((i) => y(s.mean[i]))(idx) ?? '';
  return el('g', { class: 'series' },
    el('path', { class: 'sd-band', d: band, fill: c, 'fill-opacity': 0.18, stroke: 'none' })
    + el('path', { class: 'mean-line', d: mean, fill: 'none', stroke: c, 'stroke-width': 2 }));
}

/** SVG: mean profile ± SD per condition vs x/EL; `yLabel` names the intensity scale (normalisation). */
export function cohortProfilesFigure(series: readonly ProfileSeries[], options: FigureOptions & { yLabel?: string } = {}): string {
  const { widthPx, heightPx, title, subtitle } = figureSize(options, 'Mean gradient profile by condition', 'line: mean across embryos; band: ± SD across embryos');
  const a = plotArea(widthPx, heightPx, { top: 52, right: 20, bottom: 52, left: 68 });
  const x = scaleLinear().domain([0, 1]).range([a.left, a.left + a.width]);
  const ys = series.flatMap((s) => Array.from(s.mean, (m, i) => [m - s.sd[i], m + s.sd[i], m]).flat());
  const [lo, hi] = finiteExtent(ys, [0, 1]);
  const y = scaleLinear().domain([Math.min(0, lo), hi]).nice().range([a.top + a.height, a.top]);
  const clip = clipSvg(a, stableId('clip-profiles', `${title}${widthPx}x${heightPx}`));
  const marks = series.map((s, k) => seriesMarks(s, x, y, seriesColour(k))).join('');
  const legend = legendSvg(series.map((s, k) => ({ label: s.label, colour: seriesColour(k), shape: 'line' as const })), a.left + a.width - 6, a.top + 6);
  const body = clip.def + titleSvg(a, title, subtitle) + xAxisSvg(x, a, 'position along the AP axis, x/EL (0 = anterior pole)')
    + yAxisSvg(y, a, options.yLabel ?? 'intensity (a.u.)') + clip.wrap(marks) + legend;
  return svgDocument(widthPx, heightPx, title, body);
}

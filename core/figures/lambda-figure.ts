// Decay length λ per embryo by condition: a strip plot (one dot per embryo) with the mean and its CI.
import { scaleLinear, scalePoint } from 'd3-scale';
import { plotArea, titleSvg, yAxisSvg } from './axes';
import { figureSize, finiteExtent, jitter, type FigureOptions } from './common';
import { INK, seriesColour } from './palette';
import { el, lineSvg, px, svgDocument, textSvg } from './svg';

/** One condition: per-embryo values and the mean with its confidence interval (same unit). */
export interface StripGroup {
  readonly label: string;
  readonly values: readonly number[];
  readonly mean: number;
  readonly ciLow: number;
  readonly ciHigh: number;
}

/** A vertical whisker from y0 to y1 at x with 8 px caps (SVG path data). */
export function whiskerPath(x: number, y0: number, y1: number): string {
  return `M${px(x - 4)},${px(y0)}H${px(x + 4)}M${px(x)},${px(y0)}V${px(y1)}M${px(x - 4)},${px(y1)}H${px(x + 4)}`;
}

function groupMarks(g: StripGroup, cx: number, half: number, y: (v: number) => number, colour: string): string {
  const dots = g.values.filter(Number.isFinite)
    .map((v, i) => el('circle', { class: 'embryo-point', cx: cx + jitter(i + 1) * half * 0.5, cy: y(v), r: 3.5, fill: colour, 'fill-opacity': 0.65 }));
  const mean = Number.isFinite(g.mean)
    ? lineSvg(cx - half * 0.8, y(g.mean), cx + half * 0.8, y(g.mean), { class: 'mean-mark', stroke: INK.axis, 'stroke-width': 2.5 }) : '';
  const ci = Number.isFinite(g.ciLow) && Number.isFinite(g.ciHigh)
    ? el('path', { class: 'ci-bar', d: whiskerPath(cx + half * 0.9, y(g.ciLow), y(g.ciHigh)), stroke: INK.axis, 'stroke-width': 1.5, fill: 'none' }) : '';
  return el('g', { class: 'group' }, dots.join('') + mean + ci || ' ');
}

/** SVG: λ per embryo by condition (dots), mean (bar) and CI (whiskers); unit 'EL' (fraction of egg length) or 'um';
 *  another quantity with its own y title, and a dashed line at zero when asked (e.g. a difference). */
export function lambdaByConditionFigure(groups: readonly StripGroup[], options: FigureOptions & { unit?: 'EL' | 'um'; level?: number; yTitle?: string; zeroLine?: boolean } = {}): string {
  const pct = Math.round((options.level ?? 0.95) * 100);
  const { widthPx, heightPx, title, subtitle } = figureSize(options, 'Decay length λ by condition', `dots: embryos; bar: mean; whiskers: ${pct}% CI of the mean`);
  const a = plotArea(widthPx, heightPx, { top: 52, right: 20, bottom: 52, left: 68 });
  const x = scalePoint<string>().domain(groups.map((_, i) => `${i}`)).range([a.left, a.left + a.width]).padding(0.6);
  const cx = (i: number): number => x(`${i}`) ?? a.left;
  const half = Math.min(40, x.step() / 2);
  const [lo, hi] = finiteExtent([...groups.flatMap((g) => [...g.values, g.ciLow, g.ciHigh]), ...(options.zeroLine ? [0] : [])], [0, 1]);
  const y = scaleLinear().domain([lo - (hi - lo) * 0.08, hi + (hi - lo) * 0.08]).nice().range([a.top + a.height, a.top]);
  const bottom = a.top + a.height;
  const marks = groups.map((g, i) => groupMarks(g, cx(i), half, y, seriesColour(i))).join('');
  const labels = groups.map((g, i) => textSvg(cx(i), bottom + 18, `${g.label} (n=${g.values.length})`, { anchor: 'middle', size: 11, cls: 'tick-label' })).join('');
  const yTitle = options.yTitle ?? ((options.unit ?? 'EL') === 'EL' ? 'decay length λ (fraction of egg length, EL)' : 'decay length λ (µm)');
  const zero = options.zeroLine ? lineSvg(a.left, y(0), a.left + a.width, y(0), { class: 'zero-line', stroke: INK.muted, 'stroke-dasharray': '4 3' }) : '';
  const body = titleSvg(a, title, subtitle) + yAxisSvg(y, a, yTitle) + zero + lineSvg(a.left, bottom, a.left + a.width, bottom, { stroke: INK.axis })
    + labels + textSvg(a.left + a.width / 2, bottom + 38, 'condition', { anchor: 'middle', cls: 'axis-title' }) + marks;
  return svgDocument(widthPx, heightPx, title, body);
}

// Decay length λ per embryo by condition: a strip plot (one dot per embryo) with the mean and its CI.
import { scaleLinear, scalePoint } from 'd3-scale';
import { plotArea, titleSvg, yAxisSvg } from './axes';
import { figureSize, finiteExtent, jitter, type FigureOptions } from './common';
import { INK, seriesColour } from './palette';
import { px, svgDocument, textSvg } from './svg';

/** One condition: per-embryo values and the mean with its confidence interval (same unit). */
export interface StripGroup {
  readonly label: string;
  readonly values: readonly number[];
  readonly mean: number;
  readonly ciLow: number;
  readonly ciHigh: number;
}

function groupMarks(g: StripGroup, cx: number, half: number, y: (v: number) => number, colour: string): string {
  const dots = g.values.filter(Number.isFinite).map((v, i) => `<circle class="embryo-point" cx="${px(cx + jitter(i + 1) * half * 0.5)}" cy="${px(y(v))}" r="3.5" fill="${colour}" fill-opacity="0.65"/>`);
  let summary = '';
  if (Number.isFinite(g.mean)) {
    summary += `<line class="mean-mark" x1="${px(cx - half * 0.8)}" y1="${px(y(g.mean))}" x2="${px(cx + half * 0.8)}" y2="${px(y(g.mean))}" stroke="${INK.axis}" stroke-width="2.5"/>`;
  }
  if (Number.isFinite(g.ciLow) && Number.isFinite(g.ciHigh)) {
    const x0 = cx + half * 0.9;
    summary += `<path class="ci-bar" d="M${px(x0 - 4)},${px(y(g.ciLow))}H${px(x0 + 4)}M${px(x0)},${px(y(g.ciLow))}V${px(y(g.ciHigh))}M${px(x0 - 4)},${px(y(g.ciHigh))}H${px(x0 + 4)}" stroke="${INK.axis}" stroke-width="1.5" fill="none"/>`;
  }
  return `<g class="group">${dots.join('')}${summary}</g>`;
}

/** SVG: λ per embryo by condition (dots), mean (bar) and CI (whiskers); unit 'EL' (fraction of egg length) or 'um'. */
export function lambdaByConditionFigure(groups: readonly StripGroup[], options: FigureOptions & { unit?: 'EL' | 'um'; level?: number } = {}): string {
  const unit = options.unit ?? 'EL';
  const pct = Math.round((options.level ?? 0.95) * 100);
  const { widthPx, heightPx, title, subtitle } = figureSize(options, 'Decay length λ by condition', `dots: embryos; bar: mean; whiskers: ${pct}% CI of the mean`);
  const a = plotArea(widthPx, heightPx, { top: 52, right: 20, bottom: 52, left: 68 });
  const x = scalePoint<string>().domain(groups.map((g, i) => `${i}`)).range([a.left, a.left + a.width]).padding(0.6);
  const half = Math.min(40, x.step() / 2);
  const [lo, hi] = finiteExtent(groups.flatMap((g) => [...g.values, g.ciLow, g.ciHigh]), [0, 1]);
  const pad = (hi - lo) * 0.08;
  const y = scaleLinear().domain([lo - pad, hi + pad]).nice().range([a.top + a.height, a.top]);
  const marks = groups.map((g, i) => groupMarks(g, x(`${i}`) ?? 0, half, y, seriesColour(i)));
  const labels = groups.map((g, i) => textSvg(x(`${i}`) ?? 0, a.top + a.height + 18, `${g.label} (n=${g.values.length})`, { anchor: 'middle', size: 11, cls: 'tick-label' }));
  const axisLine = `<line x1="${px(a.left)}" y1="${px(a.top + a.height)}" x2="${px(a.left + a.width)}" y2="${px(a.top + a.height)}" stroke="${INK.axis}"/>`;
  const yTitle = unit === 'EL' ? 'decay length λ (fraction of egg length, EL)' : 'decay length λ (µm)';
  const body = titleSvg(a, title, subtitle) + yAxisSvg(y, a, yTitle) + axisLine + labels.join('')
    + textSvg(a.left + a.width / 2, a.top + a.height + 38, 'condition', { anchor: 'middle', cls: 'axis-title' }) + marks.join('');
  return svgDocument(widthPx, heightPx, title, body);
}

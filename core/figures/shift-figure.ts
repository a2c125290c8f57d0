// Boundary or landmark position vs ln f: embryos as dots, condition means with CIs, the fitted line and the
// threshold-model prediction(s) drawn through the reference mean.
import { scaleLinear, type ScaleLinear } from 'd3-scale';
import { clipSvg, plotArea, titleSvg, xAxisSvg, yAxisSvg } from './axes';
import { figureSize, finiteExtent, jitter, stableId, type FigureOptions } from './common';
import { whiskerPath } from './lambda-figure';
import { legendSvg, type LegendItem } from './legend';
import { INK, seriesColour } from './palette';
import { el, px, svgDocument, textSvg } from './svg';

/** A straight line position = intercept + slope·ln f (x/EL). */
export interface FigureLine {
  readonly label: string;
  readonly slope: number;
  readonly intercept: number;
}

/** One condition's mean position with its CI, at its ln f. */
export interface ShiftGroup {
  readonly label: string;
  readonly lnF: number;
  readonly mean: number;
  readonly ciLow: number;
  readonly ciHigh: number;
}

/** Data of one shift figure; positions in x/EL. */
export interface ShiftFigureInput {
  readonly quantity: string;
  readonly points: readonly { readonly lnF: number; readonly value: number }[];
  readonly groups?: readonly ShiftGroup[];
  readonly fitted?: FigureLine | null;
  readonly predicted?: readonly FigureLine[];
}

type Scale = ScaleLinear<number, number>;
const PREDICTED_STYLES = [{ colour: seriesColour(1), dash: '6 4' }, { colour: seriesColour(2), dash: '2 3' }];

function linePath(l: FigureLine, x: Scale, y: Scale, attrs: { class: string; stroke: string; dash?: string }): string {
  if (!Number.isFinite(l.slope) || !Number.isFinite(l.intercept)) return '';
  const [d0, d1] = x.domain();
  const d = `M${px(x(d0))},${px(y(l.intercept + l.slope * d0))}L${px(x(d1))},${px(y(l.intercept + l.slope * d1))}`;
  return el('path', { class: attrs.class, d, fill: 'none', stroke: attrs.stroke, 'stroke-width': 2, 'stroke-dasharray': attrs.dash });
}

function groupMarks(g: ShiftGroup, x: Scale, y: Scale, bottom: number): string {
  if (!Number.isFinite(g.mean)) return '';
  const cx = x(g.lnF);
  const ci = Number.isFinite(g.ciLow) && Number.isFinite(g.ciHigh)
    ? el('path', { class: 'ci-bar', d: whiskerPath(cx, y(g.ciLow), y(g.ciHigh)), stroke: INK.axis, 'stroke-width': 1.5, fill: 'none' }) : '';
  const square = el('rect', { x: cx - 4, y: y(g.mean) - 4, width: 8, height: 8, fill: '#ffffff', stroke: INK.axis, 'stroke-width': 1.5 });
  return el('g', { class: 'group-mean' }, ci + square + textSvg(cx, bottom - 6, g.label, { anchor: 'middle', size: 10, fill: INK.muted, cls: 'group-label' }));
}

function pointMarks(input: ShiftFigureInput, x: Scale, y: Scale): string {
  const [d0, d1] = x.domain();
  const halfJitterPx = Math.abs(x(d0 + (d1 - d0) * 0.012) - x(d0));
  return input.points.filter((p) => Number.isFinite(p.lnF) && Number.isFinite(p.value))
    .map((p, i) => el('circle', { class: 'embryo-point', cx: x(p.lnF) + jitter(i + 1) * halfJitterPx, cy: y(p.value), r: 3, fill: seriesColour(0), 'fill-opacity': 0.5 }))
    .join('');
}

function scalesFor(input: ShiftFigureInput, range: { x: [number, number]; y: [number, number] }): { x: Scale; y: Scale } {
  const groups = input.groups ?? [];
  const [x0, x1] = finiteExtent([...input.points.map((p) => p.lnF), ...groups.map((g) => g.lnF)], [-1, 1]);
  const [y0, y1] = finiteExtent([...input.points.map((p) => p.value), ...groups.flatMap((g) => [g.ciLow, g.ciHigh])], [0, 1]);
  return {
    x: scaleLinear().domain([x0 - (x1 - x0) * 0.08, x1 + (x1 - x0) * 0.08]).range(range.x),
    y: scaleLinear().domain([y0 - (y1 - y0) * 0.1, y1 + (y1 - y0) * 0.15]).nice().range(range.y),
  };
}

/** SVG: position (x/EL) vs ln f with embryos, condition means ± CI, the fitted line and predicted lines. */
export function shiftVsLnFFigure(input: ShiftFigureInput, options: FigureOptions = {}): string {
  const { widthPx, heightPx, title, subtitle } = figureSize(options, `${input.quantity}: position vs ln f`, 'dots: embryos; squares: condition mean ± CI');
  const a = plotArea(widthPx, heightPx, { top: 52, right: 20, bottom: 52, left: 68 });
  const { x, y } = scalesFor(input, { x: [a.left, a.left + a.width], y: [a.top + a.height, a.top] });
  const legend: LegendItem[] = [{ label: 'embryos', colour: seriesColour(0), shape: 'dot' }];
  let lines = '';
  if (input.fitted) {
    lines += linePath(input.fitted, x, y, { class: 'fitted-line', stroke: INK.axis });
    legend.push({ label: input.fitted.label, colour: INK.axis, shape: 'line' });
  }
  (input.predicted ?? []).forEach((l, i) => {
    const style = PREDICTED_STYLES[i % PREDICTED_STYLES.length];
    lines += linePath(l, x, y, { class: 'predicted-line', stroke: style.colour, dash: style.dash });
    legend.push({ label: l.label, colour: style.colour, shape: 'dash' });
  });
  const groups = (input.groups ?? []).map((g) => groupMarks(g, x, y, a.top + a.height)).join('');
  const clip = clipSvg(a, stableId('clip-shift', `${title}${widthPx}x${heightPx}`));
  const body = clip.def + titleSvg(a, title, subtitle) + xAxisSvg(x, a, 'ln f (f = dosage relative to the reference)')
    + yAxisSvg(y, a, 'position, x/EL') + clip.wrap(pointMarks(input, x, y) + lines + groups) + legendSvg(legend, a.left + 6, a.top + 6, 'left');
  return svgDocument(widthPx, heightPx, title, body);
}

// Boundary or landmark position vs ln f: embryos as dots, condition means with CIs, the fitted line and the
// threshold-model prediction(s) drawn through the reference mean.
import { scaleLinear } from 'd3-scale';
import { clipSvg, plotArea, titleSvg, xAxisSvg, yAxisSvg } from './axes';
import { figureSize, finiteExtent, jitter, stableId, type FigureOptions } from './common';
import { legendSvg, type LegendItem } from './legend';
import { INK, seriesColour } from './palette';
import { px, svgDocument, textSvg } from './svg';

/** A straight line position = intercept + slope·ln f (x/EL). */
export interface FigureLine {
  readonly label: string;
  readonly slope: number;
  readonly intercept: number;
}

/** Data of one shift figure; positions in x/EL. */
export interface ShiftFigureInput {
  readonly quantity: string;
  readonly points: readonly { readonly lnF: number; readonly value: number }[];
  readonly groups?: readonly { readonly label: string; readonly lnF: number; readonly mean: number; readonly ciLow: number; readonly ciHigh: number }[];
  readonly fitted?: FigureLine | null;
  readonly predicted?: readonly FigureLine[];
}

const LINE_STYLES = [{ colour: seriesColour(1), dash: '6 4' }, { colour: seriesColour(2), dash: '2 3' }];

function lineSvg(l: FigureLine, x: (v: number) => number, y: (v: number) => number, dom: number[], stroke: string, dash: string | null, cls: string): string {
  if (!Number.isFinite(l.slope) || !Number.isFinite(l.intercept)) return '';
  const d = `M${px(x(dom[0]))},${px(y(l.intercept + l.slope * dom[0]))}L${px(x(dom[1]))},${px(y(l.intercept + l.slope * dom[1]))}`;
  return `<path class="${cls}" d="${d}" fill="none" stroke="${stroke}" stroke-width="2"${dash ? ` stroke-dasharray="${dash}"` : ''}/>`;
}

function groupSvg(g: NonNullable<ShiftFigureInput['groups']>[number], x: (v: number) => number, y: (v: number) => number, bottom: number): string {
  if (!Number.isFinite(g.mean)) return '';
  const cx = x(g.lnF);
  const ci = Number.isFinite(g.ciLow) && Number.isFinite(g.ciHigh)
    ? `<path class="ci-bar" d="M${px(cx)},${px(y(g.ciLow))}V${px(y(g.ciHigh))}M${px(cx - 4)},${px(y(g.ciLow))}H${px(cx + 4)}M${px(cx - 4)},${px(y(g.ciHigh))}H${px(cx + 4)}" stroke="${INK.axis}" stroke-width="1.5" fill="none"/>` : '';
  return `<g class="group-mean">${ci}<rect x="${px(cx - 4)}" y="${px(y(g.mean) - 4)}" width="8" height="8" fill="#ffffff" stroke="${INK.axis}" stroke-width="1.5"/>${textSvg(cx, bottom - 6, g.label, { anchor: 'middle', size: 10, fill: INK.muted, cls: 'group-label' })}</g>`;
}

/** SVG: position (x/EL) vs ln f with embryos, condition means ± CI, the fitted line and predicted lines. */
export function shiftVsLnFFigure(input: ShiftFigureInput, options: FigureOptions = {}): string {
  const { widthPx, heightPx, title, subtitle } = figureSize(options, `${input.quantity}: position vs ln f`, `dots: embryos; squares: condition mean ± CI`);
  const a = plotArea(widthPx, heightPx, { top: 52, right: 20, bottom: 52, left: 68 });
  const xs = [...input.points.map((p) => p.lnF), ...(input.groups ?? []).map((g) => g.lnF)];
  const [x0, x1] = finiteExtent(xs, [-1, 1]);
  const padX = (x1 - x0) * 0.08;
  const dom = [x0 - padX, x1 + padX];
  const x = scaleLinear().domain(dom).range([a.left, a.left + a.width]);
  const ys = [...input.points.map((p) => p.value), ...(input.groups ?? []).flatMap((g) => [g.ciLow, g.ciHigh])];
  const [y0, y1] = finiteExtent(ys, [0, 1]);
  const y = scaleLinear().domain([y0 - (y1 - y0) * 0.1, y1 + (y1 - y0) * 0.15]).nice().range([a.top + a.height, a.top]);
  const clip = clipSvg(a, stableId('clip-shift', `${title}${widthPx}x${heightPx}`));
  const halfJitter = Math.abs(x(dom[0] + (dom[1] - dom[0]) * 0.012) - x(dom[0]));
  const dots = input.points.filter((p) => Number.isFinite(p.lnF) && Number.isFinite(p.value))
    .map((p, i) => `<circle class="embryo-point" cx="${px(x(p.lnF) + jitter(i + 1) * halfJitter)}" cy="${px(y(p.value))}" r="3" fill="${seriesColour(0)}" fill-opacity="0.5"/>`);
  const legend: LegendItem[] = [{ label: 'embryos', colour: seriesColour(0), shape: 'dot' }];
  let lines = '';
  if (input.fitted) { lines += lineSvg(input.fitted, x, y, dom, INK.axis, null, 'fitted-line'); legend.push({ label: input.fitted.label, colour: INK.axis, shape: 'line' }); }
  (input.predicted ?? []).forEach((l, i) => {
    const s = LINE_STYLES[i % LINE_STYLES.length];
    lines += lineSvg(l, x, y, dom, s.colour, s.dash, 'predicted-line');
    legend.push({ label: l.label, colour: s.colour, shape: 'dash' });
  });
  const groups = (input.groups ?? []).map((g) => groupSvg(g, x, y, a.top + a.height)).join('');
  const body = clip.def + titleSvg(a, title, subtitle) + xAxisSvg(x, a, 'ln f (f = dosage relative to the reference)')
    + yAxisSvg(y, a, 'position, x/EL') + `<g ${clip.attr}>${dots.join('')}${lines}${groups}</g>` + legendSvg(legend, a.left + 6, a.top + 6, 'left');
  return svgDocument(widthPx, heightPx, title, body);
}

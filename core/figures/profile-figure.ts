// One embryo's profile: bin means with an SD band, the fitted exponential over its fit range (extrapolated
// dashed), the fit range shaded, boundaries as vertical lines, landmarks as markers, optional residual panel.
// Nothing is written over the data: the legend and the boundary and landmark labels sit in rows above the plot,
// labels that would overlap go to the next row, and the marks are clipped to the plot area.
import { scaleLinear, type ScaleLinear } from 'd3-scale';
import { area, line } from 'd3-shape';
import type { Boundary, ExponentialFit, LandmarkPosition, Profile } from '../model';
import { clipSvg, plotArea, titleSvg, xAxisSvg, yAxisSvg, type PlotArea } from './axes';
import { figureSize, finiteExtent, stableId, type FigureOptions } from './common';
import { labelRows, legendRowsSvg, type LegendItem } from './legend';
import { ciDecimals, fixed } from './number-format';
import { boundaryColour, INK, PROFILE_COLOURS } from './palette';
import { el, lineSvg, px, svgDocument, textSvg } from './svg';

/** What profileFigure draws; positions come from the model types (x/EL and µm). */
export interface ProfileFigureInput {
  readonly profile: Profile;
  readonly fit?: ExponentialFit | null;
  readonly boundaries?: readonly Boundary[];
  readonly landmarks?: readonly LandmarkPosition[];
  /** Boundary channels in the order that gives their colours (as in the window); default: order of appearance. */
  readonly boundaryChannels?: readonly string[];
  /** Earlier profiles of the same embryo (a movie's earlier time points, oldest first), drawn faded behind it. */
  readonly earlier?: readonly { readonly xEl: ArrayLike<number>; readonly mean: ArrayLike<number> }[];
}

/** Options: x axis in x/EL (default) or µm from the anterior pole; residual panel below when a fit is given. */
export interface ProfileFigureOptions extends FigureOptions {
  readonly xAxis?: 'el' | 'um';
  readonly showResiduals?: boolean;
  readonly yLabel?: string;
  /** Fixed intensity range of the plot (e.g. the whole movie's), instead of this profile's own. */
  readonly yDomain?: readonly [number, number];
}

type Scale = ScaleLinear<number, number>;
/** Scales of the main panel; `toX` maps x/EL to the x axis unit (x/EL or µm). */
interface Ctx { readonly x: Scale; readonly y: Scale; readonly a: PlotArea; readonly toX: (xEl: number) => number }

const FIT_COLOUR = PROFILE_COLOURS.fit;
const DATA_COLOUR = PROFILE_COLOURS.data;
/** Height of one row of labels above the plot, px; the labels' font size. */
const LABEL_ROW_PX = 14;
const LABEL_SIZE = 10;
/** Estimated width of a label at LABEL_SIZE, px per character. */
const LABEL_CHAR_PX = 5.9;

/** A label above the plot at a position along x, with its mark. */
interface TopLabel { readonly xp: number; readonly text: string; readonly colour: string; readonly cls: string }

function fitMarks(fit: ExponentialFit, c: Ctx): { shade: string; curves: string } {
  const [r0, r1] = fit.fitRangeEl;
  const model = (xEl: number): number => fit.amplitude * Math.exp(-xEl / fit.lambdaEl) + fit.background;
  const xs = Array.from({ length: 201 }, (_, i) => i / 200);
  const path = (keep: (v: number) => boolean): string => line<number>().defined(keep).x((v) => c.x(c.toX(v))).y((v) => c.y(model(v)))(xs) ?? '';
  const x0 = c.x(c.toX(r0));
  return {
    shade: el('rect', { class: 'fit-range', x: x0, y: c.a.top, width: c.x(c.toX(r1)) - x0, height: c.a.height, fill: INK.shade }),
    curves: el('path', { class: 'fit-extrapolated', d: path((v) => v <= r0 || v >= r1), fill: 'none', stroke: FIT_COLOUR, 'stroke-width': 1.2, 'stroke-dasharray': '4 3' })
      + el('path', { class: 'fit-curve', d: path((v) => v >= r0 && v <= r1), fill: 'none', stroke: FIT_COLOUR, 'stroke-width': 2.2 }),
  };
}

/** Boundary groups (two methods at nearly the same place share one label): dashed rules in the plot, one label each. */
function boundaryMarks(boundaries: readonly Boundary[], channels: readonly string[], c: Ctx): { rules: string; labels: TopLabel[] } {
  const found = boundaries.filter((b) => b.positionEl !== null && Number.isFinite(b.positionEl))
    .sort((p, q) => (p.positionEl as number) - (q.positionEl as number));
  const groups: Boundary[][] = [];
  for (const b of found) {
    const last = groups[groups.length - 1];
    if (last && last[0].channel === b.channel && (b.positionEl as number) - (last[0].positionEl as number) < 0.015) last.push(b);
    else groups.push([b]);
  }
  const rules: string[] = [];
  const labels = groups.map((g) => {
    const colour = boundaryColour(g[0].channel, channels);
    g.forEach((b, i) => {
      const xp = c.x(c.toX(b.positionEl as number));
      rules.push(lineSvg(xp, c.a.top, xp, c.a.top + c.a.height, { stroke: colour, 'stroke-width': 1.5, 'stroke-dasharray': i % 2 ? '2 3' : '6 3' }));
    });
    return { xp: c.x(c.toX(g[0].positionEl as number)), text: `${g[0].channel} ${g.map((b) => b.method).join(' / ')}`, colour, cls: 'boundary-label' };
  });
  return { rules: el('g', { class: 'boundary' }, rules.join('') || ' '), labels };
}

/** Landmarks: a small marker on the top edge of the plot pointing at the position, the name above the plot. */
function landmarkMarks(landmarks: readonly LandmarkPosition[], c: Ctx): { marks: string; labels: TopLabel[] } {
  const shown = landmarks.filter((l) => Number.isFinite(l.xEl) && l.xEl >= 0 && l.xEl <= 1);
  const yt = c.a.top;
  const marks = shown.map((l) => {
    const xp = c.x(c.toX(l.xEl));
    return el('g', { class: 'landmark' }, el('path', { d: `M${px(xp - 5)},${px(yt)}L${px(xp + 5)},${px(yt)}L${px(xp)},${px(yt + 8)}Z`, fill: INK.axis })
      + lineSvg(xp, yt + 8, xp, yt + c.a.height, { stroke: INK.muted, 'stroke-dasharray': '1 3' }));
  }).join('');
  return { marks, labels: shown.map((l) => ({ xp: c.x(c.toX(l.xEl)), text: l.name, colour: INK.axis, cls: 'landmark-label' })) };
}

/** Labels in rows ending `bottom` px (the lowest row just above the plot), kept between `left` and `right`. */
function topLabelsSvg(labels: readonly TopLabel[], left: number, right: number, bottom: number): string {
  const boxes = labels.map((l) => {
    const width = l.text.length * LABEL_CHAR_PX;
    return { x: Math.max(left, Math.min(l.xp - width / 2, right - width)), width };
  });
  const rows = labelRows(boxes);
  return labels.map((l, i) => textSvg(boxes[i].x, bottom - 4 - rows[i] * LABEL_ROW_PX, l.text, { size: LABEL_SIZE, fill: l.colour, cls: l.cls })).join('');
}

/** How many label rows the labels need (0 without labels). */
function labelRowCount(labels: readonly TopLabel[], left: number, right: number): number {
  if (labels.length === 0) return 0;
  const boxes = labels.map((l) => { const width = l.text.length * LABEL_CHAR_PX; return { x: Math.max(left, Math.min(l.xp - width / 2, right - width)), width }; });
  return Math.max(...labelRows(boxes)) + 1;
}

function dataMarks(p: Profile, c: Ctx): string {
  const idx = Array.from({ length: p.xEl.length }, (_, i) => i);
  const ok = (i: number): boolean => Number.isFinite(p.mean[i]) && Number.isFinite(p.xEl[i]);
  const band = area<number>().defined((i) => ok(i) && Number.isFinite(p.sd[i])).x((i) => c.x(c.toX(p.xEl[i])))
    .y0((i) => c.y(p.mean[i] - p.sd[i])).y1((i) => c.y(p.mean[i] + p.sd[i]))(idx) ?? '';
  const dots = idx.filter(ok).map((i) => el('circle', { class: 'data-point', cx: c.x(c.toX(p.xEl[i])), cy: c.y(p.mean[i]), r: 2.2, fill: DATA_COLOUR }));
  return el('path', { class: 'sd-band', d: band, fill: DATA_COLOUR, 'fill-opacity': 0.18 }) + dots.join('');
}

/** Earlier profiles as thin grey lines, the oldest faintest (opacity 0.12 → 0.5). */
function earlierMarks(earlier: readonly { readonly xEl: ArrayLike<number>; readonly mean: ArrayLike<number> }[], c: Ctx): string {
  return earlier.map((e, k) => {
    const idx = Array.from({ length: e.xEl.length }, (_, i) => i);
    const d = line<number>().defined((i) => Number.isFinite(e.mean[i]) && Number.isFinite(e.xEl[i])).x((i) => c.x(c.toX(e.xEl[i]))).y((i) => c.y(e.mean[i]))(idx) ?? '';
    const opacity = earlier.length === 1 ? 0.5 : 0.12 + (0.38 * k) / (earlier.length - 1);
    return el('path', { class: 'earlier-profile', d, fill: 'none', stroke: INK.muted, 'stroke-width': 1.2, 'stroke-opacity': +opacity.toFixed(3) });
  }).join('');
}

function residualPanel(fit: ExponentialFit, x: Scale, toX: (v: number) => number, a: PlotArea, xTitle: string): string {
  const [lo, hi] = finiteExtent(fit.residuals, [-1, 1]);
  const m = Math.max(Math.abs(lo), Math.abs(hi)) * 1.1;
  const y = scaleLinear().domain([-m, m]).nice().range([a.top + a.height, a.top]);
  const dots = Array.from(fit.xEl, (v, i) => (Number.isFinite(fit.residuals[i]) && Number.isFinite(v)
    ? el('circle', { class: 'residual-point', cx: x(toX(v)), cy: y(fit.residuals[i]), r: 2, fill: FIT_COLOUR }) : ''));
  const zero = lineSvg(a.left, y(0), a.left + a.width, y(0), { stroke: INK.muted, 'stroke-dasharray': '3 3' });
  return el('g', { class: 'residual-panel' }, xAxisSvg(x, a, xTitle) + yAxisSvg(y, a, 'residual (a.u.)', 3) + zero + dots.join(''));
}

/** Egg length (µm) implied by the profile's two coordinate arrays (xUm / xEl), 1 when unknown. */
function eggLengthFrom(p: Profile): number {
  for (let i = 0; i < p.xEl.length; i++) if (p.xEl[i] > 0 && Number.isFinite(p.xUm[i] / p.xEl[i])) return p.xUm[i] / p.xEl[i];
  return 1;
}

/** SVG of one embryo's profile (see the file comment for what is drawn). */
export function profileFigure(input: ProfileFigureInput, options: ProfileFigureOptions = {}): string {
  const { widthPx, heightPx, title, subtitle } = figureSize(options, `Profile along the AP axis, channel ${input.profile.channel}`,
    'dots: bin means; band: ± SD of the pixels in each bin; shaded: fit range');
  const p = input.profile;
  const eggUm = options.xAxis === 'um' ? eggLengthFrom(p) : 1;
  const toX = (xEl: number): number => xEl * eggUm;
  const fit = input.fit ?? null;
  const withResiduals = (options.showResiduals ?? false) && fit !== null && fit.residuals.length > 0;
  const margin = { right: 20, left: 68, bottom: withResiduals ? Math.round(heightPx * 0.3) + 46 : 52 };
  const channels = input.boundaryChannels ?? [...new Set((input.boundaries ?? []).map((b) => b.channel))];
  // Legend rows under the title, then the label rows, then the plot.
  const earlier = input.earlier ?? [];
  const legendItems: LegendItem[] = [{ label: 'bin mean', colour: DATA_COLOUR, shape: 'dot' }, { label: '± SD of pixels', colour: DATA_COLOUR, shape: 'band' }];
  if (earlier.length > 0) legendItems.push({ label: 'earlier time points (fainter = older)', colour: INK.muted, shape: 'line' });
  if (fit) {
    legendItems.push({ label: `fit: λ = ${withSe(fit.lambdaEl, fit.lambdaSeEl)} EL (${withSe(fit.lambdaUm, fit.lambdaSeUm)} µm)`, colour: FIT_COLOUR, shape: 'line' });
    legendItems.push({ label: 'fit extended', colour: FIT_COLOUR, shape: 'dash' });
  }
  channels.forEach((ch) => legendItems.push({ label: `boundary in ${ch}`, colour: boundaryColour(ch, channels), shape: 'dash' }));
  const titleBottom = 52;
  const legend = legendRowsSvg(legendItems, margin.left, widthPx - margin.right, titleBottom - 2);
  const x = scaleLinear().domain([0, toX(1)]).range([margin.left, widthPx - margin.right]);
  const probe: Ctx = { x, y: scaleLinear(), a: { left: margin.left, top: 0, width: widthPx - margin.left - margin.right, height: 0 }, toX };
  const labelCount = labelRowCount([...boundaryMarks(input.boundaries ?? [], channels, probe).labels, ...landmarkMarks(input.landmarks ?? [], probe).labels],
    margin.left, widthPx - margin.right);
  const top = titleBottom + legend.heightPx + labelCount * LABEL_ROW_PX + 6;
  const a = plotArea(widthPx, heightPx, { ...margin, top });
  const [lo, hi] = options.yDomain ?? finiteExtent([...Array.from(p.mean, (m, i) => [m - p.sd[i], m + p.sd[i]]).flat(), ...earlier.flatMap((e) => Array.from(e.mean))], [0, 1]);
  const c: Ctx = { x, y: scaleLinear().domain([Math.min(0, lo), hi]).nice().range([a.top + a.height, a.top]), a, toX };
  const fm = fit ? fitMarks(fit, c) : { shade: '', curves: '' };
  const bm = boundaryMarks(input.boundaries ?? [], channels, c);
  const lm = landmarkMarks(input.landmarks ?? [], c);
  const clip = clipSvg(a, stableId('clip-profile', `${title}${widthPx}x${heightPx}${p.channel}`));
  const xTitle = options.xAxis === 'um' ? 'distance from the anterior pole (µm)' : 'position along the AP axis, x/EL (0 = anterior pole)';
  let body = clip.def + titleSvg({ ...a, top: titleBottom }, title, subtitle) + legend.svg + fm.shade + xAxisSvg(x, a, withResiduals ? '' : xTitle)
    + yAxisSvg(c.y, a, options.yLabel ?? 'intensity (a.u., background subtracted)', 5, options.yLabel ? null : 'intensity − bg (a.u.)') + clip.wrap(earlierMarks(earlier, c) + dataMarks(p, c) + fm.curves + bm.rules + lm.marks)
    + topLabelsSvg([...bm.labels, ...lm.labels], a.left, a.left + a.width, a.top);
  if (withResiduals && fit) {
    const rTop = a.top + a.height + 26;
    body += residualPanel(fit, x, toX, { left: a.left, top: rTop, width: a.width, height: heightPx - rTop - 52 }, xTitle);
  }
  return svgDocument(widthPx, heightPx, title, body);
}

/** "v ± se" at the precision of the SE (2 significant digits of it, ≥ 3 of the value); "v" alone without an SE. */
function withSe(v: number, se: number): string {
  const d = ciDecimals(v, se);
  return Number.isFinite(se) && se > 0 ? `${fixed(v, d)} ± ${fixed(se, d)}` : fixed(v, d);
}

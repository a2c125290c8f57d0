// Figures of a movie: λ over time, a kymograph (x/EL across, time down), and the local accumulation time τ(x) with
// the synthesis–diffusion–degradation model's line.
import { scaleLinear } from 'd3-scale';
import { clipSvg, plotArea, titleSvg, xAxisSvg, yAxisSvg } from './axes';
import { figureSize, finiteExtent, stableId, type FigureOptions } from './common';
import { legendRowsSvg, legendSvg, type LegendItem } from './legend';

/** Baseline of the subtitle's bottom line, px from the top: legends go in rows under it, then the plot. */
const TITLE_BOTTOM_PX = 52;
import { whiskerPath } from './lambda-figure';
import { BOUNDARY_COLOURS, INK, PROFILE_COLOURS, TIME_MARKER_COLOUR } from './palette';
import { el, lineSvg, px, svgDocument, textSvg } from './svg';

/** Minutes when a movie spans 10 min or more, else seconds: the unit and the divisor from seconds. */
export function movieTimeUnit(spanS: number): { unit: 'min' | 's'; perS: number } {
  return spanS >= 600 ? { unit: 'min', perS: 1 / 60 } : { unit: 's', perS: 1 };
}

/** λ at one time point (x/EL) with its interval; NaN where the fit failed. */
export interface LambdaPoint {
  readonly tS: number;
  readonly lambdaEl: number;
  readonly ciLowEl: number;
  readonly ciHighEl: number;
}

/** SVG: λ (EL) per time point with its confidence interval, and the steady-state λ as a dashed line when given. */
export function lambdaOverTimeFigure(points: readonly LambdaPoint[], options: FigureOptions & { steadyLambdaEl?: number; markTimeS?: number } = {}): string {
  const { widthPx, heightPx, title, subtitle } = figureSize(options, 'Decay length over time', 'dots: λ per time point; whiskers: 95% CI of the fit');
  const steady = options.steadyLambdaEl;
  const hasSteady = steady !== undefined && Number.isFinite(steady);
  // The legend sits in a row under the title, never over the data.
  const margin = { right: 20, bottom: 52, left: 68 };
  const legend = hasSteady
    ? legendRowsSvg([{ label: 'λ per time point', colour: PROFILE_COLOURS.data, shape: 'dot' }, { label: 'steady-state λ', colour: PROFILE_COLOURS.fit, shape: 'dash' }], margin.left, widthPx - margin.right, TITLE_BOTTOM_PX - 2)
    : { svg: '', heightPx: 0 };
  const a = plotArea(widthPx, heightPx, { ...margin, top: TITLE_BOTTOM_PX + legend.heightPx + (legend.heightPx > 0 ? 6 : 0) });
  const span = Math.max(0, ...points.map((p) => p.tS).filter(Number.isFinite));
  const { unit, perS } = movieTimeUnit(span);
  const x = scaleLinear().domain([0, Math.max(span * perS, 1e-9)]).nice().range([a.left, a.left + a.width]);
  const ys = points.flatMap((p) => [p.lambdaEl, p.ciLowEl, p.ciHighEl]);
  const [lo, hi] = finiteExtent([...ys, steady ?? NaN], [0, 0.5]);
  const y = scaleLinear().domain([Math.max(0, lo - (hi - lo) * 0.1), hi + (hi - lo) * 0.1]).nice().range([a.top + a.height, a.top]);
  const clip = clipSvg(a, stableId('lt', `${title}${points.length}`));
  const marks = points.filter((p) => Number.isFinite(p.lambdaEl)).map((p) => {
    const cx = x(p.tS * perS);
    const ci = Number.isFinite(p.ciLowEl) && Number.isFinite(p.ciHighEl)
      ? el('path', { class: 'ci-bar', d: whiskerPath(cx, y(p.ciLowEl), y(p.ciHighEl)), stroke: INK.muted, fill: 'none' }) : '';
    return ci + el('circle', { class: 'lambda-point', cx, cy: y(p.lambdaEl), r: 3, fill: PROFILE_COLOURS.data });
  }).join('');
  const steadyLine = hasSteady
    ? lineSvg(a.left, y(steady), a.left + a.width, y(steady), { class: 'steady-lambda', stroke: PROFILE_COLOURS.fit, 'stroke-width': 2, 'stroke-dasharray': '6 4' }) : '';
  const mark = timeMarkerSvg(options.markTimeS, (tS) => x(tS * perS), a, 'vertical');
  const body = titleSvg({ ...a, top: TITLE_BOTTOM_PX }, title, subtitle) + legend.svg + yAxisSvg(y, a, 'decay length λ (EL)') + xAxisSvg(x, a, `time (${unit})`)
    + clip.def + clip.wrap(steadyLine + mark + marks);
  return svgDocument(widthPx, heightPx, title, body);
}

/** The shown time point as a line across the plot (a window's slider position); '' when not given. */
function timeMarkerSvg(tS: number | undefined, at: (tS: number) => number, a: { left: number; top: number; width: number; height: number }, dir: 'vertical' | 'horizontal'): string {
  if (tS === undefined || !Number.isFinite(tS)) return '';
  const p = at(tS);
  const style = { class: 'time-marker', stroke: TIME_MARKER_COLOUR, 'stroke-width': 2 };
  return dir === 'vertical' ? lineSvg(p, a.top, p, a.top + a.height, style) : lineSvg(a.left, p, a.left + a.width, p, style);
}

/** A kymograph's data: values[t][i] at xEl[i] and timesS[t]; optional boundary and landmark tracks (x/EL per t). */
export interface KymographInput {
  readonly xEl: ArrayLike<number>;
  readonly timesS: ArrayLike<number>;
  readonly values: readonly ArrayLike<number>[];
  readonly tracks?: readonly { readonly label: string; readonly kind: 'boundary' | 'landmark'; readonly xEl: ArrayLike<number> }[];
}

/** Fill colour of a value between lo and hi: white → blue → near black (a light-to-dark ramp that prints in grey). */
function ramp(lo: number, hi: number): (v: number) => string {
  const s = scaleLinear<string>().domain([lo, lo + (hi - lo) * 0.6, hi]).range(['#ffffff', '#3a7dc0', '#0b1f3a']).clamp(true);
  return (v) => (Number.isFinite(v) ? s(v) : INK.shade);
}

/** SVG: the profile at every time point as a heat map, x/EL across and time down, with boundary and landmark tracks. */
export function kymographFigure(input: KymographInput, options: FigureOptions & { markTimeS?: number } = {}): string {
  const { widthPx, heightPx, title, subtitle } = figureSize(options, 'Kymograph', 'gradient signal after background subtraction; darker = higher');
  const items: LegendItem[] = (input.tracks ?? []).map((track, k) => ({
    label: track.label, colour: track.kind === 'boundary' ? BOUNDARY_COLOURS[k % BOUNDARY_COLOURS.length] : INK.axis, shape: track.kind === 'boundary' ? 'line' : 'dash',
  }));
  // The tracks' legend sits in rows under the title, never over the cells.
  const legend = legendRowsSvg(items, 68, widthPx - 20, TITLE_BOTTOM_PX - 2);
  const a = plotArea(widthPx, heightPx, { top: TITLE_BOTTOM_PX + legend.heightPx + (legend.heightPx > 0 ? 6 : 0), right: 20, bottom: 52, left: 68 });
  const n = input.timesS.length;
  const span = n > 0 ? input.timesS[n - 1] : 0;
  const { unit, perS } = movieTimeUnit(span);
  const x = scaleLinear().domain([0, 1]).range([a.left, a.left + a.width]);
  // Each row spans half-way to its neighbours in time, so uneven frame times draw as they are.
  const tEdge = (t: number): number => (t <= 0 ? input.timesS[0] : t >= n ? input.timesS[n - 1] : (input.timesS[t - 1] + input.timesS[t]) / 2);
  // One time point (e.g. --time K): its row fills the plot, on a time axis one unit either side of its time.
  const t0 = n > 0 ? input.timesS[0] * perS : 0;
  const single = n <= 1 || !(span * perS > t0);
  const y = scaleLinear().domain(single ? [t0 - 1, t0 + 1] : [t0, span * perS]).range([a.top, a.top + a.height]);
  const [lo, hi] = finiteExtent(input.values.flatMap((row) => Array.from(row)), [0, 1]);
  const fill = ramp(Math.min(0, lo), hi);
  const xs = Array.from(input.xEl);
  const cellEdges = xs.map((v, i) => [i === 0 ? v - (xs[1] - v) / 2 : (xs[i - 1] + v) / 2, i === xs.length - 1 ? v + (v - xs[i - 1]) / 2 : (v + xs[i + 1]) / 2]);
  const cells = input.values.map((row, t) => {
    const y0 = single ? a.top : y(tEdge(t) * perS), y1 = single ? a.top + a.height : y(tEdge(t + 1) * perS);
    return cellEdges.map(([e0, e1], i) => el('rect', { x: x(e0), y: y0, width: Math.max(0.5, x(e1) - x(e0)), height: Math.max(0.5, y1 - y0), fill: fill(row[i]) })).join('');
  }).join('');
  const tracks = (input.tracks ?? []).map((track, k) => {
    const colour = track.kind === 'boundary' ? BOUNDARY_COLOURS[k % BOUNDARY_COLOURS.length] : INK.axis;
    const pts = Array.from(track.xEl, (v, t) => (Number.isFinite(v) ? `${px(x(v))},${px(y(input.timesS[t] * perS))}` : null));
    const path = pts.map((p, i) => (p === null ? '' : `${i > 0 && pts[i - 1] !== null ? 'L' : 'M'}${p}`)).join('');
    // The track's positions ride along as data (x/EL per time point, empty where none), so a reader of the figure
    // gets the numbers, not only the drawn line.
    const data = { 'data-label': track.label, 'data-x-el': Array.from(track.xEl, (v) => (Number.isFinite(v) ? String(v) : '')).join(' ') };
    return path ? el('path', { class: `track ${track.kind}`, ...data, d: path, fill: 'none', stroke: colour, 'stroke-width': 2, 'stroke-dasharray': track.kind === 'landmark' ? '4 3' : undefined }) : '';
  }).join('');
  const yAxis = yAxisSvg(y, a, `time (${unit}), down`);
  const clip = clipSvg(a, stableId('ky', `${title}${n}`));
  const mark = timeMarkerSvg(options.markTimeS, (tS) => y(tS * perS), a, 'horizontal');
  const body = titleSvg({ ...a, top: TITLE_BOTTOM_PX }, title, subtitle) + legend.svg + clip.def + clip.wrap(el('g', { class: 'kymograph-cells' }, cells || ' ') + tracks + mark)
    + yAxis + xAxisSvg(x, a, 'x/EL (0 = anterior pole)');
  return svgDocument(widthPx, heightPx, title, body);
}

/** τ(x) points with intervals, and the model fit to draw (all optional parts NaN/absent when not measured). */
export interface AccumulationFigureInput {
  readonly xEl: ArrayLike<number>;
  readonly tauS: ArrayLike<number>;
  readonly ciLowS: ArrayLike<number>;
  readonly ciHighS: ArrayLike<number>;
  /** The fitted line τ₀(1 + x/λ_τ) over rangeEl, and the model's line (1 + x/λ)/(2k) with the profile's λ. */
  readonly fit?: { readonly tau0S: number; readonly lambdaTauEl: number; readonly rangeEl: readonly [number, number]; readonly steadyLambdaEl: number } | null;
}

/** SVG: local accumulation time τ(x) with intervals, the fitted line over its range and the model line with the steady λ. */
export function accumulationFigure(input: AccumulationFigureInput, options: FigureOptions = {}): string {
  const { widthPx, heightPx, title, subtitle } = figureSize(options, 'Local accumulation time τ(x)',
    'dots: τ with 95% CI; solid: fit τ₀(1 + x/λ_τ); dashed: model with the steady-state λ');
  const a = plotArea(widthPx, heightPx, { top: 52, right: 20, bottom: 52, left: 68 });
  const all = [...Array.from(input.tauS), ...Array.from(input.ciLowS), ...Array.from(input.ciHighS)];
  const [, hiS] = finiteExtent(all, [0, 60]);
  const { unit, perS } = movieTimeUnit(hiS);
  const x = scaleLinear().domain([0, 1]).range([a.left, a.left + a.width]);
  const y = scaleLinear().domain([0, hiS * perS * 1.1]).nice().range([a.top + a.height, a.top]);
  const marks = Array.from(input.xEl).map((v, i) => {
    if (!Number.isFinite(input.tauS[i])) return '';
    const ci = Number.isFinite(input.ciLowS[i]) && Number.isFinite(input.ciHighS[i])
      ? el('path', { class: 'ci-bar', d: whiskerPath(x(v), y(input.ciLowS[i] * perS), y(input.ciHighS[i] * perS)), stroke: INK.muted, fill: 'none' }) : '';
    return ci + el('circle', { class: 'tau-point', cx: x(v), cy: y(input.tauS[i] * perS), r: 3, fill: PROFILE_COLOURS.data });
  }).join('');
  const f = input.fit;
  let lines = '';
  const items: LegendItem[] = [{ label: 'τ(x) from the movie', colour: PROFILE_COLOURS.data, shape: 'dot' }];
  if (f && Number.isFinite(f.tau0S) && Number.isFinite(f.lambdaTauEl)) {
    const line = (l: number, x0: number, x1: number) => ({ x0: x(x0), y0: y(f.tau0S * (1 + x0 / l) * perS), x1: x(x1), y1: y(f.tau0S * (1 + x1 / l) * perS) });
    const fitted = line(f.lambdaTauEl, f.rangeEl[0], f.rangeEl[1]);
    lines += lineSvg(fitted.x0, fitted.y0, fitted.x1, fitted.y1, { class: 'tau-fit', stroke: PROFILE_COLOURS.fit, 'stroke-width': 2.5 });
    items.push({ label: `fit over ${f.rangeEl[0]}–${f.rangeEl[1]} EL: λ_τ = ${f.lambdaTauEl.toPrecision(2)} EL`, colour: PROFILE_COLOURS.fit, shape: 'line' });
    if (Number.isFinite(f.steadyLambdaEl) && f.steadyLambdaEl > 0) {
      const model = line(f.steadyLambdaEl, 0, 1);
      lines += lineSvg(model.x0, model.y0, model.x1, model.y1, { class: 'tau-model', stroke: INK.axis, 'stroke-width': 1.5, 'stroke-dasharray': '6 4' });
      items.push({ label: `model (1 + x/λ)/(2k), λ = ${f.steadyLambdaEl.toPrecision(2)} EL`, colour: INK.axis, shape: 'dash' });
    }
  }
  const clip = clipSvg(a, stableId('tau', `${title}${input.xEl.length}`));
  const body = titleSvg(a, title, subtitle) + yAxisSvg(y, a, `local accumulation time τ (${unit})`) + xAxisSvg(x, a, 'x/EL (0 = anterior pole)')
    + clip.def + clip.wrap(lines + marks) + legendSvg(items, a.left + 6, a.top + 6, 'left')
    + (marks === '' ? textSvg(a.left + a.width / 2, a.top + a.height / 2, 'no position with a measurable τ', { anchor: 'middle', fill: INK.muted }) : '');
  return svgDocument(widthPx, heightPx, title, body);
}

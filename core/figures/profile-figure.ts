// One embryo's profile: bin means with an SD band, the fitted exponential over its fit range (extrapolated
// dashed), the fit range shaded, boundaries as vertical lines, landmarks as markers, optional residual panel.
import { scaleLinear, type ScaleLinear } from 'd3-scale';
import { area, line } from 'd3-shape';
import type { Boundary, ExponentialFit, LandmarkPosition, Profile } from '../model';
import { clipSvg, plotArea, titleSvg, xAxisSvg, yAxisSvg, type PlotArea } from './axes';
import { figureSize, finiteExtent, stableId, type FigureOptions } from './common';
import { legendSvg, type LegendItem } from './legend';
import { ciDecimals, fixed } from './number-format';
import { INK, seriesColour } from './palette';
import { el, lineSvg, px, svgDocument, textSvg } from './svg';

/** What profileFigure draws; positions come from the model types (x/EL and µm). */
export interface ProfileFigureInput {
  readonly profile: Profile;
  readonly fit?: ExponentialFit | null;
  readonly boundaries?: readonly Boundary[];
  readonly landmarks?: readonly LandmarkPosition[];
}

/** Options: x axis in x/EL (default) or µm from the anterior pole; residual panel below when a fit is given. */
export interface ProfileFigureOptions extends FigureOptions {
  readonly xAxis?: 'el' | 'um';
  readonly showResiduals?: boolean;
  readonly yLabel?: string;
}

type Scale = ScaleLinear<number, number>;
/** Scales of the main panel; `toX` maps x/EL to the x axis unit (x/EL or µm). */
interface Ctx { readonly x: Scale; readonly y: Scale; readonly a: PlotArea; readonly toX: (xEl: number) => number }

const FIT_COLOUR = seriesColour(1);
const DATA_COLOUR = seriesColour(0);

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

function boundaryMarks(boundaries: readonly Boundary[], c: Ctx): string {
  const colour = seriesColour(2);
  const found = boundaries.filter((b) => b.positionEl !== null && Number.isFinite(b.positionEl))
    .sort((p, q) => (p.positionEl as number) - (q.positionEl as number));
  // Boundaries found at nearly the same place (e.g. two methods) share one label, written up along the line.
  const groups: Boundary[][] = [];
  for (const b of found) {
    const last = groups[groups.length - 1];
    if (last && (b.positionEl as number) - (last[0].positionEl as number) < 0.015) last.push(b);
    else groups.push([b]);
  }
  return groups.map((g) => {
    const rules = g.map((b, i) => {
      const xp = c.x(c.toX(b.positionEl as number));
      return lineSvg(xp, c.a.top, xp, c.a.top + c.a.height, { stroke: colour, 'stroke-width': 1.5, 'stroke-dasharray': i % 2 ? '2 3' : '6 3' });
    });
    const xp = c.x(c.toX(g[0].positionEl as number));
    const label = g.map((b) => `${b.channel} ${b.method}`).join(' / ');
    return el('g', { class: 'boundary' }, rules.join('') + textSvg(xp - 5, c.a.top + c.a.height * 0.55, label, { anchor: 'middle', size: 10, fill: colour, rotate: -90 }));
  }).join('');
}

function landmarkMarks(landmarks: readonly LandmarkPosition[], c: Ctx): string {
  const colour = seriesColour(3);
  const yb = c.a.top + c.a.height;
  return landmarks.filter((l) => Number.isFinite(l.xEl)).map((l) => {
    const xp = c.x(c.toX(l.xEl));
    const marker = el('path', { d: `M${px(xp)},${px(yb - 12)}L${px(xp - 6)},${px(yb)}L${px(xp + 6)},${px(yb)}Z`, fill: colour });
    return el('g', { class: 'landmark' }, marker + textSvg(xp, yb - 16, l.name, { anchor: 'middle', size: 10, fill: colour }));
  }).join('');
}

function dataMarks(p: Profile, c: Ctx): string {
  const idx = Array.from({ length: p.xEl.length }, (_, i) => i);
  const ok = (i: number): boolean => Number.isFinite(p.mean[i]) && Number.isFinite(p.xEl[i]);
  const band = area<number>().defined((i) => ok(i) && Number.isFinite(p.sd[i])).x((i) => c.x(c.toX(p.xEl[i])))
    .y0((i) => c.y(p.mean[i] - p.sd[i])).y1((i) => c.y(p.mean[i] + p.sd[i]))(idx) ?? '';
  const dots = idx.filter(ok).map((i) => el('circle', { class: 'data-point', cx: c.x(c.toX(p.xEl[i])), cy: c.y(p.mean[i]), r: 2.2, fill: DATA_COLOUR }));
  return el('path', { class: 'sd-band', d: band, fill: DATA_COLOUR, 'fill-opacity': 0.18 }) + dots.join('');
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
  const a = plotArea(widthPx, heightPx, { top: 52, right: 20, bottom: withResiduals ? Math.round(heightPx * 0.3) + 46 : 52, left: 68 });
  const x = scaleLinear().domain([0, toX(1)]).range([a.left, a.left + a.width]);
  const [lo, hi] = finiteExtent(Array.from(p.mean, (m, i) => [m - p.sd[i], m + p.sd[i]]).flat(), [0, 1]);
  const c: Ctx = { x, y: scaleLinear().domain([Math.min(0, lo), hi]).nice().range([a.top + a.height, a.top]), a, toX };
  const fm = fit ? fitMarks(fit, c) : { shade: '', curves: '' };
  const clip = clipSvg(a, stableId('clip-profile', `${title}${widthPx}x${heightPx}${p.channel}`));
  const xTitle = options.xAxis === 'um' ? 'distance from the anterior pole (µm)' : 'position along the AP axis, x/EL (0 = anterior pole)';
  const legend: LegendItem[] = [{ label: 'bin mean', colour: DATA_COLOUR, shape: 'dot' }, { label: '± SD of pixels', colour: DATA_COLOUR, shape: 'band' }];
  if (fit) legend.push({ label: `fit: λ = ${withSe(fit.lambdaEl, fit.lambdaSeEl)} EL (${withSe(fit.lambdaUm, fit.lambdaSeUm)} µm)`, colour: FIT_COLOUR, shape: 'line' });
  let body = clip.def + titleSvg(a, title, subtitle) + fm.shade + xAxisSvg(x, a, withResiduals ? '' : xTitle)
    + yAxisSvg(c.y, a, options.yLabel ?? 'intensity (a.u., background subtracted)') + clip.wrap(dataMarks(p, c) + fm.curves)
    + boundaryMarks(input.boundaries ?? [], c) + landmarkMarks(input.landmarks ?? [], c) + legendSvg(legend, a.left + a.width - 6, a.top + 6);
  if (withResiduals && fit) {
    const top = a.top + a.height + 26;
    body += residualPanel(fit, x, toX, { left: a.left, top, width: a.width, height: heightPx - top - 52 }, xTitle);
  }
  return svgDocument(widthPx, heightPx, title, body);
}

/** "v ± se" at the precision of the SE (2 significant digits of it, ≥ 3 of the value); "v" alone without an SE. */
function withSe(v: number, se: number): string {
  const d = ciDecimals(v, se);
  return Number.isFinite(se) && se > 0 ? `${fixed(v, d)} ± ${fixed(se, d)}` : fixed(v, d);
}

// One embryo's profile: bin means with an SD band, the fitted exponential over its fit range (extrapolated
// dashed), the fit range shaded, boundaries as vertical lines, landmarks as markers, optional residual panel.
import { scaleLinear, type ScaleLinear } from 'd3-scale';
import { area, line } from 'd3-shape';
import type { Boundary, ExponentialFit, LandmarkPosition, Profile } from '../model';
import { clipSvg, plotArea, titleSvg, xAxisSvg, yAxisSvg, type PlotArea } from './axes';
import { figureSize, finiteExtent, stableId, type FigureOptions } from './common';
import { legendSvg, type LegendItem } from './legend';
import { INK, seriesColour } from './palette';
import { px, svgDocument, textSvg } from './svg';

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

interface Ctx { x: ScaleLinear<number, number>; y: ScaleLinear<number, number>; a: PlotArea; toX: (xEl: number) => number }

function fitMarks(fit: ExponentialFit, c: Ctx): { shade: string; curves: string } {
  const [r0, r1] = fit.fitRangeEl;
  const model = (xEl: number): number => fit.amplitude * Math.exp(-xEl / fit.lambdaEl) + fit.background;
  const xs = Array.from({ length: 201 }, (_, i) => i / 200);
  const path = (keep: (v: number) => boolean): string => line<number>().defined(keep).x((v) => c.x(c.toX(v))).y((v) => c.y(model(v)))(xs) ?? '';
  const shade = `<rect class="fit-range" x="${px(c.x(c.toX(r0)))}" y="${px(c.a.top)}" width="${px(c.x(c.toX(r1)) - c.x(c.toX(r0)))}" height="${px(c.a.height)}" fill="${INK.shade}"/>`;
  const outside = `<path class="fit-extrapolated" d="${path((v) => v <= r0 || v >= r1)}" fill="none" stroke="${seriesColour(1)}" stroke-width="1.2" stroke-dasharray="4 3"/>`;
  const inside = `<path class="fit-curve" d="${path((v) => v >= r0 && v <= r1)}" fill="none" stroke="${seriesColour(1)}" stroke-width="2.2"/>`;
  return { shade, curves: outside + inside };
}

function annotationMarks(input: ProfileFigureInput, c: Ctx): string {
  const parts: string[] = [];
  (input.boundaries ?? []).filter((b) => b.positionEl !== null && Number.isFinite(b.positionEl)).forEach((b, i) => {
    const xp = c.x(c.toX(b.positionEl as number));
    parts.push(`<g class="boundary"><line x1="${px(xp)}" y1="${px(c.a.top)}" x2="${px(xp)}" y2="${px(c.a.top + c.a.height)}" stroke="${seriesColour(2)}" stroke-width="1.5" stroke-dasharray="${i % 2 ? '2 3' : '6 3'}"/>`
      + `${textSvg(xp + 4, c.a.top + 14 + i * 14, `${b.channel} ${b.method}`, { size: 10, fill: seriesColour(2) })}</g>`);
  });
  for (const l of input.landmarks ?? []) {
    if (!Number.isFinite(l.xEl)) continue;
    const xp = c.x(c.toX(l.xEl));
    const yb = c.a.top + c.a.height;
    parts.push(`<g class="landmark"><path d="M${px(xp)},${px(yb - 12)}L${px(xp - 6)},${px(yb)}L${px(xp + 6)},${px(yb)}Z" fill="${seriesColour(3)}"/>`
      + `${textSvg(xp, yb - 16, l.name, { anchor: 'middle', size: 10, fill: seriesColour(3) })}</g>`);
  }
  return parts.join('');
}

function residualPanel(fit: ExponentialFit, x: ScaleLinear<number, number>, toX: (v: number) => number, a: PlotArea, xTitle: string): string {
  const [lo, hi] = finiteExtent(fit.residuals, [-1, 1]);
  const m = Math.max(Math.abs(lo), Math.abs(hi));
  const y = scaleLinear().domain([-m * 1.1, m * 1.1]).nice().range([a.top + a.height, a.top]);
  const dots = Array.from(fit.xEl, (v, i) => (Number.isFinite(fit.residuals[i]) ? `<circle class="residual-point" cx="${px(x(toX(v)))}" cy="${px(y(fit.residuals[i]))}" r="2" fill="${seriesColour(1)}"/>` : ''));
  const zero = `<line x1="${px(a.left)}" y1="${px(y(0))}" x2="${px(a.left + a.width)}" y2="${px(y(0))}" stroke="${INK.muted}" stroke-dasharray="3 3"/>`;
  return `<g class="residual-panel">${xAxisSvg(x, a, xTitle)}${yAxisSvg(y, a, 'residual (a.u.)', 3)}${zero}${dots.join('')}</g>`;
}

/** SVG of one embryo's profile (see the file comment for what is drawn). */
export function profileFigure(input: ProfileFigureInput, options: ProfileFigureOptions = {}): string {
  const { widthPx, heightPx, title, subtitle } = figureSize(options, `Profile along the AP axis, channel ${input.profile.channel}`, 'dots: bin means; band: ± SD of the pixels in each bin; shaded: fit range');
  const p = input.profile;
  const useUm = options.xAxis === 'um';
  const eggUm = useUm ? eggLengthFrom(p) : 1;
  const toX = (xEl: number): number => xEl * eggUm;
  const withResiduals = (options.showResiduals ?? false) && !!input.fit && input.fit.residuals.length > 0;
  const mainBottom = withResiduals ? Math.round(heightPx * 0.3) + 46 : 52;
  const a = plotArea(widthPx, heightPx, { top: 52, right: 20, bottom: mainBottom, left: 68 });
  const x = scaleLinear().domain([0, toX(1)]).range([a.left, a.left + a.width]);
  const idx = Array.from({ length: p.xEl.length }, (_, i) => i);
  const [lo, hi] = finiteExtent(idx.flatMap((i) => [p.mean[i] - p.sd[i], p.mean[i] + p.sd[i]]), [0, 1]);
  const y = scaleLinear().domain([Math.min(0, lo), hi]).nice().range([a.top + a.height, a.top]);
  const c: Ctx = { x, y, a, toX };
  const ok = (i: number): boolean => Number.isFinite(p.mean[i]) && Number.isFinite(p.xEl[i]);
  const band = area<number>().defined((i) => ok(i) && Number.isFinite(p.sd[i])).x((i) => x(toX(p.xEl[i]))).y0((i) => y(p.mean[i] - p.sd[i])).y1((i) => y(p.mean[i] + p.sd[i]))(idx) ?? '';
  const dots = idx.filter(ok).map((i) => `<circle class="data-point" cx="${px(x(toX(p.xEl[i])))}" cy="${px(y(p.mean[i]))}" r="2.2" fill="${seriesColour(0)}"/>`);
  const fit = input.fit ? fitMarks(input.fit, c) : { shade: '', curves: '' };
  const clip = clipSvg(a, stableId('clip-profile', `${title}${widthPx}x${heightPx}${p.channel}`));
  const xTitle = useUm ? 'distance from the anterior pole (µm)' : 'position along the AP axis, x/EL (0 = anterior pole)';
  const legend: LegendItem[] = [{ label: 'bin mean', colour: seriesColour(0), shape: 'dot' }, { label: '± SD of pixels', colour: seriesColour(0), shape: 'band' }];
  if (input.fit) legend.push({ label: `fit: λ = ${input.fit.lambdaEl.toFixed(3)} EL (${input.fit.lambdaUm.toFixed(1)} µm)`, colour: seriesColour(1), shape: 'line' });
  let body = clip.def + titleSvg(a, title, subtitle) + fit.shade + xAxisSvg(x, a, withResiduals ? '' : xTitle) + yAxisSvg(y, a, options.yLabel ?? 'intensity (a.u., background subtracted)')
    + `<g ${clip.attr}><path class="sd-band" d="${band}" fill="${seriesColour(0)}" fill-opacity="0.18"/>${dots.join('')}${fit.curves}</g>` + annotationMarks(input, c) + legendSvg(legend, a.left + a.width - 6, a.top + 6);
  if (withResiduals && input.fit) {
    const r = { left: a.left, top: a.top + a.height + 26, width: a.width, height: heightPx - (a.top + a.height + 26) - 52 };
    body += residualPanel(input.fit, x, toX, r, xTitle);
  }
  return svgDocument(widthPx, heightPx, title, body);
}

/** Egg length (µm) implied by the profile's two coordinate arrays (xUm / xEl), 1 when unknown. */
function eggLengthFrom(p: Profile): number {
  for (let i = 0; i < p.xEl.length; i++) if (p.xEl[i] > 0 && Number.isFinite(p.xUm[i] / p.xEl[i])) return p.xUm[i] / p.xEl[i];
  return 1;
}

// Plot area, axes with ticks, tick labels, grid lines and axis titles (units in the titles).
import type { ScaleLinear } from 'd3-scale';
import { INK } from './palette';
import { el, lineSvg, textSvg } from './svg';

/** The inner plotting rectangle in px (origin top-left of the SVG). */
export interface PlotArea {
  readonly left: number;
  readonly top: number;
  readonly width: number;
  readonly height: number;
}

/** Plot area inside margins (px). */
export function plotArea(widthPx: number, heightPx: number, margin: { top: number; right: number; bottom: number; left: number }): PlotArea {
  return { left: margin.left, top: margin.top, width: widthPx - margin.left - margin.right, height: heightPx - margin.top - margin.bottom };
}

/** Bottom x axis with ticks, labels, vertical grid lines and a title. */
export function xAxisSvg(x: ScaleLinear<number, number>, area: PlotArea, title: string, tickCount = 6): string {
  const bottom = area.top + area.height;
  const fmt = x.tickFormat(tickCount);
  const ticks = x.ticks(tickCount).map((t) => {
    const xp = x(t);
    return lineSvg(xp, area.top, xp, bottom, { class: 'grid', stroke: INK.grid })
      + lineSvg(xp, bottom, xp, bottom + 5, { stroke: INK.axis })
      + textSvg(xp, bottom + 18, fmt(t), { anchor: 'middle', size: 11, cls: 'tick-label' });
  });
  const axis = lineSvg(area.left, bottom, area.left + area.width, bottom, { stroke: INK.axis });
  const label = textSvg(area.left + area.width / 2, bottom + 38, title, { anchor: 'middle', cls: 'axis-title' });
  return el('g', { class: 'axis x-axis' }, ticks.join('') + axis + label);
}

/** Rough width of an axis title at 12 px in a sans-serif font (about 0.55 em a character; common practice). */
function titleWidthPx(title: string): number {
  return title.length * 6.6;
}

/** Left y axis with ticks, labels, horizontal grid lines and a rotated title. */
export function yAxisSvg(y: ScaleLinear<number, number>, area: PlotArea, title: string, tickCount = 5, shortTitle: string | null = null): string {
  const fmt = y.tickFormat(tickCount);
  const right = area.left + area.width;
  const ticks = y.ticks(tickCount).map((t) => {
    const yp = y(t);
    return lineSvg(area.left, yp, right, yp, { class: 'grid', stroke: INK.grid })
      + lineSvg(area.left - 5, yp, area.left, yp, { stroke: INK.axis })
      + textSvg(area.left - 8, yp + 4, fmt(t), { anchor: 'end', size: 11, cls: 'tick-label' });
  });
  const axis = lineSvg(area.left, area.top, area.left, area.top + area.height, { stroke: INK.axis });
  // A title much longer than the plot is tall would run out of the figure: the short one then (when given).
  const shown = shortTitle !== null && titleWidthPx(title) > area.height + 60 ? shortTitle : title;
  const label = textSvg(area.left - 48, area.top + area.height / 2, shown, { anchor: 'middle', rotate: -90, cls: 'axis-title' });
  return el('g', { class: 'axis y-axis' }, ticks.join('') + axis + label);
}

/** Figure title and optional smaller subtitle lines ('\n' separates them) above the plot area; needs a top margin of
 *  about 48 px plus subtitleExtraPx(subtitle). */
export function titleSvg(area: PlotArea, title: string, subtitle = ''): string {
  const lines = subtitle === '' ? [] : subtitle.split('\n');
  const last = area.top - 10;
  const s = lines.map((line, i) => textSvg(area.left, last - (lines.length - 1 - i) * 14, line, { size: 11, fill: '#555555', cls: 'figure-subtitle' })).join('');
  const t = title === '' ? '' : textSvg(area.left, lines.length > 0 ? last - (lines.length - 1) * 14 - 16 : area.top - 14, title, { size: 14, weight: '600', cls: 'figure-title' });
  return t + s;
}

/** Extra top margin (px) that a subtitle of several lines needs beyond the first line. */
export function subtitleExtraPx(subtitle: string): number {
  return subtitle === '' ? 0 : (subtitle.split('\n').length - 1) * 14;
}

/** A clip path limiting marks to the plot area: the <defs> element and a wrapper for clipped content. */
export function clipSvg(area: PlotArea, id: string): { def: string; wrap: (content: string) => string } {
  const rect = el('rect', { x: area.left, y: area.top, width: area.width, height: area.height });
  return {
    def: el('defs', {}, el('clipPath', { id }, rect)),
    wrap: (content) => el('g', { 'clip-path': `url(#${id})` }, content || ' '),
  };
}

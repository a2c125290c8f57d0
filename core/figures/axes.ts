// Plot area, axes with ticks, tick labels, grid lines and axis titles (units in the titles).
import type { ScaleLinear } from 'd3-scale';
import { INK } from './palette';
import { px, textSvg } from './svg';

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
  const y0 = area.top + area.height;
  const fmt = x.tickFormat(tickCount);
  const parts = [`<g class="axis x-axis">`];
  for (const t of x.ticks(tickCount)) {
    const xp = x(t);
    parts.push(`<line class="grid" x1="${px(xp)}" y1="${px(area.top)}" x2="${px(xp)}" y2="${px(y0)}" stroke="${INK.grid}"/>`);
    parts.push(`<line x1="${px(xp)}" y1="${px(y0)}" x2="${px(xp)}" y2="${px(y0 + 5)}" stroke="${INK.axis}"/>`);
    parts.push(textSvg(xp, y0 + 18, fmt(t), { anchor: 'middle', size: 11, cls: 'tick-label' }));
  }
  parts.push(`<line x1="${px(area.left)}" y1="${px(y0)}" x2="${px(area.left + area.width)}" y2="${px(y0)}" stroke="${INK.axis}"/>`);
  parts.push(textSvg(area.left + area.width / 2, y0 + 38, title, { anchor: 'middle', size: 12, cls: 'axis-title' }), '</g>');
  return parts.join('');
}

/** Left y axis with ticks, labels, horizontal grid lines and a rotated title. */
export function yAxisSvg(y: ScaleLinear<number, number>, area: PlotArea, title: string, tickCount = 5): string {
  const fmt = y.tickFormat(tickCount);
  const parts = [`<g class="axis y-axis">`];
  for (const t of y.ticks(tickCount)) {
    const yp = y(t);
    parts.push(`<line class="grid" x1="${px(area.left)}" y1="${px(yp)}" x2="${px(area.left + area.width)}" y2="${px(yp)}" stroke="${INK.grid}"/>`);
    parts.push(`<line x1="${px(area.left - 5)}" y1="${px(yp)}" x2="${px(area.left)}" y2="${px(yp)}" stroke="${INK.axis}"/>`);
    parts.push(textSvg(area.left - 8, yp + 4, fmt(t), { anchor: 'end', size: 11, cls: 'tick-label' }));
  }
  parts.push(`<line x1="${px(area.left)}" y1="${px(area.top)}" x2="${px(area.left)}" y2="${px(area.top + area.height)}" stroke="${INK.axis}"/>`);
  const xt = area.left - 48;
  parts.push(textSvg(xt, area.top + area.height / 2, title, { anchor: 'middle', size: 12, rotate: -90, cls: 'axis-title' }), '</g>');
  return parts.join('');
}

/** Figure title (and an optional smaller subtitle line) above the plot area; needs a top margin of about 48 px. */
export function titleSvg(area: PlotArea, title: string, subtitle = ''): string {
  const t = title === '' ? '' : textSvg(area.left, area.top - (subtitle ? 26 : 14), title, { size: 14, weight: '600', cls: 'figure-title' });
  const s = subtitle === '' ? '' : textSvg(area.left, area.top - 10, subtitle, { size: 11, fill: '#555555', cls: 'figure-subtitle' });
  return t + s;
}

/** A clip path limiting marks to the plot area; returns the element and the attribute to put on clipped groups. */
export function clipSvg(area: PlotArea, id: string): { def: string; attr: string } {
  return {
    def: `<defs><clipPath id="${id}"><rect x="${px(area.left)}" y="${px(area.top)}" width="${px(area.width)}" height="${px(area.height)}"/></clipPath></defs>`,
    attr: `clip-path="url(#${id})"`,
  };
}

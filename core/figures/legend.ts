// A legend box: one row per series with a small swatch (line, dashed line, dot or band) and an escaped label.
import { el, lineSvg, textSvg } from './svg';

/** One legend entry. */
export interface LegendItem {
  readonly label: string;
  readonly colour: string;
  readonly shape: 'line' | 'dash' | 'dot' | 'band';
}

function swatch(item: LegendItem, x: number, y: number): string {
  switch (item.shape) {
    case 'dot': return el('circle', { cx: x + 9, cy: y, r: 4, fill: item.colour });
    case 'band': return el('rect', { x, y: y - 5, width: 18, height: 10, fill: item.colour, 'fill-opacity': 0.25, stroke: item.colour });
    case 'dash': return lineSvg(x, y, x + 18, y, { stroke: item.colour, 'stroke-width': 2, 'stroke-dasharray': '5 3' });
    default: return lineSvg(x, y, x + 18, y, { stroke: item.colour, 'stroke-width': 2 });
  }
}

/** Legend anchored at its top-right corner (or top-left with align 'left'), px; width estimated from the longest label. */
export function legendSvg(items: readonly LegendItem[], x: number, top: number, align: 'left' | 'right' = 'right'): string {
  if (items.length === 0) return '';
  const width = 34 + Math.max(...items.map((i) => i.label.length)) * 6.6;
  const left = align === 'right' ? x - width : x;
  const box = el('rect', { x: left, y: top, width, height: 8 + items.length * 18, fill: '#ffffff', 'fill-opacity': 0.85, stroke: '#cccccc' });
  const rows = items.map((item, i) => swatch(item, left + 8, top + 13 + i * 18) + textSvg(left + 32, top + 17 + i * 18, item.label, { size: 11 }));
  return el('g', { class: 'legend' }, box + rows.join(''));
}

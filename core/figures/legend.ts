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

/** Legend entries in rows from `left` to `right` (px), starting at `top`: for a legend kept off the data. Returns the
 *  markup and the height it takes. Widths are estimated from the label length (6.6 px per character at 11 px). */
export function legendRowsSvg(items: readonly LegendItem[], left: number, right: number, top: number): { svg: string; heightPx: number } {
  if (items.length === 0) return { svg: '', heightPx: 0 };
  const rowPx = 16;
  let x = left, row = 0;
  const parts = items.map((item) => {
    const w = 32 + item.label.length * 6.6 + 12;
    if (x > left && x + w > right) { row += 1; x = left; }
    const y = top + 8 + row * rowPx;
    const part = swatch(item, x, y) + textSvg(x + 24, y + 4, item.label, { size: 11 });
    x += w;
    return part;
  });
  const heightPx = (row + 1) * rowPx;
  return { svg: el('g', { class: 'legend legend-rows', 'data-top': top, 'data-height': heightPx }, parts.join('')), heightPx };
}

/** Rows for labels on one line (x = left end, width in px): each goes to the first row where it overlaps no other. */
export function labelRows(labels: readonly { x: number; width: number }[], gapPx = 4): number[] {
  const rows: { x0: number; x1: number }[][] = [];
  return labels.map((l) => {
    const x0 = l.x - gapPx / 2, x1 = l.x + l.width + gapPx / 2;
    let r = rows.findIndex((row) => row.every((o) => x1 <= o.x0 || o.x1 <= x0));
    if (r < 0) { rows.push([]); r = rows.length - 1; }
    rows[r].push({ x0, x1 });
    return r;
  });
}

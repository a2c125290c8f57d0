// A legend box: one row per series with a small swatch (line, dashed line, dot or band) and an escaped label.
import { px, textSvg } from './svg';

/** One legend entry. */
export interface LegendItem {
  readonly label: string;
  readonly colour: string;
  readonly shape: 'line' | 'dash' | 'dot' | 'band';
}

function swatch(item: LegendItem, x: number, y: number): string {
  switch (item.shape) {
    case 'dot': return `<circle cx="${px(x + 9)}" cy="${px(y)}" r="4" fill="${item.colour}"/>`;
    case 'band': return `<rect x="${px(x)}" y="${px(y - 5)}" width="18" height="10" fill="${item.colour}" fill-opacity="0.25" stroke="${item.colour}"/>`;
    case 'dash': return `<line x1="${px(x)}" y1="${px(y)}" x2="${px(x + 18)}" y2="${px(y)}" stroke="${item.colour}" stroke-width="2" stroke-dasharray="5 3"/>`;
    default: return `<line x1="${px(x)}" y1="${px(y)}" x2="${px(x + 18)}" y2="${px(y)}" stroke="${item.colour}" stroke-width="2"/>`;
  }
}

/** Legend anchored at its top-right corner (or top-left with align 'left'), px; width estimated from the longest label. */
export function legendSvg(items: readonly LegendItem[], x: number, top: number, align: 'left' | 'right' = 'right'): string {
  if (items.length === 0) return '';
  const widest = Math.max(...items.map((i) => i.label.length));
  const width = 34 + widest * 6.6;
  const height = 8 + items.length * 18;
  const left = align === 'right' ? x - width : x;
  const rows = items.map((item, i) => swatch(item, left + 8, top + 13 + i * 18) + textSvg(left + 32, top + 17 + i * 18, item.label, { size: 11 }));
  return `<g class="legend"><rect x="${px(left)}" y="${px(top)}" width="${px(width)}" height="${px(height)}" fill="#ffffff" fill-opacity="0.85" stroke="#cccccc"/>${rows.join('')}</g>`;
}

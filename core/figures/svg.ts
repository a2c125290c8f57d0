// SVG text building blocks: escaping, number formatting and the document wrapper every figure shares.

/** Escape text for SVG/XML content and attribute values. */
export function escapeXml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&apos;');
}

/** A coordinate in px with at most 2 decimals (keeps files small; never "NaN" — non-finite becomes 0). */
export function px(v: number): string {
  return Number.isFinite(v) ? String(Math.round(v * 100) / 100) : '0';
}

/** Font stack used by every figure (system UI font, then any sans-serif). */
export const FONT_FAMILY = 'system-ui, sans-serif';

/** Wrap figure content in a standalone <svg> element with a title for screen readers. */
export function svgDocument(widthPx: number, heightPx: number, title: string, body: string): string {
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${px(widthPx)}" height="${px(heightPx)}" viewBox="0 0 ${px(widthPx)} ${px(heightPx)}"`,
    ` font-family="${FONT_FAMILY}" font-size="12" role="img" aria-label="${escapeXml(title)}">`,
    `<title>${escapeXml(title)}</title>`,
    `<rect class="background" x="0" y="0" width="${px(widthPx)}" height="${px(heightPx)}" fill="#ffffff"/>`,
    body,
    '</svg>',
  ].join('');
}

/** Attribute values: numbers are px-formatted, strings escaped, undefined/null/'' left out. */
export type SvgAttrs = Readonly<Record<string, string | number | null | undefined>>;

/** One SVG element; `content` is inserted as is (already-built markup), so escape text before passing it. */
export function el(tag: string, attrs: SvgAttrs, content = ''): string {
  const parts = Object.entries(attrs)
    .filter(([, v]) => v !== undefined && v !== null && v !== '')
    .map(([k, v]) => `${k}="${typeof v === 'number' ? px(v) : escapeXml(v as string)}"`);
  const open = parts.length > 0 ? `<${tag} ${parts.join(' ')}` : `<${tag}`;
  return content === '' ? `${open}/>` : `${open}>${content}</${tag}>`;
}

/** Text style of textSvg. */
export interface TextStyle {
  readonly anchor?: 'start' | 'middle' | 'end';
  readonly size?: number;
  readonly weight?: string;
  readonly fill?: string;
  /** Rotation in degrees about (x, y). */
  readonly rotate?: number;
  readonly cls?: string;
}

/** A text element with escaped content. */
export function textSvg(x: number, y: number, text: string, style: TextStyle = {}): string {
  return el('text', {
    class: style.cls, x, y, 'text-anchor': style.anchor ?? 'start', 'font-size': style.size ?? 12, fill: style.fill ?? '#222222',
    'font-weight': style.weight, transform: style.rotate ? `rotate(${style.rotate} ${px(x)} ${px(y)})` : undefined,
  }, escapeXml(text) || ' ');
}

/** A straight line segment. */
export function lineSvg(x1: number, y1: number, x2: number, y2: number, attrs: SvgAttrs = {}): string {
  return el('line', { x1, y1, x2, y2, ...attrs });
}

/** Validate width/height options: whole pixels between 120 and 4000; throws with an exact message. */
export function checkSize(widthPx: number, heightPx: number): void {
  for (const [name, v] of [['widthPx', widthPx], ['heightPx', heightPx]] as const) {
    if (!(Number.isFinite(v) && v >= 120 && v <= 4000)) throw new RangeError(`${name} must be a number from 120 to 4000`);
  }
}

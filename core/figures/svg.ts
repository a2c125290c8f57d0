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

/** A text element (escaped); `anchor` is the SVG text-anchor. */
export function textSvg(x: number, y: number, text: string, attrs: { anchor?: 'start' | 'middle' | 'end'; size?: number; weight?: string; fill?: string; rotate?: number; cls?: string } = {}): string {
  const rot = attrs.rotate ? ` transform="rotate(${attrs.rotate} ${px(x)} ${px(y)})"` : '';
  const cls = attrs.cls ? ` class="${attrs.cls}"` : '';
  const weight = attrs.weight ? ` font-weight="${attrs.weight}"` : '';
  return `<text${cls} x="${px(x)}" y="${px(y)}" text-anchor="${attrs.anchor ?? 'start'}" font-size="${attrs.size ?? 12}" fill="${attrs.fill ?? '#222222'}"${weight}${rot}>${escapeXml(text)}</text>`;
}

/** Validate width/height options: whole pixels between 120 and 4000; throws with an exact message. */
export function checkSize(widthPx: number, heightPx: number): void {
  for (const [name, v] of [['widthPx', widthPx], ['heightPx', heightPx]] as const) {
    if (!(Number.isFinite(v) && v >= 120 && v <= 4000)) throw new RangeError(`${name} must be a number from 120 to 4000`);
  }
}

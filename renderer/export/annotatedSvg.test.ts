import { describe, expect, it } from 'vitest';
import { annotatedSvg } from './annotatedSvg';

// Demo input.
describe('annotatedSvg', () => {
  it('sizes the document to the image and embeds image and overlay', () => {
    const s = annotatedSvg(20, 10, 'data:image/png;base64,AAA', '<circle r="1"/>');
    expect(s.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true);
    expect(s).toContain('viewBox="0 0 20 10"');
    expect(s).toContain('href="data:image/png;base64,AAA"');
    expect(s.endsWith('<circle r="1"/></svg>')).toBe(true);
  });
  it('adds a scale bar of the given length at the bottom left', () => {
    const s = annotatedSvg(200, 100, 'data:,', '', { lengthUm: 50, lengthPx: 33.3 });
    expect(s).toContain('<rect x="12" y="84" width="33.3" height="4" fill="#ffffff"/>');
    expect(s).toContain('>50 µm</text>');
  });
});

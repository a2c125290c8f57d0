import { describe, expect, it } from 'vitest';
import { legendRows, profilePanels } from './profileLayout';

// Demo data: made-up legend labels; positions worked by hand (20 px swatch and gap + 5.6 px per character + 14 px).
describe('profile plot layout', () => {
  it('wraps legend entries onto a new row when the next would pass the right edge', () => {
    const e = (label: string) => ({ label, colour: '#000', shape: 'line' as const });
    const r = legendRows([e('aaaaa'), e('bbbbb'), e('ccccc')], 0, 130);
    // Each entry is 20 + 28 + 14 = 62 px wide: two fit in 130 px, the third starts row 2.
    expect(r.items.map((i) => [i.x, i.y])).toEqual([[0, 9], [62, 9], [0, 23]]);
    expect(r.heightPx).toBe(32);
  });
  it('stacks legend, main panel, residual panel and x axis within the height', () => {
    const { main, res } = profilePanels(300, 18);
    expect(main.top).toBe(24);
    expect(res.height).toBe(54); // 18% of 300
    expect(res.top).toBe(main.top + main.height + 10);
    expect(res.top + res.height + 34).toBe(300);
  });
});

import { describe, expect, it } from 'vitest';
import { parseHexColour } from './colour';
import { compositeRgba } from './composite';
import { autoDisplayRange, dataRange, displayRangeAfterKey, histogramCounts } from './histogram';

// Demo data, worked by hand.
const plane = (data: number[], width = data.length) => ({ width, height: data.length / width, data: Float32Array.from(data) });

describe('parseHexColour', () => {
  it('parses #rrggbb and falls back to white', () => {
    expect(parseHexColour('#ff8000')).toEqual([255, 128, 0]);
    expect(parseHexColour('red')).toEqual([255, 255, 255]);
  });
});

describe('compositeRgba', () => {
  const display = (mode: 'single' | 'merged', active = 0) => ({
    mode, active, channels: [{ colour: '#ff0000', low: 0, high: 10 }, { colour: '#0000ff', low: 0, high: 100 }],
  });
  it('scales one channel linearly and clamps, NaN as 0', () => {
    const out = compositeRgba([plane([-1, 5, 10, 20, Number.NaN])], display('single'));
    expect(Array.from(out.filter((_, i) => i % 4 === 0))).toEqual([0, 128, 255, 255, 0]);
    expect(out[3]).toBe(255);
  });
  it('adds merged channels', () => {
    const out = compositeRgba([plane([5]), plane([50])], display('merged'));
    expect(Array.from(out)).toEqual([128, 0, 128, 255]);
  });
  it('shows only the active channel in single mode', () => {
    expect(Array.from(compositeRgba([plane([5]), plane([50])], display('single', 1)))).toEqual([0, 0, 128, 255]);
  });
});

describe('histogram helpers', () => {
  it('dataRange finds min and max', () => {
    expect(dataRange(plane([3, -2, 7]))).toEqual([-2, 7]);
  });
  it('histogramCounts bins values, hi in the last bin', () => {
    expect(Array.from(histogramCounts(plane([0, 1, 2, 3, 4]), 2, 0, 4))).toEqual([2, 3]);
  });
  it('autoDisplayRange ignores a single hot pixel at 0.2 % clipping', () => {
    const data = Array.from({ length: 1000 }, (_, i) => i % 100);
    data[0] = 10_000;
    const [lo, hi] = autoDisplayRange(plane(data, 100));
    expect(lo).toBeLessThanOrEqual(1);
    expect(hi).toBeGreaterThanOrEqual(99);
    expect(hi).toBeLessThan(200);
  });
});

describe('displayRangeAfterKey', () => {
  const data = { lo: 0, hi: 1000 };
  it('steps 1% of the data span per arrow, 10% with Shift', () => {
    expect(displayRangeAfterKey('low', 'ArrowRight', false, { low: 100, high: 900 }, data)).toEqual({ low: 110, high: 900 });
    expect(displayRangeAfterKey('high', 'ArrowDown', true, { low: 100, high: 900 }, data)).toEqual({ low: 100, high: 800 });
  });
  it('jumps to the data ends with Home and End, stays inside them, and never lets the handles cross', () => {
    expect(displayRangeAfterKey('low', 'Home', false, { low: 100, high: 900 }, data)).toEqual({ low: 0, high: 900 });
    expect(displayRangeAfterKey('high', 'End', false, { low: 100, high: 900 }, data)).toEqual({ low: 100, high: 1000 });
    expect(displayRangeAfterKey('low', 'ArrowLeft', true, { low: 50, high: 900 }, data)).toEqual({ low: 0, high: 900 });
    expect(displayRangeAfterKey('low', 'End', false, { low: 100, high: 300 }, data)).toEqual({ low: 300, high: 300 });
    expect(displayRangeAfterKey('high', 'Home', false, { low: 100, high: 300 }, data)).toEqual({ low: 100, high: 100 });
  });
  it('ignores other keys', () => {
    expect(displayRangeAfterKey('low', 'a', false, { low: 1, high: 2 }, data)).toBeNull();
  });
});

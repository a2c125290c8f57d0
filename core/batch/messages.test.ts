import { describe, expect, it } from 'vitest';
import { errorResult } from '../model';
import { clipMessage, collapseMessages, MAX_CELL_CHARS, tidyMessages, warningsCell } from './messages';

// Demo data: messages shaped like the decoder's and the reader's; the limits are this project's own.
describe('clipMessage', () => {
  it('folds line breaks and cuts long text to 300 characters ending in …', () => {
    expect(clipMessage('a.tif: bad\n  strip\r\n3')).toBe('a.tif: bad strip 3');
    const huge = `a.tif: Unknown compression method identifier: ${'0,'.repeat(5_000_000)}`;
    const cut = clipMessage(huge);
    expect(cut).toHaveLength(MAX_CELL_CHARS);
    expect(cut.startsWith('a.tif: Unknown compression method identifier: 0,0,')).toBe(true);
    expect(cut.endsWith('…')).toBe(true);
  });
  it('never splits a surrogate pair', () => {
    const text = `${'x'.repeat(298)}😀😀`;
    const cut = clipMessage(text);
    expect(cut).toBe(`${'x'.repeat(298)}…`);
  });
});

describe('collapseMessages and warningsCell', () => {
  it('collapses repeats and messages that differ only in numbers, with a count', () => {
    const decoder = Array.from({ length: 40 }, (_, i) => `TIFFReadDirectory: unknown field with tag ${50000 + i} encountered`);
    expect(collapseMessages(['pixel size unknown', ...decoder, 'pixel size unknown'])).toEqual([
      'pixel size unknown (×2)', 'TIFFReadDirectory: unknown field with tag 50000 encountered (×40)',
    ]);
  });
  it('keeps the warnings cell within 300 characters, saying how many were left out', () => {
    const many = Array.from({ length: 30 }, (_, i) => `warning ${String.fromCharCode(65 + (i % 26))}${'y'.repeat(i)} about something`);
    const cell = warningsCell(many);
    expect(cell.length).toBeLessThanOrEqual(MAX_CELL_CHARS);
    expect(cell).toMatch(/; … and \d+ more warnings, see results\.json$/);
    expect(warningsCell(['one', 'two'])).toBe('one; two');
    const cellOfOneLong = warningsCell([`${'z'.repeat(400)}`, 'b']);
    expect(cellOfOneLong.length).toBeLessThanOrEqual(MAX_CELL_CHARS);
    expect(cellOfOneLong.endsWith('… and 1 more warning, see results.json')).toBe(true);
  });
  it('tidyMessages clips the error and collapses the warnings of a result', () => {
    const r = tidyMessages({ ...errorResult('a.tif', `a.tif: ${'9,'.repeat(1000)}`), warnings: ['w 1', 'w 2', 'w 3'] });
    expect(r.error?.length).toBe(MAX_CELL_CHARS);
    expect(r.warnings).toEqual(['w 1 (×3)']);
  });
});

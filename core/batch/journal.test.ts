import { describe, expect, it } from 'vitest';
import { errorResult, type EmbryoResult } from '../model';
import { DEFAULT_SETTINGS } from '../settings';
import { journalFileLine, journalRunLine, normalizeResult, parseJournal, settingsKeyText } from './journal';

// Demo data: results built by hand; the format is this project's own (documented in journal.ts).
const okResult = (file: string): EmbryoResult => ({
  ...errorResult(file, 'x'), status: 'ok', error: null,
  gradientProfile: { channel: 'g', xEl: Float64Array.of(0.1, 0.2), xUm: Float64Array.of(Number.NaN, 20), mean: Float64Array.of(1, 2), sd: Float64Array.of(0, 0), n: Float64Array.of(3, 4) },
} as EmbryoResult);

describe('journal lines', () => {
  it('writes one line per entry and reads them back; the later entry of a file wins; a cut last line is skipped', () => {
    const a = { file: 'a.tif', sha256: 'aa', bytes: 10, settingsKey: 'k', result: okResult('a.tif') };
    const text = journalRunLine('r1', '2026-01-01T00:00:00.000Z', '0.1.0', false)
      + journalFileLine(a) + journalFileLine({ ...a, sha256: 'bb' }) + journalFileLine({ ...a, file: 'b.tif', result: okResult('b.tif') });
    expect(text.split('\n').filter(Boolean)).toHaveLength(4);
    const cut = text + journalFileLine({ ...a, file: 'c.tif' }).slice(0, 30);
    const parsed = parseJournal(cut);
    expect(parsed.runs).toEqual([{ type: 'run', schema: 'eggline-journal', version: 1, runId: 'r1', startedAt: '2026-01-01T00:00:00.000Z', eggline: '0.1.0', resumed: false }]);
    expect([...parsed.entries.keys()]).toEqual(['a.tif', 'b.tif']);
    expect(parsed.entries.get('a.tif')?.sha256).toBe('bb');
    expect(parsed.skippedLines).toBe(1);
    const profile = parsed.entries.get('a.tif')?.result.gradientProfile;
    expect(profile?.xEl).toBeInstanceOf(Float64Array);
    expect(Array.from(profile?.xUm ?? [])).toEqual([Number.NaN, 20]);
  });
  it('normalizeResult is what reading back gives, so reused and fresh results make the same tables', () => {
    const r = okResult('a.tif');
    const back = parseJournal(journalFileLine({ file: 'a.tif', sha256: 's', bytes: 1, settingsKey: 'k', result: r })).entries.get('a.tif')?.result;
    expect(normalizeResult(r)).toEqual(back);
  });
  it('the settings key text does not depend on key order, and changes with settings, hand edits and version', () => {
    const reordered = Object.fromEntries(Object.entries(DEFAULT_SETTINGS).reverse()) as typeof DEFAULT_SETTINGS;
    expect(settingsKeyText(reordered, null, '1')).toBe(settingsKeyText(DEFAULT_SETTINGS, null, '1'));
    expect(settingsKeyText(DEFAULT_SETTINGS, null, '2')).not.toBe(settingsKeyText(DEFAULT_SETTINGS, null, '1'));
    expect(settingsKeyText(DEFAULT_SETTINGS, { axis: null, landmarks: [] }, '1')).not.toBe(settingsKeyText(DEFAULT_SETTINGS, null, '1'));
  });
});

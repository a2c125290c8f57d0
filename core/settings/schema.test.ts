import { describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from './defaults';
import {
  fieldProblem, mergeSettings, overridesFromJson, settingProblem, settingsFromFlags, settingsFromStored, settingsInForce,
  settingsProblem, settingValue,
} from './check';
import { flagKey, SETTINGS, settingSpec } from './schema';

// Source for every expected message below: this project's settings rules (the wording is pinned on purpose, and the
// same rule text must reach the command line, config files, project files and the window). Values are demo data.
describe('the settings table', () => {
  it('has one row per setting with a flag, a label, a help line and a rule, and the defaults obey it', () => {
    for (const spec of SETTINGS) {
      expect(spec.flag).toMatch(/^--[a-z][a-z-]*$/);
      expect(spec.label.length).toBeGreaterThan(0);
      expect(spec.help.length).toBeGreaterThan(0);
      expect(spec.rule.length).toBeGreaterThan(0);
      expect(spec.isValid(settingValue(DEFAULT_SETTINGS, spec.key))).toBe(true);
    }
    expect(settingsProblem(DEFAULT_SETTINGS)).toBeNull();
    // Flags are unique, except that --projection slice:Z also sets the slice.
    const flags = SETTINGS.filter((s) => s.key !== 'sliceIndex').map((s) => s.flag);
    expect(new Set(flags).size).toBe(flags.length);
  });
  it('covers every field of AnalysisSettings', () => {
    const leaves = (o: object, prefix = ''): string[] => Object.entries(o).flatMap(([k, v]) =>
      (v !== null && typeof v === 'object' && !Array.isArray(v) && (k === 'profile' || k === 'background') ? leaves(v, `${k}.`) : [`${prefix}${k}`]));
    expect(new Set(SETTINGS.map((s) => s.key))).toEqual(new Set(leaves(DEFAULT_SETTINGS)));
  });
  it('names flags by their keys', () => expect(flagKey('--edge-depth')).toBe('edgeDepth'));
});

describe('one rule, every layer', () => {
  it('a reversed fit range: the same rule from the window, a config file, a project file and the command line', () => {
    const rule = 'two numbers [a, b] with 0 ≤ a < b ≤ 1';
    expect(fieldProblem('fitRangeEl', [0.7, 0.6])).toBe(`fit range x/EL must be ${rule} (got 0.7, 0.6)`);
    expect(() => overridesFromJson({ fitRangeEl: [0.7, 0.6] }, 'c.json')).toThrow(`c.json: "fitRangeEl" must be ${rule}`);
    expect(() => settingsFromStored({ fitRangeEl: [0.7, 0.6] })).toThrow(`settings.fitRangeEl must be ${rule}`);
    expect(() => settingsFromFlags({ fitRange: '0.7,0.6' })).toThrow('--fit-range must be two numbers 0 ≤ a < b ≤ 1 written as a,b (got "0.7,0.6")');
  });
  it('bins: one range (10 to 2000) everywhere', () => {
    expect(settingProblem('profile.binCount', 5)).toBe('bins must be a whole number from 10 to 2000');
    expect(settingProblem('profile.binCount', 2000)).toBeNull();
    expect(() => settingsFromFlags({ bins: '2001' })).toThrow('--bins must be a whole number from 10 to 2000 (got "2001")');
    expect(() => settingsFromStored({ profile: { binCount: 10000 } })).toThrow('settings.profile.binCount must be a whole number from 10 to 2000');
  });
});

describe('flags for every setting', () => {
  it('reads the flags that had none before', () => {
    expect(settingsFromFlags({
      edgeDepth: '8.5', stripWidth: '30', bins: '50', edgeSide: 'dorsal', dorsalSide: 'right', background: 'none',
      boundaryMethods: 'logistic,threshold', threshold: '0.3', timeIndex: '2',
    })).toEqual({
      profile: { edgeDepthUm: 8.5, axisWidthUm: 30, binCount: 50, edgeSide: 'dorsal', dorsalSide: 'right' },
      background: { mode: 'none' }, boundaryMethods: ['logistic', 'threshold'], boundaryThresholdFraction: 0.3, timeIndex: 2,
    });
    expect(settingsFromFlags({ backgroundRegion: '1,2,30,40', background: 'region' }))
      .toEqual({ background: { mode: 'region', regionPx: { x: 1, y: 2, width: 30, height: 40 } } });
  });
  it('reads image files and per-channel boundary windows', () => {
    expect(settingsFromFlags({ flat: 'f.tif', backgroundImage: 'dark.tif', channelWindow: ['2=0.2,0.6', 'late=0.1,0.5', 'a=b=0,1'] })).toEqual({
      flatFieldFile: 'f.tif', backgroundImageFile: 'dark.tif',
      boundaryWindows: [{ channel: 2, rangeEl: [0.2, 0.6] }, { channel: 'late', rangeEl: [0.1, 0.5] }, { channel: 'a=b', rangeEl: [0, 1] }],
    });
    expect(() => settingsFromFlags({ channelWindow: ['2=0.6,0.2'] }))
      .toThrow('--channel-window must be CH=a,b with CH a channel number or name and 0 ≤ a < b ≤ 1 (got "2=0.6,0.2")');
    expect(() => settingsFromFlags({ channelWindow: ['0.2,0.6'] })).toThrow('--channel-window must be CH=a,b');
    expect(() => settingsFromFlags({ flat: ' ' })).toThrow('--flat must be a file path (got " ")');
    expect(settingsFromStored({ boundaryWindows: [{ channel: 2, rangeEl: [0.1, 0.4] }], flatFieldFile: 'f.tif' }).boundaryWindows).toEqual([{ channel: 2, rangeEl: [0.1, 0.4] }]);
    expect(() => settingsFromStored({ boundaryWindows: [{ channel: 0, rangeEl: [0.1, 0.4] }] }))
      .toThrow('settings.boundaryWindows must be a list of { channel, rangeEl: [a, b] } with 0 ≤ a < b ≤ 1');
  });
  it('refuses bad values with the rule', () => {
    expect(() => settingsFromFlags({ edgeDepth: '0' })).toThrow('--edge-depth must be a positive number of µm (got "0")');
    expect(() => settingsFromFlags({ edgeSide: 'top' })).toThrow('--edge-side must be dorsal, ventral, both or each (got "top")');
    expect(() => settingsFromFlags({ threshold: '1' })).toThrow('--threshold must be a number between 0 and 1 (got "1")');
    expect(() => settingsFromFlags({ boundaryMethods: 'logistic,spline' }))
      .toThrow('--boundary-methods must be logistic, half-max and/or threshold, comma-separated (got "logistic,spline")');
    expect(() => settingsFromFlags({ backgroundRegion: '1,2,0,4' }))
      .toThrow('--background-region must be four whole numbers x,y,width,height with width and height > 0 (got "1,2,0,4")');
  });
});

describe('layers and the settings in force', () => {
  it('defaults < project < config < flags, nested groups key by key', () => {
    const project = settingsFromStored({ profile: { edgeDepthUm: 9 }, fitRangeEl: [0.2, 0.7] });
    const s = mergeSettings(DEFAULT_SETTINGS, project, overridesFromJson({ profile: { binCount: 60 } }, 'c.json'), settingsFromFlags({ fitRange: '0.15,0.5' }));
    expect([s.profile.edgeDepthUm, s.profile.binCount, s.profile.mode, s.fitRangeEl]).toEqual([9, 60, 'edge', [0.15, 0.5]]);
  });
  it('a file\'s own fit range wins over the shared one', () => {
    expect(settingsInForce(DEFAULT_SETTINGS, { fitRangeEl: [0.2, 0.5] }).fitRangeEl).toEqual([0.2, 0.5]);
    expect(settingsInForce(DEFAULT_SETTINGS, { fitRangeEl: null })).toBe(DEFAULT_SETTINGS);
    expect(settingsInForce(DEFAULT_SETTINGS, null)).toBe(DEFAULT_SETTINGS);
  });
  it('checks rules across settings', () => {
    expect(settingsProblem({ ...DEFAULT_SETTINGS, sliceIndex: 2 })).toBe('a slice index (2) is set but the projection is "mean", not "slice"');
    expect(settingSpec('sliceIndex').flag).toBe('--projection');
  });
});

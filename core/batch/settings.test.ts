import { describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from '../settings';
import { mergeSettings } from '../settings';
import { parseConfigText } from './parse-config';
import { parseSettingsFlags } from './parse-flags';

// Source for every expected message below: this project's option rules (the messages are pinned on purpose).
describe('parseSettingsFlags', () => {
  it('parses every settings flag', () => {
    expect(parseSettingsFlags({
      gradientChannel: '2', boundaryChannel: ['hb-like', '3'], pixelSize: '0.65', projection: 'slice:4',
      profile: 'axis', fitRange: '0.05, 0.5', anterior: 'high',
    })).toEqual({
      gradientChannel: 2, boundaryChannels: ['hb-like', 3], pixelSizeUm: 0.65, projection: 'slice', sliceIndex: 4,
      profile: { mode: 'axis' }, fitRangeEl: [0.05, 0.5], anterior: 'high',
    });
    expect(parseSettingsFlags({})).toEqual({});
  });
  it.each([
    ['0.6,0.1'], ['0.1'], ['a,b'], ['-0.1,0.5'], ['0.1,1.5'], ['0.2,0.2'], ['0.1,0.2,0.3'],
  ])('rejects --fit-range %s', (text) => {
    expect(() => parseSettingsFlags({ fitRange: text }))
      .toThrow(`--fit-range must be two numbers 0 ≤ a < b ≤ 1 written as a,b (got "${text}")`);
  });
  it('pins the other messages', () => {
    expect(() => parseSettingsFlags({ pixelSize: '0' })).toThrow('--pixel-size must be a positive number of µm per pixel (got "0")');
    expect(() => parseSettingsFlags({ pixelSize: 'abc' })).toThrow('--pixel-size must be a positive number of µm per pixel (got "abc")');
    expect(() => parseSettingsFlags({ projection: 'median' }))
      .toThrow('--projection must be max, mean, sum, slice or slice:Z with Z a 0-based slice number (got "median")');
    expect(() => parseSettingsFlags({ profile: 'ring' })).toThrow('--profile must be edge or axis (got "ring")');
    expect(() => parseSettingsFlags({ anterior: 'left' })).toThrow('--anterior must be auto, high or low (got "left")');
    expect(() => parseSettingsFlags({ gradientChannel: '0' }))
      .toThrow('--gradient-channel must be a channel number (1-based) or a channel name (got "0")');
  });
});

describe('parseConfigText', () => {
  it('accepts a subset of settings including nested groups', () => {
    expect(parseConfigText('{"fitRangeEl":[0.2,0.7],"profile":{"edgeDepthUm":8},"boundaryChannels":["b"]}', 'c.json'))
      .toEqual({ fitRangeEl: [0.2, 0.7], profile: { edgeDepthUm: 8 }, boundaryChannels: ['b'] });
  });
  it('pins the messages', () => {
    expect(() => parseConfigText('{', 'c.json')).toThrow(/^c\.json: not valid JSON \(/);
    expect(() => parseConfigText('[]', 'c.json')).toThrow('c.json: the file must be a JSON object');
    expect(() => parseConfigText('{"fitRange":[0,1]}', 'c.json')).toThrow('c.json: unknown setting "fitRange"');
    expect(() => parseConfigText('{"fitRangeEl":[0.5,0.1]}', 'c.json'))
      .toThrow('c.json: "fitRangeEl" must be two numbers [a, b] with 0 ≤ a < b ≤ 1');
    expect(() => parseConfigText('{"profile":{"mode":"ring"}}', 'c.json')).toThrow('c.json: "profile.mode" must be "edge" or "axis"');
    expect(() => parseConfigText('{"profile":{"depth":3}}', 'c.json')).toThrow('c.json: unknown setting "profile.depth"');
    expect(() => parseConfigText('{"pixelSizeUm":-1}', 'c.json')).toThrow('c.json: "pixelSizeUm" must be a positive number (µm per pixel) or null');
  });
});

describe('mergeSettings (defaults < config < flags)', () => {
  it('lets flags win over config and config over defaults, merging nested groups key by key', () => {
    const config = parseConfigText('{"fitRangeEl":[0.2,0.7],"anterior":"low","profile":{"edgeDepthUm":8}}', 'c.json');
    const flags = parseSettingsFlags({ fitRange: '0.1,0.4', profile: 'axis' });
    const s = mergeSettings(DEFAULT_SETTINGS, config, flags);
    expect(s.fitRangeEl).toEqual([0.1, 0.4]);
    expect(s.anterior).toBe('low');
    expect(s.profile).toEqual({ ...DEFAULT_SETTINGS.profile, edgeDepthUm: 8, mode: 'axis' });
    expect(s.projection).toBe(DEFAULT_SETTINGS.projection);
    expect(DEFAULT_SETTINGS.fitRangeEl).toEqual([0.1, 0.6]);
  });
  it('a --projection flag clears a slice index set in the config', () => {
    const config = parseConfigText('{"projection":"slice","sliceIndex":3}', 'c.json');
    const s = mergeSettings(DEFAULT_SETTINGS, config, parseSettingsFlags({ projection: 'max' }));
    expect([s.projection, s.sliceIndex]).toEqual(['max', null]);
  });
  it('rejects contradictory combinations', () => {
    expect(() => mergeSettings(DEFAULT_SETTINGS, { sliceIndex: 2 }))
      .toThrow('a slice index (2) is set but the projection is "mean", not "slice"');
    expect(() => mergeSettings(DEFAULT_SETTINGS, { background: { mode: 'region' } }))
      .toThrow('background mode "region" needs background.regionPx { x, y, width, height }');
  });
});

// Read a JSON settings file (same keys as AnalysisSettings, any subset) into validated overrides.
import type { BoundaryMethod } from '../model';
import { BatchOptionError } from './option-error';
import type { SettingsOverrides } from './parse-flags';

type Check = (value: unknown) => boolean;
const isNum: Check = (v) => typeof v === 'number' && Number.isFinite(v);
const isPos: Check = (v) => isNum(v) && (v as number) > 0;
const isCount: Check = (v) => Number.isInteger(v) && (v as number) >= 0;
const isChannel: Check = (v) => (Number.isInteger(v) && (v as number) >= 1) || (typeof v === 'string' && v.trim() !== '');
const among = (...allowed: unknown[]): Check => (v) => allowed.includes(v);
const METHODS: readonly BoundaryMethod[] = ['logistic', 'half-max', 'threshold'];

/** What each top-level key must be, as [check, wording of the rule]. */
const TOP: Record<string, [Check, string]> = {
  gradientChannel: [isChannel, 'a channel number (1-based) or a channel name'],
  boundaryChannels: [(v) => Array.isArray(v) && v.every(isChannel), 'a list of channel numbers (1-based) or names'],
  pixelSizeUm: [(v) => v === null || isPos(v), 'a positive number (µm per pixel) or null'],
  projection: [among('max', 'mean', 'sum', 'slice'), '"max", "mean", "sum" or "slice"'],
  sliceIndex: [(v) => v === null || isCount(v), 'a 0-based slice number or null'],
  fitRangeEl: [(v) => Array.isArray(v) && v.length === 2 && v.every(isNum) && v[0] >= 0 && v[0] < v[1] && v[1] <= 1,
    'two numbers [a, b] with 0 ≤ a < b ≤ 1'],
  anterior: [among('auto', 'high', 'low'), '"auto", "high" or "low"'],
  boundaryMethods: [(v) => Array.isArray(v) && v.length > 0 && v.every((m) => METHODS.includes(m as BoundaryMethod)),
    'a non-empty list of "logistic", "half-max", "threshold"'],
  boundaryThresholdFraction: [(v) => isNum(v) && (v as number) > 0 && (v as number) < 1, 'a number between 0 and 1'],
  timeIndex: [isCount, 'a 0-based time point number'],
};

const PROFILE: Record<string, [Check, string]> = {
  mode: [among('edge', 'axis'), '"edge" or "axis"'],
  edgeSide: [among('dorsal', 'ventral', 'both'), '"dorsal", "ventral" or "both"'],
  dorsalSide: [among('left', 'right'), '"left" or "right"'],
  edgeDepthUm: [isPos, 'a positive number of µm'],
  axisWidthUm: [isPos, 'a positive number of µm'],
  binCount: [(v) => Number.isInteger(v) && (v as number) >= 10 && (v as number) <= 2000, 'a whole number from 10 to 2000'],
};

const isRegion: Check = (v) => v === null || (typeof v === 'object' && ['x', 'y', 'width', 'height']
  .every((k) => isCount((v as Record<string, unknown>)[k])) && (v as { width: number }).width > 0 && (v as { height: number }).height > 0);
const BACKGROUND: Record<string, [Check, string]> = {
  mode: [among('outside', 'region', 'none'), '"outside", "region" or "none"'],
  regionPx: [isRegion, 'null or { x, y, width, height } in whole pixels'],
};

function checkGroup(obj: unknown, rules: Record<string, [Check, string]>, label: string, prefix: string): Record<string, unknown> {
  if (typeof obj !== 'object' || obj === null || Array.isArray(obj)) {
    throw new BatchOptionError(`${label}: ${prefix ? `"${prefix.slice(0, -1)}"` : 'the file'} must be a JSON object`);
  }
  for (const [key, value] of Object.entries(obj)) {
    const rule = rules[key];
    if (!rule) throw new BatchOptionError(`${label}: unknown setting "${prefix}${key}"`);
    if (!rule[0](value)) throw new BatchOptionError(`${label}: "${prefix}${key}" must be ${rule[1]}`);
  }
  return obj as Record<string, unknown>;
}

/** Validate a parsed settings JSON object; `label` (the file name) starts every error message. */
export function settingsFromConfig(json: unknown, label: string): SettingsOverrides {
  const rules = { ...TOP, profile: [() => true, ''] as [Check, string], background: [() => true, ''] as [Check, string] };
  const obj = checkGroup(json, rules, label, '');
  const out: Record<string, unknown> = { ...obj };
  if ('profile' in obj) out.profile = { ...checkGroup(obj.profile, PROFILE, label, 'profile.') };
  if ('background' in obj) out.background = { ...checkGroup(obj.background, BACKGROUND, label, 'background.') };
  return out as SettingsOverrides;
}

/** Parse settings JSON text; bad JSON gives a one-line message naming the file. */
export function parseConfigText(text: string, label: string): SettingsOverrides {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    throw new BatchOptionError(`${label}: not valid JSON (${(e as Error).message.split('\n')[0]})`);
  }
  return settingsFromConfig(json, label);
}

// The one table of analysis settings: for each, its type, unit, range, default, command-line flag, field label and
// help line. The command line (flags, help), config files, project files and the window's settings panel all check
// and describe settings through this table, so a rule is written once. Adding a setting: one row here, its field in
// AnalysisSettings and DEFAULT_SETTINGS, and tests (see DEVELOPERS.md).
import type { BoundaryMethod } from '../model';
import type { ChannelRef } from './types';

/** What kind of value a setting holds (decides how a flag's text is read and which field the window shows). */
export type SettingKind = 'number' | 'integer' | 'choice' | 'channel' | 'channels' | 'range' | 'methods' | 'region' | 'size' | 'file' | 'channel-windows';

/** One row of the table. `key` is the path in AnalysisSettings ('profile.edgeDepthUm'). */
export interface SettingSpec {
  readonly key: string;
  readonly kind: SettingKind;
  /** Unit of the value ('µm', 'x/EL', 'px', '' for none). */
  readonly unit: string;
  /** Name of the field in the window; the subject of the window's messages. */
  readonly label: string;
  /** The command-line flag that sets it. */
  readonly flag: string;
  /** Placeholder of the flag's value in the help. */
  readonly flagValue: string;
  /** One line for the help and the field's tooltip. */
  readonly help: string;
  /** What a valid value is, completing "<name> must be …" (config files, project files, the window). */
  readonly rule: string;
  /** What valid flag text is, completing "<flag> must be … (got "…")"; defaults to `rule`. */
  readonly flagRule?: string;
  /** Smallest and largest allowed number (number and integer kinds; both ends included unless `exclusive`). */
  readonly min?: number;
  readonly max?: number;
  readonly exclusive?: boolean;
  readonly choices?: readonly string[];
  /** null is allowed (meaning: automatic, or taken from the file). */
  readonly nullable?: boolean;
  /** The flag may be repeated (one value each time). */
  readonly repeatable?: boolean;
  /** True when `value` is allowed. */
  readonly isValid: (value: unknown) => boolean;
  /** The value a flag's text stands for, or undefined when the text is not valid. */
  readonly fromText: (text: string) => unknown;
}

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const METHODS: readonly BoundaryMethod[] = ['logistic', 'half-max', 'threshold'];

/** A number from text, or undefined when the text is not a plain decimal number. */
export function numberFromText(text: string): number | undefined {
  const t = text.trim();
  return NUMBER.test(t) ? Number(t) : undefined;
}

const isChannel = (v: unknown): v is ChannelRef => (Number.isInteger(v) && (v as number) >= 1) || (typeof v === 'string' && v.trim() !== '');
const channelFromText = (text: string): ChannelRef | undefined => {
  const t = text.trim();
  if (/^\d+$/.test(t)) return Number(t) >= 1 ? Number(t) : undefined;
  return t === '' ? undefined : t;
};
const isCount = (v: unknown): boolean => Number.isInteger(v) && (v as number) >= 0;
const quoted = (c: readonly string[]): string => `${c.slice(0, -1).map((x) => `"${x}"`).join(', ')} or "${c[c.length - 1]}"`;
const plain = (c: readonly string[]): string => `${c.slice(0, -1).join(', ')} or ${c[c.length - 1]}`;

/** A numeric row: `min`..`max` (or above `min` when `exclusive`), integers when `integer`. */
function numeric(row: Omit<SettingSpec, 'kind' | 'isValid' | 'fromText'> & { integer?: boolean }): SettingSpec {
  const { integer, ...rest } = row;
  const [lo, hi] = [rest.min ?? -Infinity, rest.max ?? Infinity];
  const inRange = (v: number): boolean => (rest.exclusive ? v > lo && v < hi : v >= lo && v <= hi);
  const isValid = (v: unknown): boolean => (v === null && rest.nullable === true)
    || (typeof v === 'number' && Number.isFinite(v) && (!integer || Number.isInteger(v)) && inRange(v));
  return {
    ...rest, kind: integer ? 'integer' : 'number', isValid,
    fromText: (text) => { const v = numberFromText(text); return v !== undefined && isValid(v) ? v : undefined; },
  };
}

/** A row with a fixed set of words. */
function choice(row: Omit<SettingSpec, 'kind' | 'isValid' | 'fromText' | 'rule' | 'flagRule'> & { choices: readonly string[] }): SettingSpec {
  return {
    ...row, kind: 'choice', rule: quoted(row.choices), flagRule: plain(row.choices),
    isValid: (v) => typeof v === 'string' && row.choices.includes(v),
    fromText: (text) => (row.choices.includes(text.trim()) ? text.trim() : undefined),
  };
}

const isFilePath = (v: unknown): boolean => v === null || (typeof v === 'string' && v.trim() !== '' && !/[\n\r\0]/.test(v));

/** A row naming an image file (null = none), e.g. a flat field. */
function fileRow(row: Omit<SettingSpec, 'kind' | 'isValid' | 'fromText' | 'rule' | 'flagRule' | 'nullable' | 'unit' | 'flagValue'>): SettingSpec {
  return {
    ...row, kind: 'file', unit: '', flagValue: 'FILE', nullable: true, rule: 'a file path or null', flagRule: 'a file path', isValid: isFilePath,
    fromText: (text) => (text.trim() !== '' && isFilePath(text) ? text : undefined),
  };
}

const isRange = (v: unknown): boolean => Array.isArray(v) && v.length === 2 && v.every((x) => typeof x === 'number' && Number.isFinite(x))
  && v[0] >= 0 && v[0] < v[1] && v[1] <= 1;
const isRegion = (v: unknown): boolean => v === null || (typeof v === 'object' && !Array.isArray(v)
  && ['x', 'y', 'width', 'height'].every((k) => isCount((v as Record<string, unknown>)[k]))
  && (v as { width: number }).width > 0 && (v as { height: number }).height > 0);

const isChannelWindow = (v: unknown): boolean => typeof v === 'object' && v !== null && !Array.isArray(v)
  && isChannel((v as Record<string, unknown>).channel) && isRange((v as Record<string, unknown>).rangeEl);

/** "CH=A,B" → { channel, rangeEl: [A, B] } (CH a 1-based number or a channel name; the last "=" splits), or undefined. */
export function channelWindowFromText(text: string): { channel: ChannelRef; rangeEl: [number, number] } | undefined {
  const at = text.lastIndexOf('=');
  if (at <= 0) return undefined;
  const channel = channelFromText(text.slice(0, at));
  const range = text.slice(at + 1).split(',').map(numberFromText);
  if (channel === undefined || range.length !== 2 || !isRange(range)) return undefined;
  return { channel, rangeEl: [range[0] as number, range[1] as number] };
}

/** Every analysis setting, in the order the help and the window show them. */
export const SETTINGS: readonly SettingSpec[] = [
  {
    key: 'gradientChannel', kind: 'channel', unit: '', label: 'gradient channel', flag: '--gradient-channel', flagValue: 'N|NAME',
    help: 'channel of the exponential gradient (1-based or name)', rule: 'a channel number (1-based) or a channel name',
    isValid: isChannel, fromText: channelFromText,
  },
  {
    key: 'boundaryChannels', kind: 'channels', unit: '', label: 'boundary channels', flag: '--boundary-channel', flagValue: 'N|NAME',
    help: 'channel to find expression boundaries in; repeat for more', rule: 'a list of channel numbers (1-based) or names',
    flagRule: 'a channel number (1-based) or a channel name', repeatable: true,
    isValid: (v) => Array.isArray(v) && v.every(isChannel), fromText: channelFromText,
  },
  numeric({
    key: 'pixelSizeUm', unit: 'µm', label: 'pixel size (when the file has none)', flag: '--pixel-size', flagValue: 'UM',
    help: 'µm per pixel, used when a file does not say', rule: 'a positive number (µm per pixel) or null',
    flagRule: 'a positive number of µm per pixel', min: 0, exclusive: true, nullable: true,
  }),
  {
    key: 'projection', kind: 'choice', unit: '', label: 'projection', flag: '--projection', flagValue: 'P',
    help: 'max | mean | sum | slice | slice:Z (Z is 0-based)', rule: quoted(['max', 'mean', 'sum', 'slice']),
    flagRule: 'max, mean, sum, slice or slice:Z with Z a 0-based slice number', choices: ['max', 'mean', 'sum', 'slice'],
    isValid: (v) => v === 'max' || v === 'mean' || v === 'sum' || v === 'slice',
    fromText: (text) => (/^(max|mean|sum|slice)$/.test(text.trim()) ? text.trim() : /^slice:\d+$/.test(text.trim()) ? 'slice' : undefined),
  },
  numeric({
    key: 'sliceIndex', unit: '', label: 'slice (0-based, empty = automatic)', flag: '--projection', flagValue: 'slice:Z',
    help: 'the slice of --projection slice:Z', rule: 'a 0-based slice number or null', min: 0, integer: true, nullable: true,
  }),
  numeric({
    key: 'timeIndex', unit: '', label: 'time point (0-based)', flag: '--time-index', flagValue: 'T',
    help: 'time point to analyse (0-based); a file with fewer: its last, with a warning', rule: 'a 0-based time point number', min: 0, integer: true,
  }),
  choice({ key: 'profile.mode', unit: '', label: 'sample', flag: '--profile', flagValue: 'MODE', help: 'edge (band under the outline) | axis (strip on the axis)', choices: ['edge', 'axis'] }),
  choice({ key: 'profile.edgeSide', unit: '', label: 'edge', flag: '--edge-side', flagValue: 'SIDE', help: 'dorsal | ventral | both (pooled) | each (pooled, plus each side\'s λ and their difference)', choices: ['dorsal', 'ventral', 'both', 'each'] }),
  choice({ key: 'profile.dorsalSide', unit: '', label: 'dorsal is', flag: '--dorsal-side', flagValue: 'SIDE', help: 'dorsal is left or right of the direction anterior→posterior', choices: ['left', 'right'] }),
  numeric({
    key: 'profile.edgeDepthUm', unit: 'µm', label: 'edge band depth µm', flag: '--edge-depth', flagValue: 'UM',
    help: 'depth of the edge band inward from the outline, µm (reach past the nuclear layer)', rule: 'a positive number of µm', min: 0, exclusive: true,
  }),
  numeric({
    key: 'profile.axisWidthUm', unit: 'µm', label: 'axis strip width µm', flag: '--strip-width', flagValue: 'UM',
    help: 'full width of the axis strip, µm', rule: 'a positive number of µm', min: 0, exclusive: true,
  }),
  numeric({
    key: 'profile.binCount', unit: '', label: 'bins', flag: '--bins', flagValue: 'N',
    help: 'number of bins from x/EL 0 to 1', rule: 'a whole number from 10 to 2000', min: 10, max: 2000, integer: true,
  }),
  choice({ key: 'background.mode', unit: '', label: 'background', flag: '--background', flagValue: 'B', help: 'outside (around the embryo) | region (a rectangle) | none', choices: ['outside', 'region', 'none'] }),
  {
    key: 'background.regionPx', kind: 'region', unit: 'px', label: 'background rectangle', flag: '--background-region', flagValue: 'X,Y,W,H',
    help: 'rectangle for --background region, px (x, y = top-left, 0-based)', rule: 'null or { x, y, width, height } in whole pixels',
    flagRule: 'four whole numbers x,y,width,height with width and height > 0', nullable: true, isValid: isRegion,
    fromText: (text) => {
      const p = text.split(',').map((s) => s.trim());
      if (p.length !== 4 || !p.every((s) => /^\d+$/.test(s))) return undefined;
      const [x, y, width, height] = p.map(Number);
      return isRegion({ x, y, width, height }) ? { x, y, width, height } : undefined;
    },
  },
  fileRow({
    key: 'flatFieldFile', label: 'flat-field image', flag: '--flat',
    help: 'image with one plane per channel (mean over Z if several), normalised to mean 1, that divides every plane',
  }),
  fileRow({
    key: 'backgroundImageFile', label: 'background image', flag: '--background-image',
    help: 'image with one plane per channel (mean over Z if several) subtracted from every plane before the flat field',
  }),
  {
    key: 'fitRangeEl', kind: 'range', unit: 'x/EL', label: 'fit range x/EL', flag: '--fit-range', flagValue: 'A,B',
    help: 'x/EL range of the exponential fit, 0 ≤ A < B ≤ 1', rule: 'two numbers [a, b] with 0 ≤ a < b ≤ 1',
    flagRule: 'two numbers 0 ≤ a < b ≤ 1 written as a,b', isValid: isRange,
    fromText: (text) => {
      const parts = text.split(',').map(numberFromText);
      return parts.length === 2 && isRange(parts) ? parts : undefined;
    },
  },
  choice({ key: 'anterior', unit: '', label: 'anterior', flag: '--anterior', flagValue: 'A', help: 'auto (high end of the gradient) | high | low', choices: ['auto', 'high', 'low'] }),
  {
    key: 'boundaryMethods', kind: 'methods', unit: '', label: 'boundary methods', flag: '--boundary-methods', flagValue: 'M,M',
    help: 'boundary methods: logistic, half-max, threshold (comma-separated)', rule: `a non-empty list of ${METHODS.map((m) => `"${m}"`).join(', ')}`,
    flagRule: 'logistic, half-max and/or threshold, comma-separated',
    isValid: (v) => Array.isArray(v) && v.length > 0 && v.every((m) => METHODS.includes(m as BoundaryMethod)),
    fromText: (text) => {
      const m = text.split(',').map((s) => s.trim());
      return m.length > 0 && m.every((x) => METHODS.includes(x as BoundaryMethod)) ? [...new Set(m)] : undefined;
    },
  },
  numeric({
    key: 'boundaryThresholdFraction', unit: '', label: 'threshold (fraction of the range)', flag: '--threshold', flagValue: 'F',
    help: 'level of the threshold boundary method, as a fraction of the profile range', rule: 'a number between 0 and 1',
    min: 0, max: 1, exclusive: true,
  }),
  {
    key: 'boundarySearchEl', kind: 'range', unit: 'x/EL', label: 'boundary search x/EL', flag: '--boundary-window', flagValue: 'A,B',
    help: 'x/EL range searched for boundaries, 0 ≤ A < B ≤ 1', rule: 'two numbers [a, b] with 0 ≤ a < b ≤ 1',
    flagRule: 'two numbers 0 ≤ a < b ≤ 1 written as a,b', isValid: isRange,
    fromText: (text) => {
      const parts = text.split(',').map(numberFromText);
      return parts.length === 2 && isRange(parts) ? parts : undefined;
    },
  },
  {
    key: 'boundaryWindows', kind: 'channel-windows', unit: 'x/EL', label: 'search window per channel', flag: '--channel-window', flagValue: 'CH=A,B',
    help: 'x/EL range searched for boundaries in one channel (1-based or name), overriding --boundary-window for it; repeat for more',
    rule: 'a list of { channel, rangeEl: [a, b] } with 0 ≤ a < b ≤ 1', flagRule: 'CH=a,b with CH a channel number or name and 0 ≤ a < b ≤ 1',
    repeatable: true, isValid: (v) => Array.isArray(v) && v.every(isChannelWindow), fromText: channelWindowFromText,
  },
];

const SIZE_UNIT_POWERS: Readonly<Record<string, number>> = { '': 0, K: 1, M: 2, G: 3, T: 4 };

/** Bytes from "N", "N K|M|G|T" with an optional "B" or "iB" (units are powers of 1024), or undefined for other text. */
export function bytesFromText(text: string): number | undefined {
  const m = /^\s*(\d+(?:\.\d+)?)\s*([kmgt]?)(?:i?b)?\s*$/i.exec(text);
  return m ? Math.floor(Number(m[1]) * 1024 ** (SIZE_UNIT_POWERS[m[2].toUpperCase()] ?? 0)) : undefined;
}

/** Smallest --max-memory, bytes (64 MiB). */
export const MIN_MAX_MEMORY_BYTES = 2 ** 26;

/**
 * Run settings of the batch command: how a run goes, not what it measures. Same rows as SETTINGS (flag, help, rule,
 * range, unit, how the flag's text is read), so their flags, messages and help come from one place too; but they are
 * not fields of AnalysisSettings: project files, config files, results.json and the window's panel do not hold them,
 * and their defaults depend on the machine (the command line states them).
 */
export const RUN_SETTINGS: readonly SettingSpec[] = [
  numeric({
    key: 'jobs', unit: '', label: 'workers', flag: '--jobs', flagValue: 'N', help: 'worker processes',
    rule: 'a whole number from 1 to 256', min: 1, max: 256, integer: true,
  }),
  numeric({
    key: 'fileTimeoutS', unit: 's', label: 'time limit per file', flag: '--file-timeout', flagValue: 'S',
    help: 'give up on one file after S seconds', rule: 'a whole number from 1 to 86400', min: 1, max: 86_400, integer: true,
  }),
  {
    key: 'maxMemoryBytes', kind: 'size', unit: 'B', label: 'memory per file', flag: '--max-memory', flagValue: 'SIZE',
    help: 'memory one file\'s analysis may use (512M, 4G, …); a file estimated to need more is refused, a worker that uses more is stopped; either way that file gets an error row',
    rule: 'a size of at least 64M, like 512M, 4G or 1.5G', min: MIN_MAX_MEMORY_BYTES,
    isValid: (v) => typeof v === 'number' && Number.isFinite(v) && v >= MIN_MAX_MEMORY_BYTES,
    fromText: (text) => { const b = bytesFromText(text); return b !== undefined && Number.isFinite(b) && b >= MIN_MAX_MEMORY_BYTES ? b : undefined; },
  },
];

/** The run setting of `key` (RUN_SETTINGS); throws for a key that is not one (a programming error). */
export function runSettingSpec(key: string): SettingSpec {
  const row = RUN_SETTINGS.find((s) => s.key === key);
  if (row === undefined) throw new Error(`no run setting "${key}"`);
  return row;
}

/** The row of `key`; throws for a key that is not a setting (a programming error, not user input). */
export function settingSpec(key: string): SettingSpec {
  const row = SETTINGS.find((s) => s.key === key);
  if (row === undefined) throw new Error(`no analysis setting "${key}"`);
  return row;
}

/** `--edge-depth` → `edgeDepth`: the key of a flag's value in SettingsFlags. */
export function flagKey(flag: string): string {
  return flag.replace(/^--/, '').replace(/-([a-z])/g, (_, c: string) => c.toUpperCase());
}

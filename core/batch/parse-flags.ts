// Turn the batch command's settings flags (raw strings) into a partial AnalysisSettings, validating each one.
import type { AnalysisSettings, ChannelRef } from '../settings';
import { BatchOptionError } from './option-error';

/** Raw flag values as typed on the command line (undefined = not given). */
export interface SettingsFlags {
  readonly gradientChannel?: string;
  readonly boundaryChannel?: readonly string[];
  readonly pixelSize?: string;
  readonly projection?: string;
  readonly profile?: string;
  readonly fitRange?: string;
  readonly anterior?: string;
}

/** Settings the flags (or a config file) may override; nested groups are partial too. */
export type SettingsOverrides = Partial<Omit<AnalysisSettings, 'profile' | 'background'>> & {
  readonly profile?: Partial<AnalysisSettings['profile']>;
  readonly background?: Partial<AnalysisSettings['background']>;
};

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** A channel given as a 1-based number or a name. */
export function parseChannelRef(text: string, flag: string): ChannelRef {
  const t = text.trim();
  if (t === '') throw new BatchOptionError(`${flag} must be a channel number (1-based) or a channel name (got "${text}")`);
  if (/^\d+$/.test(t)) {
    const n = Number(t);
    if (n < 1) throw new BatchOptionError(`${flag} must be a channel number (1-based) or a channel name (got "${text}")`);
    return n;
  }
  return t;
}

/** `--fit-range A,B`: two numbers with 0 ≤ A < B ≤ 1 (x/EL). */
export function parseFitRange(text: string): [number, number] {
  const parts = text.split(',').map((s) => s.trim());
  const ok = parts.length === 2 && parts.every((p) => NUMBER.test(p));
  const [a, b] = parts.map(Number);
  if (!ok || !(a >= 0 && a < b && b <= 1)) {
    throw new BatchOptionError(`--fit-range must be two numbers 0 ≤ a < b ≤ 1 written as a,b (got "${text}")`);
  }
  return [a, b];
}

/** `--pixel-size UM`: a positive number of µm per pixel. */
export function parsePixelSize(text: string): number {
  const v = Number(text.trim());
  if (!NUMBER.test(text.trim()) || !(v > 0) || !Number.isFinite(v)) {
    throw new BatchOptionError(`--pixel-size must be a positive number of µm per pixel (got "${text}")`);
  }
  return v;
}

/** `--projection max|mean|sum|slice[:Z]` → projection and slice index (0-based; null = automatic). */
export function parseProjection(text: string): Pick<AnalysisSettings, 'projection' | 'sliceIndex'> {
  const t = text.trim();
  if (t === 'max' || t === 'mean' || t === 'sum' || t === 'slice') return { projection: t, sliceIndex: null };
  const m = /^slice:(\d+)$/.exec(t);
  if (m) return { projection: 'slice', sliceIndex: Number(m[1]) };
  throw new BatchOptionError(`--projection must be max, mean, sum, slice or slice:Z with Z a 0-based slice number (got "${text}")`);
}

function oneOf<T extends string>(text: string, allowed: readonly T[], flag: string): T {
  const t = text.trim() as T;
  if (allowed.includes(t)) return t;
  throw new BatchOptionError(`${flag} must be ${allowed.slice(0, -1).join(', ')} or ${allowed[allowed.length - 1]} (got "${text}")`);
}

/** Validate every settings flag that was given and return the overrides (flags not given are absent). */
export function parseSettingsFlags(flags: SettingsFlags): SettingsOverrides {
  const out: Record<string, unknown> = {};
  if (flags.gradientChannel !== undefined) out.gradientChannel = parseChannelRef(flags.gradientChannel, '--gradient-channel');
  if (flags.boundaryChannel !== undefined && flags.boundaryChannel.length > 0) {
    out.boundaryChannels = flags.boundaryChannel.map((c) => parseChannelRef(c, '--boundary-channel'));
  }
  if (flags.pixelSize !== undefined) out.pixelSizeUm = parsePixelSize(flags.pixelSize);
  if (flags.projection !== undefined) Object.assign(out, parseProjection(flags.projection));
  if (flags.profile !== undefined) out.profile = { mode: oneOf(flags.profile, ['edge', 'axis'] as const, '--profile') };
  if (flags.fitRange !== undefined) out.fitRangeEl = parseFitRange(flags.fitRange);
  if (flags.anterior !== undefined) out.anterior = oneOf(flags.anterior, ['auto', 'high', 'low'] as const, '--anterior');
  return out as SettingsOverrides;
}

// Validation of AnalysisSettings read from a project file or received from the renderer.
import { DEFAULT_SETTINGS, type AnalysisSettings } from '../../core/settings';
import { badField } from './format-error';
import { isRecord, checkFiniteNumber, checkOneOf, checkRange } from './check-values';

const PROJECTIONS = ['max', 'mean', 'sum', 'slice'] as const;
const BOUNDARY_METHODS = ['logistic', 'half-max', 'threshold'] as const;

/** Check a channel reference: a 1-based integer or a non-empty name. */
function checkChannelRef(value: unknown, where: string): number | string {
  if (typeof value === 'string' && value.trim() !== '') return value;
  if (Number.isInteger(value) && (value as number) >= 1) return value as number;
  return badField(where, 'must be a 1-based channel number or a channel name');
}

/** Check the nested profile settings (missing fields take the defaults). */
function checkProfile(value: unknown, where: string): AnalysisSettings['profile'] {
  if (value !== undefined && !isRecord(value)) badField(where, 'must be an object');
  const p = { ...DEFAULT_SETTINGS.profile, ...(value as object | undefined) };
  checkOneOf(p.mode, ['edge', 'axis'], `${where}.mode`);
  checkOneOf(p.edgeSide, ['dorsal', 'ventral', 'both'], `${where}.edgeSide`);
  checkOneOf(p.dorsalSide, ['left', 'right'], `${where}.dorsalSide`);
  if (checkFiniteNumber(p.edgeDepthUm, `${where}.edgeDepthUm`) <= 0) badField(`${where}.edgeDepthUm`, 'must be > 0');
  if (checkFiniteNumber(p.axisWidthUm, `${where}.axisWidthUm`) <= 0) badField(`${where}.axisWidthUm`, 'must be > 0');
  if (!Number.isInteger(p.binCount) || p.binCount < 2 || p.binCount > 10000) {
    badField(`${where}.binCount`, 'must be an integer from 2 to 10000');
  }
  return { mode: p.mode, edgeSide: p.edgeSide, dorsalSide: p.dorsalSide, edgeDepthUm: p.edgeDepthUm,
    axisWidthUm: p.axisWidthUm, binCount: p.binCount };
}

/** Check the background settings (missing fields take the defaults). */
function checkBackground(value: unknown, where: string): AnalysisSettings['background'] {
  if (value !== undefined && !isRecord(value)) badField(where, 'must be an object');
  const b = { ...DEFAULT_SETTINGS.background, ...(value as object | undefined) };
  checkOneOf(b.mode, ['outside', 'region', 'none'], `${where}.mode`);
  if (b.regionPx === null) {
    if (b.mode === 'region') badField(`${where}.regionPx`, "must be set when mode is 'region'");
    return { mode: b.mode, regionPx: null };
  }
  if (!isRecord(b.regionPx)) return badField(`${where}.regionPx`, 'must be null or {x, y, width, height} in pixels');
  const r = b.regionPx;
  for (const k of ['x', 'y'] as const) checkRange(r[k], 0, Number.MAX_SAFE_INTEGER, `${where}.regionPx.${k}`);
  for (const k of ['width', 'height'] as const) {
    if (checkFiniteNumber(r[k], `${where}.regionPx.${k}`) <= 0) badField(`${where}.regionPx.${k}`, 'must be > 0');
  }
  return { mode: b.mode, regionPx: { x: r.x as number, y: r.y as number, width: r.width as number, height: r.height as number } };
}

/** Check an x/EL range: two numbers 0 ≤ a < b ≤ 1. */
export function checkRangeEl(value: unknown, where: string): readonly [number, number] {
  const ok = Array.isArray(value) && value.length === 2 && value.every((v) => typeof v === 'number' && Number.isFinite(v))
    && value[0] >= 0 && value[0] < value[1] && value[1] <= 1;
  if (!ok) badField(where, 'must be two numbers 0 ≤ a < b ≤ 1');
  return [value[0], value[1]] as const;
}

/** Validate settings; fields missing from an older file take the defaults. Throws ProjectFormatError. */
export function checkSettings(value: unknown, where = 'settings'): AnalysisSettings {
  if (!isRecord(value)) return badField(where, 'must be an object');
  const s = { ...DEFAULT_SETTINGS, ...value } as Record<keyof AnalysisSettings, unknown>;
  if (!Array.isArray(s.boundaryChannels)) badField(`${where}.boundaryChannels`, 'must be a list');
  if (s.pixelSizeUm !== null && checkFiniteNumber(s.pixelSizeUm, `${where}.pixelSizeUm`) <= 0) {
    badField(`${where}.pixelSizeUm`, 'must be null or a number > 0');
  }
  if (s.sliceIndex !== null && !(Number.isInteger(s.sliceIndex) && (s.sliceIndex as number) >= 0)) {
    badField(`${where}.sliceIndex`, 'must be null or an integer ≥ 0');
  }
  if (!Array.isArray(s.boundaryMethods)) badField(`${where}.boundaryMethods`, 'must be a list');
  if (!Number.isInteger(s.timeIndex) || (s.timeIndex as number) < 0) badField(`${where}.timeIndex`, 'must be an integer ≥ 0');
  return {
    gradientChannel: checkChannelRef(s.gradientChannel, `${where}.gradientChannel`),
    boundaryChannels: (s.boundaryChannels as unknown[]).map((c, i) => checkChannelRef(c, `${where}.boundaryChannels[${i}]`)),
    pixelSizeUm: s.pixelSizeUm as number | null,
    projection: checkOneOf(s.projection, PROJECTIONS, `${where}.projection`),
    sliceIndex: s.sliceIndex as number | null,
    profile: checkProfile(s.profile, `${where}.profile`),
    background: checkBackground(s.background, `${where}.background`),
    fitRangeEl: checkRangeEl(s.fitRangeEl, `${where}.fitRangeEl`),
    anterior: checkOneOf(s.anterior, ['auto', 'high', 'low'], `${where}.anterior`),
    boundaryMethods: (s.boundaryMethods as unknown[]).map((m, i) => checkOneOf(m, BOUNDARY_METHODS, `${where}.boundaryMethods[${i}]`)),
    boundaryThresholdFraction: checkRange(s.boundaryThresholdFraction, 0, 1, `${where}.boundaryThresholdFraction`),
    timeIndex: s.timeIndex as number,
  };
}

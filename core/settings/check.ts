// Checking and combining settings through the table in schema.ts: flags, config files, project files and the window's
// fields get the same rules and the same wording ("… must be <rule>").
import { DEFAULT_SETTINGS } from './defaults';
import { flagKey, SETTINGS, settingSpec, type SettingSpec } from './schema';
import { SettingsError } from './settings-error';
import type { AnalysisSettings } from './types';

/** Settings a layer (project, config file, flags, an edit in the window) may override; nested groups are partial too. */
export type SettingsOverrides = Partial<Omit<AnalysisSettings, 'profile' | 'background'>> & {
  readonly profile?: Partial<AnalysisSettings['profile']>;
  readonly background?: Partial<AnalysisSettings['background']>;
};

/** Raw flag values as typed on the command line, keyed by flagKey (undefined = not given). */
export type SettingsFlags = Readonly<Record<string, string | readonly string[] | undefined>>;

/** The value of a setting (by its key path) in a settings object. */
export function settingValue(settings: AnalysisSettings, key: string): unknown {
  return key.split('.').reduce<unknown>((o, k) => (o as Record<string, unknown> | undefined)?.[k], settings);
}

/** Overrides that set one setting (by its key path) to `value`. */
export function overrideOf(key: string, value: unknown): SettingsOverrides {
  const [group, leaf] = key.split('.');
  return (leaf === undefined ? { [group]: value } : { [group]: { [leaf]: value } }) as SettingsOverrides;
}

/** "<subject> must be <rule>" when `value` breaks the setting's rule, else null. */
export function settingProblem(key: string, value: unknown, subject: string = settingSpec(key).label): string | null {
  const spec = settingSpec(key);
  return spec.isValid(value) ? null : `${subject} must be ${spec.rule}`;
}

/** The message the window shows for a refused field value: the rule, and the value that broke it. */
export function fieldProblem(key: string, value: unknown): string | null {
  const problem = settingProblem(key, value);
  if (problem === null) return null;
  const shown = Array.isArray(value) ? value.join(', ') : value === null ? 'empty' : String(value);
  return `${problem} (got ${shown})`;
}

/** The first problem of a complete settings object ("<label> must be <rule>", or a rule across settings), or null. */
export function settingsProblem(settings: AnalysisSettings): string | null {
  for (const spec of SETTINGS) {
    const problem = settingProblem(spec.key, settingValue(settings, spec.key));
    if (problem !== null) return problem;
  }
  return combinationProblem(settings);
}

/** Overrides applied onto settings without checking (nested groups merge key by key); check with settingsProblem. */
export function applyOverrides(base: AnalysisSettings, layer: SettingsOverrides): AnalysisSettings {
  return { ...base, ...layer, profile: { ...base.profile, ...layer.profile }, background: { ...base.background, ...layer.background } } as AnalysisSettings;
}

/** Apply overrides in order onto a base; nested profile/background groups merge key by key. Inputs are not changed. */
export function mergeSettings(base: AnalysisSettings, ...layers: readonly SettingsOverrides[]): AnalysisSettings {
  let out: AnalysisSettings = base;
  for (const layer of layers) out = applyOverrides(out, layer);
  checkCombination(out);
  return out;
}

/** Rules that involve more than one setting, checked after merging. */
export function checkCombination(s: AnalysisSettings): void {
  const problem = combinationProblem(s);
  if (problem !== null) throw new SettingsError(problem);
}

/** The first rule across settings that `s` breaks, or null. */
export function combinationProblem(s: AnalysisSettings): string | null {
  if (s.sliceIndex !== null && s.projection !== 'slice') {
    return `a slice index (${s.sliceIndex}) is set but the projection is "${s.projection}", not "slice"`;
  }
  if (s.background.mode === 'region' && s.background.regionPx === null) {
    return 'background mode "region" needs background.regionPx { x, y, width, height }';
  }
  return null;
}

/** Read every settings flag that was given into overrides, checking each: "<flag> must be <rule> (got "<text>")". */
export function settingsFromFlags(flags: SettingsFlags): SettingsOverrides {
  let out: SettingsOverrides = {};
  for (const spec of SETTINGS) {
    if (spec.key === 'sliceIndex') continue; // set by --projection slice:Z
    const given = flags[flagKey(spec.flag)];
    if (given === undefined || (Array.isArray(given) && given.length === 0)) continue;
    const texts = typeof given === 'string' ? [given] : given;
    const values = texts.map((text) => flagValue(spec, text));
    out = mergeOverrides(out, overrideOf(spec.key, spec.repeatable ? values : values[values.length - 1]));
    if (spec.key === 'projection') {
      const m = /^slice:(\d+)$/.exec(texts[texts.length - 1].trim());
      out = { ...out, sliceIndex: m ? Number(m[1]) : null };
    }
  }
  return out;
}

/** The value of a flag's text by the row's rule; throws SettingsError "<flag> must be <rule> (got "<text>")". */
export function flagValue(spec: SettingSpec, text: string): unknown {
  const v = spec.fromText(text);
  if (v === undefined) throw new SettingsError(`${spec.flag} must be ${spec.flagRule ?? spec.rule} (got "${text}")`);
  return v;
}

function mergeOverrides(a: SettingsOverrides, b: SettingsOverrides): SettingsOverrides {
  return { ...a, ...b, ...(a.profile || b.profile ? { profile: { ...a.profile, ...b.profile } } : {}),
    ...(a.background || b.background ? { background: { ...a.background, ...b.background } } : {}) };
}

const GROUPS = ['profile', 'background'] as const;
const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/** Check a settings object from a JSON file (any subset of the keys). Unknown keys are refused; every message starts
 *  with `label` (the file name): `label: "profile.binCount" must be a whole number from 10 to 2000`. */
export function overridesFromJson(json: unknown, label: string): SettingsOverrides {
  if (!isRecord(json)) throw new SettingsError(`${label}: the file must be a JSON object`);
  for (const [key, value] of Object.entries(json)) {
    if ((GROUPS as readonly string[]).includes(key)) {
      if (!isRecord(value)) throw new SettingsError(`${label}: "${key}" must be a JSON object`);
      for (const [leaf, v] of Object.entries(value)) checkJsonKey(`${key}.${leaf}`, v, label);
    } else {
      checkJsonKey(key, value, label);
    }
  }
  const out: Record<string, unknown> = { ...json };
  for (const g of GROUPS) if (g in json) out[g] = { ...(json[g] as object) };
  return out as SettingsOverrides;
}

function checkJsonKey(key: string, value: unknown, label: string): void {
  const spec = SETTINGS.find((s) => s.key === key);
  if (spec === undefined) throw new SettingsError(`${label}: unknown setting "${key}"`);
  if (!spec.isValid(value)) throw new SettingsError(`${label}: "${key}" must be ${spec.rule}`);
}

/** Complete settings from a stored object (a project file): missing keys take the defaults (older files), unknown keys
 *  are dropped, each value is checked: `<where>.<key> must be <rule>` thrown as SettingsError. */
export function settingsFromStored(value: unknown, where = 'settings'): AnalysisSettings {
  if (!isRecord(value)) throw new SettingsError(`${where} must be an object`);
  for (const g of GROUPS) if (value[g] !== undefined && !isRecord(value[g])) throw new SettingsError(`${where}.${g} must be an object`);
  let out: AnalysisSettings = DEFAULT_SETTINGS;
  for (const spec of SETTINGS) {
    const stored = spec.key.split('.').reduce<unknown>((o, k) => (isRecord(o) ? o[k] : undefined), value);
    if (stored === undefined) continue;
    if (!spec.isValid(stored)) throw new SettingsError(`${where}.${spec.key} must be ${spec.rule}`);
    out = applyOverrides(out, overrideOf(spec.key, stored));
  }
  const problem = combinationProblem(out);
  if (problem !== null) throw new SettingsError(`${where}: ${problem}`);
  return out;
}

/** The settings in force for one file: the shared settings with the file's own fit range and dorsal side when it
 *  has them (the same object when it has neither). */
export function settingsInForce(
  settings: AnalysisSettings,
  edits: { readonly fitRangeEl: readonly [number, number] | null; readonly dorsalSide?: 'left' | 'right' | null } | null | undefined,
): AnalysisSettings {
  let out = settings;
  if (edits?.fitRangeEl) out = { ...out, fitRangeEl: [edits.fitRangeEl[0], edits.fitRangeEl[1]] };
  if (edits?.dorsalSide && edits.dorsalSide !== out.profile.dorsalSide) out = { ...out, profile: { ...out.profile, dorsalSide: edits.dorsalSide } };
  return out;
}

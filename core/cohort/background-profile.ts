// The background condition of a cohort (a null or secondary-only staining imaged like the others): which condition
// it is, its embryos, and its mean profile per channel with the spread between its embryos. The checks here give one
// line each, naming the sheet, the condition or the file at fault.
import type { EmbryoResult } from '../model';
import { CohortError } from './cohort-error';
import { NO_BACKGROUND_CONDITION, type BackgroundProfile, type Profile, type SampleSheet } from '../model';

/** The rule, in one sentence, as the report and the record state it. */
export const BACKGROUND_CONDITION_RULE = 'Each embryo\'s profile, after its own background setting, minus the mean profile of the '
  + 'background condition\'s embryos measured the same way, bin by bin; λ and the boundaries are then fitted again on the difference.';

/** Header of the sample sheet's optional column that marks background rows (value `background`). */
export const ROLE_COLUMN = 'role';

function roleOf(extra: Readonly<Record<string, string>>): string {
  const key = Object.keys(extra).find((k) => k.trim().toLowerCase() === ROLE_COLUMN);
  return key === undefined ? '' : extra[key].trim().toLowerCase();
}

/** The background rule in force: the condition subtracted (null with rule 'none'), the condition the role column marks
 *  that is set aside without subtraction (rule 'none' only), who chose, and why in one sentence. */
export interface BackgroundChoice {
  readonly rule: 'option' | 'sheet' | 'none';
  readonly name: string | null;
  readonly setAside: string | null;
  readonly namedBy: string;
  readonly why: string;
}

/** The condition the sheet's role column marks as background, or null; one line when it marks rows of several
 *  conditions, or only some rows of one. */
function markedCondition(sheet: SampleSheet): string | null {
  const marked = [...new Set(sheet.rows.filter((r) => roleOf(r.extra) === 'background').map((r) => r.condition))];
  if (marked.length === 0) return null;
  if (marked.length > 1) throw new CohortError(`${sheet.source}: the role column marks rows of several conditions as background (${marked.join(', ')}); mark one`);
  const unmarked = sheet.rows.find((r) => r.condition === marked[0] && roleOf(r.extra) !== 'background');
  if (unmarked) throw new CohortError(`${sheet.source} line ${unmarked.line}: ${unmarked.file} is in background condition "${marked[0]}" but its role is not background`);
  return marked[0];
}

const ROLE_TEXT = `the sample sheet's ${ROLE_COLUMN} column`;

/**
 * The one rule for the background condition, for every caller (command line, project, window): `given` names a
 * condition (subtracted), or is NO_BACKGROUND_CONDITION (`none`: nothing subtracted; a condition the role column marks
 * stays out of the comparison), or null (the condition the role column marks, else none: returns null). `namedBy`
 * says who gave `given`. One line when the name is not in the sheet, or the role column is inconsistent.
 */
export function backgroundConditionOf(sheet: SampleSheet, given: string | null, namedBy = '--background-condition'): BackgroundChoice | null {
  const names = [...new Set(sheet.rows.map((r) => r.condition))];
  if (given === NO_BACKGROUND_CONDITION) {
    const setAside = markedCondition(sheet);
    const why = setAside === null
      ? `${namedBy} is "${NO_BACKGROUND_CONDITION}": no background condition is subtracted`
      : `${namedBy} is "${NO_BACKGROUND_CONDITION}": nothing is subtracted; "${setAside}", marked background in ${ROLE_TEXT}, is left out of the comparison`;
    return { rule: 'none', name: null, setAside, namedBy, why };
  }
  if (given !== null) {
    if (!names.includes(given)) {
      throw new CohortError(`${sheet.source}: background condition "${given}" is not in the sheet (conditions: ${names.join(', ')})`);
    }
    return { rule: 'option', name: given, setAside: null, namedBy, why: `${namedBy} names "${given}": its mean profile is subtracted` };
  }
  const marked = markedCondition(sheet);
  if (marked === null) return null;
  return { rule: 'sheet', name: marked, setAside: null, namedBy: ROLE_TEXT, why: `${ROLE_TEXT} marks "${marked}" as background and no option overrides it: its mean profile is subtracted` };
}

/** The profiles an embryo has, by channel name: the gradient's, then each boundary channel's (a channel in both roles
 *  once). */
export function profilesByChannel(r: EmbryoResult): Map<string, Profile> {
  const out = new Map<string, Profile>();
  for (const p of [...(r.gradientProfile ? [r.gradientProfile] : []), ...r.boundaryProfiles]) if (!out.has(p.channel)) out.set(p.channel, p);
  return out;
}

/** True when two profiles have the same x/EL bins. */
export function sameBins(a: Profile, b: Profile): boolean {
  if (a.xEl.length !== b.xEl.length) return false;
  for (let i = 0; i < a.xEl.length; i++) if (Math.abs(a.xEl[i] - b.xEl[i]) > 1e-9) return false;
  return true;
}

const fitRangeText = (r: EmbryoResult): string => `${r.gradientFit?.fitRangeEl[0]}–${r.gradientFit?.fitRangeEl[1]}`;

/** Check the background embryos against each other: at least one, one channel set, one set of bins, one fit range
 *  (among those whose fit succeeded). */
export function checkBackgroundEmbryos(condition: string, embryos: readonly EmbryoResult[]): void {
  const where = `background condition "${condition}"`;
  if (embryos.length === 0) throw new CohortError(`${where} has no analysed embryos; its files failed or are not in the results`);
  const first = embryos[0];
  const channels = (r: EmbryoResult): string => [...profilesByChannel(r).keys()].join(', ');
  if (profilesByChannel(first).size === 0) throw new CohortError(`${where}: ${first.file} has no profile`);
  for (const r of embryos.slice(1)) {
    if (channels(r) !== channels(first)) {
      throw new CohortError(`${where}: its embryos have different channels (${first.file}: ${channels(first)}; ${r.file}: ${channels(r)})`);
    }
    const bad = [...profilesByChannel(r).values()].find((p) => !sameBins(p, profilesByChannel(first).get(p.channel) as Profile));
    if (bad) throw new CohortError(`${where}: ${r.file} has other x/EL bins than ${first.file} (${bad.xEl.length} against ${first.gradientProfile?.xEl.length ?? 'n/a'}); analyse them with one bin count`);
  }
  // A null staining often has no gradient to fit: an embryo whose fit failed says nothing about its range.
  const fitted = embryos.filter((r) => r.gradientFit);
  const other = fitted.find((r) => fitRangeText(r) !== fitRangeText(fitted[0]));
  if (other) {
    throw new CohortError(`${where}: its embryos were fitted over different x/EL ranges (${fitted[0].file}: ${fitRangeText(fitted[0])}; ${other.file}: ${fitRangeText(other)}); analyse them with one fit range`);
  }
}

/** Mean, SD between embryos and SE of one channel's bin means over the background embryos (bins with n > 0 only). */
export function backgroundProfile(channel: string, profiles: readonly Profile[]): BackgroundProfile {
  const xEl = Float64Array.from(profiles[0].xEl);
  const bins = xEl.length;
  const mean = new Float64Array(bins), sd = new Float64Array(bins), se = new Float64Array(bins), n = new Float64Array(bins);
  for (let b = 0; b < bins; b++) {
    const v: number[] = [];
    for (const p of profiles) if (p.n[b] > 0 && Number.isFinite(p.mean[b])) v.push(p.mean[b]);
    n[b] = v.length;
    const m = v.length ? v.reduce((s, x) => s + x, 0) / v.length : NaN;
    const s = v.length >= 2 ? Math.sqrt(v.reduce((acc, x) => acc + (x - m) ** 2, 0) / (v.length - 1)) : NaN;
    mean[b] = m;
    sd[b] = s;
    se[b] = s / Math.sqrt(v.length);
  }
  return { channel, xEl, mean, sd, se, n };
}

/** The background condition's mean profile of every channel its embryos have (checked first). */
export function backgroundProfiles(condition: string, embryos: readonly EmbryoResult[]): BackgroundProfile[] {
  checkBackgroundEmbryos(condition, embryos);
  const channels = [...profilesByChannel(embryos[0]).keys()];
  return channels.map((c) => backgroundProfile(c, embryos.map((e) => profilesByChannel(e).get(c) as Profile)));
}

// The background condition's outputs (written only when one was subtracted): its mean profile per channel, every
// embryo's values before and after the refit, the per-condition means with the background's SE, and a JSON record.
import { toCsv, type CsvValue } from '../csv';
import type { BackgroundChoiceRecord, BackgroundConditionRecord } from '../model';

/** background_profile.csv: the background condition's mean profile per channel and bin, with SD and SE between its
 *  embryos and how many had data. */
export function backgroundProfileCsv(r: BackgroundConditionRecord): string {
  const rows: CsvValue[][] = [];
  for (const p of r.profiles) for (let b = 0; b < p.xEl.length; b++) rows.push([p.channel, p.xEl[b], p.n[b], p.mean[b], p.sd[b], p.se[b]]);
  return toCsv(['channel', 'x_el', 'embryos', 'mean', 'sd', 'se'], rows);
}

/** background_refit.csv: per embryo and quantity, the value before and after subtracting the background condition,
 *  the refit's own SE and the background's jackknife SE. */
export function backgroundRefitCsv(r: BackgroundConditionRecord): string {
  return toCsv(['file', 'condition', 'quantity', 'unit', 'before', 'after', 'se_fit', 'se_background'],
    r.refits.map((x) => [x.file, x.condition, x.quantity, x.unit, x.before, x.after, x.seFit, x.seBackground]));
}

/** background_conditions.csv: per condition and quantity, the means before and after, the SE between embryos, the
 *  background's SE and their combined interval (the interval conditions.csv gives counts the first only). */
export function backgroundConditionsCsv(r: BackgroundConditionRecord): string {
  return toCsv(['condition', 'quantity', 'unit', 'n', 'mean_before', 'mean_after', 'se_between', 'se_background', 'se_combined', 'ci_low', 'ci_high'],
    r.summaries.map((s) => [s.condition, s.quantity, s.unit, s.n, s.meanBefore, s.meanAfter, s.seBetween, s.seBackground, s.seCombined, s.ciLow, s.ciHigh]));
}

/** background_condition.json: which condition, from where (and why, when `choice` is given), its embryos, the rule,
 *  the channels and bins, and the sample sheet; the cohort's own record of the subtraction. */
export function backgroundRecordJson(r: BackgroundConditionRecord, sheetSource: string, choice?: BackgroundChoiceRecord): string {
  const namedBy = r.source === 'option' ? r.namedBy ?? '--background-condition' : 'role column of the sample sheet';
  const doc = {
    schema: 'eggline-background-condition', version: 1, condition: r.condition, namedBy,
    ...(choice ? { choice: choice.rule, why: choice.why } : {}),
    sampleSheet: sheetSource, rule: r.rule, embryos: r.files, channels: r.profiles.map((p) => p.channel), bins: r.profiles[0]?.xEl.length ?? 0,
    outputs: ['background_profile.csv', 'background_refit.csv', 'background_conditions.csv', 'background-condition.svg', 'background-condition.png'],
  };
  return `${JSON.stringify(doc, null, 2)}\n`;
}

/** background_condition.json when `none` was chosen: no condition subtracted, who chose and why, and the condition
 *  the role column marks that was left out of the comparison (with its embryos), if any. */
export function backgroundChoiceJson(c: BackgroundChoiceRecord, sheetSource: string): string {
  const doc = {
    schema: 'eggline-background-condition', version: 1, condition: null, namedBy: c.namedBy, choice: c.rule, why: c.why,
    sampleSheet: sheetSource, setAside: c.setAside, setAsideEmbryos: c.setAsideFiles, outputs: [],
  };
  return `${JSON.stringify(doc, null, 2)}\n`;
}

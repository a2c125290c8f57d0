// The cohort report: ONE self-contained HTML file (inline CSS and SVG; no scripts, no network). Order: summary,
// figures, dosage test (tables, reading, caveats), per-condition tables, gradients over time (when the batch had
// movies), failed files, run settings (mostly folded).
import { quantityLabel, slopeRatio, type CohortAnalysis, type ConditionStat } from '../../core/cohort';
import { escapeXml, plainNumber, sigFig, valueWithCi, type NamedFigure } from '../../core/figures';
import { flattenRecord } from './flatten-record';
import { keySettings } from './key-settings';
import { sidesSection } from './sides-section';
import { dosageReading, prose, pText, r2Text, slopeVerdict, withCi } from './reading';

/** Everything the report shows. */
export interface ReportInput {
  readonly analysis: CohortAnalysis;
  readonly figures: readonly NamedFigure[];
  readonly failures: readonly { readonly file: string; readonly error: string }[];
  readonly runRecord: unknown;
  readonly warnings: readonly string[];
  readonly sheetSource: string;
  readonly generatedAt: string;
  /** Embryos analysed without error (before matching to the sample sheet). */
  readonly okCount?: number;
  /** The time-lapse section (HTML made by the batch's time pass), placed after the per-condition tables; absent or
   *  empty when the batch had no movie. */
  readonly timelapseHtml?: string;
}

const esc = escapeXml;
const CSS = `body{font-family:system-ui,sans-serif;margin:2rem auto;max-width:1100px;padding:0 1rem;color:#222;line-height:1.45}
h1{font-size:1.6rem}h2{font-size:1.25rem;margin-top:2.2rem;border-bottom:1px solid #ddd;padding-bottom:.2rem}h3{font-size:1.05rem}
table{border-collapse:collapse;margin:.6rem 0 1rem;font-size:.88rem}th,td{border:1px solid #ddd;padding:.25rem .5rem;text-align:right}
th{background:#f4f4f4}td{white-space:nowrap;font-variant-numeric:tabular-nums}td.t,th.t{text-align:left;white-space:normal}figure{margin:1rem 0}figcaption{font-size:.85rem;color:#555}
figure svg{width:100%;max-width:860px;height:auto}pre{background:#f7f7f7;padding:.6rem;overflow:auto;font-size:.8rem}.warn{color:#8a4b00}.note{color:#555;font-size:.9rem}
.summary{background:#f7f9fb;border:1px solid #dde3ea;border-radius:6px;padding:.2rem 1rem .6rem}.summary h2{margin-top:.8rem}
details{margin:.6rem 0}summary{cursor:pointer;font-weight:600}td.ok{color:#1b6e3a;text-align:left;white-space:normal}td.off{color:#8a4b00;text-align:left;white-space:normal}
td.t:first-child{white-space:nowrap}`;

/** A table cell: text, or text with a CSS class (e.g. colour for a verdict). */
type Cell = string | { readonly text: string; readonly cls: string };

function table(header: readonly string[], rows: readonly (readonly Cell[])[], textCols = 1): string {
  const th = header.map((h, i) => `<th${i < textCols ? ' class="t"' : ''}>${esc(h)}</th>`).join('');
  const tr = rows.map((r) => `<tr>${r.map((c, i) => {
    const text = typeof c === 'string' ? c : c.text;
    const classes = [i < textCols ? 't' : '', typeof c === 'string' ? '' : c.cls].filter((x) => x !== '').join(' ');
    return `<td${classes ? ` class="${classes}"` : ''}>${esc(text)}</td>`;
  }).join('')}</tr>`).join('');
  return `<table><thead><tr>${th}</tr></thead><tbody>${tr}</tbody></table>`;
}

const unitText = (u: string): string => (u === 'um' ? 'µm' : u);
const embryoCount = (a: CohortAnalysis, condition: string): number => new Set(a.observations.filter((o) => o.condition === condition).map((o) => o.file)).size;

function summarySection(r: ReportInput): string {
  const a = r.analysis;
  const pct = Math.round(a.options.level * 100);
  const assigned = new Set(a.observations.map((o) => o.file)).size;
  const ok = r.okCount ?? assigned;
  const files = `<p><strong>${ok}</strong> file${ok === 1 ? '' : 's'} analysed without error, <strong>${r.failures.length}</strong> failed${r.failures.length ? ' (see <a href="#failed">Failed files</a>)' : ''}; `
    + `${assigned} embryo${assigned === 1 ? '' : 's'} in ${a.conditions.length} condition${a.conditions.length === 1 ? '' : 's'} (from ${esc(r.sheetSource)}); `
    + `reference: ${a.reference === null ? 'none' : `<strong>${esc(a.reference)}</strong>`}.</p>`;
  const conds = table(['condition', 'dosage', 'f', 'ln f', 'n', `λ, x/EL (mean [${pct}% CI])`], a.conditions.map((c) => {
    const lam = a.stats.find((s) => s.condition === c.name && s.quantity === 'lambda' && s.unit === 'EL');
    return [c.name + (c.name === a.reference ? ' (reference)' : ''), plainNumber(c.dosage), plainNumber(c.factor), c.factor !== null ? sigFig(Math.log(c.factor), 3) : 'n/a',
      String(embryoCount(a, c.name)), lam ? withCi(lam.mean, lam.ciLow, lam.ciHigh) : 'n/a'];
  }));
  let dosage: string;
  if (a.reference === null) dosage = '<p class="note">Dosage test skipped: no reference condition.</p>';
  else if (a.dosageFits.length === 0) dosage = '<p class="note">Dosage test: no boundary or landmark positions with at least two dosages.</p>';
  else {
    const lam = a.referenceLambda;
    const predicted = lam ? withCi(lam.lambdaEl, lam.ciLowEl, lam.ciHighEl) : 'n/a';
    const rows = a.dosageFits.map((f): Cell[] => {
      const v = slopeVerdict(f, lam, a.options.level);
      // Green when the ratio interval includes 1 (not rejected), amber when it excludes it.
      return [quantityLabel(f.quantity), v.ratio, { text: v.verdict, cls: v.verdict === 'ratio 1 not rejected' ? 'ok' : 'off' }, withCi(f.slopeEl, f.ciLow, f.ciHigh), predicted];
    });
    dosage = `<h3>Dosage test: position vs ln f</h3>${table(['quantity', `ratio λ_eff/λ_ref [${pct}% CI]`, 'test of ratio = 1', `slope λ_eff, x/EL per ln f [${pct}% CI]`, 'predicted λ_ref [CI]'], rows, 1)}`;
    dosage += `<p class="note">λ_ref: mean λ of the reference condition; the threshold model predicts slope = λ_ref, i.e. a ratio of 1. The ratio interval counts both uncertainties; "not rejected" does not mean "confirmed" (details and caveats under <a href="#dosage">Dosage test</a>).</p>`;
  }
  const bg = a.backgroundCondition;
  const none = a.backgroundChoice?.rule === 'none' ? `<p><strong>No background condition subtracted:</strong> ${esc(a.backgroundChoice.why)}; see <a href="#background">Background condition</a>.</p>` : '';
  const subtracted = none !== '' ? none : bg ? `<p><strong>Background condition subtracted:</strong> every λ, amplitude and boundary position in this report is refitted after subtracting the mean profile of <strong>${esc(bg.condition)}</strong> (${bg.files.length} embryo${bg.files.length === 1 ? '' : 's'}, not compared as a condition); see <a href="#background">Background condition</a>.</p>` : '';
  const warnings = r.warnings.length ? `<h3 class="warn">Warnings (${r.warnings.length})</h3><ul>${r.warnings.map((w) => `<li class="warn">${esc(w)}</li>`).join('')}</ul>` : '';
  return `<section class="summary" id="summary"><h2>Summary</h2>${files}${subtracted}${conds}${dosage}${warnings}</section>`;
}

function settingsSection(a: CohortAnalysis, sheetSource: string, runRecord: unknown): string {
  const o = a.options;
  const cohortRows = [
    ['conditions from', sheetSource], ['reference condition', a.reference ?? 'none (no dosage test)'],
    ['λ used for predictions', 'mean λ (x/EL) of the reference condition; its CI is scaled by ln f'],
    ['profile normalisation', o.normalisation], ['posterior gradient λ_P (x/EL)', o.lambdaPosteriorEl === null ? 'not given' : String(o.lambdaPosteriorEl)],
    ['confidence level', String(o.level)], ['profile grid step (x/EL)', String(o.gridStepEl)], ['slope half-window h (x/EL)', String(o.slopeHalfWidthEl)],
    ...(a.backgroundCondition ? [['background condition (subtracted, refitted)', `${a.backgroundCondition.condition}: ${a.backgroundCondition.files.join(', ')}`]] : []),
    ...(a.covariates ? [['covariates (dosage regression; covariates.csv)', a.covariates.map((c) => c.kind === 'numeric' ? `${c.column} (numeric)` : `${c.column} (categorical, base level ${c.baseLevel ?? 'n/a'})`).join(', ')]] : []),
    ...(a.backgroundChoice?.rule === 'none' ? [['background condition', `none (${a.backgroundChoice.namedBy})${a.backgroundChoice.setAside === null ? '' : `; set aside, not subtracted: ${a.backgroundChoice.setAside}`}`]] : []),
  ];
  const key = keySettings(runRecord);
  const keyTable = key.length > 0 ? table(['setting', 'value'], [...key, ['profile normalisation (cohort)', o.normalisation]], 2)
    : '<p class="note">No batch settings were recorded.</p>';
  const record = runRecord === null || runRecord === undefined ? '<p class="note">No run record was given.</p>'
    : `<h3>Batch analysis (run record)</h3>${table(['setting', 'value'], flattenRecord(runRecord), 2)}`
      + `<details><summary>Full run record (JSON)</summary><pre>${esc(JSON.stringify(runRecord, null, 2) ?? '')}</pre></details>`;
  const files = '<h3>Output files</h3><p class="note">conditions.csv, shifts.csv, dosage_fit.csv and positional_error.csv hold every number at full precision. '
    + 'Their <code>quantity</code> column uses keys: <code>lambda</code>, <code>amplitude</code>, <code>egg_length</code>, '
    + '<code>boundary:&lt;channel&gt;:&lt;method&gt;</code> and <code>landmark:&lt;name&gt;</code>; units are in a <code>unit</code> column (EL, um, a.u.) or in column names (<code>_el</code>).</p>';
  return `<h2 id="settings">Run settings</h2>${keyTable}<details><summary>All settings (cohort step, batch run record, output files)</summary>`
    + `<h3>Cohort step</h3>${table(['setting', 'value'], cohortRows, 2)}${record}${files}</details>`;
}

function statRow(s: ConditionStat): string[] {
  const v = valueWithCi(s.mean, s.ciLow, s.ciHigh, { style: 'words' });
  return [quantityLabel(s.quantity), unitText(s.unit), String(s.n), v.value, sigFig(s.sd, 2), sigFig(s.sem, 2), v.ci];
}

function conditionTables(a: CohortAnalysis): string {
  const pct = Math.round(a.options.level * 100);
  const per = a.conditions.map((c) => {
    const rows = a.stats.filter((s) => s.condition === c.name).map(statRow);
    const head = `${esc(c.name)}${c.name === a.reference ? ' (reference)' : ''} <span class="note">dosage ${esc(plainNumber(c.dosage))}, n = ${embryoCount(a, c.name)}</span>`;
    return `<h3>${head}</h3>${rows.length ? table(['quantity', 'unit', 'n', 'mean', 'SD', 'SEM', `${pct}% CI`], rows, 2) : '<p class="note">No embryos.</p>'}`;
  });
  return `<h2 id="conditions">Conditions</h2><p class="note">For boundaries and landmarks the SD across embryos is the positional error. Means and CIs are shown to the precision of the CI; SD and SEM to 2 significant digits.</p>${per.join('')}`;
}

function dosageSection(a: CohortAnalysis): string {
  if (a.reference === null) return '<h2 id="dosage">Dosage test</h2><p class="note">Skipped: no reference condition.</p>';
  const pct = Math.round(a.options.level * 100);
  const fits = table(['quantity', 'λ_eff/λ_ref [CI]', 'slope λ_eff (x/EL per ln f)', `${pct}% CI`, 'fitted to', 'dof', 'intercept (x/EL)', 'R²', 'lack of fit p', 'predicted slope λ_ref'],
    a.dosageFits.map((f) => {
      const s = valueWithCi(f.slopeEl, f.ciLow, f.ciHigh, { style: 'words' });
      const r = slopeRatio(f, a.referenceLambda, a.options.level);
      const lam = a.referenceLambda;
      const to = f.method === 'condition-means' ? `${f.conditions} condition means` : `${f.n} embryos (HC3)`;
      return [quantityLabel(f.quantity), withCi(r.ratio, r.ratioCiLow, r.ratioCiHigh), s.value, s.ci, to, String(f.dof), sigFig(f.interceptEl, 4), r2Text(f.r2),
        pText(f.lackOfFit?.p), lam ? withCi(lam.lambdaEl, lam.ciLowEl, lam.ciHighEl) : prose(f.predictedSlopeEl)];
    }));
  // The two-gradient column only when a posterior gradient was given.
  const two = a.options.lambdaPosteriorEl !== null;
  const shifts = table(['quantity', 'condition', 'ln f', 'observed Δx', `${pct}% CI`, 'predicted Δx', 'CI', ...(two ? ['two gradients'] : []), 'ratio', 'CI', 'p (ratio = 1)', 'Holm p'],
    a.shifts.map((s) => {
      const o = valueWithCi(s.observedShiftEl, s.ciLow, s.ciHigh, { signed: true, style: 'words' });
      const p = s.predictedShiftEl === null ? { value: 'n/a', ci: 'n/a' } : valueWithCi(s.predictedShiftEl, s.predictedCiLow, s.predictedCiHigh, { signed: true, style: 'words' });
      const q = s.ratio === null ? { value: 'n/a', ci: 'n/a' } : valueWithCi(s.ratio, s.ratioCiLow, s.ratioCiHigh, { style: 'words' });
      return [quantityLabel(s.quantity), s.condition, s.lnF === null ? 'n/a' : sigFig(s.lnF, 3), o.value, o.ci, p.value, p.ci,
        ...(two ? [s.predictedTwoGradientEl === null ? 'n/a' : sigFig(s.predictedTwoGradientEl, 3, true)] : []), q.value, q.ci, pText(s.pRatio), pText(s.pRatioHolm)];
    }), 2);
  const reading = dosageReading(a);
  const findings = reading.findings.map((f) => `<h4>${esc(f.label)}</h4>${f.sentences.map((s) => `<p>${esc(s)}</p>`).join('')}`).join('');
  return `<h2 id="dosage">Dosage test</h2><p>A boundary set by a fixed threshold on an exponential gradient moves by Δx = λ·ln f when the dosage changes by a factor f (f &gt; 1: posterior). Shifts are in x/EL relative to the reference.</p>`
    + `<h3>Position vs ln f</h3>${fits}<h3>Shift per condition</h3>${shifts}<h3>Reading</h3>${findings}<h3>Caveats</h3><ul>${reading.caveats.map((c) => `<li>${esc(c)}</li>`).join('')}</ul>`;
}

/** The background condition: the rule, its embryos, and per condition the means before and after with both SEs. */
function backgroundSection(a: CohortAnalysis): string {
  const bg = a.backgroundCondition;
  const choice = a.backgroundChoice;
  if (!bg && choice?.rule === 'none') {
    const aside = choice.setAside === null ? '' : ` Its embryos (${choice.setAsideFiles.length}): ${choice.setAsideFiles.map(esc).join(', ') || 'none analysed'}.`;
    return `<h2 id="background">Background condition</h2><p>None: ${esc(choice.why)}.${aside} Every λ, amplitude and boundary in this report is the batch's own, `
      + `after each embryo's own background setting only. background_condition.json records this choice.</p>`;
  }
  if (!bg) return '';
  const pct = Math.round(a.options.level * 100);
  const num = (v: number | null): string => (v === null || !Number.isFinite(v) ? 'n/a' : sigFig(v, 3));
  const rows = bg.summaries.filter((s) => s.unit !== 'um').map((s) => [s.condition, quantityLabel(s.quantity), unitText(s.unit), String(s.n), num(s.meanBefore), num(s.meanAfter),
    num(s.seBetween), num(s.seBackground), Number.isFinite(s.ciLow) ? `${num(s.ciLow)} to ${num(s.ciHigh)}` : 'n/a']);
  const named = bg.source === 'option' ? `named by ${bg.namedBy ?? '--background-condition'}` : 'marked background in the sample sheet\'s role column';
  return `<h2 id="background">Background condition</h2><p>${esc(bg.rule)} The background condition <strong>${esc(bg.condition)}</strong> (${esc(named)}) is not compared as a condition; `
    + `its embryos: ${bg.files.map(esc).join(', ')}. Channels: ${bg.profiles.map((p) => esc(p.channel)).join(', ')}.</p>`
    + table(['condition', 'quantity', 'unit', 'n', 'mean before', 'mean after', 'SE between embryos', 'SE from the background', `${pct}% CI (both)`], rows, 3)
    + `<p class="note">The background's own noise is shared by every embryo, so the spread between embryos does not show it: its SE is a jackknife over the background embryos `
    + `(each left out in turn, the rest subtracted, every embryo fitted again). The intervals in the other tables of this report count the spread between embryos only; the last column counts both. `
    + `Subtracting assumes the background condition was stained, mounted and imaged like the others; a background profile brighter than the embryo's own signal leaves negative values. `
    + `Every number is in background_refit.csv, background_conditions.csv and background_profile.csv; background_condition.json records the subtraction.</p>`;
}

/** Build the report HTML. */
export function cohortReportHtml(r: ReportInput): string {
  const figs = r.figures.map((f) => `<figure id="fig-${esc(f.name)}">${f.svg}<figcaption>${esc(f.title)} (also saved as ${esc(f.name)}.svg and .png)</figcaption></figure>`).join('');
  const failed = `<h2 id="failed">Failed files</h2>${r.failures.length ? table(['file', 'reason'], r.failures.map((f) => [f.file, f.error]), 2) : '<p class="note">None.</p>'}`;
  return `<!DOCTYPE html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">`
    + `<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">`
    + `<title>Eggline cohort report</title><style>${CSS}</style></head><body><h1>Eggline cohort report</h1>`
    + `<p class="note">Generated ${esc(r.generatedAt)}. Positions are x/EL (0 = anterior pole, 1 = posterior pole).</p>`
    + summarySection(r) + `<h2 id="figures">Figures</h2>${figs}` + backgroundSection(r.analysis) + dosageSection(r.analysis) + sidesSection(r.analysis) + conditionTables(r.analysis)
    + (r.timelapseHtml ?? '') + failed + settingsSection(r.analysis, r.sheetSource, r.runRecord) + '</body></html>\n';
}

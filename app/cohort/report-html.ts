// The cohort report: ONE self-contained HTML file (inline CSS and SVG; no scripts, no network).
import type { CohortAnalysis, ConditionStat } from '../../core/cohort';
import { escapeXml, type NamedFigure } from '../../core/figures';
import { flattenRecord } from './flatten-record';
import { dosageReading, prose } from './reading';

/** Everything the report shows. */
export interface ReportInput {
  readonly analysis: CohortAnalysis;
  readonly figures: readonly NamedFigure[];
  readonly failures: readonly { readonly file: string; readonly error: string }[];
  readonly runRecord: unknown;
  readonly warnings: readonly string[];
  readonly sheetSource: string;
  readonly generatedAt: string;
}

const esc = escapeXml;
const CSS = `body{font-family:system-ui,sans-serif;margin:2rem auto;max-width:1100px;padding:0 1rem;color:#222;line-height:1.45}
h1{font-size:1.6rem}h2{font-size:1.25rem;margin-top:2.2rem;border-bottom:1px solid #ddd;padding-bottom:.2rem}h3{font-size:1.05rem}
table{border-collapse:collapse;margin:.6rem 0 1rem;font-size:.88rem}th,td{border:1px solid #ddd;padding:.25rem .5rem;text-align:right}
th{background:#f4f4f4}td{white-space:nowrap}td.t,th.t{text-align:left;white-space:normal}figure{margin:1rem 0}figcaption{font-size:.85rem;color:#555}
figure svg{width:100%;max-width:860px;height:auto}pre{background:#f7f7f7;padding:.6rem;overflow:auto;font-size:.8rem}.warn{color:#8a4b00}.note{color:#555;font-size:.9rem}`;

function table(header: readonly string[], rows: readonly (readonly string[])[], textCols = 1): string {
  const th = header.map((h, i) => `<th${i < textCols ? ' class="t"' : ''}>${esc(h)}</th>`).join('');
  const tr = rows.map((r) => `<tr>${r.map((c, i) => `<td${i < textCols ? ' class="t"' : ''}>${esc(c)}</td>`).join('')}</tr>`).join('');
  return `<table><thead><tr>${th}</tr></thead><tbody>${tr}</tbody></table>`;
}

function settingsSection(a: CohortAnalysis, sheetSource: string, runRecord: unknown): string {
  const o = a.options;
  const rows = [
    ['conditions from', sheetSource], ['reference condition', a.reference ?? 'none (no dosage test)'],
    ['λ used for predictions', 'mean λ (x/EL) of the reference condition; its CI is scaled by ln f'],
    ['profile normalisation', o.normalisation], ['posterior gradient λ_P (x/EL)', o.lambdaPosteriorEl === null ? 'not given' : String(o.lambdaPosteriorEl)],
    ['confidence level', String(o.level)], ['profile grid step (x/EL)', String(o.gridStepEl)], ['slope half-window h (x/EL)', String(o.slopeHalfWidthEl)],
  ];
  const record = runRecord === null || runRecord === undefined ? '<p class="note">No run record was given.</p>'
    : `<h3>Batch analysis (run record)</h3>${table(['setting', 'value'], flattenRecord(runRecord), 2)}`
      + `<details><summary>Full run record (JSON)</summary><pre>${esc(JSON.stringify(runRecord, null, 2) ?? '')}</pre></details>`;
  return `<h2>Run settings</h2><h3>Cohort step</h3>${table(['setting', 'value'], rows, 2)}${record}`;
}

function conditionTables(a: CohortAnalysis): string {
  const pct = Math.round(a.options.level * 100);
  const overview = table(['condition', 'dosage', 'f', 'ln f', 'embryos'], a.conditions.map((c) => [
    c.name + (c.name === a.reference ? ' (reference)' : ''), prose(c.dosage), prose(c.factor), prose(c.factor !== null ? Math.log(c.factor) : null),
    String(new Set(a.observations.filter((o) => o.condition === c.name).map((o) => o.file)).size),
  ]));
  const per = a.conditions.map((c) => {
    const rows = a.stats.filter((s) => s.condition === c.name).map((s: ConditionStat) => [s.quantity, s.unit, String(s.n), prose(s.mean), prose(s.sd), prose(s.sem), `${prose(s.ciLow)} to ${prose(s.ciHigh)}`]);
    return `<h3>${esc(c.name)}</h3>${rows.length ? table(['quantity', 'unit', 'n', 'mean', 'SD', 'SEM', `${pct}% CI`], rows, 2) : '<p class="note">No embryos.</p>'}`;
  });
  return `<h2>Conditions</h2>${overview}<p class="note">For boundaries and landmarks the SD across embryos is the positional error.</p>${per.join('')}`;
}

function dosageSection(a: CohortAnalysis): string {
  if (a.reference === null) return '<h2>Dosage test</h2><p class="note">Skipped: no reference condition.</p>';
  const fits = table(['quantity', 'slope (x/EL per ln f)', 'CI', 'intercept', 'R²', 'n', 'predicted slope λ_ref'],
    a.dosageFits.map((f) => [f.quantity, prose(f.slopeEl), `${prose(f.ciLow)} to ${prose(f.ciHigh)}`, prose(f.interceptEl), prose(f.r2), String(f.n), prose(f.predictedSlopeEl)]));
  const shifts = table(['quantity', 'condition', 'ln f', 'observed Δx', 'CI', 'predicted Δx', 'CI', 'two gradients', 'ratio', 'CI'],
    a.shifts.map((s) => [s.quantity, s.condition, prose(s.lnF), prose(s.observedShiftEl, true), `${prose(s.ciLow, true)} to ${prose(s.ciHigh, true)}`,
      prose(s.predictedShiftEl, true), `${prose(s.predictedCiLow, true)} to ${prose(s.predictedCiHigh, true)}`, prose(s.predictedTwoGradientEl, true), prose(s.ratio), `${prose(s.ratioCiLow)} to ${prose(s.ratioCiHigh)}`]), 2);
  const reading = dosageReading(a);
  const findings = reading.findings.map((f) => `<h3>${esc(f.quantity)}</h3>${f.sentences.map((s) => `<p>${esc(s)}</p>`).join('')}`).join('');
  return `<h2>Dosage test</h2><p>A boundary set by a fixed threshold on an exponential gradient moves by Δx = λ·ln f when the dosage changes by a factor f (f &gt; 1: posterior). Shifts are in x/EL relative to the reference.</p>`
    + `<h3>Position vs ln f (all embryos)</h3>${fits}<h3>Shift per condition</h3>${shifts}<h2>Reading</h2>${findings}<h3>Caveats</h3><ul>${reading.caveats.map((c) => `<li>${esc(c)}</li>`).join('')}</ul>`;
}

/** Build the report HTML. */
export function cohortReportHtml(r: ReportInput): string {
  const figs = r.figures.map((f) => `<figure id="fig-${esc(f.name)}">${f.svg}<figcaption>${esc(f.title)} (also saved as ${esc(f.name)}.svg and .png)</figcaption></figure>`).join('');
  const warnings = r.warnings.length ? `<h2>Warnings</h2><ul>${r.warnings.map((w) => `<li class="warn">${esc(w)}</li>`).join('')}</ul>` : '';
  const failed = `<h2>Failed files</h2>${r.failures.length ? table(['file', 'reason'], r.failures.map((f) => [f.file, f.error]), 2) : '<p class="note">None.</p>'}`;
  return `<!DOCTYPE html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">`
    + `<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">`
    + `<title>Eggline cohort report</title><style>${CSS}</style></head><body><h1>Eggline cohort report</h1>`
    + `<p class="note">Generated ${esc(r.generatedAt)}. Positions are x/EL (0 = anterior pole, 1 = posterior pole).</p>`
    + settingsSection(r.analysis, r.sheetSource, r.runRecord) + conditionTables(r.analysis) + `<h2>Figures</h2>${figs}`
    + dosageSection(r.analysis) + warnings + failed + '</body></html>\n';
}

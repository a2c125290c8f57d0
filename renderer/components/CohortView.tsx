// Cohort view of the last batch. With a sample sheet (samples.csv in the folder) it shows what report.html shows:
// per-condition λ, the dosage test (observed vs predicted shift, λ_eff vs λ_ref) and the report's figures, with the
// numbers formatted by core/figures so they read the same. Without one: a single-group summary of the batch.
import { embryoResults } from '../../core/batch';
import { useMemo } from 'react';
import type { BatchSummary, CohortConditionRow, CohortReading, CohortSummary } from '../../core/contract';
import { quantityLabel, slopeRatio, type DosageFit, type ShiftRow } from '../../core/cohort';
import { cohortProfilesFigure, lambdaByConditionFigure, plainNumber, sigFig, valueWithCi } from '../../core/figures';
import { lambdaSummaryEl, lambdaValuesEl, meanScaledProfile } from '../export/cohortSeries';
import { ComparisonOptions, type ComparisonOptionsProps } from './ComparisonOptions';
import { fmt } from '../ui/format';

/** "value [lo, hi]" at the interval's precision; the value alone when there is no interval (n = 1); "n/a" without a value. */
function withCi(v: number | null | undefined, lo: number | null, hi: number | null, signed = false): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return 'n/a';
  const r = valueWithCi(v, lo, hi, { signed });
  return r.ci === 'n/a' ? r.value : `${r.value} ${r.ci}`;
}

function ConditionTable({ c }: { c: CohortSummary }) {
  const pct = Math.round(c.level * 100);
  return (
    <div className="table-scroll" data-testid="cohort-conditions-scroll">
    <table className="results cohort-table" data-testid="cohort-conditions">
      <thead><tr><th>condition</th><th>dosage</th><th>f</th><th>ln f</th><th>n</th><th>λ, x/EL (mean [{pct}% CI])</th><th>λ, µm (mean [{pct}% CI])</th></tr></thead>
      <tbody>{c.conditions.map((r: CohortConditionRow) => (
        <tr key={r.name} data-testid="cohort-condition" data-name={r.name}>
          <td>{r.name}{r.isReference && <span className="muted"> (reference)</span>}</td>
          <td>{plainNumber(r.dosage)}</td><td>{plainNumber(r.factor)}</td><td>{r.factor === null ? 'n/a' : sigFig(Math.log(r.factor), 3)}</td>
          <td data-testid="cohort-n">{r.n}</td>
          <td>{r.lambdaEl ? withCi(r.lambdaEl.mean, r.lambdaEl.ciLow, r.lambdaEl.ciHigh) : 'n/a'}</td>
          <td>{r.lambdaUm ? withCi(r.lambdaUm.mean, r.lambdaUm.ciLow, r.lambdaUm.ciHigh) : 'n/a'}</td>
        </tr>))}</tbody>
    </table>
    </div>
  );
}

/** Green when the ratio's interval includes 1 (1 not rejected), amber when it excludes it, plain without an interval. */
function ratioClass(lo: number | null, hi: number | null): string {
  if (lo === null || hi === null || !Number.isFinite(lo) || !Number.isFinite(hi)) return '';
  return lo <= 1 && hi >= 1 ? 'verdict-ok' : 'verdict-off';
}

function SlopeTable({ c }: { c: CohortSummary }) {
  const pct = Math.round(c.level * 100);
  const lam = c.referenceLambda;
  return (
    <div className="table-scroll" data-testid="cohort-slopes-scroll">
    <table className="results cohort-table" data-testid="cohort-slopes">
      <thead><tr><th>quantity</th><th>λ_eff/λ_ref [{pct}% CI]</th><th>slope λ_eff, x/EL per ln f [CI]</th><th>predicted λ_ref [CI]</th><th>fitted to</th><th>R²</th></tr></thead>
      <tbody>{c.dosageFit.map((f: DosageFit) => {
        const r = slopeRatio(f, lam, c.level);
        return (
          <tr key={f.quantity} data-testid="cohort-slope">
            <td>{quantityLabel(f.quantity)}</td>
            <td className={ratioClass(r.ratioCiLow, r.ratioCiHigh)}>{withCi(r.ratio, r.ratioCiLow, r.ratioCiHigh)}</td>
            <td>{withCi(f.slopeEl, f.ciLow, f.ciHigh)}</td>
            <td>{lam ? withCi(lam.lambdaEl, lam.ciLowEl, lam.ciHighEl) : sigFig(f.predictedSlopeEl, 3)}</td>
            <td>{f.method === 'condition-means' ? `${f.conditions} condition means` : `${f.n} embryos (HC3)`}</td>
            <td>{Number.isFinite(f.r2) && f.r2 > 0.9995 && f.r2 < 1 ? '> 0.999' : sigFig(f.r2, 3)}</td>
          </tr>);
      })}</tbody>
    </table>
    </div>
  );
}

function ShiftTable({ c }: { c: CohortSummary }) {
  const pct = Math.round(c.level * 100);
  return (
    <div className="table-scroll" data-testid="cohort-shifts-scroll">
    <table className="results cohort-table" data-testid="cohort-shifts">
      <thead><tr><th>quantity</th><th>condition</th><th>ln f</th><th>observed Δx, x/EL [{pct}% CI]</th><th>predicted λ·ln f [CI]</th><th>ratio observed/predicted [CI]</th><th>Holm p (ratio = 1)</th><th>n (ref, cond.)</th></tr></thead>
      <tbody>{c.shifts.map((s: ShiftRow) => (
        <tr key={`${s.quantity} ${s.condition}`} data-testid="cohort-shift" data-condition={s.condition}>
          <td>{quantityLabel(s.quantity)}</td><td>{s.condition}</td><td>{s.lnF === null ? 'n/a' : sigFig(s.lnF, 3)}</td>
          <td>{withCi(s.observedShiftEl, s.ciLow, s.ciHigh, true)}</td>
          <td>{withCi(s.predictedShiftEl, s.predictedCiLow, s.predictedCiHigh, true)}</td>
          <td className={ratioClass(s.ratioCiLow, s.ratioCiHigh)}>{withCi(s.ratio, s.ratioCiLow, s.ratioCiHigh)}</td>
          <td>{s.pRatioHolm === null ? 'n/a' : s.pRatioHolm < 1e-4 ? '< 0.0001' : sigFig(s.pRatioHolm, 2)}</td>
          <td>{s.nReference}, {s.nCondition}</td>
        </tr>))}</tbody>
    </table>
    </div>
  );
}

/** σx per condition at a few positions, with the normalisation it follows (positional_error.csv has every position). */
function PositionalErrorTable({ c }: { c: CohortSummary }) {
  const rows = c.positionalError ?? [];
  if (rows.length === 0) return null;
  const pct = Math.round(c.level * 100);
  const xs = rows[0].points.map((p) => p.xEl);
  return (
    <div className="table-scroll" data-testid="cohort-sigma-scroll">
      <h4>Positional error σx, x/EL [{pct}% CI] <span className="muted">after normalisation <code data-testid="cohort-sigma-normalisation">{rows[0].normalisation}</code>; every position in positional_error.csv</span></h4>
      <table className="results cohort-table" data-testid="cohort-sigma">
        <thead><tr><th>condition</th>{xs.map((x) => <th key={x}>x = {x.toFixed(1)} EL</th>)}</tr></thead>
        <tbody>{rows.map((r) => (
          <tr key={r.condition} data-testid="cohort-sigma-row" data-condition={r.condition}>
            <td>{r.condition}</td>
            {r.points.map((p) => <td key={p.xEl} data-x={p.xEl.toFixed(1)}>{withCi(p.sigmaXEl, p.ciLowEl, p.ciHighEl)}</td>)}
          </tr>))}</tbody>
      </table>
    </div>
  );
}

function DosageTest({ c }: { c: CohortSummary }) {
  if (c.reference === null) return <p className="muted">Dosage test skipped: no reference condition (give the reference dosage 1 in samples.csv).</p>;
  if (c.dosageFit.length === 0 && c.shifts.length === 0) return <p className="muted">Dosage test: no boundary or landmark positions to compare.</p>;
  const smallN = c.conditions.some((r) => r.n < 2);
  return (
    <div data-testid="cohort-dosage">
      <h4>Dosage test <span className="muted">threshold model: a boundary moves by Δx = λ·ln f (f &gt; 1: posterior); λ = mean λ of the reference</span></h4>
      {c.dosageFit.length > 0 && <SlopeTable c={c} />}
      {c.shifts.length > 0 && <ShiftTable c={c} />}
      {smallN && <p className="muted small">Conditions with one embryo have no confidence interval; the value alone is shown.</p>}
      {c.reading && <Reading reading={c.reading} />}
    </div>
  );
}

/** The report's reading of the dosage test in words, and the caveats that apply (the same text as report.html). */
function Reading({ reading }: { reading: CohortReading }) {
  return (
    <details className="cohort-reading" data-testid="cohort-reading" open>
      <summary>Reading and caveats <span className="muted small">(as in report.html; they support, not replace, your judgement)</span></summary>
      {reading.findings.map((f) => (
        <div key={f.quantity} data-testid="cohort-finding" data-quantity={f.quantity}>
          <h5>{f.label}</h5>
          {f.sentences.map((t) => <p key={t} className="small">{t}</p>)}
        </div>))}
      <h5>Caveats</h5>
      <ul className="small" data-testid="cohort-caveats">{reading.caveats.map((t) => <li key={t}>{t}</li>)}</ul>
    </details>
  );
}

function ConditionsView({ c, outDir, onOpenReport, options }: { c: CohortSummary; outDir: string; onOpenReport: (path: string) => void; options?: ComparisonOptionsProps }) {
  return (
    <section className="panel cohort" data-testid="cohort-view">
      <h3>Cohort <span className="muted">last batch · {c.conditions.length} conditions from <code data-testid="cohort-sheet">{c.sampleSheetPath}</code> · reference: {c.reference ?? 'none'}</span></h3>
      <p className="muted small"><button data-testid="cohort-open-report" onClick={() => onOpenReport(c.reportPath)} title="Open report.html in the system's browser">Open report</button>{' '}
        <code data-testid="cohort-report">{c.reportPath}</code> · tables (conditions.csv, shifts.csv, dosage_fit.csv) in <code>{outDir}</code></p>
      {options && <ComparisonOptions {...options} />}
      {options && <p className="muted small" data-testid="cohort-options-note">The files in <code>{outDir}</code> (report.html, the tables) keep the options of the batch that wrote them; the window shows the options above.</p>}
      <ConditionTable c={c} />
      <DosageTest c={c} />
      <PositionalErrorTable c={c} />
      {c.warnings.length > 0 && <ul className="warnings" data-testid="cohort-warnings">{c.warnings.map((w) => <li key={w}>{w}</li>)}</ul>}
      <div className="figures cohort-figures">
        {c.figures.map((f) => <figure key={f.name} className="figure" data-testid="cohort-figure" data-name={f.name} title={f.title} dangerouslySetInnerHTML={{ __html: f.svg }} />)}
      </div>
    </section>
  );
}

/** The whole batch as one group (no sample sheet): mean scaled profile and λ per embryo, computed as the report does. */
function SingleGroupView({ summary, options }: { summary: BatchSummary; options?: ComparisonOptionsProps }) {
  const figs = useMemo(() => {
    // One row per embryo: a movie counts once, with its last analysed time point (as in the report).
    const ok = embryoResults(summary.results).filter((r) => r.status === 'ok');
    const prof = meanScaledProfile(ok);
    const lam = lambdaValuesEl(ok);
    const { mean, sd, ciLow, ciHigh } = lambdaSummaryEl(ok);
    // Whiskers only where there is an interval (two or more embryos); the subtitle says what is drawn.
    const hasCi = lam.length >= 2 && Number.isFinite(ciLow) && Number.isFinite(ciHigh);
    return {
      profiles: prof === null ? null : cohortProfilesFigure([{ label: `this batch (n=${prof.embryoCount})`, ...prof }], { widthPx: 560, heightPx: 340, yLabel: 'intensity, min–max scaled to [0, 1]' }),
      lambda: lam.length === 0 ? null : lambdaByConditionFigure([{ label: 'this batch', values: lam, mean, ciLow: hasCi ? ciLow : NaN, ciHigh: hasCi ? ciHigh : NaN }],
        { widthPx: 460, heightPx: 340, unit: 'EL', title: 'Decay length λ per embryo', subtitle: hasCi ? 'dots: embryos; bar: mean; whiskers: 95% CI of the mean' : 'dots: embryos; bar: mean (one embryo: no interval)' }),
      mean, sd, n: lam.length,
    };
  }, [summary]);
  const hint = summary.cohortError
    ? <>{options && <ComparisonOptions {...options} />}<p className="error" data-testid="cohort-error">The cohort step failed: {summary.cohortError}</p></>
    : summary.cancelled ? <p className="muted" data-testid="cohort-hint">The batch was cancelled; conditions are compared after a complete batch.</p>
    : <p className="muted" data-testid="cohort-hint">All embryos are shown as one group. To compare conditions (and run the dosage test), put a <code>samples.csv</code> with columns file, condition, dosage (reference = 1) in the folder and run the batch again.</p>;
  if (figs.n === 0) return <section className="panel cohort" data-testid="cohort-view">{hint}<p className="muted">The last batch has no embryo with a gradient fit, so there is nothing to summarise.</p></section>;
  return (
    <section className="panel cohort" data-testid="cohort-view">
      <h3>Cohort <span className="muted" data-testid="cohort-lambda-summary">last batch · {figs.n >= 2 ? `λ/EL mean ${fmt(figs.mean)} ± ${fmt(figs.sd, 2)} SD (n = ${figs.n})` : `λ/EL ${fmt(figs.mean)} (n = 1: no SD)`}</span></h3>
      {hint}
      <div className="figures">
        {figs.profiles && <div className="figure" dangerouslySetInnerHTML={{ __html: figs.profiles }} />}
        {figs.lambda && <div className="figure" dangerouslySetInnerHTML={{ __html: figs.lambda }} />}
      </div>
    </section>
  );
}

/** Cohort view; empty until a batch has finished. */
export function CohortView({ summary, onOpenReport, options }: { summary: BatchSummary | null; onOpenReport: (path: string) => void; options?: ComparisonOptionsProps }) {
  if (summary === null) return <section className="panel cohort"><p className="muted">Run a batch to see the cohort summary here.</p></section>;
  if (summary.cohort) return <ConditionsView c={summary.cohort} outDir={summary.outDir} onOpenReport={onOpenReport} options={options} />;
  return <SingleGroupView summary={summary} options={options} />;
}

// Batch: choose an output folder, run over the open folder with the current settings and hand edits, follow progress.
import type { BatchState } from '../hooks/useBatch';
import { embryoResults } from '../../core/batch';
import { resultKeyOf } from '../../core/model';
import { fixed, fmt } from '../ui/format';

/** Props of the batch panel. */
export interface BatchPanelProps {
  readonly batch: BatchState;
  readonly folder: string | null;
  readonly fileCount: number;
  readonly onChooseOutput: () => void;
  readonly onRun: () => void;
  readonly onCancel: () => void;
  /** Show a file of the results in the embryo view. */
  readonly onOpenFile: (file: string) => void;
  /** Open report.html in the system's browser. */
  readonly onOpenReport: (path: string) => void;
  /** The file shown in the embryo view (its row is marked). */
  readonly current: string | null;
}

/** The batch panel. */
export function BatchPanel({ batch, folder, fileCount, onChooseOutput, onRun, onCancel, onOpenFile, onOpenReport, current }: BatchPanelProps) {
  const pct = batch.total > 0 ? (100 * batch.done) / batch.total : 0;
  // After a cancel, the files that never ran (they have no row in the results).
  const notRun = batch.summary === null ? 0 : Math.max(0, batch.total - batch.summary.ok - batch.summary.failed);
  return (
    <section className="panel batch" data-testid="batch-panel">
      <h3>Batch <span className="muted">all {fileCount} files of the folder, current settings and hand edits</span></h3>
      <div className="row"><span className="muted">input</span><code>{folder ?? '—'}</code></div>
      <div className="row"><span className="muted">output</span><code data-testid="batch-out">{batch.outDir ?? 'not chosen'}</code>
        <button onClick={onChooseOutput} disabled={batch.running} data-testid="batch-choose">Choose…</button></div>
      <div className="row">
        <button className="primary" onClick={onRun} disabled={batch.running || batch.outDir === null || folder === null} data-testid="batch-run">Run batch</button>
        <button onClick={onCancel} disabled={!batch.running} data-testid="batch-cancel">Cancel</button>
      </div>
      <div className="progress" data-testid="batch-progress"><div style={{ width: `${pct}%` }} /><span>{batch.done} / {batch.total}{batch.running ? ' · running' : ''}</span></div>
      {batch.error && <p className="error" data-testid="batch-error">{batch.error}</p>}
      {batch.files.length > 0 && !batch.summary && (
        <ul className="batch-files">{batch.files.map((f) => <li key={f.file}><span className={`status status-${f.status}`}>{f.status}</span> {f.file} {f.message && <em>{f.message}</em>}</li>)}</ul>
      )}
      {batch.summary && (
        <>
          <p data-testid="batch-summary">{batch.summary.cancelled ? 'Cancelled' : 'Finished'}: {batch.summary.ok} ok, {batch.summary.failed} failed{notRun > 0 ? `, ${notRun} not run` : ''} · written to <code>{batch.summary.outDir}</code></p>
          {batch.summary.cohort && (
            <p className="muted" data-testid="batch-cohort">Conditions compared ({batch.summary.cohort.conditions.length}, from samples.csv): see the Cohort tab ·{' '}
              <button data-testid="batch-open-report" onClick={() => batch.summary?.cohort && onOpenReport(batch.summary.cohort.reportPath)} title={batch.summary.cohort.reportPath}>Open report</button></p>
          )}
          <p className="muted small">Click a row (or focus it and press Enter) to show that embryo with its warnings.</p>
          {batch.summary.cohortError && <p className="error" data-testid="batch-cohort-error">The cohort step failed: {batch.summary.cohortError}</p>}
          <div className="table-scroll">
          <table className="results" data-testid="batch-results"><thead><tr><th>file</th><th>status</th><th>λ µm</th><th>± SE</th><th>λ/EL</th><th>R²</th><th>EL µm</th><th>boundaries (x/EL)</th><th>warnings or error</th></tr></thead>
            <tbody>{embryoResults(batch.summary.results).map((r) => (
              <tr key={resultKeyOf(r)} className={`clickable${r.status === 'error' ? ' row-error' : ''}${r.file === current ? ' current' : ''}`} tabIndex={0}
                data-testid="batch-row" data-file={r.file} aria-label={`show ${r.file}`}
                onClick={() => onOpenFile(r.file)} onKeyDown={(e) => { if (e.key === 'Enter' || e.key === ' ') { e.preventDefault(); onOpenFile(r.file); } }}>
                <td>{r.file}</td><td>{r.status}</td><td>{fmt(r.gradientFit?.lambdaUm)}</td><td>{fmt(r.gradientFit?.lambdaSeUm, 2)}</td>
                <td>{fixed(r.gradientFit?.lambdaEl, 4)}</td><td>{fixed(r.gradientFit?.r2, 4)}</td><td>{fmt(r.eggLengthUm, 4)}</td>
                <td>{r.boundaries.filter((b) => b.positionEl !== null).map((b) => `${b.channel} ${b.method} ${fixed(b.positionEl, 3)}`).join('; ')}</td>
                <td className={r.status === 'ok' && r.warnings.length > 0 ? 'warn-cell' : ''}>{r.error ?? r.warnings.join('; ')}</td>
              </tr>))}</tbody></table>
          </div>
        </>
      )}
    </section>
  );
}

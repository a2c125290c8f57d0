// A simple cohort view of the last batch: mean scaled profile across embryos and λ per embryo, drawn by core/figures.
import { useMemo } from 'react';
import type { BatchSummary } from '../../core/contract';
import { cohortProfilesFigure, lambdaByConditionFigure } from '../../core/figures';
import { lambdaValuesEl, meanScaledProfile } from '../export/cohortSeries';
import { fmt } from '../ui/format';

/** Cohort view; empty until a batch has finished. */
export function CohortView({ summary }: { summary: BatchSummary | null }) {
  const figs = useMemo(() => {
    if (summary === null) return null;
    const ok = summary.results.filter((r) => r.status === 'ok');
    const prof = meanScaledProfile(ok);
    const lam = lambdaValuesEl(ok);
    const mean = lam.reduce((a, v) => a + v, 0) / (lam.length || 1);
    const sd = Math.sqrt(lam.reduce((a, v) => a + (v - mean) ** 2, 0) / Math.max(1, lam.length - 1));
    return {
      profiles: prof === null ? null : cohortProfilesFigure([{ label: `this batch (n=${prof.count})`, ...prof }], { widthPx: 560, heightPx: 340, yLabel: 'intensity, min–max scaled to [0, 1]' }),
      lambda: lam.length === 0 ? null : lambdaByConditionFigure([{ label: 'this batch', values: lam, mean, ciLow: NaN, ciHigh: NaN }], { widthPx: 460, heightPx: 340, unit: 'EL', title: 'Decay length λ per embryo (bar: mean)' }),
      mean, sd, n: lam.length,
    };
  }, [summary]);
  if (figs !== null && figs.n === 0) return <section className="panel cohort" data-testid="cohort-view"><p className="muted">The last batch has no embryo with a gradient fit, so there is nothing to summarise.</p></section>;
  if (figs === null) return <section className="panel cohort"><p className="muted">Run a batch to see the cohort summary here.</p></section>;
  return (
    <section className="panel cohort" data-testid="cohort-view">
      <h3>Cohort <span className="muted">last batch · λ/EL mean {fmt(figs.mean)} ± {fmt(figs.sd, 2)} SD (n = {figs.n})</span></h3>
      <div className="figures">
        {figs.profiles && <div className="figure" dangerouslySetInnerHTML={{ __html: figs.profiles }} />}
        {figs.lambda && <div className="figure" dangerouslySetInnerHTML={{ __html: figs.lambda }} />}
      </div>
    </section>
  );
}

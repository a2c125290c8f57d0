// The report's section on the two sides of the embryo (batches run with --edge-side each): per condition, the mean of
// the embryos' paired differences λ_dorsal − λ_ventral with its interval from the spread between embryos, and a plain
// reading of the test of zero ("rejected" / "not rejected", never "the sides agree").
import type { CohortAnalysis, SideDifferenceRow } from '../../core/cohort';
import { escapeXml, plainNumber, sigFig, valueWithCi } from '../../core/figures';
import { pText, withCi } from './reading';

/** One condition's reading in plain words. */
export function sideDifferenceSentence(r: SideDifferenceRow, level: number): string {
  const alpha = plainNumber(1 - level);
  const pct = Math.round(level * 100);
  const embryos = `${r.n} embryo${r.n === 1 ? '' : 's'}`;
  if (r.n < 2 || !Number.isFinite(r.ciLowEl)) {
    return `${r.condition}: λ_dorsal − λ_ventral = ${withCi(r.meanEl, null, null, true)} EL from ${embryos}; at least two embryos are needed for an interval.`;
  }
  const head = `${r.condition}: the mean of λ_dorsal − λ_ventral over ${embryos} is ${withCi(r.meanEl, r.ciLowEl, r.ciHighEl, true)} EL`
    + ` (${Number.isFinite(r.meanUm) ? `${withCi(r.meanUm, r.ciLowUm, r.ciHighUm, true)} µm; ` : ''}${pct}% t interval from the spread between embryos).`;
  if (r.ciLowEl > 0 || r.ciHighEl < 0) {
    const longer = r.meanEl > 0 ? 'dorsal' : 'ventral';
    return `${head} A mean difference of zero is rejected at the ${alpha} level (p = ${pText(r.p)}, Holm-adjusted over the conditions ${pText(r.pHolm)}): the decay length is longer on the ${longer} side in these embryos.`;
  }
  return `${head} A mean difference of zero is not rejected at the ${alpha} level (p = ${pText(r.p)}, Holm-adjusted ${pText(r.pHolm)}); that does not show that the sides are equal, only that these embryos do not resolve a difference.`;
}

/** The section's HTML; empty when no embryo was measured on each side. */
export function sidesSection(a: CohortAnalysis): string {
  const rows = a.sideDifferences ?? [];
  if (rows.length === 0) return '';
  const pct = Math.round(a.options.level * 100);
  const head = ['condition', 'n', 'mean λ_d − λ_v (x/EL)', `${pct}% CI`, 'SD', 'p (mean = 0)', 'Holm p'];
  const body = rows.map((r) => {
    const v = valueWithCi(r.meanEl, r.ciLowEl, r.ciHighEl, { signed: true, style: 'words' });
    const cells = [r.condition, String(r.n), v.value, v.ci, sigFig(r.sdEl, 2), pText(r.p), pText(r.pHolm)];
    return `<tr>${cells.map((c, i) => `<td${i === 0 ? ' class="t"' : ''}>${escapeXml(c)}</td>`).join('')}</tr>`;
  }).join('');
  const table = `<table><thead><tr>${head.map((h, i) => `<th${i === 0 ? ' class="t"' : ''}>${escapeXml(h)}</th>`).join('')}</tr></thead><tbody>${body}</tbody></table>`;
  const reading = rows.map((r) => `<p>${escapeXml(sideDifferenceSentence(r, a.options.level))}</p>`).join('');
  return `<h2 id="sides">Dorsal and ventral sides</h2><p>Each embryo's edge band was also fitted on its dorsal and its ventral side alone; `
    + `its paired difference λ_dorsal − λ_ventral is in embryos.csv with its own interval, and the conditions' means are in side_differences.csv. `
    + `The interval below comes from the spread of the differences between embryos, so it includes whatever made one embryo's sides differ `
    + `(the axis, the band, the staining), not only the fit's noise.</p>${table}<h3>Reading</h3>${reading}`;
}

// timelapse.html: one self-contained page (inline CSS and SVG) with each movie's time analysis — the model fit and
// its plain reading, warnings, λ over time, the kymograph and τ(x) — then the movies that failed and the method.
import { escapeXml, sigFig } from '../../core/figures';
import type { Estimate } from '../../core/timelapse';
import type { MovieOutcome } from './timelapse-pass';

const esc = escapeXml;
const CSS = `body{font-family:system-ui,sans-serif;margin:2rem auto;max-width:1100px;padding:0 1rem;color:#222;line-height:1.45}
h1{font-size:1.6rem}h2{font-size:1.25rem;margin-top:2.2rem;border-bottom:1px solid #ddd;padding-bottom:.2rem}
table{border-collapse:collapse;margin:.6rem 0 1rem;font-size:.88rem}th,td{border:1px solid #ddd;padding:.25rem .5rem;text-align:right}
th{background:#f4f4f4}td.t,th.t{text-align:left}figure{margin:1rem 0}figure svg{width:100%;max-width:860px;height:auto}
.warn{color:#8a4b00}.note{color:#555;font-size:.9rem}`;

function cell(e: Estimate, scale = 1): string {
  if (!Number.isFinite(e.value)) return '<td>—</td>';
  const ci = Number.isFinite(e.ciLow) && Number.isFinite(e.ciHigh) ? ` (${sigFig(e.ciLow * scale, 3)} to ${sigFig(e.ciHigh * scale, 3)})` : '';
  return `<td>${sigFig(e.value * scale, 3)}${ci}</td>`;
}

/** One movie's section, its heading at level `h` (2 on the page, 3 inside the report's section). */
function movieSection(m: MovieOutcome, figures: readonly { title: string; svg: string }[], h = 2): string {
  const s = m.summary;
  const fit = s.model;
  const table = fit ? `<table><tr><th class="t">quantity</th><th>value (95% interval)</th></tr>
<tr><td class="t">τ₀ (min)</td>${cell(fit.tau0S, 1 / 60)}</tr>
<tr><td class="t">k = 1/(2τ₀) (1/min)</td>${cell(fit.kPerS, 60)}</tr>
<tr><td class="t">λ_τ from τ(x) (EL)</td>${cell(fit.lambdaTauEl)}</tr>
<tr><td class="t">steady-state λ from the profile (EL)</td>${cell(fit.lambdaEl)}</tr>
<tr><td class="t">D = k·λ² (µm²/s)</td>${cell(fit.dUm2PerS)}</tr></table>
<p>${esc(fit.reading)}</p>` : '';
  const notes = [s.note, ...s.warnings].filter((w): w is string => w !== null).map((w) => `<p class="warn">${esc(w)}</p>`).join('');
  const span = m.timesS ? `${m.timeIndices.length} time points over ${sigFig(m.timesS[m.timesS.length - 1] - m.timesS[0], 3)} s (times from: ${m.timeSource ?? 'unknown'})`
    : `${m.timeIndices.length} time points (times unknown)`;
  return `<h${h}>${esc(m.file)}</h${h}><p class="note">${esc(span)}; model fit over x/EL ${fit ? `${fit.rangeEl[0]}–${fit.rangeEl[1]}` : '—'}</p>${table}${notes}`
    + figures.map((f) => `<figure>${f.svg}<figcaption class="note">${esc(f.title)}</figcaption></figure>`).join('');
}

const METHOD_TEXT = `<p>Each time point is analysed as a single stack (projection over Z, segmentation, profile, background of its own), along one
axis for the movie found on the mean over up to eight time points (or per time point, or the hand-set axis). λ(t) is the
exponential fit at each time point. The local accumulation time is τ(x) = ∫(1 − C(x,t)/C(x,∞)) dt, estimated on 0.025 EL
bins with the first frame(s) as the zero before production starts and the mean of the last three frames as C(x,∞); its
interval propagates frame-to-frame noise (estimated from the second half of the movie). It is biased low when the movie
ends before steady state or starts after production has begun. For a source at the anterior pole with diffusion and
uniform degradation, τ(x) = (1 + x/λ)/(2k); the line τ₀(1 + x/λ_τ) fitted over the chosen range gives k = 1/(2τ₀), and λ_τ
is compared with the steady-state λ. Agreement is consistent with that model but does not prove it.</p>`;
const METHOD = `<h2>Method and caveats</h2>\n${METHOD_TEXT}`;

/** The movies not analysed over time as a table (empty text when none), its heading at level h: failures, and
 *  movies whose chosen time points all lie past their end (a warning; their main-pass row stands). */
function failedTable(failures: readonly { file: string; error: string; warningOnly?: boolean }[], h: number): string {
  return failures.length > 0 ? `<h${h}>Movies not analysed over time</h${h}><table><tr><th class="t">file</th><th class="t">reason</th></tr>${
    failures.map((f) => `<tr><td class="t">${esc(f.file)}</td><td class="t${f.warningOnly ? ' warn' : ''}">${esc(f.error)}</td></tr>`).join('')}</table>` : '';
}

/**
 * The time-lapse section of the cohort report (report.html): each movie's model-fit table and its plain reading,
 * warnings, λ(t) with intervals, the kymograph and τ(x) with the model line — the figures of timelapse.html — then the
 * movies not analysed and the method. Empty text when the batch had no movie.
 */
export function timelapseReportSection(
  movies: readonly { movie: MovieOutcome; figures: readonly { title: string; svg: string }[] }[], failures: readonly { file: string; error: string; warningOnly?: boolean }[],
): string {
  if (movies.length === 0 && failures.length === 0) return '';
  return `<h2 id="timelapse">Gradients over time</h2><p class="note">Movies analysed per time point (tables: timecourse.csv, accumulation.csv, model_fit.csv; `
    + `the same figures in timelapse.html). In the condition statistics above, a movie counts once, with its last analysed time point.</p>`
    + movies.map(({ movie, figures }) => movieSection(movie, figures, 3)).join('\n') + failedTable(failures, 3) + `<h3>Method and caveats</h3>${METHOD_TEXT}`;
}

/** The whole page. */
export function timelapsePage(
  movies: readonly { movie: MovieOutcome; figures: readonly { title: string; svg: string }[] }[],
  failures: readonly { file: string; error: string; warningOnly?: boolean }[], generatedAt: string,
): string {
  const failed = failedTable(failures, 2);
  return `<!DOCTYPE html><html lang="en"><head><meta charset="utf-8"><title>Eggline time-lapse analysis</title><style>${CSS}</style></head><body>
<h1>Gradients over time</h1><p class="note">Generated ${esc(generatedAt)} by Eggline. Research software: check the kymograph and the fits before relying on a number.</p>
${movies.map(({ movie, figures }) => movieSection(movie, figures)).join('\n')}${failed}${METHOD}</body></html>\n`;
}

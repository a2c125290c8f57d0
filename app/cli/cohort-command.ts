// `eggline cohort <results-dir> --samples sheet.csv [...]`: the cohort step on a finished batch's results.json.
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import { joinNegativeValues } from './parse-command-args';
import { resultsDocFromJson } from '../../core/batch';
import { timelapseReportSection } from '../batch/timelapse-page';
import { movieFigures, movieOutcomes } from '../batch/timelapse-pass';
import type { FilenameRule, Normalisation } from '../../core/cohort';
import { runCohortStep } from '../cohort/run-cohort';
import { backgroundLine, cohortChoices, parseComparisonFlags, type CohortChoices, type CohortFlags } from '../cohort/cohort-choices';
import { loadProjectOrBackup } from '../project';

/** Streams the command writes to (process.stdout/stderr, or buffers in tests). */
export interface CohortCommandIo {
  readonly stdout: { write(text: string): unknown };
  readonly stderr: { write(text: string): unknown };
}

/** Help for the cohort command. */
export const COHORT_HELP = `Usage: eggline cohort <results-dir> --samples <csv> [options]

Reads <results-dir>/results.json (written by "eggline batch"), groups the embryos by the sample sheet and
writes conditions.csv, shifts.csv, dosage_fit.csv, positional_error.csv, each figure as .svg and .png, and a
self-contained report.html. The CSV files keep full precision; their quantity column uses the keys lambda,
amplitude, egg_length, boundary:<channel>:<method> and landmark:<name> (positions in x/EL and µm).

Sample sheet: CSV with a header; columns file, condition, and optionally dosage (relative to the reference)
and any free columns. Files match by relative path, or by file name when that is unique.

Options:
  --samples CSV               sample sheet                          [required unless --pattern]
  --pattern REGEX             take conditions from file names instead: a regular expression with a
                              named group (?<condition>...) and optionally (?<dosage>...)
  --dosage COND=F             dosage of a condition for --pattern (repeat for each condition)
  --reference COND            reference condition              [default: the one with dosage 1]
  --background-condition COND a condition of null or secondary-only stainings: its mean profile
                              (after each embryo's own background) is subtracted from every other
                              embryo's, whose λ and boundaries are then fitted again; it is not
                              compared. "none": subtract nothing (rows the role column marks
                              stay out of the comparison). Default: the condition whose rows say
                              "background" in a role column of the sheet, else none
  --normalise MODE            scale-offset | none | amplitude | minmax: profile scaling before
                              averaging (scale-offset: each profile fitted onto the mean)  [scale-offset]
  --lambda-posterior-el V     decay length of an opposing posterior gradient (x/EL), adds the
                              two-gradient prediction Δx = ln f / (1/λ_A + 1/λ_P)
  --equivalence-margin M      also test whether observed/predicted lies within 1 ± M (two one-sided
                              tests on the 90% interval); 0 < M < 1                        [none]
  --covariate COLUMN          adjust the dosage regression for a free column of the sample sheet
                              (repeat for several): COLUMN:numeric (e.g. stage in minutes) or
                              COLUMN:categorical (e.g. batch; dummies against its first level in
                              the sheet); plain COLUMN is numeric when every value is a number.
                              Coefficients are estimated within conditions; adds a
                              covariate-adjusted row to dosage_fit.csv and covariates.csv  [none]
  --project FILE              take the options above from the project file's cohort entry (as the
                              window saves them); a flag given here overrides the project's value
  --out DIR                   output folder                          [default: <results-dir>/cohort]
  -h, --help                  show this help

Exit status: 0 outputs written, 1 bad input (results, sample sheet) or write failure, 2 usage error.
`;

interface CohortPlan {
  resultsDir: string; samples: string | null; rule: FilenameRule | null; reference: string | null;
  normalisation: Normalisation; lambdaPosteriorEl: number | null; equivalenceMargin: number | null; outDir: string;
  backgroundCondition: string | null;
  /** The project file whose cohort options apply (--project), or null. */
  project: string | null;
  /** The options given as flags (undefined: not given), for the precedence flag > project > default. */
  flags: CohortFlags;
}

/** `--dosage COND=F` values as a map, or a usage message. */
function parseDosages(values: readonly string[]): Record<string, number> | { usage: string } {
  const out: Record<string, number> = {};
  for (const v of values) {
    const eq = v.lastIndexOf('=');
    const f = Number(v.slice(eq + 1));
    if (eq <= 0 || !(Number.isFinite(f) && f > 0)) return { usage: `--dosage must look like CONDITION=F with F > 0 (got "${v}")` };
    out[v.slice(0, eq)] = f;
  }
  return out;
}

const COHORT_OPTIONS = {
  samples: { type: 'string' }, pattern: { type: 'string' }, dosage: { type: 'string', multiple: true },
  reference: { type: 'string' }, 'background-condition': { type: 'string' }, normalise: { type: 'string' }, 'lambda-posterior-el': { type: 'string' },
  'equivalence-margin': { type: 'string' }, covariate: { type: 'string', multiple: true }, project: { type: 'string' },
  out: { type: 'string' }, help: { type: 'boolean', short: 'h' },
} as const;

/** Parse the arguments; returns a plan, 'help', or a usage-error message. */
export function parseCohortArgs(argv: readonly string[]): CohortPlan | 'help' | { usage: string } {
  let parsed;
  try {
    parsed = parseArgs({ args: joinNegativeValues(argv, COHORT_OPTIONS), allowPositionals: true, strict: true, options: COHORT_OPTIONS });
  } catch (e) {
    return { usage: (e as Error).message.split('\n')[0].replace(/\. To specify a positional argument.*$/, '') };
  }
  const v = parsed.values;
  if (v.help) return 'help';
  if (parsed.positionals.length !== 1) return { usage: parsed.positionals.length === 0 ? 'missing <results-dir>' : `expected one <results-dir>, got ${parsed.positionals.length}` };
  if (!v.samples && !v.pattern) return { usage: '--samples <csv> is required' };
  if (v.samples && v.pattern) return { usage: 'use either --samples or --pattern, not both' };
  const dosages = parseDosages(v.dosage ?? []);
  if ('usage' in dosages) return { usage: dosages.usage as string };
  const shared = parseComparisonFlags(v);
  if ('usage' in shared) return { usage: shared.usage as string };
  const bgc = v['background-condition'];
  if (bgc !== undefined && bgc.trim() === '') return { usage: '--background-condition needs a condition name' };
  const resultsDir = parsed.positionals[0];
  const rule = v.pattern ? { pattern: v.pattern, dosages: dosages as Record<string, number> } : null;
  if (v.project !== undefined && v.project.trim() === '') return { usage: '--project needs a project file' };
  const flags: CohortFlags = { ...shared, reference: v.reference, backgroundCondition: bgc };
  const c = cohortChoices(null, flags);
  return { resultsDir, samples: v.samples ?? null, rule, ...c, outDir: v.out ?? join(resultsDir, 'cohort'), project: v.project ?? null, flags };
}

/** The plan's options with the project's cohort entry under the flags (flag > project > default); rejects with one
 *  line naming the project file when it cannot be read or checked. */
export async function planChoices(plan: CohortPlan): Promise<{ choices: CohortChoices; warning: string | null }> {
  if (plan.project === null) return { choices: cohortChoices(null, plan.flags), warning: null };
  const loaded = await loadProjectOrBackup(plan.project);
  return { choices: cohortChoices(loaded.doc.cohort, plan.flags), warning: loaded.warning };
}

async function readOptionalJson(path: string): Promise<unknown> {
  try {
    return JSON.parse(await readFile(path, 'utf8')) as unknown;
  } catch {
    return null;
  }
}

/** Run `eggline cohort`; resolves with the exit code (0 written, 1 bad input, 2 usage). Never throws. */
export async function cohortCommand(argv: readonly string[], io: CohortCommandIo): Promise<number> {
  const plan = parseCohortArgs(argv);
  if (plan === 'help') { io.stdout.write(COHORT_HELP); return 0; }
  if ('usage' in plan) { io.stderr.write(`eggline cohort: ${plan.usage} (see "eggline cohort --help")\n`); return 2; }
  const resultsPath = join(plan.resultsDir, 'results.json');
  try {
    let text: string;
    try {
      text = await readFile(resultsPath, 'utf8');
    } catch (e) {
      throw new Error(`${resultsPath}: cannot read (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
    }
    let doc;
    try {
      doc = resultsDocFromJson(text);
    } catch (e) {
      throw new Error(`${resultsPath}: ${(e as Error).message.replace(/^results\.json: /, '')}`);
    }
    const { choices, warning } = await planChoices(plan);
    if (warning !== null) io.stderr.write(`warning: ${warning}\n`);
    const runRecord = await readOptionalJson(join(plan.resultsDir, 'run.json'));
    // Movies analysed over time get the report's time-lapse section, made again from their records and results.
    const { movies, failures: movieFailures } = movieOutcomes(doc.movies, doc.results);
    const timelapseHtml = timelapseReportSection(movies.map((movie) => ({ movie, figures: movieFigures(movie) })), movieFailures);
    const out = await runCohortStep({
      results: doc.results, failures: [], timelapseHtml, sampleSheetPath: plan.samples, reference: choices.reference, outDir: plan.outDir, runRecord,
      normalisation: choices.normalisation, lambdaPosteriorEl: choices.lambdaPosteriorEl, equivalenceMargin: choices.equivalenceMargin, backgroundCondition: choices.backgroundCondition,
      backgroundConditionNamedBy: choices.backgroundConditionNamedBy, covariates: choices.covariates, ...(plan.rule ? { filenameRule: plan.rule } : {}),
    });
    for (const w of out.warnings) io.stderr.write(`warning: ${w}\n`);
    const background = backgroundLine(out.analysis);
    if (background !== null) io.stdout.write(`${background}\n`);
    io.stdout.write(`wrote ${out.written.length} files to ${plan.outDir} (open report.html)\n`);
    return 0;
  } catch (e) {
    io.stderr.write(`eggline cohort: ${((e as Error).message ?? String(e)).split(/\r?\n/)[0]}\n`);
    return 1;
  }
}

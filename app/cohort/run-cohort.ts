// The cohort step as files: reads the sample sheet, analyses, writes conditions.csv, shifts.csv, dosage_fit.csv,
// positional_error.csv, one .svg and one .png per figure and report.html into outDir. Every file is written atomically.
import { mkdir, readFile, rm } from 'node:fs/promises';
import sharp from 'sharp';
import { basename, join } from 'node:path';
import { embryoResults, type EmbryoResult } from '../../core/model';
import {
  analyseCohort, backgroundChoiceJson, covariatesCsv, backgroundConditionsCsv, backgroundProfileCsv, backgroundRecordJson, backgroundRefitCsv, CohortError, conditionsCsv, dosageFitCsv, positionalErrorCsv, sheetFromFilenameRule, parseSampleSheet, shiftsCsv, sideDifferencesCsv,
  type CohortAnalysis, type FilenameRule, type Normalisation, type RefitSettings, type SampleSheet,
} from '../../core/cohort';
import { settingsFromStored } from '../../core/settings';
import { cohortFigures, type NamedFigure } from '../../core/figures';
import { writeFileAtomic } from '../project';
import { cohortReportHtml } from './report-html';

/** Options of runCohortStep (see the file comment). */
export interface CohortStepOptions {
  readonly results: readonly EmbryoResult[];
  readonly failures: readonly { readonly file: string; readonly error: string }[];
  /** CSV with file, condition, optional dosage; null = use `filenameRule`, or else one condition "all" (no dosage test). */
  readonly sampleSheetPath: string | null;
  readonly reference: string | null;
  readonly outDir: string;
  readonly runRecord: unknown;
  readonly normalisation?: Normalisation;
  /** Decay length of an opposing posterior gradient, x/EL, for the two-gradient prediction. */
  readonly lambdaPosteriorEl?: number | null;
  /** Equivalence margin of the ratio observed/predicted (see CohortOptions). */
  readonly equivalenceMargin?: number | null;
  readonly filenameRule?: FilenameRule;
  /** The condition whose mean profile is subtracted from every other embryo's (a null or secondary-only staining);
   *  `none`: nothing is subtracted (a condition the role column marks stays out of the comparison); null or absent:
   *  the one the sheet's role column marks, else none. */
  readonly backgroundCondition?: string | null;
  /** Who gave backgroundCondition, as background_condition.json and the report name it; absent: --background-condition. */
  readonly backgroundConditionNamedBy?: string;
  /** Sample-sheet columns that adjust the dosage regression (`column`, `column:numeric`, `column:categorical`);
   *  absent or empty: none (covariates.csv is then not written). */
  readonly covariates?: readonly string[];
  /** The time-lapse section of report.html (HTML; see app/batch timelapseReportSection); absent: none. */
  readonly timelapseHtml?: string;
}

/** What the cohort step wrote and computed (the window shows the same analysis and figures). */
export interface CohortStepResult {
  readonly written: string[];
  readonly warnings: string[];
  readonly analysis: CohortAnalysis;
  readonly figures: readonly NamedFigure[];
}

/** Read and parse a sample sheet; rejects with CohortError (one line naming the sheet) when it cannot. */
export async function readSampleSheet(path: string): Promise<SampleSheet> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (e) {
    throw new CohortError(`${path}: cannot read the sample sheet (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
  }
  return parseSampleSheet(text, basename(path));
}

async function loadSheet(opts: CohortStepOptions, warnings: string[]): Promise<SampleSheet> {
  if (opts.sampleSheetPath !== null) return readSampleSheet(opts.sampleSheetPath);
  const files = opts.results.filter((r) => r.status === 'ok').map((r) => r.file);
  if (opts.filenameRule) {
    const r = sheetFromFilenameRule(files, opts.filenameRule);
    warnings.push(...r.warnings);
    return r.sheet;
  }
  warnings.push('no sample sheet: all embryos form one condition "all"; no dosage test');
  return { source: 'no sample sheet', rows: files.map((file) => ({ file, condition: 'all', dosage: null, extra: {}, line: 0 })) };
}

/** Failures given by the caller plus results with status 'error', one entry per file. */
function allFailures(opts: CohortStepOptions): { file: string; error: string }[] {
  const out = [...opts.failures];
  for (const r of opts.results) {
    if (r.status === 'error' && !out.some((f) => f.file === r.file)) out.push({ file: r.file, error: r.error ?? 'analysis failed' });
  }
  return out;
}

/** Run the cohort step and write its outputs; rejects with CohortError (one line, names the file) for bad input. */
export async function runCohortStep(opts: CohortStepOptions): Promise<CohortStepResult> {
  // Each embryo once: results may be keyed by (file, time point); a movie counts with its last analysed time point.
  opts = { ...opts, results: embryoResults(opts.results) };
  if (typeof opts.outDir !== 'string' || opts.outDir.trim() === '') throw new CohortError('outDir must be a non-empty path');
  const warnings: string[] = [];
  const sheet = await loadSheet(opts, warnings);
  const analysis = analyseCohort(opts.results, sheet, {
    reference: opts.reference, normalisation: opts.normalisation ?? 'scale-offset', lambdaPosteriorEl: opts.lambdaPosteriorEl ?? null, equivalenceMargin: opts.equivalenceMargin ?? null,
    backgroundCondition: opts.backgroundCondition ?? null, refitSettings: batchSettings(opts.runRecord),
    ...(opts.backgroundConditionNamedBy !== undefined ? { backgroundConditionNamedBy: opts.backgroundConditionNamedBy } : {}),
    ...(opts.covariates !== undefined && opts.covariates.length > 0 ? { covariates: opts.covariates } : {}),
  });
  warnings.push(...analysis.warnings);
  const figures = cohortFigures(analysis);
  const failures = allFailures(opts);
  const html = cohortReportHtml({ analysis, figures, failures, runRecord: opts.runRecord, warnings, sheetSource: sheet.source, generatedAt: new Date().toISOString(), okCount: opts.results.filter((r) => r.status === 'ok').length, timelapseHtml: opts.timelapseHtml });
  const files: [string, string][] = [
    ['conditions.csv', conditionsCsv(analysis)], ['shifts.csv', shiftsCsv(analysis)], ['dosage_fit.csv', dosageFitCsv(analysis)],
    ['positional_error.csv', positionalErrorCsv(analysis)], ...backgroundFiles(analysis, sheet.source), ...figures.map((f): [string, string] => [`${f.name}.svg`, f.svg]), ['report.html', html],
  ];
  const sides = sideDifferencesCsv(analysis.sideDifferences);
  if (sides !== null) files.splice(4, 0, ['side_differences.csv', sides]);
  const covariates = covariatesCsv(analysis);
  if (covariates !== null) files.splice(3, 0, ['covariates.csv', covariates]);
  try {
    await mkdir(opts.outDir, { recursive: true });
    for (const [name, text] of files) await writeFileAtomic(join(opts.outDir, name), text);
  } catch (e) {
    throw new CohortError(`${opts.outDir}: cannot write the cohort outputs (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
  }
  // Background tables of an earlier cohort run that subtracted a background condition must not outlive it (with
  // `none`, its record is this run's own background_condition.json).
  if (!analysis.backgroundCondition) {
    for (const name of BACKGROUND_FILES) if (!files.some(([n]) => n === name)) await rm(join(opts.outDir, name), { force: true }).catch(() => undefined);
  }
  // Nor may an earlier run's covariate table outlive a run without covariates.
  if (covariates === null) await rm(join(opts.outDir, 'covariates.csv'), { force: true }).catch(() => undefined);
  const pngs = await writePngs(figures, opts.outDir, warnings);
  return { written: [...files.map(([name]) => join(opts.outDir, name)), ...pngs], warnings, analysis, figures };
}

/** The batch settings recorded in run.json (the refit after a background condition searches boundaries with them), or
 *  null when the record has none or they do not check. */
export function batchSettings(runRecord: unknown): RefitSettings | null {
  const stored = typeof runRecord === 'object' && runRecord !== null ? (runRecord as { settings?: unknown }).settings : undefined;
  if (stored === undefined) return null;
  try {
    return settingsFromStored(stored, 'run.json settings');
  } catch {
    return null;
  }
}

/** The files written only when a background condition was subtracted. */
export const BACKGROUND_FILES = [
  'background_profile.csv', 'background_refit.csv', 'background_conditions.csv', 'background_condition.json', 'background-condition.svg', 'background-condition.png',
] as const;

/** The background condition's tables and record, when one was subtracted; with `none`, the record of that choice. */
function backgroundFiles(a: CohortAnalysis, sheetSource: string): [string, string][] {
  const r = a.backgroundCondition;
  if (!r) return a.backgroundChoice?.rule === 'none' ? [['background_condition.json', backgroundChoiceJson(a.backgroundChoice, sheetSource)]] : [];
  return [['background_profile.csv', backgroundProfileCsv(r)], ['background_refit.csv', backgroundRefitCsv(r)],
    ['background_conditions.csv', backgroundConditionsCsv(r)], ['background_condition.json', backgroundRecordJson(r, sheetSource, a.backgroundChoice)]];
}

/** Each figure also as PNG (2× scale, white background); a failure here is a warning, the SVGs stay. The figures
 *  are rendered at once (libvips renders each on its own thread; one after another they took about twice the wall
 *  time at the end of a batch); paths and warnings keep the figures' order. */
async function writePngs(figures: readonly { name: string; svg: string }[], outDir: string, warnings: string[]): Promise<string[]> {
  const outcomes = await Promise.all(figures.map(async (f): Promise<{ path: string } | { warning: string }> => {
    const path = join(outDir, `${f.name}.png`);
    try {
      await writeFileAtomic(path, await sharp(Buffer.from(f.svg), { density: 144 }).png().toBuffer());
      return { path };
    } catch (e) {
      return { warning: `${f.name}.png: not written (${(e as Error).message.split('\n')[0]})` };
    }
  }));
  for (const o of outcomes) if ('warning' in o) warnings.push(o.warning);
  return outcomes.flatMap((o) => ('path' in o ? [o.path] : []));
}

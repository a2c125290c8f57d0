// The cohort step's numbers and figures for the window: the same analysis and figures report.html is built from
// (core/cohort analyseCohort + core/figures cohortFigures over the batch results and the sample sheet).
import { promises as fs } from 'node:fs';
import { join } from 'node:path';
import { analyseCohort, type CohortAnalysis, type ConditionStat } from '../../core/cohort';
import type { CohortConditionRow, CohortPositionalError, CohortSummary } from '../../core/contract';
import { cohortFigures, type NamedFigure } from '../../core/figures';
import { batchSettings, readSampleSheet } from '../cohort/run-cohort';
import { dosageReading } from '../cohort/reading';
import type { EmbryoResult } from '../../core/model';
import { DEFAULT_COHORT_CHOICES, type CohortChoices } from '../cohort/cohort-choices';

/** File name of the sample sheet the app looks for in a batch's input folder. */
export const SAMPLE_SHEET_NAME = 'samples.csv';

/** `<folder>/samples.csv` when it is a file, else null. */
export async function findSampleSheet(folder: string): Promise<string | null> {
  const path = join(folder, SAMPLE_SHEET_NAME);
  const isFile = await fs.stat(path).then((s) => s.isFile(), () => false);
  return isFile ? path : null;
}

/** Embryos of a condition that gave at least one value. */
function embryoCount(a: CohortAnalysis, condition: string): number {
  return new Set(a.observations.filter((o) => o.condition === condition).map((o) => o.file)).size;
}

function lambdaStat(a: CohortAnalysis, condition: string, unit: 'EL' | 'um'): ConditionStat | null {
  return a.stats.find((s) => s.condition === condition && s.quantity === 'lambda' && s.unit === unit) ?? null;
}

/** One row per condition, in sample-sheet order. */
export function conditionRows(a: CohortAnalysis): CohortConditionRow[] {
  return a.conditions.map((c) => ({
    name: c.name, dosage: c.dosage, factor: c.factor, isReference: c.name === a.reference, n: embryoCount(a, c.name),
    lambdaEl: lambdaStat(a, c.name, 'EL'), lambdaUm: lambdaStat(a, c.name, 'um'),
  }));
}

/** Positions (x/EL) at which the window shows σx: grid points of positional_error.csv across the usual gradient range. */
export const POSITIONAL_ERROR_XS_EL = [0.2, 0.3, 0.4, 0.5, 0.6] as const;

/** σx of each condition at POSITIONAL_ERROR_XS_EL (the nearest grid point, as written in positional_error.csv). */
export function positionalErrorRows(a: CohortAnalysis): CohortPositionalError[] {
  return a.profiles.map((p) => ({
    condition: p.condition, normalisation: p.normalisation,
    points: POSITIONAL_ERROR_XS_EL.flatMap((x) => {
      let best = -1;
      for (let i = 0; i < p.xEl.length; i++) if (best < 0 || Math.abs(p.xEl[i] - x) < Math.abs(p.xEl[best] - x)) best = i;
      return best < 0 || Math.abs(p.xEl[best] - x) > 1e-6 ? [] : [{ xEl: p.xEl[best], sigmaXEl: p.sigmaXEl[best], ciLowEl: p.sigmaXCiLowEl[best], ciHighEl: p.sigmaXCiHighEl[best] }];
    }),
  }));
}

/** The line that says the values are background-subtracted, when they are, or that `none` was chosen (the window lists
 *  it first). */
function backgroundNote(a: CohortAnalysis): string[] {
  const bg = a.backgroundCondition;
  if (bg) return [`λ, amplitude and boundaries are refitted after subtracting background condition "${bg.condition}" (${bg.files.length} embryo${bg.files.length === 1 ? '' : 's'}: ${bg.files.join(', ')}); see report.html`];
  const c = a.backgroundChoice;
  return c?.rule === 'none' ? [`no background condition: ${c.why}`] : [];
}

/** Plain-data summary of an analysis (figures included: those given, else drawn here) for the renderer. */
export function summariseCohort(
  a: CohortAnalysis, sampleSheetPath: string, outDir: string, figures: readonly NamedFigure[] = cohortFigures(a),
): CohortSummary {
  return {
    reportPath: join(outDir, 'report.html'), sampleSheetPath, reference: a.reference, level: a.options.level,
    referenceLambda: a.referenceLambda, conditions: conditionRows(a), stats: a.stats, shifts: a.shifts, dosageFit: a.dosageFits,
    figures: figures.map((f) => ({ name: f.name, title: f.title, svg: f.svg })), warnings: [...backgroundNote(a), ...a.warnings],
    backgroundCondition: a.backgroundCondition?.condition ?? null, positionalError: positionalErrorRows(a),
    ...(a.backgroundChoice?.setAside ? { backgroundSetAside: a.backgroundChoice.setAside } : {}),
    ...(a.sheetColumns.length > 0 ? { sheetColumns: a.sheetColumns } : {}),
    ...(a.reference !== null ? { reading: dosageReading(a) } : {}),
  };
}

/** Read the sample sheet and analyse the batch results with the given cohort options (as `eggline cohort` with the same
 *  flags; default: the step's defaults). Rejects with CohortError (one line naming the sheet) when the sheet cannot be
 *  read or parsed or an option does not fit it (e.g. a reference the sheet does not have). */
export async function cohortSummaryFor(
  results: readonly EmbryoResult[], sampleSheetPath: string, choices: CohortChoices | null, outDir: string,
): Promise<CohortSummary> {
  const sheet = await readSampleSheet(sampleSheetPath);
  // The batch's settings, for a background condition's refit (the sheet's role column may name one).
  const record = await fs.readFile(join(outDir, 'run.json'), 'utf8').then((t) => JSON.parse(t) as unknown, () => null);
  const analysis = analyseCohort(results, sheet, { ...(choices ?? DEFAULT_COHORT_CHOICES), refitSettings: batchSettings(record) });
  return summariseCohort(analysis, sampleSheetPath, outDir);
}

// `eggline merge <dir> [--samples sheet.csv] [--reference COND] [--allow-missing]`: the parts of a split batch into one set of tables.
import { promises as fs } from 'node:fs';
import { join, resolve } from 'node:path';
import { mergeParts, MergeRefusal } from '../batch/merge-parts';
import { MERGE_HELP } from './help';
import { reportTimelapse } from './timelapse-step';
import { joinNegativeValues, parseCommandArgs } from './parse-command-args';
import { cohortChoices, parseComparisonFlags } from '../cohort/cohort-choices';
import { loadProjectOrBackup } from '../project';
import { UsageError, type CliIo } from './usage-error';

const OPTIONS = {
  samples: { type: 'string' }, reference: { type: 'string' }, 'background-condition': { type: 'string' }, 'allow-missing': { type: 'boolean' }, help: { type: 'boolean', short: 'h' },
  normalise: { type: 'string' }, 'lambda-posterior-el': { type: 'string' }, 'equivalence-margin': { type: 'string' }, covariate: { type: 'string', multiple: true },
  project: { type: 'string' },
} as const;

/** Run `eggline merge`; returns the exit code (0 merged and every file ok, 1 some files failed or missing or the cohort
 *  step failed, 2 usage error or a merge refused: a part missing, present twice, or made differently). */
export async function mergeCommand(argv: readonly string[], io: CliIo): Promise<number> {
  const { values: v, positionals } = parseCommandArgs(joinNegativeValues(argv, OPTIONS), OPTIONS, 'merge');
  if (v.help) { io.stdout.write(MERGE_HELP); return 0; }
  if (positionals.length !== 1) {
    throw new UsageError(positionals.length === 0 ? 'missing the batch output folder (the --out of the split batch)' : `expected one folder, got ${positionals.length}: ${positionals.join(' ')}`, 'merge');
  }
  if (v.reference !== undefined && v.samples === undefined) throw new UsageError('--reference needs --samples', 'merge');
  if (v['background-condition'] !== undefined && v.samples === undefined) throw new UsageError('--background-condition needs --samples', 'merge');
  for (const flag of ['normalise', 'lambda-posterior-el', 'equivalence-margin', 'covariate'] as const) {
    if (v[flag] !== undefined && v.samples === undefined) throw new UsageError(`--${flag} needs --samples`, 'merge');
  }
  if (v.project !== undefined && v.samples === undefined) throw new UsageError('--project needs --samples', 'merge');
  const comparison = parseComparisonFlags(v);
  if ('usage' in comparison) throw new UsageError(comparison.usage as string, 'merge');
  if (v.samples !== undefined && !(await fs.stat(v.samples).then((s) => s.isFile(), () => false))) {
    throw new UsageError(`sample sheet not found: ${v.samples}`, 'merge');
  }
  const outDir = resolve(positionals[0]);
  // The cohort options: each flag over the project's cohort entry (--project, as eggline cohort takes it) over the
  // defaults; the record then names who chose the background condition.
  let project = null;
  if (v.project !== undefined) {
    try {
      const loaded = await loadProjectOrBackup(resolve(v.project));
      if (loaded.warning !== null) io.stderr.write(`eggline: warning: ${loaded.warning}\n`);
      project = loaded.doc.cohort ?? null;
    } catch (e) {
      io.stderr.write(`eggline merge: ${(e as Error).message.split(/\r?\n/)[0]}\n`);
      return 1;
    }
  }
  const c = cohortChoices(project, { ...comparison, reference: v.reference, backgroundCondition: v['background-condition'] });
  try {
    const merged = await mergeParts({
      outDir, allowMissing: v['allow-missing'] === true, commandLine: ['eggline', 'merge', ...argv],
      cohort: v.samples !== undefined ? {
        sampleSheetPath: resolve(v.samples), reference: c.reference, backgroundCondition: c.backgroundCondition, backgroundConditionNamedBy: c.backgroundConditionNamedBy,
        normalisation: c.normalisation, lambdaPosteriorEl: c.lambdaPosteriorEl, equivalenceMargin: c.equivalenceMargin,
        ...(c.covariates.length > 0 ? { covariates: c.covariates } : {}),
      } : null,
    });
    for (const w of merged.warnings) io.stderr.write(`eggline: warning: ${w}\n`);
    const total = merged.ok + merged.failed;
    const missing = merged.missingFiles === null ? 'an unknown number of' : String(merged.missingFiles.length);
    io.stdout.write(`Merged ${merged.parts - merged.record.merge!.missingParts.length} of ${merged.parts} parts: ${total} file${total === 1 ? '' : 's'}, ${merged.ok} ok, ${merged.failed} failed.\n`);
    if (merged.record.cancelled) io.stdout.write(`Missing: ${missing} files of parts ${merged.record.merge!.missingParts.join(', ') || '(unfinished)'} (listed in run.json).\n`);
    io.stdout.write(`Tables written to ${outDir}\n`);
    const moviesFailed = reportTimelapse(merged.timelapse, outDir, io);
    if (merged.cohortError) io.stderr.write(`eggline: the cohort step failed: ${merged.cohortError}\n`);
    else if (v.samples !== undefined) io.stdout.write(`Cohort report: ${join(outDir, 'report.html')}\n`);
    return merged.failed > 0 || moviesFailed > 0 || merged.record.cancelled || merged.cohortError ? 1 : 0;
  } catch (e) {
    if (e instanceof MergeRefusal) {
      io.stderr.write(`eggline merge: ${e.message}\n`);
      return 2;
    }
    throw e;
  }
}

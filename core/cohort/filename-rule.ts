// Conditions from file names: a regex with a named group `condition` (optionally `dosage`) builds sample rows.
import { CohortError } from './cohort-error';
import type { FilenameRule, SampleRow, SampleSheet } from '../model';

/** Turn file names into sample rows with a rule; files that do not match are returned as warnings. */
export function sheetFromFilenameRule(
  files: readonly string[], rule: FilenameRule,
): { sheet: SampleSheet; warnings: string[] } {
  const regex = compileRule(rule.pattern);
  const rows: SampleRow[] = [];
  const warnings: string[] = [];
  for (const file of files) {
    const groups = regex.exec(file)?.groups;
    const condition = groups?.condition;
    if (condition === undefined || condition === '') {
      warnings.push(`${file}: file name does not match the rule ${regex.source}; left out`);
      continue;
    }
    const dosage = dosageFor(groups?.dosage, condition, rule, file);
    rows.push({ file, condition, dosage, extra: {}, line: 0 });
  }
  return { sheet: { source: 'file-name rule', rows }, warnings };
}

function compileRule(pattern: string | RegExp): RegExp {
  let regex: RegExp;
  try {
    regex = typeof pattern === 'string' ? new RegExp(pattern) : pattern;
  } catch (e) {
    throw new CohortError(`file-name rule: invalid regular expression (${(e as Error).message})`);
  }
  if (!regex.source.includes('(?<condition>')) {
    throw new CohortError('file-name rule: the pattern needs a named group (?<condition>...)');
  }
  return regex;
}

function dosageFor(text: string | undefined, condition: string, rule: FilenameRule, file: string): number | null {
  const raw = text !== undefined && text !== '' ? Number(text.replace('p', '.')) : rule.dosages?.[condition] ?? null;
  if (raw !== null && !(Number.isFinite(raw) && raw > 0)) {
    throw new CohortError(`file-name rule: dosage for ${file} is not a positive number`);
  }
  return raw;
}

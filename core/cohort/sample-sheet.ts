// Sample sheet: CSV with columns file, condition, optional dosage (relative to the reference) and free columns.
import { CohortError } from './cohort-error';
import { parseCsv } from '../csv';
import type { SampleRow, SampleSheet } from '../model';

/** Parse a sample sheet; `source` (the file name) appears in every error, e.g. `samples.csv line 4: ...`. */
export function parseSampleSheet(text: string, source: string): SampleSheet {
  const table = readTable(text, source).filter((r) => r.some((c) => c.trim() !== ''));
  if (table.length === 0) throw new CohortError(`${source}: the sample sheet is empty`);
  const header = table[0].map((h) => h.trim());
  const lower = header.map((h) => h.toLowerCase());
  for (const required of ['file', 'condition']) {
    if (!lower.includes(required)) {
      throw new CohortError(`${source}: missing column "${required}" (the header needs file, condition; dosage is optional)`);
    }
  }
  const fileCol = lower.indexOf('file');
  const condCol = lower.indexOf('condition');
  const doseCol = lower.indexOf('dosage');
  const rows: SampleRow[] = [];
  for (let i = 1; i < table.length; i++) {
    rows.push(parseRow(table[i], header, { fileCol, condCol, doseCol }, source, i + 1));
  }
  if (rows.length === 0) throw new CohortError(`${source}: the sample sheet has a header but no rows`);
  return { source, rows };
}

function parseRow(
  cells: readonly string[], header: readonly string[],
  cols: { fileCol: number; condCol: number; doseCol: number }, source: string, line: number,
): SampleRow {
  const cell = (c: number): string => (c >= 0 && c < cells.length ? cells[c].trim() : '');
  const file = cell(cols.fileCol);
  const condition = cell(cols.condCol);
  if (file === '') throw new CohortError(`${source} line ${line}: empty file name`);
  if (condition === '') throw new CohortError(`${source} line ${line}: empty condition for ${file}`);
  const doseText = cell(cols.doseCol);
  const dosage = doseText === '' ? null : Number(doseText);
  if (dosage !== null && !(Number.isFinite(dosage) && dosage > 0)) {
    throw new CohortError(`${source} line ${line}: dosage "${doseText}" is not a positive number`);
  }
  const extra: Record<string, string> = {};
  header.forEach((h, c) => {
    if (c !== cols.fileCol && c !== cols.condCol && c !== cols.doseCol && h !== '') extra[h] = cell(c);
  });
  return { file, condition, dosage, extra, line };
}

function readTable(text: string, source: string): string[][] {
  try {
    return parseCsv(text);
  } catch (e) {
    throw new CohortError(`${source}: ${(e as Error).message}`);
  }
}

// Shared by the cohort command's tests: captured stdout/stderr for a command run in-process, and a CSV file read as
// rows keyed by its header.
import { readFileSync } from 'node:fs';
import { parseCsv } from '../../core/csv';

/** Stand-ins for stdout and stderr that keep what a command writes. */
export function capturedIo() {
  const out: string[] = [];
  const err: string[] = [];
  return { io: { stdout: { write: (t: string) => out.push(t) }, stderr: { write: (t: string) => err.push(t) } }, out, err };
}

/** A CSV file's rows, each keyed by the header's column names. */
export function csvRowsOf(path: string): Record<string, string>[] {
  const [header, ...rows] = parseCsv(readFileSync(path, 'utf8'));
  return rows.map((r) => Object.fromEntries(header.map((h, i) => [h, r[i]])));
}

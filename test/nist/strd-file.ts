// Reader for the NIST StRD nonlinear regression .dat layout (see data/README.md).
import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

/** One certified problem: starts, certified values and SDs, certified RSS / residual SD, and the data. */
export interface StrdProblem {
  readonly name: string;
  readonly start1: number[];
  readonly start2: number[];
  readonly certified: number[];
  readonly certifiedSd: number[];
  readonly rss: number;
  readonly residualSd: number;
  readonly x: Float64Array;
  readonly y: Float64Array;
}

/** Folder holding the reference files: copies of the NIST StRD files kept in the repository (see data/README.md). */
export const STRD_DIR = resolve(dirname(fileURLToPath(import.meta.url)), 'data');

function labelledNumber(lines: string[], label: string): number {
  const line = lines.find((l) => l.startsWith(label));
  if (!line) throw new Error(`StRD file: missing "${label}"`);
  return Number(line.slice(label.length).trim().split(/\s+/)[0]);
}

/** Parses the text of a NIST StRD nonlinear .dat file (CRLF or LF, Fortran-style exponents like 10.07E0). */
export function parseStrd(name: string, text: string): StrdProblem {
  const lines = text.split(/\r?\n/);
  const start1: number[] = [], start2: number[] = [], certified: number[] = [], certifiedSd: number[] = [];
  for (const line of lines) {
    const m = /^\s*b(\d+)\s*=\s*(\S+)\s+(\S+)\s+(\S+)\s+(\S+)\s*$/.exec(line);
    if (!m) continue;
    start1.push(Number(m[2])); start2.push(Number(m[3]));
    certified.push(Number(m[4])); certifiedSd.push(Number(m[5]));
  }
  const dataStart = lines.findIndex((l) => /^Data:\s+y\s+x/.test(l));
  if (dataStart < 0) throw new Error(`StRD file ${name}: no data block`);
  const xs: number[] = [], ys: number[] = [];
  for (const line of lines.slice(dataStart + 1)) {
    const parts = line.trim().split(/\s+/);
    if (parts.length !== 2) continue;
    ys.push(Number(parts[0])); xs.push(Number(parts[1]));
  }
  const observations = labelledNumber(lines, 'Number of Observations:');
  if (xs.length !== observations || [...xs, ...ys].some((v) => !Number.isFinite(v))) {
    throw new Error(`StRD file ${name}: expected ${observations} data rows, read ${xs.length}`);
  }
  return {
    name, start1, start2, certified, certifiedSd,
    rss: labelledNumber(lines, 'Residual Sum of Squares:'),
    residualSd: labelledNumber(lines, 'Residual Standard Deviation:'),
    x: Float64Array.from(xs), y: Float64Array.from(ys),
  };
}

/** Reads and parses NAME.dat from the reference folder. */
export function loadStrd(name: string): StrdProblem {
  return parseStrd(name, readFileSync(resolve(STRD_DIR, `${name}.dat`), 'utf8'));
}

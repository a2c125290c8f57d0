// results.json: every EmbryoResult of a batch as plain JSON (typed arrays become arrays; NaN becomes null).
import type { EmbryoResult, ExponentialFit, Profile } from '../model';

/** Schema tag and version written into results.json. */
export const RESULTS_SCHEMA = 'eggline-results';
export const RESULTS_VERSION = 1;

/** Serialise results as `{ schema, version, results }` JSON text (pretty-printed, typed arrays as plain arrays). */
export function resultsToJson(results: readonly EmbryoResult[]): string {
  const doc = { schema: RESULTS_SCHEMA, version: RESULTS_VERSION, results };
  return `${jsonWithArrays(doc, 1)}\n`;
}

function toFloat64(value: unknown, what: string): Float64Array {
  if (!Array.isArray(value)) throw new Error(`results.json: ${what} is not an array`);
  return Float64Array.from(value, (v) => (typeof v === 'number' ? v : Number.NaN));
}

function reviveProfile(p: Profile, file: string): Profile {
  const at = `profile "${p.channel}" of ${file}`;
  return {
    ...p, xEl: toFloat64(p.xEl, `${at} xEl`), xUm: toFloat64(p.xUm, `${at} xUm`),
    mean: toFloat64(p.mean, `${at} mean`), sd: toFloat64(p.sd, `${at} sd`), n: toFloat64(p.n, `${at} n`),
  };
}

function reviveFit(f: ExponentialFit, file: string): ExponentialFit {
  return { ...f, xEl: toFloat64(f.xEl, `fit xEl of ${file}`), residuals: toFloat64(f.residuals, `fit residuals of ${file}`) };
}

/** JSON text of values that may hold typed arrays (as plain arrays; NaN becomes null), `space` as in JSON.stringify. */
export function jsonWithArrays(value: unknown, space?: number): string {
  return JSON.stringify(value, (_key, v: unknown) => (ArrayBuffer.isView(v) ? Array.from(v as Float64Array) : v), space);
}

/** One parsed JSON result back into an EmbryoResult (arrays become Float64Array, null becomes NaN); `where` names it in errors. */
export function reviveResult(raw: unknown, where: string): EmbryoResult {
  const r = raw as EmbryoResult;
  if (typeof raw !== 'object' || raw === null || typeof r.file !== 'string' || (r.status !== 'ok' && r.status !== 'error')) {
    throw new Error(`${where} is not an embryo result (needs "file" and "status")`);
  }
  return {
    ...r,
    gradientProfile: r.gradientProfile ? reviveProfile(r.gradientProfile, r.file) : null,
    gradientFit: r.gradientFit ? reviveFit(r.gradientFit, r.file) : null,
    boundaryProfiles: (r.boundaryProfiles ?? []).map((p) => reviveProfile(p, r.file)),
    boundaries: r.boundaries ?? [], landmarks: r.landmarks ?? [], backgrounds: r.backgrounds ?? [], warnings: r.warnings ?? [],
  };
}

/** Read results.json text back into EmbryoResults (arrays become Float64Array, null becomes NaN); throws a one-line message. */
export function resultsFromJson(text: string): EmbryoResult[] {
  let doc: { schema?: unknown; version?: unknown; results?: unknown };
  try {
    doc = JSON.parse(text) as typeof doc;
  } catch (e) {
    throw new Error(`results.json: not valid JSON (${(e as Error).message})`);
  }
  if (typeof doc !== 'object' || doc === null || doc.schema !== RESULTS_SCHEMA) {
    throw new Error(`results.json: not an Eggline results file (schema must be "${RESULTS_SCHEMA}")`);
  }
  if (doc.version !== RESULTS_VERSION) throw new Error(`results.json: unsupported version ${String(doc.version)} (expected ${RESULTS_VERSION})`);
  if (!Array.isArray(doc.results)) throw new Error('results.json: "results" is not an array');
  return doc.results.map((r, i) => reviveResult(r, `results.json: entry ${i}`));
}

// results.json: every result of a batch keyed by (file, time point) as plain JSON (typed arrays become arrays; NaN
// becomes null), with the movies analysed per time point. Schema version 2; version 1 files (one result per file, no
// time points) are still read, their results taken as time point 0.
import { resultKeyOf, resultTimeIndex, withTimePoint, type EmbryoResult, type ExponentialFit, type MovieRecord, type Profile, type SidesMeasurement } from '../model';

/** Schema tag written into results.json. */
export const RESULTS_SCHEMA = 'eggline-results';
/** Schema version written into results.json (`schemaVersion`): 2 = results keyed by (file, tIndex), with movies. */
export const RESULTS_SCHEMA_VERSION = 2;
/** The version of the first format (`"version": 1`, results keyed by file alone), still read. */
export const RESULTS_OLD_VERSION = 1;

/** What results.json holds: every result keyed by (file, tIndex), and the movies analysed per time point. */
export interface ResultsDoc {
  readonly results: readonly EmbryoResult[];
  readonly movies: readonly MovieRecord[];
}

/** Serialise results as `{ schema, schemaVersion, results, movies }` JSON text (pretty-printed, typed arrays as
 *  plain arrays); every result is written with its tIndex (0 when it has none) and tS. */
export function resultsToJson(results: readonly EmbryoResult[], movies: readonly MovieRecord[] = []): string {
  const keyed = results.map((r) => withTimePoint(r, resultTimeIndex(r), r.tS ?? null));
  const doc = { schema: RESULTS_SCHEMA, schemaVersion: RESULTS_SCHEMA_VERSION, results: keyed, movies };
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

/** The per-side profiles and fits of a result, typed arrays revived (null fits and difference stay null). */
function reviveSides(sd: SidesMeasurement, file: string): SidesMeasurement {
  return {
    ...sd,
    dorsalProfile: reviveProfile(sd.dorsalProfile, file), ventralProfile: reviveProfile(sd.ventralProfile, file),
    dorsalFit: sd.dorsalFit ? reviveFit(sd.dorsalFit, file) : null, ventralFit: sd.ventralFit ? reviveFit(sd.ventralFit, file) : null,
    difference: sd.difference ? reviveNumbers(sd.difference) : null,
  };
}

/** A flat record of numbers (and words) from JSON: null back to NaN. */
function reviveNumbers<T extends object>(o: T): T {
  return Object.fromEntries(Object.entries(o).map(([k, v]) => [k, v === null ? Number.NaN : v])) as T;
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
  if (r.tIndex !== undefined && !(Number.isInteger(r.tIndex) && r.tIndex >= 0)) throw new Error(`${where}: tIndex must be a whole number ≥ 0`);
  if (r.tS !== undefined && r.tS !== null && typeof r.tS !== 'number') throw new Error(`${where}: tS must be a number of seconds or null`);
  return {
    ...r,
    gradientProfile: r.gradientProfile ? reviveProfile(r.gradientProfile, r.file) : null,
    gradientFit: r.gradientFit ? reviveFit(r.gradientFit, r.file) : null,
    boundaryProfiles: (r.boundaryProfiles ?? []).map((p) => reviveProfile(p, r.file)),
    boundaries: r.boundaries ?? [], landmarks: r.landmarks ?? [], backgrounds: r.backgrounds ?? [], warnings: r.warnings ?? [],
    ...(r.sides ? { sides: reviveSides(r.sides, r.file) } : {}),
  };
}

/** Check one movie record of results.json (file, time points, their times, the summary's options). */
function reviveMovie(raw: unknown, where: string): MovieRecord {
  const m = raw as MovieRecord;
  const range = (v: unknown): boolean => Array.isArray(v) && v.length === 2 && v.every((x) => typeof x === 'number');
  if (typeof raw !== 'object' || raw === null || typeof m.file !== 'string' || !Array.isArray(m.timeIndices)
    || !m.timeIndices.every((t) => Number.isInteger(t) && t >= 0) || !range(m.fitRangeEl) || !range(m.modelRangeEl) || typeof m.baselineFrames !== 'number') {
    throw new Error(`results.json: ${where} is not a movie record (needs "file", "timeIndices", "fitRangeEl", "modelRangeEl", "baselineFrames")`);
  }
  const timesS = m.timesS === null || m.timesS === undefined ? null : toFloat64(m.timesS, `${where} timesS`);
  if (timesS !== null && timesS.length !== m.timeIndices.length) throw new Error(`results.json: ${where}: timesS has ${timesS.length} values for ${m.timeIndices.length} time points`);
  return {
    file: m.file, timeIndices: [...m.timeIndices], timesS, timeSource: typeof m.timeSource === 'string' ? m.timeSource : null, fitRangeEl: [m.fitRangeEl[0], m.fitRangeEl[1]], modelRangeEl: [m.modelRangeEl[0], m.modelRangeEl[1]],
    baselineFrames: m.baselineFrames, warnings: Array.isArray(m.warnings) ? m.warnings.map(String) : [], error: typeof m.error === 'string' ? m.error : null,
  };
}

/**
 * Read results.json text (schema version 2, or the first format, version 1) into its results, each with its tIndex
 * and tS (a version 1 result is time point 0, time unknown), and its movies (none in version 1). Arrays become
 * Float64Array, null becomes NaN. Throws with a one-line message starting "results.json:".
 */
export function resultsDocFromJson(text: string): ResultsDoc {
  let doc: { schema?: unknown; schemaVersion?: unknown; version?: unknown; results?: unknown; movies?: unknown };
  try {
    doc = JSON.parse(text) as typeof doc;
  } catch (e) {
    throw new Error(`results.json: not valid JSON (${(e as Error).message})`);
  }
  if (typeof doc !== 'object' || doc === null || doc.schema !== RESULTS_SCHEMA) {
    throw new Error(`results.json: not an Eggline results file (schema must be "${RESULTS_SCHEMA}")`);
  }
  const old = doc.schemaVersion === undefined && doc.version === RESULTS_OLD_VERSION;
  if (!old && doc.schemaVersion !== RESULTS_SCHEMA_VERSION) {
    const found = doc.schemaVersion ?? doc.version;
    throw new Error(`results.json: unsupported schema version ${String(found)} (this Eggline reads ${RESULTS_OLD_VERSION} and ${RESULTS_SCHEMA_VERSION})`);
  }
  if (!Array.isArray(doc.results)) throw new Error('results.json: "results" is not an array');
  const seen = new Set<string>();
  const results = doc.results.map((raw, i) => {
    const r = reviveResult(raw, `results.json: entry ${i}`);
    const keyed = withTimePoint(r, old ? 0 : resultTimeIndex(r), old ? null : r.tS ?? null);
    const key = resultKeyOf(keyed);
    if (seen.has(key)) throw new Error(`results.json: entry ${i} repeats ${keyed.file} at time point ${resultTimeIndex(keyed)}`);
    seen.add(key);
    return keyed;
  });
  if (doc.movies !== undefined && !Array.isArray(doc.movies)) throw new Error('results.json: "movies" is not an array');
  const movies = old ? [] : ((doc.movies ?? []) as unknown[]).map((m, i) => reviveMovie(m, `movie ${i}`));
  return { results, movies };
}

/** The results of results.json text (see resultsDocFromJson); throws a one-line message. */
export function resultsFromJson(text: string): EmbryoResult[] {
  return [...resultsDocFromJson(text).results];
}

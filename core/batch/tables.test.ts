import { describe, expect, it } from 'vitest';
import type { EmbryoResult, Profile } from '../model';
import { parseCsv } from '../csv';
import { errorResult, withTimePoint } from '../model';
import { jsonWithArrays, resultsDocFromJson, resultsFromJson, resultsToJson } from './results-json';
import { boundariesCsv, embryoResults, embryosCsv, EMBRYO_COLUMNS, landmarksCsv, profilesCsv, SIDE_COLUMNS, summaryBoundary } from './tables';

// Source: demo data (a hand-built result; every expected cell is copied from it).
const profile = (channel: string, mean: number[]): Profile => ({
  channel, xEl: Float64Array.from([0.25, 0.75]), xUm: Float64Array.from([125, 375]),
  mean: Float64Array.from(mean), sd: Float64Array.from([1, 2]), n: Float64Array.from([10, 12]),
});
const ok: EmbryoResult = {
  file: 'dose,half/E01.ome.tif', status: 'ok', error: null, warnings: ['pixel size from "file"', 'edge clipped'],
  pixelSizeUm: 0.5, pixelSizeSource: 'ome', eggLengthUm: 500, eggWidthUm: 180,
  axis: { anterior: { x: 10, y: 20 }, posterior: { x: 1010, y: 22.5 }, source: 'hand' },
  gradientChannel: 'grad', gradientProfile: profile('grad', [100, 5]),
  gradientFit: {
    amplitude: 120, amplitudeSe: 2, lambdaUm: 100, lambdaSeUm: 3, lambdaCiLowUm: 94, lambdaCiHighUm: 106, lambdaEl: 0.2,
    lambdaSeEl: 0.006, lambdaSeModelUm: 2.5, lambdaSeSerialUm: 3, lambdaSeSource: 'serial', residualLag1: 0.31, weighted: true,
    background: 4, backgroundSe: 0.5, r2: 0.99, rss: 1, dof: 10, iterations: 7, fitRangeEl: [0.1, 0.6],
    xEl: Float64Array.from([0.1, 0.2]), residuals: Float64Array.from([Number.NaN, -0.5]),
  },
  boundaryProfiles: [profile('grad', [100, 5]), profile('stripe', [50, 1])],
  boundaries: [
    { channel: 'stripe', method: 'half-max', positionEl: 0.48, positionUm: 240, widthEl: null, positionSeEl: null, direction: 'falling', note: null },
    { channel: 'stripe', method: 'logistic', positionEl: 0.5, positionUm: 250, widthEl: 0.02, positionSeEl: 0.001, direction: 'falling', note: 'a "note", with comma' },
    { channel: 'other', method: 'logistic', positionEl: 0.7, positionUm: 350, widthEl: 0.03, positionSeEl: null, direction: 'rising', note: null },
  ],
  landmarks: [{ name: 'furrow', point: { x: 330, y: 40 }, xEl: 0.32, xUm: 160, offAxisUm: -1.5 }],
  backgrounds: [{ channel: 'grad', method: 'outside', value: 4 }],
};
const bad = errorResult('junk.tif', 'junk.tif: not a TIFF file\n(first bytes 00 00)');

describe('output tables', () => {
  it('embryos.csv has every column and one row per file with the known cells', () => {
    const rows = parseCsv(embryosCsv([ok, bad]));
    expect(rows[0]).toEqual([...EMBRYO_COLUMNS]);
    expect(rows).toHaveLength(3);
    const row = Object.fromEntries(EMBRYO_COLUMNS.map((c, i) => [c, rows[1][i]]));
    expect(row).toMatchObject({
      file: 'dose,half/E01.ome.tif', status: 'ok', error: '', warnings: 'pixel size from "file"; edge clipped',
      pixel_size_um: '0.5', anterior_y_px: '20', posterior_y_px: '22.5', axis_source: 'hand', lambda_um: '100',
      lambda_el: '0.2', lambda_se_model_um: '2.5', lambda_se_serial_um: '3', lambda_se_source: 'serial',
      residual_lag1: '0.31', fit_weighting: 'inverse-variance', fit_start_el: '0.1', fit_end_el: '0.6', boundary_el: '0.5', boundary_width_el: '0.02',
      // Source: 10% and 90% of a logistic step lie at x₀ ∓ w·ln 9, so the 10–90% width is 2·ln 9·w (derived).
      boundary_width_10_90_el: String(2 * Math.log(9) * 0.02),
    });
    expect(rows[2].slice(0, 4)).toEqual(['junk.tif', 'error', 'junk.tif: not a TIFF file', '']);
    expect(rows[2].slice(4).every((c, i) => c === '' || ['pixel_size_source', 't_index'].includes(EMBRYO_COLUMNS[i + 4]))).toBe(true);
    // A file with one time point: t_index 0, t_s empty (its time unknown), as the last two columns.
    expect(EMBRYO_COLUMNS.slice(-2)).toEqual(['t_index', 't_s']);
    expect([row.t_index, row.t_s]).toEqual(['0', '']);
  });
  it('embryos.csv carries each side\'s λ and their difference before the time columns, empty when not measured', () => {
    // Demo data: invented numbers, checked cell by cell.
    const difference = {
      lambdaUm: 20, lambdaEl: 0.04, seUm: 4, seEl: 0.008, ciLowUm: 12, ciHighUm: 28, ciLowEl: 0.024, ciHighEl: 0.056,
      seModelEl: 0.008, seSerialEl: 0.006, seSource: 'model' as const, sideCorrelation: 0.3, dof: 40,
    };
    const withSides = { ...ok, sides: { dorsalProfile: ok.gradientProfile!, ventralProfile: ok.gradientProfile!, dorsalFit: ok.gradientFit, ventralFit: null, difference } };
    const rows = parseCsv(embryosCsv([withSides, { ...ok, file: 'other.tif' }]));
    const row = Object.fromEntries(EMBRYO_COLUMNS.map((c, i) => [c, rows[1][i]]));
    expect(row).toMatchObject({
      lambda_dorsal_um: '100', lambda_dorsal_el: '0.2', lambda_ventral_um: '', lambda_ventral_ci_high_um: '',
      lambda_dorsal_minus_ventral_um: '20', lambda_dorsal_minus_ventral_se_el: '0.008', lambda_dorsal_minus_ventral_ci_low_um: '12',
      lambda_dorsal_minus_ventral_ci_high_el: '0.056', lambda_dorsal_minus_ventral_se_source: 'model', side_error_correlation: '0.3', t_index: '0',
    });
    expect(EMBRYO_COLUMNS.indexOf('side_error_correlation')).toBe(EMBRYO_COLUMNS.length - 3);
    const plain = Object.fromEntries(EMBRYO_COLUMNS.map((c, i) => [c, rows[2][i]]));
    expect(SIDE_COLUMNS.every((c) => plain[c] === '')).toBe(true);
    // results.json keeps them (typed arrays and NaN revived) and leaves them out when not measured.
    const back = resultsFromJson(resultsToJson([withSides, { ...ok, file: 'other.tif' }]));
    expect(back[0].sides?.difference).toEqual(difference);
    expect(back[0].sides?.dorsalProfile.mean).toBeInstanceOf(Float64Array);
    expect('sides' in back[1]).toBe(false);
  });
  it('summary boundary is the first channel, logistic preferred', () => {
    expect(summaryBoundary(ok)?.positionEl).toBe(0.5);
    expect(summaryBoundary(bad)).toBeNull();
  });
  it('boundaries, profiles and landmarks tables', () => {
    expect(boundariesCsv([ok, bad]).split('\r\n')[2])
      .toBe(`dose,half/E01.ome.tif,stripe,logistic,0.5,250,0.02,${2 * Math.log(9) * 0.02},0.001,falling,"a ""note"", with comma",0,`.replace('dose,half/E01.ome.tif', '"dose,half/E01.ome.tif"'));
    const profiles = parseCsv(profilesCsv([ok, bad]));
    expect(profiles).toEqual([
      ['file', 'channel', 'x_el', 'x_um', 'mean', 'sd', 'n', 't_index', 't_s'],
      [ok.file, 'grad', '0.25', '125', '100', '1', '10', '0', ''], [ok.file, 'grad', '0.75', '375', '5', '2', '12', '0', ''],
      [ok.file, 'stripe', '0.25', '125', '50', '1', '10', '0', ''], [ok.file, 'stripe', '0.75', '375', '1', '2', '12', '0', ''],
    ]);
    expect(landmarksCsv([ok])).toBe('file,name,x_px,y_px,x_el,x_um,off_axis_um\r\n"dose,half/E01.ome.tif",furrow,330,40,0.32,160,-1.5\r\n');
  });
});

// A movie's results at three time points, 60 s apart (demo data).
const movie = [0, 1, 2].map((t) => withTimePoint({ ...ok, file: 'movie.ome.tif', gradientProfile: profile('grad', [100 * (t + 1), 5]) }, t, 60 * t));

describe('tables keyed by (file, time point)', () => {
  it('profiles.csv and boundaries.csv carry every time point of a movie with t_index and t_s', () => {
    const profiles = parseCsv(profilesCsv(movie)).slice(1).filter((r) => r[1] === 'grad' && r[2] === '0.25');
    expect(profiles.map((r) => [r[4], r[7], r[8]])).toEqual([['100', '0', '0'], ['200', '1', '60'], ['300', '2', '120']]);
    const boundaries = parseCsv(boundariesCsv(movie)).slice(1);
    expect(boundaries).toHaveLength(9);
    expect(boundaries.map((r) => r.slice(-2))).toEqual([0, 0, 0, 1, 1, 1, 2, 2, 2].map((t) => [String(t), String(60 * t)]));
  });
  it('embryos.csv and landmarks.csv have one row per file: a movie\'s last analysed time point', () => {
    expect(embryoResults([movie[1], ok, movie[2], movie[0], bad])).toEqual([movie[2], ok, bad]);
    const rows = parseCsv(embryosCsv([...movie, ok]));
    expect(rows.map((r) => [r[0], ...r.slice(-2)])).toEqual([['file', 't_index', 't_s'], ['movie.ome.tif', '2', '120'], [ok.file, '0', '']]);
    expect(parseCsv(landmarksCsv([...movie, ok])).slice(1).map((r) => r[0])).toEqual(['movie.ome.tif', ok.file]);
  });
});

describe('results.json', () => {
  it('round-trips results keyed by (file, time point), typed arrays included (NaN comes back as NaN)', () => {
    const text = resultsToJson([ok, bad, ...movie]);
    expect(JSON.parse(text)).toMatchObject({ schema: 'eggline-results', schemaVersion: 2, movies: [] });
    expect(JSON.parse(text).results[0]).toMatchObject({ file: ok.file, tIndex: 0, tS: null });
    expect(JSON.parse(text).results[0].gradientProfile.mean).toEqual([100, 5]);
    const back = resultsFromJson(text);
    expect(back[0].gradientProfile?.mean).toBeInstanceOf(Float64Array);
    expect(Array.from(back[0].gradientFit?.residuals ?? [])).toEqual([Number.NaN, -0.5]);
    expect(back[0]).toEqual(withTimePoint(ok, 0, null));
    expect(back[1]).toEqual(withTimePoint(bad, 0, null));
    expect(back.slice(2)).toEqual(movie);
    expect(resultsToJson(back)).toBe(text);
  });
  it('round-trips the movie records', () => {
    const record = {
      file: 'movie.ome.tif', timeIndices: [0, 1, 2], timesS: Float64Array.from([0, 60, 120]), timeSource: 'ome-increment', fitRangeEl: [0.1, 0.6] as const,
      modelRangeEl: [0.1, 0.4] as const, baselineFrames: 1, warnings: ['times from the file'], error: null,
    };
    const doc = resultsDocFromJson(resultsToJson(movie, [record]));
    expect(doc.movies).toEqual([record]);
    expect(doc.results).toEqual(movie);
  });
  it('reads the first format (version 1: one result per file, no time points) as time point 0', () => {
    // The layout the version 1 writer produced: { schema, version: 1, results } with results keyed by file alone.
    const v1 = `${jsonWithArrays({ schema: 'eggline-results', version: 1, results: [ok, bad] }, 1)}\n`;
    const doc = resultsDocFromJson(v1);
    expect(doc.results).toEqual([withTimePoint(ok, 0, null), withTimePoint(bad, 0, null)]);
    expect(doc.movies).toEqual([]);
    expect(embryosCsv(doc.results)).toBe(embryosCsv([ok, bad]));
  });
  it('rejects other files with one-line messages', () => {
    expect(() => resultsFromJson('nope')).toThrow(/^results\.json: not valid JSON/);
    expect(() => resultsFromJson('{"schema":"x"}')).toThrow('results.json: not an Eggline results file (schema must be "eggline-results")');
    expect(() => resultsFromJson('{"schema":"eggline-results","schemaVersion":3,"results":[]}')).toThrow('results.json: unsupported schema version 3 (this Eggline reads 1 and 2)');
    expect(() => resultsFromJson('{"schema":"eggline-results","version":2,"results":[]}')).toThrow('results.json: unsupported schema version 2 (this Eggline reads 1 and 2)');
    expect(() => resultsFromJson('{"schema":"eggline-results","version":1,"results":[{}]}'))
      .toThrow('results.json: entry 0 is not an embryo result (needs "file" and "status")');
    const two = JSON.stringify({ schema: 'eggline-results', schemaVersion: 2, results: [{ ...bad, tIndex: 1 }, { ...bad, tIndex: 1 }] });
    expect(() => resultsFromJson(two)).toThrow('results.json: entry 1 repeats junk.tif at time point 1');
    const negative = JSON.stringify({ schema: 'eggline-results', schemaVersion: 2, results: [{ ...bad, tIndex: -1 }] });
    expect(() => resultsFromJson(negative)).toThrow('results.json: entry 0: tIndex must be a whole number ≥ 0');
    expect(() => resultsDocFromJson(JSON.stringify({ schema: 'eggline-results', schemaVersion: 2, results: [], movies: [{ file: 'm' }] })))
      .toThrow(/^results\.json: movie 0 is not a movie record/);
  });
});

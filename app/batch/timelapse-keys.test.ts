// A batch's results with its movies' time points in place (pure parts of the time pass). All inputs are demo data.
import { describe, expect, it } from 'vitest';
import { errorResult, withTimePoint, type EmbryoResult, type MovieRecord } from '../../core/model';
import { timelapsePage, timelapseReportSection } from './timelapse-page';
import { movieOutcomes, withMovieResults, type MovieRun } from './timelapse-pass';

const result = (file: string, t?: number): EmbryoResult => (t === undefined ? errorResult(file, 'demo') : withTimePoint(errorResult(file, 'demo'), t, 60 * t));
const record = (file: string, timeIndices: number[], error: string | null = null): MovieRecord => ({
  file, timeIndices, timesS: Float64Array.from(timeIndices, (t) => 60 * t), timeSource: 'user', fitRangeEl: [0.1, 0.6], modelRangeEl: [0.1, 0.4],
  baselineFrames: 1, warnings: ['times from --time-step'], error,
});

describe('withMovieResults', () => {
  it('puts each movie\'s time points where its main-pass result was, in time order; a failed movie keeps its one result', () => {
    const main = [result('a.tif'), result('movie.tif', 0), result('b.tif'), result('broken-movie.tif', 0)];
    const runs: MovieRun[] = [
      { record: record('movie.tif', [0, 1, 2]), results: [result('movie.tif', 0), result('movie.tif', 1), result('movie.tif', 2)] },
      { record: record('broken-movie.tif', [], 'broken-movie.tif: time point 9 is outside the movie'), results: [] },
    ];
    const keyed = withMovieResults(main, runs);
    expect(keyed.map((r) => `${r.file}@${r.tIndex ?? '-'}`)).toEqual(['a.tif@-', 'movie.tif@0', 'movie.tif@1', 'movie.tif@2', 'b.tif@-', 'broken-movie.tif@0']);
    expect(keyed[1]).toBe(runs[0].results[0]);
  });
});

describe('movieOutcomes', () => {
  it('summarises each movie from its record and its keyed results; a failed record or missing time point is a failure', () => {
    const results = [result('movie.tif', 0), result('movie.tif', 1), result('gap.tif', 0)];
    const { movies, failures } = movieOutcomes([record('movie.tif', [0, 1]), record('gap.tif', [0, 1]), record('bad.tif', [], 'bad.tif: cannot be read')], results);
    expect(movies.map((m) => [m.file, m.timeIndices, m.timeSource])).toEqual([['movie.tif', [0, 1], 'user']]);
    expect(movies[0].results).toEqual([results[0], results[1]]);
    // These demo results are errors, so the summary says why it has no λ(t); the record's warnings come first.
    expect(movies[0].summary.note).toBe('time point 0 was not analysed, so the movie is not summarised');
    expect(movies[0].summary.warnings[0]).toBe('times from --time-step');
    expect(failures).toEqual([
      { file: 'gap.tif', error: 'gap.tif: results of some time points are missing' },
      { file: 'bad.tif', error: 'bad.tif: cannot be read' },
    ]);
  });
});

describe('a movie whose chosen time points all lie past its end', () => {
  // Demo data: --time 10:20 over a 4-time-point movie beside a movie that has them.
  const warning = 'short.tif: time points 10:20 asked for (--time, 0-based), but the movie has 4 time points (0 to 3); no time point was analysed over time';
  const none: MovieRecord = { ...record('short.tif', []), timesS: null, warnings: [warning] };

  it('keeps its main-pass result, with the warning added once, and fails nothing', () => {
    const main = [result('short.tif', 0), result('movie.tif', 0)];
    const runs: MovieRun[] = [{ record: none, results: [] }, { record: record('movie.tif', [10, 11]), results: [result('movie.tif', 10), result('movie.tif', 11)] }];
    const keyed = withMovieResults(main, runs);
    expect(keyed.map((r) => `${r.file}@${r.tIndex}`)).toEqual(['short.tif@0', 'movie.tif@10', 'movie.tif@11']);
    expect(keyed[0].warnings).toEqual([warning, ...main[0].warnings]);
    expect(withMovieResults(keyed, runs)[0].warnings).toEqual(keyed[0].warnings);
    const { movies, failures } = movieOutcomes(runs.map((r) => r.record), keyed);
    expect(movies.map((m) => m.file)).toEqual(['movie.tif']);
    // Listed with the movies not analysed, as a warning (warningOnly), not counted as failed.
    expect(failures).toEqual([{ file: 'short.tif', error: warning, warningOnly: true }]);
    expect(timelapsePage([], failures, 'now')).toContain(warning);
    expect(timelapseReportSection([], failures)).toContain(warning);
  });
});

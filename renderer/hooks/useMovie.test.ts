import { describe, expect, it } from 'vitest';
import type { MovieView } from '../../core/contract';
import { applyMovieAnswer, applyMovieProgress, MOVIE_IDLE, movieViewOf, type MovieState } from './useMovie';

// Source: demo data (invented file names and counts).
describe('movie state', () => {
  const running: MovieState = { ...MOVIE_IDLE, status: 'running', file: 'a.ome.tif' };
  it('counts progress of the running file only', () => {
    expect(applyMovieProgress(running, { file: 'a.ome.tif', done: 3, total: 46 })).toMatchObject({ done: 3, total: 46 });
    expect(applyMovieProgress(running, { file: 'b.ome.tif', done: 3, total: 46 })).toBe(running);
    expect(applyMovieProgress(MOVIE_IDLE, { file: 'a.ome.tif', done: 3, total: 46 })).toBe(MOVIE_IDLE);
  });
  it('keeps the answer, tells cancelling from failing, and drops answers for another file', () => {
    const view = { timeIndices: [0, 1, 2] } as unknown as MovieView;
    expect(applyMovieAnswer(running, 'a.ome.tif', { ok: true, value: view })).toMatchObject({ status: 'done', view, done: 3, total: 3 });
    expect(applyMovieAnswer(running, 'a.ome.tif', { ok: false, error: { code: 'cancelled', message: 'a.ome.tif: analysis over time cancelled' } }).status).toBe('cancelled');
    expect(applyMovieAnswer(running, 'a.ome.tif', { ok: false, error: { code: 'bad-file', message: 'a.ome.tif: truncated' } })).toMatchObject({ status: 'error', error: 'a.ome.tif: truncated' });
    expect(applyMovieAnswer(running, 'b.ome.tif', { ok: true, value: view })).toBe(running);
  });
  it('gives the outcome of the shown file only', () => {
    const view = { file: 'a.ome.tif', timeIndices: [0, 1] } as unknown as MovieView;
    const done = applyMovieAnswer(running, 'a.ome.tif', { ok: true, value: view });
    expect(movieViewOf(done, 'a.ome.tif')).toBe(view);
    expect(movieViewOf(done, 'b.ome.tif')).toBeNull();
    expect(movieViewOf(done, null)).toBeNull();
    expect(movieViewOf(MOVIE_IDLE, 'a.ome.tif')).toBeNull();
  });
});

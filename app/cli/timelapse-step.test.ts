import { describe, expect, it } from 'vitest';
import { reportTimelapse } from './timelapse-step';

describe('reportTimelapse', () => {
  it('says that no movie was analysed over time when every chosen range lies past its movie\'s end', () => {
    // Demo data: one movie whose time points were all past its end (a warning, not a failure).
    let out = '', err = '';
    const io = { stdout: { write: (s: string) => { out += s; } }, stderr: { write: (s: string) => { err += s; } } };
    const failed = reportTimelapse({ movies: [], failures: [{ file: 'short.ome.tif', error: 'short.ome.tif: no time point was analysed over time', warningOnly: true }] }, '/out', io);
    expect(failed).toBe(0);
    expect(err).toBe('eggline: warning: short.ome.tif: no time point was analysed over time\n');
    expect(out).toBe('No movie was analysed over time (see the warnings above); the time tables hold their headers only, and /out/timelapse.html lists the movies\n');
  });
});

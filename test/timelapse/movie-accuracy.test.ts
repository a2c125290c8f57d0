// Accuracy on a synthetic movie (demo data): a gradient forming by synthesis at the anterior pole, diffusion and
// degradation, painted onto one embryo per frame with camera noise, analysed frame by frame as the batch does.
import { describe, expect, it } from 'vitest';
import { fitExponentialDecay } from '../../core/fit';
import type { EmbryoResult } from '../../core/model';
import { analyseMovie } from '../../core/pipeline';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { planSyntheticMovie, syntheticMovieInfo, syntheticMoviePlaneSource } from '../../core/synth';
import {
  accumulationRows, coarsenProfiles, fitAccumulationModel, fitLambdaSeries, localAccumulationTime, MODEL_FIT_COLUMNS,
  modelFitRow, sddAccumulationTimeS, shapeFormedAtS, summarizeMovie,
} from '../../core/timelapse';

// Demo scenario: λ = 100 µm on a 500 µm egg, degradation time 1/k = 20 min, a frame every 3 min for 3 h,
// production from the second frame on. Small frames (2 µm/px, 2 slices) keep the test fast.
const K_PER_S = 1 / 1200;
const movie = planSyntheticMovie({
  embryo: { widthPx: 320, heightPx: 224, pixelSizeUm: 2, sizeZ: 2, zStepUm: 4, lambdaUm: 100, eggLengthUm: 500, eggWidthUm: 190 },
  degradationPerS: K_PER_S, frameIntervalS: 180, frames: 61, framesBeforeOnset: 1,
}, 4242);

async function analyseDemoMovie(): Promise<EmbryoResult[]> {
  const info = syntheticMovieInfo(movie);
  // The axis is found once, on the mean over a sample of time points (the embryo does not move).
  const m = await analyseMovie(info, syntheticMoviePlaneSource(movie), DEFAULT_SETTINGS, {
    fileLabel: 'movie', timeIndices: Array.from({ length: info.sizeT }, (_, t) => t),
  });
  expect(m.movieAxis).not.toBeNull();
  return [...m.results];
}

describe('a synthetic movie analysed frame by frame', async () => {
  const results = await analyseDemoMovie();
  const eggLengthUm = results[results.length - 1].eggLengthUm!;

  it('recovers λ(t) within 5% once the gradient has formed', () => {
    const series = fitLambdaSeries(results.map((r, i) => ({ tS: movie.timesS[i], profile: r.gradientProfile!, eggLengthUm: r.eggLengthUm! })), [0.1, 0.6]);
    // Truth: λ fitted to the painted concentration itself (no noise, no optics) over the same range.
    const xEl = movie.xUm.map((x) => x / movie.embryo.eggLengthUm);
    const truth = movie.shapes.map((c, i) => {
      try {
        return { tS: movie.timesS[i], fit: fitExponentialDecay(movie.xUm, c, { eggLengthUm: movie.embryo.eggLengthUm, fitRangeEl: [0.1, 0.6], xEl }), error: null };
      } catch (e) { return { tS: movie.timesS[i], fit: null, error: String(e) }; }
    });
    const formedS = shapeFormedAtS(truth, 0.02);
    expect(formedS).toBeLessThan(movie.timesS[movie.timesS.length - 1] / 2);
    let checked = 0;
    series.forEach((s, i) => {
      if (movie.timesS[i] < formedS) return;
      expect(s.fit, `frame ${i}`).not.toBeNull();
      expect(Math.abs(s.fit!.lambdaEl / truth[i].fit!.lambdaEl - 1), `frame ${i}`).toBeLessThan(0.05);
      checked++;
    });
    expect(checked).toBeGreaterThan(30);
  });

  it('recovers τ(x) within 15% of the model at 0.1–0.4 EL, and the model fit finds k and λ_τ', () => {
    const profiles = results.map((r) => r.gradientProfile!);
    const coarse = coarsenProfiles(profiles[0].xEl, profiles.map((p) => p.mean), 0.025);
    const xEl = coarse.xEl;
    const acc = localAccumulationTime(movie.timesS, coarse.frames, { baselineFrames: 1 });
    const lambdaUm = movie.embryo.lambdaUm;
    let checked = 0;
    for (let i = 0; i < xEl.length; i++) {
      if (xEl[i] < 0.1 || xEl[i] > 0.4) continue;
      // Source: τ(x) = (1 + x/λ)/(2k) (Berezhkovskii, Sample & Shvartsman 2010 — from memory; matched to our own
      // numerical solution in core/timelapse/accumulation.test.ts).
      const model = sddAccumulationTimeS(xEl[i] * movie.embryo.eggLengthUm, lambdaUm, K_PER_S);
      expect(Math.abs(acc.tauS[i] / model - 1), `x/EL ${xEl[i].toFixed(3)}`).toBeLessThan(0.15);
      expect(acc.stillRising[i], `x/EL ${xEl[i].toFixed(3)}`).toBe(0);
      checked++;
    }
    expect(checked).toBeGreaterThan(10);
    const xUm = xEl.map((v) => v * eggLengthUm);
    const last = results[results.length - 1].gradientFit!;
    const fit = fitAccumulationModel(xUm, xEl, acc.tauS, acc.tauSeS, { eggLengthUm, steady: { lambdaUm: last.lambdaUm, lambdaSeUm: last.lambdaSeUm } });
    expect(Math.abs(fit.kPerS.value / K_PER_S - 1)).toBeLessThan(0.15);
    expect(Math.abs(fit.lambdaTauUm.value / lambdaUm - 1)).toBeLessThan(0.2);
    expect(fit.agreement).toBe('agree');
    // D = kλ² of the scenario: 100²/1200 µm²/s.
    expect(Math.abs(fit.dUm2PerS.value / (100 ** 2 * K_PER_S) - 1)).toBeLessThan(0.2);
  });

  it('summarises the movie: the same τ(x), a model fit that agrees, table rows', () => {
    const times = movie.timesS;
    const summary = summarizeMovie('movie.ome.tif', results.map((_, t) => t), times, results, { fitRangeEl: [0.1, 0.6] });
    expect(summary.note).toBeNull();
    expect(summary.warnings).toEqual([]);
    expect(summary.model!.agreement).toBe('agree');
    expect(Math.abs(summary.model!.kPerS.value / K_PER_S - 1)).toBeLessThan(0.15);
    expect(Math.abs(summary.steadyFit!.lambdaUm / 100 - 1)).toBeLessThan(0.05);
    const rows = accumulationRows(summary);
    expect(rows.length).toBe(summary.accumulation!.xEl.length);
    expect(modelFitRow(summary)).toHaveLength(MODEL_FIT_COLUMNS.length);
    // Without a pixel size: λ in EL and k still come out; µm positions and D stay empty.
    const noPx = results.map((r) => ({ ...r, eggLengthUm: null, gradientProfile: { ...r.gradientProfile!, xUm: r.gradientProfile!.xUm.map(() => NaN) } }));
    const bare = summarizeMovie('movie.ome.tif', noPx.map((_, t) => t), times, noPx, { fitRangeEl: [0.1, 0.6] });
    expect(Math.abs(bare.steadyFit!.lambdaEl / 0.2 - 1)).toBeLessThan(0.05);
    expect(Math.abs(bare.model!.kPerS.value / K_PER_S - 1)).toBeLessThan(0.15);
    expect(Number.isNaN(bare.accumulation!.xUm[0])).toBe(true);
    expect(modelFitRow(bare)[MODEL_FIT_COLUMNS.indexOf('d_um2_per_s')]).toBeNull();
    // A movie cut at one degradation time after the onset is still rising: the summary says so.
    const cut = 8;
    const early = summarizeMovie('movie.ome.tif', results.slice(0, cut).map((_, t) => t), times.slice(0, cut), results.slice(0, cut), { fitRangeEl: [0.1, 0.6] });
    expect(early.warnings.join(' ')).toMatch(/still rises at the end of the movie/);
  });
});

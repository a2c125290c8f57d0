// Synthetic time-lapse movies (demo data, our own invented scenario): a gradient forming by synthesis at the
// anterior pole, diffusion and uniform degradation, solved numerically (core/timelapse) and painted onto one embryo
// per frame with fresh camera noise. The embryo does not move; production starts after `framesBeforeOnset` frames.
import type { PlaneSource, StackInfo } from '../model';
import { createRng } from '../stats';
import { solveSdd } from '../timelapse';
import type { SddModel } from '../timelapse';
import { makeSyntheticEmbryo, syntheticPlacement } from './embryo';
import type { SyntheticEmbryo } from './embryo';
import { DEFAULT_SYNTH_PARAMS } from './params';
import type { SyntheticEmbryoParams } from './params';
import { syntheticStackInfo } from './source';

/** What shapes a synthetic movie. The embryo's lambdaUm is the steady-state decay length λ = √(D/k). */
export interface SyntheticMovieParams {
  readonly embryo: Partial<SyntheticEmbryoParams>;
  /** Degradation rate k, 1/s; D = k·λ². */
  readonly degradationPerS: number;
  readonly frameIntervalS: number;
  readonly frames: number;
  /** Frames imaged before production starts (the baseline); the onset is at the last of them. */
  readonly framesBeforeOnset: number;
}

/** A movie's plan: the time of every frame and the painted gradient shape of each (relative to steady state at x = 0). */
export interface SyntheticMovie {
  readonly params: SyntheticMovieParams;
  /** The embryo parameters shared by every frame (placement fixed). */
  readonly embryo: SyntheticEmbryoParams;
  readonly timesS: Float64Array;
  readonly onsetS: number;
  readonly model: SddModel;
  /** Grid of the shapes (µm from the anterior pole) and each frame's C(x,t)/C_steady(0). */
  readonly xUm: Float64Array;
  readonly shapes: readonly Float64Array[];
  readonly seed: number;
}

/** Check the movie parameters first (exact messages). */
function checkMovie(p: SyntheticMovieParams): void {
  if (!(p.degradationPerS > 0)) throw new Error(`degradationPerS must be a positive number, got ${p.degradationPerS}`);
  if (!(p.frameIntervalS > 0)) throw new Error(`frameIntervalS must be a positive number, got ${p.frameIntervalS}`);
  if (!(Number.isInteger(p.frames) && p.frames >= 2)) throw new Error(`frames must be an integer ≥ 2, got ${p.frames}`);
  if (!(Number.isInteger(p.framesBeforeOnset) && p.framesBeforeOnset >= 0 && p.framesBeforeOnset < p.frames)) {
    throw new Error(`framesBeforeOnset must be an integer from 0 to frames − 1, got ${p.framesBeforeOnset}`);
  }
}

/**
 * Plan a synthetic movie (demo data): solves the synthesis–diffusion–degradation model on the egg length (reflecting
 * posterior pole) and fixes one random placement of the embryo from the seed. Frames are made by movieFrame.
 */
export function planSyntheticMovie(params: SyntheticMovieParams, seed: number): SyntheticMovie {
  checkMovie(params);
  const base: SyntheticEmbryoParams = { ...DEFAULT_SYNTH_PARAMS, ...params.embryo };
  // One draw of the placement, then fixed for every frame: the embryo does not move.
  const placed = syntheticPlacement(base, seed);
  const embryo: SyntheticEmbryoParams = { ...base, centre: placed.centre, angleDeg: placed.angleDeg };
  const k = params.degradationPerS;
  const model: SddModel = { diffusionUm2PerS: k * embryo.lambdaUm ** 2, degradationPerS: k, sourceFlux: 1, lengthUm: embryo.eggLengthUm };
  const timesS = Float64Array.from({ length: params.frames }, (_, i) => i * params.frameIntervalS);
  const onsetS = Math.max(0, params.framesBeforeOnset - 1) * params.frameIntervalS;
  const since = Array.from(timesS, (t) => Math.max(0, t - onsetS));
  const solution = solveSdd(model, since);
  // Normalise by the steady state at the pole, (jλ/D)·coth(L/λ), so the amplitude parameter keeps its meaning.
  const lambdaUm = embryo.lambdaUm;
  const steadyPole = (lambdaUm / model.diffusionUm2PerS) / Math.tanh(embryo.eggLengthUm / lambdaUm);
  const shapes = solution.concentration.map((c) => c.map((v) => v / steadyPole));
  return { params, embryo, timesS, onsetS, model, xUm: solution.xUm, shapes, seed };
}

/** Frame t of a planned movie (demo data): the embryo with that frame's gradient and its own camera noise. */
export function movieFrame(movie: SyntheticMovie, t: number): SyntheticEmbryo {
  const stepUm = movie.xUm[1] - movie.xUm[0];
  const frameSeed = Math.floor(createRng(movie.seed * 7919 + t).uniform() * 2 ** 31);
  return makeSyntheticEmbryo({ ...movie.embryo, gradientShape: { stepUm, values: movie.shapes[t] } }, frameSeed);
}

/** StackInfo of the whole movie (XYZCT, T = frames) as if read from an OME-TIFF. */
export function syntheticMovieInfo(movie: SyntheticMovie): StackInfo {
  const one = syntheticStackInfo(movieFrame(movie, 0));
  const sizeT = movie.timesS.length;
  const planeIfd = Int32Array.from({ length: one.sizeZ * one.sizeC * sizeT }, (_, i) => i);
  return { ...one, sizeT, planeIfd, ifdCount: planeIfd.length };
}

/** PlaneSource over a planned movie; each frame is rendered when first asked for and kept until another is. */
export function syntheticMoviePlaneSource(movie: SyntheticMovie): PlaneSource {
  let cached: { t: number; frame: SyntheticEmbryo } | null = null;
  return {
    async readPlane(z, c, t) {
      if (!(t >= 0 && t < movie.timesS.length)) throw new Error(`no time point ${t}`);
      if (!cached || cached.t !== t) cached = { t, frame: movieFrame(movie, t) };
      const { sizeX, sizeY, sizeZ, sizeC, planes } = cached.frame.stack;
      if (z < 0 || z >= sizeZ || c < 0 || c >= sizeC) throw new Error(`no plane z=${z} c=${c} t=${t}`);
      return { width: sizeX, height: sizeY, data: planes[c * sizeZ + z] };
    },
    async close() { cached = null; },
  };
}

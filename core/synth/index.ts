// Public surface of core/synth: seeded synthetic embryos and the demo dosage series (demo data, invented).
export { makeSyntheticEmbryo, syntheticPlacement, gradientShapeAt } from './embryo';
export type { SyntheticEmbryo, SyntheticTruth } from './embryo';
export { DEFAULT_SYNTH_PARAMS, checkSynthParams } from './params';
export type { SyntheticEmbryoParams, GradientShape } from './params';
export { planSyntheticMovie, movieFrame, syntheticMovieInfo, syntheticMoviePlaneSource } from './movie';
export type { SyntheticMovie, SyntheticMovieParams } from './movie';
export { DEMO_MOVIE_FILE, DEMO_MOVIE_SEED, DEMO_MOVIE_PARAMS } from './demo';
export { demoDataSet, DEMO_DOSAGES, DEMO_EMBRYOS_PER_CONDITION, DEMO_VARIATION, FURROW_BUFFERING } from './demo';
export type { DemoItem } from './demo';
export { syntheticStackInfo, syntheticPlaneSource } from './source';
export { warmTiming } from './warm-timing';

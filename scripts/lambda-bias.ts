// Where the small bias of λ on synthetic embryos comes from: the same embryos (demo data, λ = 100 µm) analysed once,
// then each gradient profile fitted again several ways, so that the differences are paired (same noise, same axis):
//   npx tsx scripts/lambda-bias.ts [embryos=80] [photons=1] [edgeDepthUm=20] [firstSeed=90000] [quick]
// (`quick`: the batch's analysis only, for many embryos)
//   - batch:      the analysis as it is (bins weighted by n/SD² of their own pixels)
//   - unweighted: the same profile, every bin weight 1
//   - smoothed:   weights n/SD² with SD² averaged over the 9 nearest bins (a weight no longer tracks its own bin's noise)
// and the same noisy image analysed again with parts taken from elsewhere:
//   - true axis:  the generator's poles given as a hand axis (the mask is still the noisy image's)
//   - true mask:  the generator's outline (an ellipse of the egg's length and width) and poles as the detection
//   - twin mask:  mask and axis found on a twin of the embryo with 20× the photons (same placement), profile from the
//                 noisy image
// Then a parametric bootstrap of the fit alone: each embryo's fitted curve plus Gaussian noise of its bins' own SE
// (SD/√n, independent bins), fitted again 40 times; the mean of those refits minus the curve's λ is the bias of the
// nonlinear least-squares estimator itself (Box 1971, J. R. Statist. Soc. B 33:171, from memory), at more than the
// real noise, since a bin's pixel SD also holds the band's structure. Last, per dosage, how far the detected outline
// lies outside the generator's ellipse in the anterior and posterior thirds, and the detected minus true egg length.
// `photons` multiplies every photon count of the generator (gradient, boundary, autofluorescence, stray light), so
// shot noise shrinks by its square root. Prints the mean error of each ± its SE, and the paired differences.
import { analyseStack, detectEmbryo, projectStack } from '../core/pipeline';
import type { EmbryoDetection } from '../core/geometry';
import type { SyntheticEmbryo } from '../core/synth';
import { trueDetection } from './synth-truth';
import { DEFAULT_SETTINGS, type AnalysisSettings } from '../core/settings';
import { DEFAULT_SYNTH_PARAMS, makeSyntheticEmbryo, syntheticPlaneSource, syntheticStackInfo } from '../core/synth';
import { fitExponentialDecay } from '../core/fit';
import { binWeights, filledBins } from '../core/profile';
import type { EmbryoResult } from '../core/model';
import { createRng } from '../core/stats';

const n = Number(process.argv[2] ?? 80);
const photons = Number(process.argv[3] ?? 1);
const depth = Number(process.argv[4] ?? 20);
const firstSeed = Number(process.argv[5] ?? 90_000);
const quick = process.argv[6] === 'quick';
const settings: AnalysisSettings = { ...DEFAULT_SETTINGS, profile: { ...DEFAULT_SETTINGS.profile, edgeDepthUm: depth } };
const P = DEFAULT_SYNTH_PARAMS;

type Variant = 'batch' | 'unweighted' | 'smoothed' | 'true axis' | 'true mask' | 'twin mask';

function smoothedWeights(sd: Float64Array, nPx: Float64Array): Float64Array | null {
  const v = Float64Array.from(sd, (s, i) => (nPx[i] >= 2 && s > 0 ? s * s : NaN));
  const avg = v.map((_, i) => {
    let sum = 0, k = 0;
    for (let j = Math.max(0, i - 4); j <= Math.min(v.length - 1, i + 4); j++) if (Number.isFinite(v[j])) { sum += v[j]; k++; }
    return k ? sum / k : NaN;
  });
  return binWeights(Float64Array.from(avg, Math.sqrt), nPx);
}

function refit(r: EmbryoResult, variant: Variant): number {
  if (variant === 'batch') return r.gradientFit?.lambdaUm ?? NaN;
  const p = filledBins(r.gradientProfile!);
  const L = r.eggLengthUm as number;
  const weights = variant === 'smoothed' ? smoothedWeights(p.sd, p.n) : null;
  const f = fitExponentialDecay(Float64Array.from(p.xEl, (x) => x * L), p.mean, { eggLengthUm: L, fitRangeEl: settings.fitRangeEl, xEl: p.xEl, ...(weights ? { weights } : {}) });
  return f.lambdaUm;
}

/** Mean signed distance (µm, + outside) of a detected outline from the generator's ellipse in the anterior and
 *  posterior thirds of the axis, and the detected minus true egg length (µm). */
function outlineOffsets(e: SyntheticEmbryo, d: EmbryoDetection): { anteriorUm: number; posteriorUm: number; lengthUm: number } {
  const t = e.truth;
  const a = t.eggLengthUm / 2 / e.pixelSizeUm, b = t.eggWidthUm / 2 / e.pixelSizeUm;
  const c = Math.cos((t.angleDeg * Math.PI) / 180), s = Math.sin((t.angleDeg * Math.PI) / 180);
  const uv = (p: { x: number; y: number }) => { const dx = p.x - t.centre.x, dy = p.y - t.centre.y; return [dx * c + dy * s, -dx * s + dy * c]; };
  const sideA = Math.sign(uv(t.anterior)[0]);
  const sums = { ant: [0, 0], post: [0, 0] };
  for (const p of d.outline) {
    const [u, v] = uv(p);
    const r = Math.hypot(u / a, v / b);
    const dist = (r - 1) / (Math.hypot(u / (a * a), v / (b * b)) / r);
    const w = u * sideA;
    if (w > a / 3) { sums.ant[0] += dist; sums.ant[1]++; } else if (w < -a / 3) { sums.post[0] += dist; sums.post[1]++; }
  }
  return { anteriorUm: (sums.ant[0] / sums.ant[1]) * e.pixelSizeUm, posteriorUm: (sums.post[0] / sums.post[1]) * e.pixelSizeUm, lengthUm: d.eggLengthUm - t.eggLengthUm };
}
const offsets: { anteriorUm: number; posteriorUm: number; lengthUm: number }[] = [];

const rng = createRng(7);
const dosageOf: number[] = [];
const byDosage: number[][] = [[], [], [], []];
const bootBias: number[] = [];
/** Mean over 40 refits of (fitted curve + noise of the bins' own SE), minus the curve's λ (µm). */
function bootstrapBias(r: EmbryoResult): number {
  const f = r.gradientFit!;
  const p = filledBins(r.gradientProfile!);
  const L = r.eggLengthUm as number;
  const xUm = Float64Array.from(p.xEl, (x) => x * L);
  const curve = xUm.map((x) => f.amplitude * Math.exp(-x / f.lambdaUm) + f.background);
  const se = Float64Array.from(p.sd, (s, i) => s / Math.sqrt(p.n[i]));
  const weights = binWeights(p.sd, p.n);
  let sum = 0;
  const reps = 40;
  for (let b = 0; b < reps; b++) {
    const y = curve.map((c, i) => c + se[i] * rng.normal());
    sum += fitExponentialDecay(xUm, y, { eggLengthUm: L, fitRangeEl: settings.fitRangeEl, xEl: p.xEl, ...(weights ? { weights } : {}) }).lambdaUm;
  }
  return sum / reps - f.lambdaUm;
}

const variants: Variant[] = ['batch', 'unweighted', 'smoothed', 'true axis', 'true mask', 'twin mask'];
const errors = new Map<Variant, number[]>(variants.map((v) => [v, []]));
const embryo = (k: number, seed: number, f: number) => makeSyntheticEmbryo({
  widthPx: 384, heightPx: 384, pixelSizeUm: 1.5, sizeZ: 8, dosage: [0.5, 1, 2, 4][k % 4],
  gradientAmplitude: P.gradientAmplitude * f, gradientBaseline: P.gradientBaseline * f, boundaryThreshold: P.boundaryThreshold * f,
  furrowThreshold: P.furrowThreshold * f, boundaryAmplitude: P.boundaryAmplitude * f, autofluorescence: P.autofluorescence * f,
  backgroundPhotons: P.backgroundPhotons * f,
}, seed);
for (let k = 0; k < n; k++) {
  const seed = firstSeed + 17 * k;
  const e = embryo(k, seed, photons);
  const info = syntheticStackInfo(e);
  const r = await analyseStack(info, syntheticPlaneSource(e), settings, { fileLabel: `embryo-${k}` });
  if (!r.gradientFit) continue;
  byDosage[k % 4].push(r.gradientFit.lambdaUm - e.truth.lambdaUm);
  if (quick) { errors.get('batch')!.push(r.gradientFit.lambdaUm - e.truth.lambdaUm); continue; }
  const axis = { anterior: e.truth.anterior, posterior: e.truth.posterior, source: 'hand' as const };
  const byAxis = await analyseStack(info, syntheticPlaneSource(e), settings, { fileLabel: `embryo-${k}`, handEdits: { axis, landmarks: [] } });
  const twin = embryo(k, seed, 20 * photons);
  if (Math.hypot(twin.truth.centre.x - e.truth.centre.x, twin.truth.centre.y - e.truth.centre.y) > 1e-9) throw new Error('the twin is placed elsewhere');
  const detection = detectEmbryo(await projectStack(syntheticStackInfo(twin), syntheticPlaneSource(twin), settings), settings);
  const byTwin = await analyseStack(info, syntheticPlaneSource(e), settings, { fileLabel: `embryo-${k}`, detection });
  offsets.push(outlineOffsets(e, detectEmbryo(await projectStack(info, syntheticPlaneSource(e), settings), settings)));
  const byTrue = await analyseStack(info, syntheticPlaneSource(e), settings, { fileLabel: `embryo-${k}`, detection: trueDetection(e) });
  errors.get('true mask')!.push((byTrue.gradientFit?.lambdaUm ?? NaN) - e.truth.lambdaUm);
  dosageOf.push(k % 4);
  bootBias.push(bootstrapBias(r));
  const truth = e.truth.lambdaUm;
  for (const v of variants.slice(0, 3)) errors.get(v)!.push(refit(r, v) - truth);
  errors.get('true axis')!.push((byAxis.gradientFit?.lambdaUm ?? NaN) - truth);
  errors.get('twin mask')!.push((byTwin.gradientFit?.lambdaUm ?? NaN) - truth);
}

const stats = (d: readonly number[]): string => {
  const m = d.reduce((s, x) => s + x, 0) / d.length;
  const sd = Math.sqrt(d.reduce((s, x) => s + (x - m) ** 2, 0) / (d.length - 1));
  return `${m >= 0 ? '+' : ''}${m.toFixed(3)} ± ${(sd / Math.sqrt(d.length)).toFixed(3)} µm (SD ${sd.toFixed(2)}, n = ${d.length})`;
};
console.log(`photons ×${photons}, edge band ${depth} µm, ${n} embryos (λ = 100 µm)`);
for (const v of quick ? variants.slice(0, 1) : variants) console.log(`  ${v.padEnd(11)} mean error ${stats(errors.get(v)!)}`);
[0.5, 1, 2, 4].forEach((f, i) => console.log(`  dosage ${f}: mean error ${stats(byDosage[i])}`));
const base = errors.get('batch')!;
for (const v of quick ? [] : variants.slice(1)) console.log(`  ${v} − batch: ${stats(errors.get(v)!.map((x, i) => x - base[i]))}`);
if (!quick) [0.5, 1, 2, 4].forEach((f, d) => console.log(`  dosage ${f}: true mask ${stats(errors.get('true mask')!.filter((_, i) => dosageOf[i] === d))}; batch ${stats(base.filter((_, i) => dosageOf[i] === d))}`));
if (!quick) console.log(`  bootstrap bias of the fit alone: ${stats(bootBias)}`);
if (!quick) [0.5, 1, 2, 4].forEach((f, d) => {
  const o = offsets.filter((_, i) => dosageOf[i] === d);
  const m = (k: 'anteriorUm' | 'posteriorUm' | 'lengthUm') => stats(o.map((x) => x[k]));
  console.log(`  dosage ${f}: detected outline − true ellipse, anterior third ${m('anteriorUm')}; posterior third ${m('posteriorUm')}; egg length ${m('lengthUm')}`);
});

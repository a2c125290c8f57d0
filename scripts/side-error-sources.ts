// Where the error of each side's own λ comes from (--edge-side each) on the project's synthetic embryos (demo data,
// λ = 100 µm on both sides): the same embryos made and analysed several ways, so that the comparisons are paired:
//   npx tsx scripts/side-error-sources.ts [embryos=40] [variants=base,photons,reseed,truemask,flat,sharp,onez] [firstSeed=90000]
//   - base:     the analysis as it is
//   - photons:  every photon count ×5 (shot noise /2.2; what does not shrink is not noise)
//   - reseed:   the same placement (centre, angle) with other noise (the share of the error fixed by the geometry)
//   - angleA:   A→P at A degrees to the image's x axis (e.g. angle0, angle22.5), other placement as drawn
//   - uniformA: as angleA with the stain the same at every depth (no nuclear layer: interiorLevel 1)
//   - binsN@A:  as angleA, analysed with N bins along the axis instead of the default
//   - truemask: the generator's outline (the ellipse of the egg) and poles given as the detection
//   - flat:     no nuclear texture (nucleiContrast 0)
//   - sharp:    almost no blur (0.1 px in every slice)
//   - onez:     one slice (no projection over z)
// Prints per variant the SD of each side's λ error and of the pooled λ's, their mean SEs, the correlation of the
// two sides' errors, how many 95% intervals held the truth, and for variants other than base the correlation of
// each side's error with its base error (the same error when it is high). Writes nothing.
import { analyseStack } from '../core/pipeline';
import { DEFAULT_SETTINGS, type AnalysisSettings } from '../core/settings';
import { DEFAULT_SYNTH_PARAMS, makeSyntheticEmbryo, syntheticPlacement, syntheticPlaneSource, syntheticStackInfo, type SyntheticEmbryoParams } from '../core/synth';
import { trueDetection } from './synth-truth';

const n = Number(process.argv[2] ?? 40);
const variants = (process.argv[3] ?? 'base,photons,reseed,truemask,flat,sharp,onez').split(',');
const firstSeed = Number(process.argv[4] ?? 90_000);
const settings: AnalysisSettings = { ...DEFAULT_SETTINGS, profile: { ...DEFAULT_SETTINGS.profile, edgeSide: 'each' } };
const P = DEFAULT_SYNTH_PARAMS;

function params(variant: string, k: number): Partial<SyntheticEmbryoParams> {
  const base: Partial<SyntheticEmbryoParams> = { widthPx: 384, heightPx: 384, pixelSizeUm: 1.5, sizeZ: 8, rightLambdaUm: 100, dosage: [0.5, 1, 2, 4][k % 4] };
  const f = 5;
  if (variant.startsWith('angle')) return { ...base, angleDeg: Number(variant.slice(5)) };
  if (variant.startsWith('bins')) return { ...base, angleDeg: Number(variant.split('@')[1]) };
  if (variant.startsWith('uniform')) return { ...base, angleDeg: Number(variant.slice(7)), interiorLevel: 1 };
  switch (variant) {
    case 'photons': return { ...base, gradientAmplitude: P.gradientAmplitude * f, gradientBaseline: P.gradientBaseline * f, boundaryThreshold: P.boundaryThreshold * f,
      furrowThreshold: P.furrowThreshold * f, boundaryAmplitude: P.boundaryAmplitude * f, autofluorescence: P.autofluorescence * f, backgroundPhotons: P.backgroundPhotons * f };
    case 'flat': return { ...base, nucleiContrast: 0 };
    case 'sharp': return { ...base, blurPx: 0.1, defocusBlurPxPerUm: 0 };
    case 'onez': return { ...base, sizeZ: 1 };
    default: return base;
  }
}

const mean = (a: number[]): number => a.reduce((s, v) => s + v, 0) / a.length;
const sd = (a: number[]): number => Math.sqrt(a.reduce((s, v) => s + (v - mean(a)) ** 2, 0) / (a.length - 1));
const pearson = (p: number[], q: number[]): number => mean(p.map((v, i) => (v - mean(p)) * (q[i] - mean(q)))) * p.length / (p.length - 1) / (sd(p) * sd(q));
interface Row { d: number; v: number; p: number; seD: number; seV: number; seP: number; inD: boolean; inV: boolean; inP: boolean }
const out = new Map<string, Row[]>();
function report(variant: string, rows: Row[]): void {
  const base = out.get(variants[0])!;
  const ok = rows.map((r, i) => [r, i] as const).filter(([r]) => Number.isFinite(r.d));
  const col = (f: (r: Row) => number) => ok.map(([r]) => f(r));
  const cnt = (f: (r: Row) => boolean) => `${ok.filter(([r]) => f(r)).length}/${ok.length}`;
  const vsBase = variant === variants[0] ? '' : `; corr with ${variants[0]}: dorsal ${pearson(col((r) => r.d), ok.map(([, i]) => base[i].d)).toFixed(2)}, ventral ${pearson(col((r) => r.v), ok.map(([, i]) => base[i].v)).toFixed(2)}`;
  console.log(`${variant.padEnd(9)} SD/SE µm: dorsal ${sd(col((r) => r.d)).toFixed(2)}/${mean(col((r) => r.seD)).toFixed(2)}, ventral ${sd(col((r) => r.v)).toFixed(2)}/${mean(col((r) => r.seV)).toFixed(2)}, pooled ${sd(col((r) => r.p)).toFixed(2)}/${mean(col((r) => r.seP)).toFixed(2)}; mean err d ${mean(col((r) => r.d)).toFixed(2)} v ${mean(col((r) => r.v)).toFixed(2)} p ${mean(col((r) => r.p)).toFixed(2)}; corr(d,v) ${pearson(col((r) => r.d), col((r) => r.v)).toFixed(2)}; held: d ${cnt((r) => r.inD)} v ${cnt((r) => r.inV)} p ${cnt((r) => r.inP)}; d − v mean ${mean(col((r) => r.d - r.v)).toFixed(2)} SD ${sd(col((r) => r.d - r.v)).toFixed(2)}${vsBase}`);
}
for (const variant of variants) {
  const rows: Row[] = [];
  for (let k = 0; k < n; k++) {
    const seed = firstSeed + 17 * k;
    const e = variant === 'reseed'
      ? makeSyntheticEmbryo({ ...params(variant, k), ...syntheticPlacement(params(variant, k), seed) }, seed + 7_000_000)
      : makeSyntheticEmbryo(params(variant, k), seed);
    const bins = variant.startsWith('bins') ? Number(variant.slice(4).split('@')[0]) : settings.profile.binCount;
    const r = await analyseStack(syntheticStackInfo(e), syntheticPlaneSource(e), { ...settings, profile: { ...settings.profile, binCount: bins } }, { fileLabel: `embryo-${k}`, ...(variant === 'truemask' ? { detection: trueDetection(e) } : {}) });
    const d = r.sides?.dorsalFit, v = r.sides?.ventralFit, p = r.gradientFit;
    if (!d || !v || !p) { rows.push({ d: NaN, v: NaN, p: NaN, seD: NaN, seV: NaN, seP: NaN, inD: false, inV: false, inP: false }); continue; }
    const inside = (f: typeof d) => f.lambdaCiLowUm <= 100 && 100 <= f.lambdaCiHighUm;
    rows.push({ d: d.lambdaUm - 100, v: v.lambdaUm - 100, p: p.lambdaUm - 100, seD: d.lambdaSeUm, seV: v.lambdaSeUm, seP: p.lambdaSeUm, inD: inside(d), inV: inside(v), inP: inside(p) });
  }
  out.set(variant, rows);
  report(variant, rows);
}

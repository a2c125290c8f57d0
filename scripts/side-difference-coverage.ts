// How the per-embryo intervals of each side's λ and of λ_dorsal − λ_ventral hold on the project's own synthetic
// embryos (demo data: the same λ = 100 µm on both sides unless a second value is given; random position and rotation,
// nuclear texture, z-blur, shot and read noise), analysed with --edge-side each:
//   npx tsx scripts/side-difference-coverage.ts [embryos=80] [rightLambdaUm=100] [edgeDepthUm=the default, 20] [firstSeed=90000]
// Prints how many 95% intervals held the truth (dorsal, ventral, difference), the SD of each side's error against
// its mean SE, the mean errors, the SD of the detected axis's angle error and its correlation with the λ errors, the
// correlation of the two sides' λ errors across embryos and the mean estimated correlation of their residuals, and
// how many of each side's intervals would hold the truth with the depth term times 0, ¼, ½ (as used), ¾ or 1 (nothing
// is written). By default the embryos are those of
// scripts/lambda-coverage.ts (seeds 90 000 + 17k); another firstSeed gives an independent set (firstSeed + 17k).
import { analyseStack } from '../core/pipeline';
import { DEFAULT_SETTINGS, type AnalysisSettings } from '../core/settings';
import { makeSyntheticEmbryo, syntheticPlaneSource, syntheticStackInfo } from '../core/synth';

const n = Number(process.argv[2] ?? 80);
const rightUm = Number(process.argv[3] ?? 100);
const edgeDepthUm = Number(process.argv[4] ?? DEFAULT_SETTINGS.profile.edgeDepthUm);
const firstSeed = Number(process.argv[5] ?? 90_000);
const settings: AnalysisSettings = { ...DEFAULT_SETTINGS, profile: { ...DEFAULT_SETTINGS.profile, edgeSide: 'each', edgeDepthUm } };
const rows: { d: number; v: number; seD: number; seV: number; diff: number; seDiff: number; inD: boolean; inV: boolean; inDiff: boolean; corr: number; angleErrDeg: number; sides: { err: number; seRaw: number; twoT: number; t: number }[] }[] = [];
for (let k = 0; k < n; k++) {
  const e = makeSyntheticEmbryo({ widthPx: 384, heightPx: 384, pixelSizeUm: 1.5, sizeZ: 8, rightLambdaUm: rightUm, dosage: [0.5, 1, 2, 4][k % 4] }, firstSeed + 17 * k);
  const r = await analyseStack(syntheticStackInfo(e), syntheticPlaneSource(e), settings, { fileLabel: `embryo-${k}` });
  const s = r.sides;
  if (!s?.dorsalFit || !s.ventralFit || !s.difference) { console.log(`embryo-${k}: no difference (${r.warnings.join('; ')})`); continue; }
  const d = s.dorsalFit, v = s.ventralFit, x = s.difference;
  const a = r.axis!, t = e.truth;
  const angle = (p: { x: number; y: number }, q: { x: number; y: number }): number => Math.atan2(q.y - p.y, q.x - p.x);
  const angleErrDeg = ((angle(a.anterior, a.posterior) - angle(t.anterior, t.posterior) + 3 * Math.PI) % (2 * Math.PI) - Math.PI) * 180 / Math.PI;
  rows.push({
    d: d.lambdaUm - 100, v: v.lambdaUm - rightUm, seD: d.lambdaSeUm, seV: v.lambdaSeUm, diff: x.lambdaUm - (100 - rightUm), seDiff: x.seUm,
    inD: d.lambdaCiLowUm <= 100 && 100 <= d.lambdaCiHighUm, inV: v.lambdaCiLowUm <= rightUm && rightUm <= v.lambdaCiHighUm,
    inDiff: x.ciLowUm <= 100 - rightUm && 100 - rightUm <= x.ciHighUm, corr: x.sideCorrelation, angleErrDeg,
    // Each side's SE without its depth term, twice the term (|λ − λ_outer|, µm) and the t quantile: for other factors.
    sides: [[d, 100], [v, rightUm]].map(([f, truth]) => {
      const fit = f as typeof d;
      const twoT = 2 * (fit.depthTermEl ?? 0) * (r.eggLengthUm ?? NaN);
      const seRaw = Math.sqrt(fit.lambdaSeUm ** 2 - (twoT / 2) ** 2);
      return { err: fit.lambdaUm - (truth as number), seRaw, twoT, t: (fit.lambdaCiHighUm - fit.lambdaUm) / fit.lambdaSeUm };
    }),
  });
}
const mean = (a: number[]): number => a.reduce((s, v) => s + v, 0) / a.length;
const sd = (a: number[]): number => Math.sqrt(a.reduce((s, v) => s + (v - mean(a)) ** 2, 0) / (a.length - 1));
const count = (f: (r: typeof rows[number]) => boolean): string => `${rows.filter(f).length}/${rows.length}`;
const dErr = rows.map((r) => r.d), vErr = rows.map((r) => r.v);
const corr = mean(dErr.map((v, i) => (v - mean(dErr)) * (vErr[i] - mean(vErr)))) * rows.length / (rows.length - 1) / (sd(dErr) * sd(vErr));
console.log(`intervals holding the truth: dorsal ${count((r) => r.inD)}, ventral ${count((r) => r.inV)}, difference ${count((r) => r.inDiff)}`);
console.log(`SD of the error / mean SE, µm: dorsal ${sd(dErr).toFixed(2)} / ${mean(rows.map((r) => r.seD)).toFixed(2)}, ventral ${sd(vErr).toFixed(2)} / ${mean(rows.map((r) => r.seV)).toFixed(2)}, difference ${sd(rows.map((r) => r.diff)).toFixed(2)} / ${mean(rows.map((r) => r.seDiff)).toFixed(2)}`);
console.log(`mean error, µm: dorsal ${mean(dErr).toFixed(2)}, ventral ${mean(vErr).toFixed(2)}, difference ${mean(rows.map((r) => r.diff)).toFixed(2)}`);
const pearson = (p: number[], q: number[]): number => mean(p.map((v, i) => (v - mean(p)) * (q[i] - mean(q)))) * p.length / (p.length - 1) / (sd(p) * sd(q));
const ang = rows.map((r) => r.angleErrDeg);
console.log(`axis angle error (detected − true), deg: SD ${sd(ang).toFixed(2)}; its correlation with the difference's error ${pearson(ang, rows.map((r) => r.diff)).toFixed(2)}, with the dorsal error ${pearson(ang, dErr).toFixed(2)}, with the ventral error ${pearson(ang, vErr).toFixed(2)}`);
console.log(`RMS of error/SE of the difference ${Math.sqrt(mean(rows.map((r) => (r.diff / r.seDiff) ** 2))).toFixed(2)}; correlation of the sides' λ errors across embryos ${corr.toFixed(2)}; mean estimated residual correlation ${mean(rows.map((r) => r.corr)).toFixed(2)}`);
for (const [i, name] of ['dorsal', 'ventral'].entries()) {
  const line = [0, 0.25, 0.5, 0.75, 1].map((c) => {
    const held = rows.filter((r) => { const q = r.sides[i]; return Math.abs(q.err) <= q.t * Math.hypot(q.seRaw, c * q.twoT); }).length;
    const rms = Math.sqrt(mean(rows.map((r) => { const q = r.sides[i]; return (q.err / Math.hypot(q.seRaw, c * q.twoT)) ** 2; })));
    return `×${c}: ${held}/${rows.length} (RMS ${rms.toFixed(2)})`;
  });
  console.log(`${name} side's interval with the term's factor ${line.join(', ')}`);
}

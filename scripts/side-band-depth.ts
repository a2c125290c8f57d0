// How deep the edge band reaches on each side, measured against the generator's own outline (demo data): for embryos
// at fixed angles of the AP axis to the pixel grid, the band is taken as the analysis takes it (the detected mask's
// distance transform, pixels within the band depth) and each band pixel's true depth below the mid-section's
// ellipse is looked up; per side, the mean true depth of the band's pixels in each bin of the fit range, and its
// change along the fit range (slope of a straight line through them, µm of depth per EL); and the λ error that the
// stain the band holds would give on its own: the generator's layer profile (with its partial-cover rim) at each band
// pixel's true depth, averaged per bin, and λ² times the slope of its logarithm along x (no noise, no blur):
//   npx tsx scripts/side-band-depth.ts [embryosPerAngle=8] [angles=0,11.25,22.5,45,67.5] [firstSeed=90000]
// A band whose reach changes along a side samples the stained layer and the dimmer interior in changing shares,
// which bends that side's profile. Writes nothing.
import { detectEmbryo, projectStack } from '../core/pipeline';
import { distanceInside } from '../core/image';
import { binIndices } from '../core/profile';
import { DEFAULT_SETTINGS } from '../core/settings';
import { DEFAULT_SYNTH_PARAMS, makeSyntheticEmbryo, syntheticPlaneSource, syntheticStackInfo } from '../core/synth';
import { ellipseDepth } from '../core/synth/ellipse-distance';

const n = Number(process.argv[2] ?? 8);
const angles = (process.argv[3] ?? '0,11.25,22.5,45,67.5').split(',').map(Number);
const firstSeed = Number(process.argv[4] ?? 90_000);
const settings = DEFAULT_SETTINGS;
const [start, end] = settings.fitRangeEl;
const binCount = settings.profile.binCount;

/** Least-squares slope of y on x. */
function slope(x: number[], y: number[]): number {
  const mx = x.reduce((s, v) => s + v, 0) / x.length, my = y.reduce((s, v) => s + v, 0) / y.length;
  let sxy = 0, sxx = 0;
  for (let i = 0; i < x.length; i++) { sxy += (x[i] - mx) * (y[i] - my); sxx += (x[i] - mx) ** 2; }
  return sxy / sxx;
}
const P = DEFAULT_SYNTH_PARAMS;
/** The generator's stain at a true depth (µm) in the mid-section: its layer profile times its partial cover of the rim pixel. */
function layer(depthUm: number, pixelSizeUm: number): number {
  const cover = Math.min(1, Math.max(0, 0.5 + depthUm / pixelSizeUm));
  return cover * (P.interiorLevel + (1 - P.interiorLevel) / (1 + Math.exp((depthUm - P.nuclearLayerUm) / 2)));
}
const mean = (a: number[]): number => a.reduce((s, v) => s + v, 0) / a.length;
const sd = (a: number[]): number => Math.sqrt(a.reduce((s, v) => s + (v - mean(a)) ** 2, 0) / (a.length - 1));

for (const angleDeg of angles) {
  const slopes = { left: [] as number[], right: [] as number[] };
  const depths = { left: [] as number[], right: [] as number[] };
  const implied = { left: [] as number[], right: [] as number[] };
  for (let k = 0; k < n; k++) {
    const e = makeSyntheticEmbryo({ widthPx: 384, heightPx: 384, pixelSizeUm: 1.5, sizeZ: 8, angleDeg, dosage: [0.5, 1, 2, 4][k % 4] }, firstSeed + 17 * k);
    const det = detectEmbryo(await projectStack(syntheticStackInfo(e), syntheticPlaneSource(e), settings), settings);
    const { mask } = det;
    const depthPx = distanceInside(mask);
    const bandPx = settings.profile.edgeDepthUm / e.pixelSizeUm;
    const xs: number[] = [], ys: number[] = [];
    for (let i = 0; i < mask.data.length; i++) if (mask.data[i] === 1 && depthPx[i] - 0.5 <= bandPx) { xs.push(i % mask.width); ys.push(Math.floor(i / mask.width)); }
    const t = e.truth;
    const c = Math.cos((t.angleDeg * Math.PI) / 180), s = Math.sin((t.angleDeg * Math.PI) / 180);
    const trueDepth = xs.map((x, i) => {
      const dx = (x - t.centre.x) * e.pixelSizeUm, dy = (ys[i] - t.centre.y) * e.pixelSizeUm;
      return ellipseDepth(dx * c + dy * s, dx * s - dy * c, t.eggLengthUm / 2, t.eggWidthUm / 2);
    });
    for (const side of ['left', 'right'] as const) {
      const bins = binIndices(Float32Array.from(xs), Float32Array.from(ys), det.axis, binCount, side);
      const sum = new Float64Array(binCount), cnt = new Float64Array(binCount), stain = new Float64Array(binCount);
      bins.forEach((b, i) => { if (b >= 0) { sum[b] += trueDepth[i]; cnt[b]++; stain[b] += layer(trueDepth[i], e.pixelSizeUm); } });
      const xEl: number[] = [], d: number[] = [], lnStain: number[] = [];
      for (let b = 0; b < binCount; b++) {
        const x = (b + 0.5) / binCount;
        if (x >= start && x <= end && cnt[b] > 0) { xEl.push(x); d.push(sum[b] / cnt[b]); lnStain.push(Math.log(stain[b] / cnt[b])); }
      }
      slopes[side].push(slope(xEl, d));
      // A profile A·exp(−x/λ)·M(x) fitted as an exponential has 1/λ' ≈ 1/λ − d ln M/dx, so λ' − λ ≈ λ²·d ln M/dx.
      implied[side].push(e.truth.lambdaUm ** 2 * slope(xEl, lnStain) / e.truth.eggLengthUm);
      depths[side].push(mean(d));
    }
  }
  const f = (a: number[]): string => `${mean(a) >= 0 ? '+' : ''}${mean(a).toFixed(2)} (SD ${sd(a).toFixed(2)})`;
  console.log(`${String(angleDeg).padStart(6)}°: mean true depth of the band, µm: left ${mean(depths.left).toFixed(2)}, right ${mean(depths.right).toFixed(2)}; its change along the fit range, µm per EL: left ${f(slopes.left)}, right ${f(slopes.right)}, left − right ${f(slopes.left.map((v, i) => v - slopes.right[i]))}; λ error implied by the stain the band holds, µm: left ${f(implied.left)}, right ${f(implied.right)}, left − right ${f(implied.left.map((v, i) => v - implied.right[i]))}`);
}

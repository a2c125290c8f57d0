// Exact distribution of offset + Poisson(background photons) + read noise, rounded: the part of every camera pixel
// that does not depend on the scene, drawn with one uniform and a table look-up instead of a Poisson and a normal.

/** Complementary error function (Chebyshev fit, fractional error < 1.2e-7 everywhere). */
export function erfc(x: number): number {
  const z = Math.abs(x);
  const t = 1 / (1 + 0.5 * z);
  const r = t * Math.exp(-z * z - 1.26551223 + t * (1.00002368 + t * (0.37409196 + t * (0.09678418 + t * (-0.18628806 +
    t * (0.27886807 + t * (-1.13520398 + t * (1.48851587 + t * (-0.82215223 + t * 0.17087277)))))))));
  return x >= 0 ? r : 2 - r;
}

/** Standard normal cumulative distribution. */
function normalCdf(z: number): number {
  return 0.5 * erfc(-z / Math.SQRT2);
}

/** Sampler of round(offset + Poisson(mean) + readSd·N(0, 1)) by inversion of its exact CDF (not clipped to uint16). */
export interface PixelTable {
  /** The output value for a uniform u in [0, 1). */
  sample(u: number): number;
  /** Probability of each output value from `first` on (for tests). */
  readonly first: number;
  readonly pmf: Float64Array;
  /** Cumulative probabilities (last = 1) and the guide: guide[m] = first index whose CDF exceeds m/guide.length. */
  readonly cdf: Float64Array;
  readonly guide: Int32Array;
}

/** Poisson probabilities of 0..n−1 for the given mean, by the recurrence p(j) = p(j−1)·mean/j in log space. */
function poissonPmf(mean: number): Float64Array {
  const n = Math.ceil(mean + 12 * Math.sqrt(mean) + 20);
  const out = new Float64Array(n);
  let logP = -mean;
  for (let j = 0; j < n; j++) {
    if (j > 0) logP += Math.log(mean) - Math.log(j);
    out[j] = mean > 0 ? Math.exp(logP) : j === 0 ? 1 : 0;
  }
  return out;
}

/** Build the table for a camera with offset and read-noise SD (counts) and a constant photon mean. */
export function pixelTable(offset: number, meanPhotons: number, readSd: number): PixelTable {
  const pois = poissonPmf(meanPhotons);
  const spread = Math.ceil(9 * readSd) + 1;
  const first = Math.floor(offset) - spread;
  const last = Math.ceil(offset) + pois.length + spread;
  const pmf = new Float64Array(last - first + 1);
  for (let j = 0; j < pois.length; j++) {
    if (pois[j] < 1e-300) continue;
    const centre = offset + j;
    if (readSd === 0) { pmf[Math.min(last, Math.max(first, Math.round(centre))) - first] += pois[j]; continue; }
    // round(v) = k for v in [k − 0.5, k + 0.5); the two end values also collect the (negligible) tails beyond them.
    for (let k = first; k <= last; k++) {
      const lo = k === first ? 0 : normalCdf((k - 0.5 - centre) / readSd);
      const hi = k === last ? 1 : normalCdf((k + 0.5 - centre) / readSd);
      pmf[k - first] += pois[j] * Math.max(0, hi - lo);
    }
  }
  const cdf = new Float64Array(pmf.length);
  let acc = 0;
  for (let k = 0; k < pmf.length; k++) { acc += pmf[k]; cdf[k] = acc; }
  for (let k = 0; k < pmf.length; k++) { pmf[k] /= acc; cdf[k] /= acc; }
  cdf[cdf.length - 1] = 1;
  // Guide table: guide[m] = first index whose CDF exceeds m/M, so a search starts close to its answer.
  const M = 1024;
  const guide = new Int32Array(M);
  for (let m = 0, k = 0; m < M; m++) {
    while (cdf[k] <= m / M) k++;
    guide[m] = k;
  }
  return {
    first, pmf, cdf, guide,
    sample(u: number): number {
      let k = guide[Math.floor(u * M)];
      while (cdf[k] <= u) k++;
      return first + k;
    },
  };
}

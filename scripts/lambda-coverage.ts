// The λ-interval coverage study with more embryos than the suite runs, for one or more edge-band depths:
//   npx tsx scripts/lambda-coverage.ts [embryos=200] [depthUm,depthUm,…=12,20]
// Prints, per depth, how many 95% intervals held the true λ, the mean error (bias) ± its SE, the SD between embryos
// against the mean SE, and the RMS of error/SE (demo data; nothing is written).
import { coverageLine, lambdaCoverageStudy, summariseCoverage } from '../test/accuracy/lambda-coverage-study';

const n = Number(process.argv[2] ?? 200);
const depths = (process.argv[3] ?? '12,20').split(',').map(Number);
for (const d of depths) {
  const rows = await lambdaCoverageStudy(n, 90_000, { edgeDepthUm: d });
  console.log(coverageLine(`edge band ${d} µm`, summariseCoverage(rows, 100)));
}

// Render the cohort figures of a demo series to PNG (test/artifacts/cohort/) so a person can look at them.
// Run: npx tsx test/cohort/render-figures.ts   (also used by render-figures.test.ts)
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import sharp from 'sharp';
import { analyseCohort, makeDemoCohort, parseSampleSheet } from '../../core/cohort';
import { cohortFigures, profileFigure } from '../../core/figures';

/** Demo cohort (invented synthetic embryos) used for the figures: dosages 0.5–4, λ = 0.2 EL. */
export function demoAnalysis(lambdaPosteriorEl: number | null = 0.35) {
  const demo = makeDemoCohort({
    conditions: [{ name: 'half', dosage: 0.5, count: 8 }, { name: 'reference', dosage: 1, count: 8 }, { name: 'double', dosage: 2, count: 8 }, { name: 'quadruple', dosage: 4, count: 8 }],
    seed: 21,
  });
  return { demo, analysis: analyseCohort(demo.results, parseSampleSheet(demo.sheetCsv, 'samples.csv'), { normalisation: 'none', lambdaPosteriorEl }) };
}

/** Render every figure to PNG in `dir`; returns the written paths. */
export async function renderAll(dir: string): Promise<string[]> {
  mkdirSync(dir, { recursive: true });
  const { demo, analysis } = demoAnalysis();
  const e = demo.results[9];
  const residuals = Float64Array.from({ length: 50 }, (_, i) => 20 * Math.sin(i));
  const fit = { ...e.gradientFit!, xEl: Float64Array.from({ length: 50 }, (_, i) => 0.1 + i * 0.01), residuals };
  const figs = [...cohortFigures(analysis), { name: 'profile-single', title: '', svg: profileFigure({ profile: e.gradientProfile!, fit, boundaries: e.boundaries, landmarks: e.landmarks }, { showResiduals: true, heightPx: 520 }) },
    { name: 'profile-um', title: '', svg: profileFigure({ profile: e.gradientProfile!, fit: e.gradientFit, boundaries: e.boundaries, landmarks: e.landmarks }, { xAxis: 'um' }) }];
  const out: string[] = [];
  for (const f of figs) {
    const path = join(dir, `${f.name}.png`);
    writeFileSync(join(dir, `${f.name}.svg`), f.svg);
    await sharp(Buffer.from(f.svg), { density: 144 }).png().toFile(path);
    out.push(path);
  }
  return out;
}

if (process.argv[1]?.endsWith('render-figures.ts')) {
  renderAll(join(process.cwd(), 'test/artifacts/cohort')).then((p) => console.log(p.join('\n')));
}

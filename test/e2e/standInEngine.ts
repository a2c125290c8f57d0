// A stand-in analysis engine for the browser tests while the real decoder/pipeline is not wired into the shell:
// synthetic embryos (demo data, invented) keyed by file name, measured with the renderer's live code.
// The harness uses it only when the real engine reports that it is not available.
import { promises as fs } from 'node:fs';
import { basename, join } from 'node:path';
import type { AnalysisEngine, BatchRunOptions } from '../../app/main/engine';
import { embryosCsv } from '../../core/batch';
import type { BatchSummary } from '../../core/contract';
import type { EmbryoResult } from '../../core/model';
import { liveToResult } from '../../renderer/export/liveResult';
import { measureLive, prepareLive } from '../../renderer/live';
import { SMALL_EMBRYO, syntheticStack } from '../../renderer/live/syntheticStack';
import type { SyntheticEmbryo } from '../../renderer/live/syntheticStack';

/** Demo embryos written by the stand-in: name → parameters (λ differs a little between embryos). */
export const STAND_IN_EMBRYOS: Readonly<Record<string, Partial<SyntheticEmbryo>>> = {
  'embryo-01.tif': { lambdaUm: 95, seed: 1 },
  'embryo-02.tif': { lambdaUm: 105, seed: 2, boundaryEl: 0.42 },
  'embryo-03.tif': { lambdaUm: 88, seed: 3, boundaryEl: 0.47 },
  'damaged.tif': {},
};

const BASE: SyntheticEmbryo = { ...SMALL_EMBRYO, widthPx: 520, heightPx: 260, pixelSizeUm: 1, semiMajorPx: 230, semiMinorPx: 92, noiseSd: 25, amplitude: 900 };

/** The synthetic stack of a stand-in file, or a one-line error naming it. */
function stackFor(path: string, label: string) {
  const p = STAND_IN_EMBRYOS[basename(path)];
  if (p === undefined || basename(path) === 'damaged.tif') throw new Error(`${label}: not a TIFF file (bad header)`);
  return { ...syntheticStack({ ...BASE, ...p }), path };
}

/** One embryo measured the way the window measures it, with the project's hand edits. */
function measureFile(path: string, key: string, o: BatchRunOptions): EmbryoResult {
  try {
    const stack = stackFor(path, key);
    const edits = o.doc.files[key];
    const axis = edits?.axis ?? stack.detection.axis;
    const m = measureLive(prepareLive(stack, o.settings), axis, o.settings, edits?.landmarks ?? [], edits?.fitRangeEl ?? o.settings.fitRangeEl);
    return liveToResult(key, m, axis, stack.projected.pixelSizeUm, 'ome', stack.detection.eggWidthUm);
  } catch (e) {
    return { ...liveToResultError(key), error: e instanceof Error ? e.message : String(e) };
  }
}

/** An error result with nothing measured. */
function liveToResultError(file: string): EmbryoResult {
  return { file, status: 'error', error: null, warnings: [], pixelSizeUm: null, pixelSizeSource: 'unknown', eggLengthUm: null, eggWidthUm: null,
    axis: null, gradientChannel: null, gradientProfile: null, gradientFit: null, boundaryProfiles: [], boundaries: [], landmarks: [], backgrounds: [] };
}

/** The stand-in engine. */
export function createStandInEngine(stepDelayMs = 120): AnalysisEngine {
  return {
    async loadForView(path, label) {
      const s = stackFor(path, label);
      return { info: { ...s.info, sizeZ: 3 }, projected: s.projected, detection: s.detection };
    },
    async readSlice(path, label, z, c) {
      const s = stackFor(path, label);
      const plane = s.projected.channels[c];
      if (plane === undefined || z > 2) throw new Error(`${label}: plane z=${z}, c=${c} is outside the stack`);
      return { width: plane.width, height: plane.height, data: plane.data.map((v) => v * (0.6 + 0.2 * z)) };
    },
    async runBatch(o): Promise<BatchSummary> {
      const keys = Object.keys(STAND_IN_EMBRYOS);
      const results: EmbryoResult[] = [];
      let cancelled = false;
      for (const [i, key] of keys.entries()) {
        if (o.signal.aborted) { cancelled = true; break; }
        o.onProgress({ runId: '', done: i, total: keys.length, file: key, status: 'running', message: null });
        await new Promise((r) => setTimeout(r, stepDelayMs));
        const r = measureFile(join(o.folder, key), key, o);
        results.push(r);
        o.onProgress({ runId: '', done: i + 1, total: keys.length, file: key, status: r.status, message: r.error });
      }
      await fs.writeFile(join(o.outDir, 'embryos.csv'), embryosCsv(results));
      o.onProgress({ runId: '', done: results.length, total: keys.length, file: null, status: cancelled ? 'cancelled' : 'finished', message: null });
      const ok = results.filter((r) => r.status === 'ok').length;
      return { runId: '', outDir: o.outDir, ok, failed: results.length - ok, cancelled, results };
    },
    async writeDemoDataSet(dir) {
      await fs.mkdir(dir, { recursive: true });
      const files = Object.keys(STAND_IN_EMBRYOS).map((n) => join(dir, n));
      // Placeholder bytes: the stand-in derives each embryo from its name, not from the file.
      for (const f of files) await fs.writeFile(f, 'stand-in demo embryo\n');
      const samplesPath = join(dir, 'samples.csv');
      await fs.writeFile(samplesPath, 'file,condition\n' + Object.keys(STAND_IN_EMBRYOS).map((n) => `${n},demo`).join('\n') + '\n');
      return { files, samplesPath, projectPath: join(dir, 'eggline-project.json') };
    },
  };
}

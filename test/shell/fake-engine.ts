// A stand-in analysis engine for shell tests (demo data: invented files; no real decoding).
import { promises as fs } from 'node:fs';
import { join } from 'node:path';
import type { BatchProgress } from '../../core/contract';
import type { Detection, ProjectedStack, StackInfo } from '../../core/model';
import { DEFAULT_SETTINGS } from '../../core/settings';
import type { AnalysisEngine, BatchRunOptions } from '../../app/engine/engine';

/** A fake engine plus a log of what it was asked. */
export function createFakeEngine(): AnalysisEngine & { calls: string[]; batchOptions: BatchRunOptions[] } {
  const calls: string[] = [];
  const batchOptions: BatchRunOptions[] = [];
  return {
    calls, batchOptions,
    async loadForView(path, label, settings) {
      calls.push(`loadForView ${label} ${settings.projection}`);
      const bytes = await fs.readFile(path);
      if (bytes.length === 0) throw Object.assign(new Error(`${label}: empty file (0 bytes)`), { name: 'TiffError', code: 'empty' });
      const info = { sizeX: 4, sizeY: 3, sizeZ: 2, sizeC: 1, sizeT: 1 } as unknown as StackInfo;
      const plane = { width: 4, height: 3, data: new Float32Array(12).fill(1) };
      const projected = { channels: [plane], channelNames: ['c1'], pixelSizeUm: 1, pixelSizeSource: 'ome', projection: settings.projection,
        sliceIndex: null, warnings: [] } as ProjectedStack;
      const detection = { mask: { width: 4, height: 3, data: new Uint8Array(12).fill(1) }, outline: [],
        axis: { anterior: { x: 0, y: 1 }, posterior: { x: 3, y: 1 }, source: 'auto' }, eggLengthUm: 3, eggWidthUm: 2, warnings: [] } as Detection;
      return { info, projected, detection };
    },
    async readSlice(_path, label, z, c, t) {
      calls.push(`readSlice ${label} ${z} ${c} ${t}`);
      if (z > 1) throw new Error(`${label}: slice z=${z} is out of range (2 slices)`);
      return { width: 2, height: 1, data: new Float32Array([z, c]) };
    },
    async runBatch(options) {
      batchOptions.push(options);
      const total = 3;
      for (let done = 0; done < total; done++) {
        if (options.signal.aborted) break;
        options.onProgress({ runId: 'engine-id', done, total, file: `e${done}.tif`, status: 'running', message: null } satisfies BatchProgress);
        await new Promise((r) => setTimeout(r, 20));
      }
      const cancelled = options.signal.aborted;
      return { runId: 'engine-id', outDir: options.outDir, ok: cancelled ? 0 : total, failed: 0, cancelled, results: [] };
    },
    async writeDemoDataSet(dir) {
      calls.push('writeDemoDataSet');
      await fs.mkdir(join(dir, 'dose-1'), { recursive: true });
      const files = [join(dir, 'dose-1', 'embryo-01.ome.tif'), join(dir, 'dose-1', 'embryo-02.ome.tif')];
      for (const f of files) await fs.writeFile(f, new Uint8Array([0x49, 0x49, 42, 0]));
      const projectPath = join(dir, 'eggline-project.json');
      await fs.writeFile(projectPath, JSON.stringify({
        schema: 'eggline-project', version: 1, folder: '.', settings: DEFAULT_SETTINGS,
        files: { 'dose-1/embryo-01.ome.tif': { axis: null, landmarks: [{ name: 'furrow', point: { x: 5, y: 6 } }], fitRangeEl: null } },
      }));
      const samplesPath = join(dir, 'samples.csv');
      await fs.writeFile(samplesPath, 'file,condition,dosage\n');
      return { files, samplesPath, projectPath };
    },
  };
}

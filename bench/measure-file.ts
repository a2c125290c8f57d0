// One file's timings shared by the benchmarks: decoding alone and the whole per-file analysis.
import { analyseFile } from '../app/batch/analyse-file';
import { openStack } from '../app/batch/deps';
import { readAhead } from '../core/image';
import { DEFAULT_SETTINGS } from '../core/settings';

/** Settings of every measured analysis: defaults, channel 2 as the boundary channel. */
export const BENCH_SETTINGS = { ...DEFAULT_SETTINGS, boundaryChannels: [2] };

/**
 * Read every plane of a file once in the pipeline's order (z outer, channel inner) and with its read-ahead
 * (core/image readAhead, as projectStack reads), keeping nothing: the same reading as the pipeline, without the
 * analysis. Milliseconds.
 */
export async function decodeOnce(path: string): Promise<number> {
  const t0 = performance.now();
  const { info, source } = await openStack(path, path);
  const order: { z: number; c: number }[] = [];
  for (let z = 0; z < info.sizeZ; z += 1) for (let c = 0; c < info.sizeC; c += 1) order.push({ z, c });
  await readAhead(order.length, (i) => source.readPlane(order[i].z, order[i].c, 0), () => undefined);
  await source.close();
  return performance.now() - t0;
}

/** The whole per-file analysis, as a batch worker runs it; milliseconds. */
export async function pipelineOnce(path: string): Promise<number> {
  const t0 = performance.now();
  const r = await analyseFile({ index: 0, path, file: path, settings: BENCH_SETTINGS, handEdits: null });
  if (r.status !== 'ok') process.stderr.write(`bench: ${r.error}\n`);
  return performance.now() - t0;
}

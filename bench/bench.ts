// Batch benchmark (`npm run bench`): generates its own large synthetic stacks (demo data), then measures per file
// decode-only vs whole-pipeline time, files/s with one worker vs all cores, and peak memory vs the raw stack size.
// Each measurement runs in a fresh child process so peak RSS belongs to that measurement alone. Prints, never asserts.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { makeSyntheticEmbryo } from '../core/synth';
import { writeOmeTiff } from '../core/tiff';
import { DEFAULT_SETTINGS } from '../core/settings';
import { analyzeFile } from '../app/batch/analyze-file';
import { openStack } from '../app/batch/deps';
import { runBatch } from '../app/batch/run-batch';
import { limitDecoderThreads } from '../app/batch/decoder-threads';

const SIZE = { widthPx: 1024, heightPx: 1024, sizeZ: 24, sizeC: 2 };
const RAW_BYTES = SIZE.widthPx * SIZE.heightPx * SIZE.sizeZ * SIZE.sizeC * 2;
const FILES: { name: string; compression: 'deflate' | 'none' }[] = [
  { name: 'bench-1-deflate.ome.tif', compression: 'deflate' }, { name: 'bench-2-none.ome.tif', compression: 'none' },
  { name: 'bench-3-deflate.ome.tif', compression: 'deflate' }, { name: 'bench-4-none.ome.tif', compression: 'none' },
];
const MiB = 1024 * 1024;
const self = fileURLToPath(import.meta.url);
const workerPath = fileURLToPath(new URL('./batch-worker.mjs', import.meta.url));

/** Peak resident memory of this process so far, bytes (the kernel's high-water mark). */
const peakRss = (): number => process.resourceUsage().maxRSS * 1024;

/** Sample JS heap + ArrayBuffer memory every 5 ms (fires between awaits, e.g. while a plane decodes); returns a stop
 *  function giving the largest sample, bytes. Synchronous stretches are not sampled, so this is a lower bound. */
function watchHeap(): () => number {
  let peak = 0;
  const sample = (): void => {
    const m = process.memoryUsage();
    peak = Math.max(peak, m.heapUsed + m.arrayBuffers);
  };
  const timer = setInterval(sample, 5);
  return () => { clearInterval(timer); sample(); return peak; };
}

/** Write the benchmark stacks into `dir` unless already there (one synthetic embryo, written with each compression). */
function generate(dir: string): void {
  if (FILES.every((f) => existsSync(join(dir, 'in', f.name)))) return;
  mkdirSync(join(dir, 'in'), { recursive: true });
  process.stderr.write(`bench: generating a ${SIZE.widthPx}×${SIZE.heightPx}×${SIZE.sizeZ}×${SIZE.sizeC} uint16 synthetic stack…\n`);
  const e = makeSyntheticEmbryo({ widthPx: SIZE.widthPx, heightPx: SIZE.heightPx, sizeZ: SIZE.sizeZ, pixelSizeUm: 0.6, zStepUm: 2 }, 4242);
  const planes = e.stack.planes.map((data) => ({ width: SIZE.widthPx, height: SIZE.heightPx, data }));
  for (const f of FILES) {
    const bytes = writeOmeTiff(planes, {
      sizeZ: SIZE.sizeZ, sizeC: SIZE.sizeC, sizeT: 1, dimensionOrder: 'XYZCT', channelNames: e.channelNames,
      physicalSizeXUm: e.pixelSizeUm, compression: f.compression,
    });
    writeFileSync(join(dir, 'in', f.name), bytes);
  }
}

/** Child: read every plane of a file once (decode only), plane by plane, keeping nothing. */
async function childDecode(path: string): Promise<Record<string, number>> {
  limitDecoderThreads(availableParallelism());
  const base = process.memoryUsage().rss;
  const t0 = performance.now();
  const { info, source } = await openStack(path, path);
  for (let c = 0; c < info.sizeC; c += 1) for (let z = 0; z < info.sizeZ; z += 1) await source.readPlane(z, c, 0);
  await source.close();
  return { ms: performance.now() - t0, peakExtra: peakRss() - base };
}

/** Child: the whole per-file analysis, as a batch worker runs it. */
async function childPipeline(path: string): Promise<Record<string, number>> {
  limitDecoderThreads(availableParallelism());
  const base = process.memoryUsage().rss;
  const stop = watchHeap();
  const t0 = performance.now();
  const r = await analyzeFile({ index: 0, path, file: path, settings: { ...DEFAULT_SETTINGS, boundaryChannels: [2] }, handEdits: null });
  if (r.status !== 'ok') process.stderr.write(`bench: ${r.error}\n`);
  const ms = performance.now() - t0;
  return { ms, peakExtra: peakRss() - base, heapPeak: stop(), ok: r.status === 'ok' ? 1 : 0 };
}

/** Child: a whole batch over the folder with `jobs` worker threads. */
async function childPool(dir: string, jobs: number): Promise<Record<string, number>> {
  const base = process.memoryUsage().rss;
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  const s = await runBatch({
    folder: join(dir, 'in'), outDir: join(dir, `out-${jobs}`), settings: { ...DEFAULT_SETTINGS, boundaryChannels: [2] },
    doc: null, jobs, workerPath,
  });
  const ms = performance.now() - t0;
  const cpu = process.cpuUsage(cpu0);
  return { ms, cpuMs: (cpu.user + cpu.system) / 1000, peakExtra: peakRss() - base, ok: s.ok, files: s.ok + s.failed };
}

function runChild(args: string[]): Record<string, number> {
  const out = execFileSync(process.execPath, [self, '--child', ...args], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'inherit'], maxBuffer: 1 << 20 });
  return JSON.parse(out.trim().split('\n').pop() ?? '{}') as Record<string, number>;
}

const pad = (s: string | number, n: number): string => String(s).padStart(n);
const mib = (b: number): string => (b / MiB).toFixed(0);

async function main(): Promise<void> {
  const args = process.argv.slice(2);
  if (args[0] === '--child') {
    const [, kind, a, b] = args;
    const r = kind === 'decode' ? await childDecode(a) : kind === 'pipeline' ? await childPipeline(a) : await childPool(a, Number(b));
    process.stdout.write(`${JSON.stringify(r)}\n`);
    return;
  }
  const keepAt = args[0] === '--dir' ? args[1] : undefined;
  const dir = keepAt ?? mkdtempSync(join(tmpdir(), 'eggline-bench-'));
  generate(dir);
  const cores = availableParallelism();
  console.log(`\nEggline batch benchmark — ${cores} cores, Node ${process.versions.node}; stack ${SIZE.sizeC} ch × ${SIZE.sizeZ} z × ${SIZE.widthPx}×${SIZE.heightPx} uint16 = ${mib(RAW_BYTES)} MiB raw\n`);
  console.log(`${'file'.padEnd(26)}${pad('decode s', 10)}${pad('pipeline s', 12)}${pad('ratio', 8)}${pad('peak MiB', 10)}${pad('× raw', 8)}${pad('heap+buf MiB', 14)}`);
  const ratios: number[] = [];
  const peaks: number[] = [];
  for (const f of FILES) {
    const path = join(dir, 'in', f.name);
    const d = runChild(['decode', path]);
    const p = runChild(['pipeline', path]);
    ratios.push(p.ms / d.ms);
    peaks.push(p.peakExtra);
    console.log(`${f.name.padEnd(26)}${pad((d.ms / 1000).toFixed(2), 10)}${pad((p.ms / 1000).toFixed(2), 12)}${pad((p.ms / d.ms).toFixed(2), 8)}${pad(mib(p.peakExtra), 10)}${pad((p.peakExtra / RAW_BYTES).toFixed(2), 8)}${pad(mib(p.heapPeak), 14)}`);
  }
  console.log(`\n${'jobs'.padEnd(6)}${pad('files', 6)}${pad('seconds', 10)}${pad('files/s', 10)}${pad('speed-up', 10)}${pad('peak MiB', 10)}${pad('MiB/worker', 12)}${pad('CPU s/file', 12)}`);
  const one = runChild(['pool', dir, '1']);
  const all = runChild(['pool', dir, String(cores)]);
  for (const [jobs, r] of [[1, one], [cores, all]] as const) {
    const speed = one.ms / r.ms;
    console.log(`${String(jobs).padEnd(6)}${pad(r.files, 6)}${pad((r.ms / 1000).toFixed(2), 10)}${pad((r.files / (r.ms / 1000)).toFixed(3), 10)}${pad(speed.toFixed(2), 10)}${pad(mib(r.peakExtra), 10)}${pad(mib(r.peakExtra / jobs), 12)}${pad((r.cpuMs / 1000 / r.files).toFixed(2), 12)}`);
  }
  const worstRatio = Math.max(...ratios);
  const worstPeak = Math.max(...peaks, one.peakExtra);
  const mark = (ok: boolean): string => (ok ? 'met' : 'NOT met');
  console.log(`\naims: pipeline ≤ 1.5× decode: worst ${worstRatio.toFixed(2)}× — ${mark(worstRatio <= 1.5)}`);
  console.log(`      all cores ≥ 1.7× one worker: ${(one.ms / all.ms).toFixed(2)}× — ${mark(one.ms / all.ms >= 1.7)}`);
  console.log(`      peak memory per worker ≤ 2× raw stack: worst ${(worstPeak / RAW_BYTES).toFixed(2)}× — ${mark(worstPeak <= 2 * RAW_BYTES)}`);
  console.log(`(peak = rise of the process's peak RSS over its RSS at start; heap+buf = sampled JS heap + ArrayBuffers, a lower bound;\n times include decoding from the page cache; CPU s/file is the process's CPU time (all threads) per file: when it stays flat\n while the speed-up is low, other load on the machine, not the batch, held the cores)`);
  if (!keepAt) rmSync(dir, { recursive: true, force: true });
}

await main();

// Side-by-side benchmark (`npm run bench:script`, also run by `npm run bench`): `eggline batch` against a scripted
// reference pipeline in Python (bench/reference_pipeline.py: numpy, scipy, scikit-image, tifffile) on the same files
// in the same run, alternated; the read floor (file bytes read and inflated with node:zlib); the 65,535-plane file;
// and the desktop app's first picture and axis with λ. All stacks are demo data written here. Prints, never asserts.
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { inflateSync } from 'node:zlib';
import { openFileByteSource } from '../core/io';
import { makeSyntheticEmbryo } from '../core/synth';
import { readChunkPlan, readIfdChain, readTiffHeader, writeOmeTiff, writePlainTiff } from '../core/tiff';
import { DEFAULT_SETTINGS } from '../core/settings';
import { detectEmbryo, measureEmbryo, prepareSampling, projectStack } from '../core/pipeline';
import { analyseFileWithDigest } from '../app/batch/analyse-file';
import { workerBuffers } from '../app/batch/worker-buffers';
import { openStackForAnalysis, readPreviewPlane } from '../app/decode';

const self = fileURLToPath(import.meta.url);
const cli = fileURLToPath(new URL('./cli.mjs', import.meta.url));
const script = fileURLToPath(new URL('../bench/reference_pipeline.py', import.meta.url));
const PYTHON = '/usr/bin/python3';
const SETTINGS = { ...DEFAULT_SETTINGS, boundaryChannels: [2] };
const MiB = 2 ** 20;

/** One stack of a set: its name, size and compression. */
interface StackSpec { name: string; sizePx: number; sizeZ: number; sizeC: number; compression: 'none' | 'deflate' }

/** Shaped like microscope exports: 16 stacks, 3 channels × 5–9 slices, 570–820 px, half uncompressed, half Deflate. */
const MICROSCOPE: StackSpec[] = Array.from({ length: 16 }, (_, i) => ({
  name: `export-${String(i + 1).padStart(2, '0')}.ome.tif`, sizePx: 570 + ((i * 53) % 251), sizeZ: 5 + (i % 5), sizeC: 3,
  compression: i % 2 === 0 ? 'none' : 'deflate',
}));

/** The large set: 1024² × 2 channels × 24 slices, two of each compression. */
const LARGE: StackSpec[] = Array.from({ length: 4 }, (_, i) => ({
  name: `large-${i + 1}.ome.tif`, sizePx: 1024, sizeZ: 24, sizeC: 2, compression: i % 2 === 0 ? 'deflate' : 'none',
}));

/** Writes one demo stack (a synthetic embryo; a third channel, when asked, is the mean of the first two). */
function writeStack(path: string, spec: StackSpec, seed: number): void {
  const e = makeSyntheticEmbryo({ widthPx: spec.sizePx, heightPx: spec.sizePx, sizeZ: spec.sizeZ, pixelSizeUm: 650 / spec.sizePx, zStepUm: 2 }, seed);
  const planes = [...e.stack.planes];
  const names = [...e.channelNames];
  if (spec.sizeC === 3) {
    for (let z = 0; z < spec.sizeZ; z++) {
      const a = e.stack.planes[z];
      const b = e.stack.planes[spec.sizeZ + z];
      planes.push(Uint16Array.from(a, (v, i) => (v + b[i]) >> 1));
    }
    names.push('nuclei');
  }
  const bytes = writeOmeTiff(planes.map((data) => ({ width: spec.sizePx, height: spec.sizePx, data })), {
    sizeZ: spec.sizeZ, sizeC: spec.sizeC, sizeT: 1, dimensionOrder: 'XYZCT', channelNames: names, physicalSizeXUm: e.pixelSizeUm, compression: spec.compression,
  });
  writeFileSync(path, bytes);
}

/** Writes a set's stacks into dir (unless there) and returns their paths. */
function writeSet(dir: string, specs: StackSpec[]): string[] {
  mkdirSync(dir, { recursive: true });
  return specs.map((s, i) => {
    const path = join(dir, s.name);
    if (!existsSync(path)) writeStack(path, s, 9000 + i);
    return path;
  });
}

/** A 64×64 plain TIFF of 65,535 planes (Deflate): one small demo embryo, each plane with its own noise. */
function writeManyPlanes(path: string): void {
  if (existsSync(path)) return;
  const e = makeSyntheticEmbryo({ widthPx: 64, heightPx: 64, sizeZ: 1, pixelSizeUm: 10, eggLengthUm: 450, eggWidthUm: 180, zStepUm: 1 }, 77);
  const base = e.stack.planes[0];
  let state = 12345;
  const planes = Array.from({ length: 65_535 }, () => ({
    width: 64, height: 64,
    data: Uint16Array.from(base, (v) => { state = (state * 1103515245 + 12345) >>> 0; return v + (state >>> 29); }),
  }));
  writeFileSync(path, writePlainTiff(planes, { pixelSizeUm: 10, compression: 'deflate' }));
}

/** Wall seconds, user+sys CPU seconds and peak RSS (KiB, the largest process) of a command, from GNU time. */
function timed(cmd: string, args: string[], env: NodeJS.ProcessEnv = process.env): { wallS: number; cpuS: number; maxRssKiB: number; stdout: string } {
  const r = spawnSync('/usr/bin/time', ['-f', '@@%e %U %S %M', cmd, ...args], { encoding: 'utf8', env, maxBuffer: 64 * MiB });
  const line = r.stderr.split('\n').reverse().find((l) => l.startsWith('@@'));
  // A run that failed (a usage error ends in a fraction of a second) must never be timed as if it had worked.
  if (!line || r.status !== 0) throw new Error(`${cmd} ${args.slice(0, 2).join(' ')} failed (exit ${r.status}): ${r.stderr.slice(-400)}`);
  const [wall, user, sys, rss] = line.slice(2).trim().split(/\s+/).map(Number);
  return { wallS: wall, cpuS: user + sys, maxRssKiB: rss, stdout: r.stdout };
}

/** Child: read every strip of every plane of each file and inflate it with node:zlib (the read floor). */
async function childFloor(paths: string[]): Promise<void> {
  for (const path of paths) {
    const source = await openFileByteSource(path, path);
    const header = await readTiffHeader(source, path);
    const ifds = await readIfdChain(source, header, path);
    for (const ifd of ifds) {
      const plan = await readChunkPlan(source, header, ifd, path);
      for (let i = 0; i < plan.offsets.length; i++) {
        const bytes = await source.read(plan.offsets[i], plan.byteCounts[i]);
        if (plan.compression === 8) inflateSync(bytes);
      }
    }
    await source.close();
  }
}

/** Child: the whole per-file analysis, one file after another in one process, with a batch worker's lent arrays
 *  (one batch worker's work, less the SHA-256 it takes of each file for run.json, as in earlier versions' figures). */
async function childPipeline(paths: string[]): Promise<void> {
  const buffers = workerBuffers();
  for (const path of paths) {
    const { result: r } = await analyseFileWithDigest({ index: 0, path, file: path, settings: SETTINGS, handEdits: null }, false, buffers);
    if (r.status !== 'ok') process.stderr.write(`bench: ${r.error}\n`);
  }
}

/** Child: the desktop app's steps for one stack, timed from the click: the first picture (the preview slice, as
 *  loadPreview), the projection with the embryo found (as loadStack, started at the same moment in the app; here
 *  after the preview, so its time includes the preview's), and the axis with λ (sampling prepared and the profile
 *  measured and fitted, as the window does next). */
async function childDesktop(path: string): Promise<void> {
  const runs: { sliceS: number; pictureS: number; lambdaS: number }[] = [];
  for (let k = 0; k < 4; k++) {
    const t0 = performance.now();
    await readPreviewPlane(path, path);
    const t1 = performance.now();
    const opened = await openStackForAnalysis(path, path);
    const projected = await projectStack(opened.info, opened.source, SETTINGS);
    const detection = detectEmbryo(projected, SETTINGS);
    await opened.source.close();
    const t2 = performance.now();
    const m = measureEmbryo(prepareSampling(projected, detection, SETTINGS), detection.axis, SETTINGS, []);
    const t3 = performance.now();
    if (!m) throw new Error('no measurement');
    runs.push({ sliceS: (t1 - t0) / 1000, pictureS: (t2 - t0) / 1000, lambdaS: (t3 - t0) / 1000 });
  }
  process.stdout.write(`${JSON.stringify(runs)}\n`);
}

const med = (v: number[]): number => [...v].sort((a, b) => a - b)[v.length >> 1];
const range = (v: number[]): string => (v.length === 1 ? v[0].toFixed(2) : `${Math.min(...v).toFixed(2)}–${Math.max(...v).toFixed(2)}`);

/** The alternated side-by-side on one set; prints the aims as ratios. */
function compareSet(label: string, dir: string, paths: string[], rawBytesLargest: number, rounds: number): void {
  const nodeEnv = { ...process.env };
  const pyEnv = { ...process.env, OMP_NUM_THREADS: '1', OPENBLAS_NUM_THREADS: '1' };
  const rows: Record<string, { wallS: number; cpuS: number; maxRssKiB: number }[]> = { eggline: [], script: [], floor: [], pipeline1: [], scriptRead: [] };
  for (let r = 0; r < rounds; r++) {
    // Outside the input folder: eggline refuses an output folder inside its input (exit 2).
    const out = `${dir}-out-${r}`;
    rmSync(out, { recursive: true, force: true });
    const runEggline = () => rows.eggline.push(timed(process.execPath, [cli, 'batch', dir, '--out', out, '--jobs', '2', '--boundary-channel', '2'], nodeEnv));
    const runScript = () => rows.script.push(timed(PYTHON, [script, ...paths], pyEnv));
    // Alternate which goes first, so a drift in the machine's speed does not favour one side.
    if (r % 2 === 0) { runEggline(); runScript(); } else { runScript(); runEggline(); }
    rows.floor.push(timed(process.execPath, [self, '--child', 'floor', ...paths], nodeEnv));
    rows.pipeline1.push(timed(process.execPath, ['--no-concurrent-recompilation', self, '--child', 'pipeline', ...paths], { ...nodeEnv, MALLOC_ARENA_MAX: '2' }));
    rows.scriptRead.push(timed(PYTHON, [script, '--read-only', ...paths], pyEnv));
    rmSync(out, { recursive: true, force: true });
  }
  const n = paths.length;
  const w = (k: string) => rows[k].map((x) => x.wallS);
  const c = (k: string) => rows[k].map((x) => x.cpuS);
  console.log(`\n${label}: ${n} files, ${rounds} alternated round(s); seconds per round (range over rounds)`);
  console.log(`  eggline batch --jobs 2     wall ${range(w('eggline'))}   CPU (with the workers it reaped) ${range(c('eggline'))}   peak RSS of one process ${(Math.max(...rows.eggline.map((x) => x.maxRssKiB)) / 1024).toFixed(0)} MiB`);
  console.log(`  Python script (1 thread)   wall ${range(w('script'))}   CPU ${range(c('script'))}`);
  console.log(`  tifffile read only         wall ${range(w('scriptRead'))}   CPU ${range(c('scriptRead'))}`);
  console.log(`  eggline, one process       wall ${range(w('pipeline1'))}   CPU ${range(c('pipeline1'))}`);
  console.log(`  read floor (bytes + zlib)  wall ${range(w('floor'))}   CPU ${range(c('floor'))}`);
  const wallRatio = rows.eggline.map((x, i) => x.wallS / rows.script[i].wallS);
  // CPU per embryo from the one-process run: GNU time does not see the batch's worker processes once the batch has
  // ended them, so the batch's own CPU figure above counts only its main process.
  const cpuRatio = rows.pipeline1.map((x, i) => x.cpuS / rows.script[i].cpuS);
  const floorRatio = rows.pipeline1.map((x, i) => x.wallS / rows.floor[i].wallS);
  const memRatio = Math.max(...rows.eggline.map((x) => x.maxRssKiB * 1024)) / rawBytesLargest;
  const mark = (ok: boolean) => (ok ? 'met' : 'NOT met');
  console.log(`  aims: batch wall ÷ script wall ${range(wallRatio)} (≤ 0.5: ${mark(med(wallRatio) <= 0.5)}); CPU per embryo ÷ script's ${range(cpuRatio)} (≤ 0.7: ${mark(med(cpuRatio) <= 0.7)})`);
  console.log(`        per-embryo pipeline ÷ read floor ${range(floorRatio)} (≤ 1.5: ${mark(med(floorRatio) <= 1.5)}); peak RSS of a process ÷ largest raw stack ${memRatio.toFixed(2)} (≤ 2: ${mark(memRatio <= 2)})`);
  console.log(`        (CPU s per embryo: eggline ${(med(c('pipeline1')) / n).toFixed(3)}, script ${(med(c('script')) / n).toFixed(3)}; the whole-process RSS includes Node itself, ~50 MiB)`);
}

async function main(): Promise<void> {
  const args = process.argv.slice(2);
  if (args[0] === '--child') {
    const [, kind, ...rest] = args;
    if (kind === 'floor') await childFloor(rest);
    else if (kind === 'pipeline') await childPipeline(rest);
    else await childDesktop(rest[0]);
    return;
  }
  const keep = args.includes('--dir') ? args[args.indexOf('--dir') + 1] : undefined;
  const rounds = args.includes('--rounds') ? Number(args[args.indexOf('--rounds') + 1]) : 2;
  const only = args.includes('--only') ? args[args.indexOf('--only') + 1] : 'all';
  const dir = keep ?? mkdtempSync(join(tmpdir(), 'eggline-bench-script-'));
  const hasPython = spawnSync(PYTHON, ['-c', 'import numpy, scipy, skimage, tifffile'], { encoding: 'utf8' }).status === 0;
  console.log(`Eggline against a scripted Python pipeline — Node ${process.versions.node}; load average ${readFileSync('/proc/loadavg', 'utf8').split(' ').slice(0, 3).join(' ')}`);
  if (only === 'all' || only === 'sets') {
    if (!hasPython) console.log('(no /usr/bin/python3 with numpy, scipy, scikit-image and tifffile: the side-by-side is skipped)');
    else {
      process.stderr.write('bench: writing the demo stacks…\n');
      const micro = writeSet(join(dir, 'microscope'), MICROSCOPE);
      const largest = Math.max(...MICROSCOPE.map((s) => s.sizePx * s.sizePx * s.sizeZ * s.sizeC * 2));
      compareSet('Microscope-shaped set (3 ch × 5–9 z, 570–820 px, uint16, none and Deflate)', join(dir, 'microscope'), micro, largest, rounds);
      const large = writeSet(join(dir, 'large'), LARGE);
      compareSet('Large set (2 ch × 24 z, 1024², uint16, none and Deflate)', join(dir, 'large'), large, 1024 * 1024 * 48 * 2, rounds);
    }
  }
  if (only === 'all' || only === 'desktop') {
    const path = writeSet(join(dir, 'desktop'), [LARGE[0]])[0];
    const runs = JSON.parse(execFileSync(process.execPath, [self, '--child', 'desktop', path], { encoding: 'utf8' }).trim().split('\n').pop()!) as { sliceS: number; pictureS: number; lambdaS: number }[];
    const later = runs.slice(1);
    console.log(`\nDesktop, 1024² × 2 ch × 24 z Deflate stack (first of 4 opens, then the median of the other 3):`);
    const aim = (label: string, first: number, then: number, limit: number) =>
      console.log(`  ${label.padEnd(44)} ${first.toFixed(2)} s, then ${then.toFixed(2)} s; ÷ aim ${(then / limit).toFixed(2)} (≤ ${limit} s: ${then <= limit ? 'met' : 'NOT met'})`);
    aim('first picture (preview slice)', runs[0].sliceS, med(later.map((r) => r.sliceS)), 0.3);
    console.log(`  ${'projection and embryo outline'.padEnd(44)} ${runs[0].pictureS.toFixed(2)} s, then ${med(later.map((r) => r.pictureS)).toFixed(2)} s`);
    aim('axis with λ (+ sampling, profile, fit)', runs[0].lambdaS, med(later.map((r) => r.lambdaS)), 1);
    console.log('  (times from the click, in one process; the window adds IPC and drawing, not measured here)');
  }
  if (only === 'all' || only === 'planes') {
    const folder = join(dir, 'many-planes');
    mkdirSync(folder, { recursive: true });
    process.stderr.write('bench: writing the 65,535-plane file…\n');
    writeManyPlanes(join(folder, 'planes-65535.tif'));
    const out = join(dir, 'out-many');
    rmSync(out, { recursive: true, force: true });
    const r = timed(process.execPath, [cli, 'batch', folder, '--out', out, '--jobs', '1']);
    const status = readFileSync(join(out, 'embryos.csv'), 'utf8').split('\n')[1]?.split(',')[1] ?? '?';
    console.log(`\n65,535 planes of 64×64 (Deflate, one file): eggline batch ${r.wallS.toFixed(1)} s wall, ${r.cpuS.toFixed(1)} s CPU, status ${status}; ÷ aim ${(r.wallS / 10).toFixed(2)} (< 10 s: ${r.wallS < 10 ? 'met' : 'NOT met'})`);
  }
  if (!keep) rmSync(dir, { recursive: true, force: true });
}

await main();

// OME-Zarr benchmark (part of `npm run bench`): the same synthetic stack (demo data) as an uncompressed OME-TIFF
// and as an OME-Zarr with Blosc-LZ4 chunks of one plane; per-embryo cost of decoding alone and of the whole pipeline,
// warm, alternating the two files in one process so drifts of a shared machine hit both alike. Prints, never asserts.
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ARENA_LIMIT, BATCH_V8_FLAGS } from '../app/batch/worker-tuning';
import { makeSyntheticEmbryo } from '../core/synth';
import { writeOmeTiff } from '../core/tiff';
import { writeV3Store } from '../scripts/make-zarr-v3-fixtures';
import { decodeOnce, pipelineOnce } from './measure-file';

const SIZE = { widthPx: 1024, heightPx: 1024, sizeZ: 24, sizeC: 2 };
const RAW_BYTES = SIZE.widthPx * SIZE.heightPx * SIZE.sizeZ * SIZE.sizeC * 2;
/** Rounds of (TIFF, Zarr); the first round is left out (the analysis is still being compiled). */
const ROUNDS = 5;
const self = fileURLToPath(import.meta.url);

/**
 * Writes the stack as an uncompressed OME-TIFF and as a Blosc-LZ4 OME-Zarr: with Python's zarr (Zarr v2, type size 2,
 * byte shuffle, as microscope pipelines write) when /usr/bin/python3 has it, else with zarrita (Zarr v3; numcodecs'
 * WebAssembly Blosc writes type size 1). Returns both paths and which writer made the store.
 */
async function generate(dir: string): Promise<{ tiff: string; zarr: string; writer: string }> {
  process.stderr.write(`zarr bench: generating a ${SIZE.widthPx}×${SIZE.heightPx}×${SIZE.sizeZ}×${SIZE.sizeC} uint16 synthetic stack…\n`);
  const e = makeSyntheticEmbryo({ widthPx: SIZE.widthPx, heightPx: SIZE.heightPx, sizeZ: SIZE.sizeZ, pixelSizeUm: 0.6, zStepUm: 2 }, 4242);
  const tiff = join(dir, 'stack.ome.tif');
  writeFileSync(tiff, writeOmeTiff(e.stack.planes.map((data) => ({ width: SIZE.widthPx, height: SIZE.heightPx, data })), {
    sizeZ: SIZE.sizeZ, sizeC: SIZE.sizeC, sizeT: 1, dimensionOrder: 'XYZCT', channelNames: e.channelNames, physicalSizeXUm: e.pixelSizeUm, compression: 'none',
  }));
  const script = fileURLToPath(new URL('../scripts/make-zarr-fixtures.py', import.meta.url));
  const py = spawnSync('/usr/bin/python3', [script, tiff, dir, 'blosc-lz4', '--pixel-size-um', String(e.pixelSizeUm), '--z-step-um', '2',
    '--channels', e.channelNames.join(',')], { encoding: 'utf8' });
  if (py.status === 0) return { tiff, zarr: join(dir, 'blosc-lz4.ome.zarr'), writer: "Python's zarr 2 (Zarr v2, type size 2, byte shuffle)" };
  process.stderr.write(`zarr bench: /usr/bin/python3 cannot write the store (${(py.stderr || '').trim().split('\n').pop()}); zarrita writes it\n`);
  const zarr = await writeV3Store({
    sizeX: SIZE.widthPx, sizeY: SIZE.heightPx, sizeZ: SIZE.sizeZ, sizeC: SIZE.sizeC, planes: e.stack.planes as Uint16Array[],
    pixelSizeUm: e.pixelSizeUm, zStepUm: 2, channels: e.channelNames,
  }, dir, 'v3-blosc-lz4');
  return { tiff, zarr, writer: 'zarrita (Zarr v3, type size 1)' };
}

const median = (v: number[]): number => [...v].sort((a, b) => a - b)[v.length >> 1];

/** One timed run: wall and CPU milliseconds (CPU of the whole process, all threads). */
async function timed(run: (path: string) => Promise<number>, path: string): Promise<[number, number]> {
  const cpu0 = process.cpuUsage();
  const wall = await run(path);
  const cpu = process.cpuUsage(cpu0);
  return [wall, (cpu.user + cpu.system) / 1000];
}

/**
 * Child: `kind` on (tiff, zarr) alternately for ROUNDS rounds; medians of the warm rounds' wall and CPU time, and
 * the peak RSS rise. CPU time is the steadier figure when other work shares the cores.
 */
async function child(kind: string, tiff: string, zarr: string): Promise<Record<string, number>> {
  const base = process.memoryUsage().rss;
  const run = kind === 'decode' ? decodeOnce : pipelineOnce;
  const t: [number, number][] = [];
  const z: [number, number][] = [];
  for (let i = 0; i < ROUNDS; i++) {
    // Alternate which goes first, so neither always follows the other's garbage.
    if (i % 2 === 0) { t.push(await timed(run, tiff)); z.push(await timed(run, zarr)); } else { z.push(await timed(run, zarr)); t.push(await timed(run, tiff)); }
  }
  const warm = (v: [number, number][], k: 0 | 1) => median(v.slice(1).map((x) => x[k]));
  return { tiff: warm(t, 0), zarr: warm(z, 0), tiffCpu: warm(t, 1), zarrCpu: warm(z, 1), peakExtra: process.resourceUsage().maxRSS * 1024 - base };
}

/** Runs a child the way `eggline batch` runs (same V8 flags and malloc arena cap). */
function runChild(args: string[]): Record<string, number> {
  const out = execFileSync(process.execPath, [...BATCH_V8_FLAGS, self, '--child', ...args], {
    encoding: 'utf8', stdio: ['ignore', 'pipe', 'inherit'], env: { ...process.env, MALLOC_ARENA_MAX: process.env.MALLOC_ARENA_MAX ?? ARENA_LIMIT },
  });
  return JSON.parse(out.trim().split('\n').pop() ?? '{}') as Record<string, number>;
}

async function main(): Promise<void> {
  const args = process.argv.slice(2);
  if (args[0] === '--child') {
    process.stdout.write(`${JSON.stringify(await child(args[1], args[2], args[3]))}\n`);
    return;
  }
  const dir = mkdtempSync(join(tmpdir(), 'eggline-zarr-bench-'));
  try {
    const { tiff, zarr, writer } = await generate(dir);
    console.log(`\nOME-Zarr against OME-TIFF — the same ${SIZE.sizeC} ch × ${SIZE.sizeZ} z × ${SIZE.widthPx}×${SIZE.heightPx} uint16 stack (${(RAW_BYTES / 2 ** 20).toFixed(0)} MiB raw);`);
    console.log(`uncompressed OME-TIFF against Blosc-LZ4 OME-Zarr (one chunk per plane, written by ${writer}); warm medians of ${ROUNDS - 1} alternating runs\n`);
    console.log(`${''.padEnd(18)}${'wall time'.padStart(34)}${'CPU time'.padStart(34)}`);
    console.log(`${'measure'.padEnd(18)}${['OME-TIFF s', 'OME-Zarr s', 'Zarr÷TIFF', 'OME-TIFF s', 'OME-Zarr s', 'Zarr÷TIFF'].map((h) => h.padStart(11)).join('')}${'peak MiB'.padStart(10)}`);
    const rows: [string, Record<string, number>][] = [['decode only', runChild(['decode', tiff, zarr])], ['whole pipeline', runChild(['pipeline', tiff, zarr])]];
    const s = (ms: number) => (ms / 1000).toFixed(3).padStart(11);
    for (const [name, r] of rows) {
      console.log(`${name.padEnd(18)}${s(r.tiff)}${s(r.zarr)}${(r.zarr / r.tiff).toFixed(2).padStart(11)}${s(r.tiffCpu)}${s(r.zarrCpu)}${(r.zarrCpu / r.tiffCpu).toFixed(2).padStart(11)}${(r.peakExtra / 2 ** 20).toFixed(0).padStart(10)}`);
    }
    const p = rows[1][1];
    const verdict = (x: number) => `${x.toFixed(2)}× — ${x <= 1.2 ? 'met' : 'NOT met'}`;
    console.log(`\naim: per-embryo pipeline on Blosc-LZ4 OME-Zarr ≤ 1.2× uncompressed OME-TIFF: wall ${verdict(p.zarr / p.tiff)}; CPU ${verdict(p.zarrCpu / p.tiffCpu)}`);
    console.log('(the machine is shared, so single figures vary by tens of percent; the ratio of alternating runs varies less;\n peak MiB is the rise of the process\'s peak RSS over both files)');
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

await main();

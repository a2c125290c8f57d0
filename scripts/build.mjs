// Build everything into dist/: the CLI, workers and Electron processes with esbuild, the renderer with Vite.
// Entries that do not exist yet are skipped so the tree builds at every stage of development.
import { build } from 'esbuild';
import { existsSync, readdirSync, rmSync } from 'node:fs';
import { build as viteBuild } from 'vite';
import { bundledExceptNative, externalExceptBundled, externalExceptEsmOnly } from './bundle-externals.mjs';

const nodeEntries = [
  { in: 'app/cli/main.ts', out: 'cli' },
  { in: 'app/workers/analysis-worker.ts', out: 'analysis-worker' },
  { in: 'app/workers/zarr-chunk-worker.ts', out: 'zarr-chunk-worker' },
  { in: 'bench/bench.ts', out: 'bench' },
  { in: 'bench/zarr-bench.ts', out: 'zarr-bench' },
].filter((e) => existsSync(e.in));

const common = { bundle: true, platform: 'node', target: 'node20', sourcemap: true, logLevel: 'warning' };

if (nodeEntries.length > 0) {
  // Code split: what an entry imports dynamically (each command of the CLI, the cohort step, …) is a chunk of its
  // own (dist/chunk-*.mjs, beside the entries so import.meta.url-relative paths still hold), loaded only when used.
  // Chunks of earlier builds are removed first (their names carry a hash of their content).
  for (const f of existsSync('dist') ? readdirSync('dist') : []) if (/^chunk-.*\.mjs(\.map)?$/.test(f)) rmSync(`dist/${f}`);
  await build({
    ...common,
    entryPoints: nodeEntries,
    outdir: 'dist',
    format: 'esm',
    splitting: true,
    chunkNames: 'chunk-[hash]',
    outExtension: { '.js': '.mjs' },
    plugins: [externalExceptBundled],
    banner: { js: "import { createRequire as __cr } from 'node:module'; const require = __cr(import.meta.url);" },
  });
}

// The batch worker is one file of its own (no shared chunks) with its packages inside (bundledExceptNative): each
// worker process loads only the code it uses, in one read and one parse. Modules it imports dynamically (the demo
// writer, OME-Zarr) are in the same file and run only when first imported. The scripted-pipeline bench runs "one batch
// worker's work" in a child process, so it is bundled the same way and starts as a worker does.
const selfContained = [
  { in: 'app/workers/batch-worker.ts', out: 'batch-worker' },
  { in: 'bench/vs-script.ts', out: 'bench-script' },
].filter((e) => existsSync(e.in));
if (selfContained.length > 0) {
  await build({
    ...common,
    entryPoints: selfContained,
    outdir: 'dist',
    format: 'esm',
    outExtension: { '.js': '.mjs' },
    plugins: [bundledExceptNative],
    banner: { js: "import { createRequire as __cr } from 'node:module'; const require = __cr(import.meta.url);" },
  });
}

const electronEntries = [
  { in: 'app/main/main.ts', out: 'main' },
  { in: 'app/preload/preload.ts', out: 'preload' },
].filter((e) => existsSync(e.in));

if (electronEntries.length > 0) {
  await build({
    ...common,
    entryPoints: electronEntries,
    outdir: 'dist',
    format: 'cjs',
    outExtension: { '.js': '.cjs' },
    // electron and sharp are external like every other package; the ESM-only ones are bundled.
    plugins: [externalExceptEsmOnly],
  });
}

if (existsSync('renderer/index.html')) {
  await viteBuild({ configFile: 'renderer/vite.config.ts', logLevel: 'warn' });
}
console.log('build: done');

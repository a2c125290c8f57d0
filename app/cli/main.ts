// Entry of the `eggline` command line (built to dist/cli.mjs, next to dist/batch-worker.mjs).
import { fileURLToPath } from 'node:url';
import { needsBatchTuning, runTunedBatch } from './batch-tuning';
import { runCli } from './run-cli';

const args = process.argv.slice(2);
const self = fileURLToPath(import.meta.url);
const workerPath = fileURLToPath(new URL('./batch-worker.mjs', import.meta.url));
process.exitCode = needsBatchTuning(args[0], process.platform, process.env)
  ? await runTunedBatch([self, ...args], process.env)
  : await runCli(args, { stdout: process.stdout, stderr: process.stderr }, { workerPath, cliPath: self });

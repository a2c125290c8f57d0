// Entry of the `eggline` command line (built to dist/cli.mjs, next to dist/batch-worker.mjs).
import { fileURLToPath } from 'node:url';
import { needsArenaLimit, runWithArenaLimit } from './arena-limit';
import { runCli } from './run-cli';

const args = process.argv.slice(2);
const self = fileURLToPath(import.meta.url);
const workerPath = fileURLToPath(new URL('./batch-worker.mjs', import.meta.url));
process.exitCode = needsArenaLimit(args[0], process.platform, process.env)
  ? await runWithArenaLimit([self, ...args], process.env)
  : await runCli(args, { stdout: process.stdout, stderr: process.stderr }, { workerPath });

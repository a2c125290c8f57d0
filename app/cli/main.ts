// Entry of the `eggline` command line (built to dist/cli.mjs, next to dist/batch-worker.mjs).
import { fileURLToPath } from 'node:url';
import { runCli } from './run-cli';

const workerPath = fileURLToPath(new URL('./batch-worker.mjs', import.meta.url));
process.exitCode = await runCli(process.argv.slice(2), { stdout: process.stdout, stderr: process.stderr }, { workerPath });

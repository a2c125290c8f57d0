// Entry of the `eggline` command line (built to dist/cli.mjs, next to dist/batch-worker.mjs). It loads only what the
// command asks for: every command's code is imported when that command runs (a separate chunk of the build).
import { fileURLToPath } from 'node:url';
import { mark, markProcessStart } from '../batch/timeline';

markProcessStart();
mark('command line loaded');
const args = process.argv.slice(2);
const self = fileURLToPath(import.meta.url);
const workerPath = fileURLToPath(new URL('./batch-worker.mjs', import.meta.url));
const { runCli } = await import('./run-cli');
process.exitCode = await runCli(args, { stdout: process.stdout, stderr: process.stderr }, { workerPath, cliPath: self });
mark('command line done');

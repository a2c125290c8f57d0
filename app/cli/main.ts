// Entry of the `eggline` command line (built to dist/cli.mjs).
import { runCli } from './run-cli';

process.exitCode = await runCli(process.argv.slice(2), { stdout: process.stdout, stderr: process.stderr });

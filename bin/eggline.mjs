#!/usr/bin/env node
// Command-line entry: runs the bundled CLI built by `npm run build`.
import { existsSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';

const cli = fileURLToPath(new URL('../dist/cli.mjs', import.meta.url));
if (!existsSync(cli)) {
  process.stderr.write('eggline: the command line is not built yet; run `npm run build` first.\n');
  process.exit(2);
}
await import(pathToFileURL(cli).href);

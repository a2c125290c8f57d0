// `eggline demo <dir>`: write the synthetic demo data set and say what to try next.
import { join } from 'node:path';
import { writeDemoDataSet } from '../batch/write-demo';
import { DEMO_HELP } from './help';
import { parseCommandArgs } from './parse-command-args';
import { UsageError, type CliIo } from './usage-error';

/** Run `eggline demo`; exit code 0, or 2 for usage errors. */
export async function demoCommand(argv: readonly string[], io: CliIo, workerPath?: string): Promise<number> {
  const { values, positionals } = parseCommandArgs(argv, { count: { type: 'string' }, help: { type: 'boolean', short: 'h' } } as const, 'demo');
  if (values.help) { io.stdout.write(DEMO_HELP); return 0; }
  if (positionals.length !== 1) throw new UsageError(positionals.length === 0 ? 'missing the folder to write the demo data to' : 'demo takes one folder', 'demo');
  let count: number | undefined;
  if (values.count !== undefined) {
    count = Number(values.count);
    if (!/^\d+$/.test(values.count) || count < 1) throw new UsageError(`--count must be a whole number ≥ 1 (got "${values.count}")`, 'demo');
  }
  const dir = positionals[0];
  io.stderr.write(`eggline: writing synthetic demo data to ${dir} …\n`);
  const result = await writeDemoDataSet(dir, { ...(count === undefined ? {} : { subset: count }), ...(workerPath ? { workerPath } : {}) });
  const out = join(dir, '..', `${dir.replace(/[\\/]+$/, '').split(/[\\/]/).pop() ?? 'demo'}-results`);
  const samples = join(dir, 'samples.csv');
  io.stdout.write(`Wrote ${result.files.length} synthetic stacks, ${samples} and ${join(dir, 'eggline-project.json')}.\n`);
  // The project file in the folder sets the boundary channel and holds the furrow landmarks, so no flags are needed.
  io.stdout.write(`Next, try:\n  eggline batch ${dir} --out ${out} --samples ${samples}\n`);
  if (count === undefined) io.stdout.write(`The movie in ${join(dir, 'timelapse')} is analysed over time by the same command (see timelapse.html in the results).\n`);
  return 0;
}

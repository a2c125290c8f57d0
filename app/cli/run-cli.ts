// The `eggline` command dispatcher: picks the command, maps usage errors to exit code 2 with a hint to --help.
import { BatchOptionError } from '../../core/batch';
import { EGGLINE_VERSION } from '../batch/versions';
import { batchCommand } from './batch-command';
import { cohortCommand } from './cohort-command';
import { demoCommand } from './demo-command';
import { MAIN_HELP } from './help';
import { inspectCommand } from './inspect-command';
import { mergeCommand } from './merge-command';
import { UsageError, type CliIo } from './usage-error';

/** Where the entry point found things it alone can locate (the built worker next to the bundle). */
export interface CliEnv {
  readonly workerPath?: string;
  /** The running CLI script (dist/cli.mjs), written by absolute path into Slurm scripts. */
  readonly cliPath?: string;
}

/** Run the command line; resolves with the exit code (0 ok, 1 some files failed, 2 usage error). */
export async function runCli(argv: readonly string[], io: CliIo, env: CliEnv = {}): Promise<number> {
  const COMMANDS: Record<string, (argv: readonly string[], io: CliIo) => Promise<number>> = {
    batch: (a, o) => batchCommand(a, o, env.workerPath ? { workerPath: env.workerPath } : {}, env.cliPath),
    cohort: (a, o) => cohortCommand([...a], o), inspect: inspectCommand, merge: mergeCommand, demo: (a, o) => demoCommand(a, o, env.workerPath),
  };
  const [first, ...rest] = argv;
  if (first === undefined || first === '--help' || first === '-h' || first === 'help') {
    io[first === undefined ? 'stderr' : 'stdout'].write(MAIN_HELP);
    return first === undefined ? 2 : 0;
  }
  if (first === '--version' || first === '-v') { io.stdout.write(`eggline ${EGGLINE_VERSION}\n`); return 0; }
  const command = COMMANDS[first];
  try {
    if (!command) throw new UsageError(first.startsWith('-') ? `unknown option ${first}` : `unknown command "${first}"`);
    return await command(rest, io);
  } catch (e) {
    if (e instanceof UsageError || e instanceof BatchOptionError) {
      const cmd = e instanceof UsageError ? e.command : first;
      io.stderr.write(`eggline${cmd ? ` ${cmd}` : ''}: ${e.message} (see "eggline ${cmd ? `${cmd} ` : ''}--help")\n`);
      return 2;
    }
    io.stderr.write(`eggline: ${(e as Error).message?.split(/\r?\n/)[0] ?? String(e)}\n`);
    return 1;
  }
}

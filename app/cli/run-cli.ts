// The `eggline` command dispatcher: picks the command, maps usage errors to exit code 2 with a hint to --help.
import { BatchOptionError } from '../../core/batch';
import { EGGLINE_VERSION } from '../batch/versions';
import { workerTuning } from '../batch/worker-tuning';
import { MAIN_HELP } from './help';
import { UsageError, type CliIo } from './usage-error';

/** Where the entry point found things it alone can locate (the built worker next to the bundle). */
export interface CliEnv {
  readonly workerPath?: string;
  /** The running CLI script (dist/cli.mjs), written by absolute path into Slurm scripts. */
  readonly cliPath?: string;
}

/** What the batch command gets from the entry point: the built worker, started tuned for batches (worker-tuning). */
function batchExtra(env: CliEnv): { workerPath?: string; workerExecArgv: readonly string[]; workerEnv: Readonly<Record<string, string>> } {
  const tuning = workerTuning(process.platform, process.env);
  return { ...(env.workerPath ? { workerPath: env.workerPath } : {}), workerExecArgv: tuning.execArgv, workerEnv: tuning.env };
}

/** Run the command line; resolves with the exit code (0 ok, 1 some files failed, 2 usage error). */
export async function runCli(argv: readonly string[], io: CliIo, env: CliEnv = {}): Promise<number> {
  // Each command's module is loaded when it runs: `eggline batch` never loads the cohort report's figures or sharp.
  const COMMANDS: Record<string, (argv: readonly string[], io: CliIo) => Promise<number>> = {
    batch: async (a, o) => (await import('./batch-command')).batchCommand(a, o, batchExtra(env), env.cliPath),
    cohort: async (a, o) => (await import('./cohort-command')).cohortCommand([...a], o),
    inspect: async (a, o) => (await import('./inspect-command')).inspectCommand(a, o),
    merge: async (a, o) => (await import('./merge-command')).mergeCommand(a, o),
    demo: async (a, o) => (await import('./demo-command')).demoCommand(a, o, env.workerPath),
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

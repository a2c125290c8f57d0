// The `eggline` command dispatcher: picks the command, maps usage errors to exit code 2 with a hint to --help.
import { BatchOptionError } from '../../core/batch';
import { EGGLINE_VERSION } from '../batch/versions';
import { batchCommand } from './batch-command';
import { runCohortCommand } from './cohort-entry';
import { demoCommand } from './demo-command';
import { MAIN_HELP } from './help';
import { inspectCommand } from './inspect-command';
import { UsageError, type CliIo } from './usage-error';

const COMMANDS: Record<string, (argv: readonly string[], io: CliIo) => Promise<number>> = {
  batch: batchCommand, cohort: runCohortCommand, inspect: inspectCommand, demo: demoCommand,
};

/** Run the command line; resolves with the exit code (0 ok, 1 some files failed, 2 usage error). */
export async function runCli(argv: readonly string[], io: CliIo): Promise<number> {
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

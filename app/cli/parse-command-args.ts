// Thin wrapper over node:util parseArgs that turns its errors into one-line usage errors.
import { parseArgs, type ParseArgsConfig } from 'node:util';
import { UsageError } from './usage-error';

type Options = NonNullable<ParseArgsConfig['options']>;

/** Parse argv strictly for `command`; unknown flags and missing values become UsageError. */
export function parseCommandArgs<T extends Options>(argv: readonly string[], options: T, command: string) {
  try {
    return parseArgs({ args: [...argv], options, allowPositionals: true, strict: true });
  } catch (e) {
    const err = e as Error & { code?: string };
    const text = err.message.split(/\r?\n/)[0];
    const flag = /'(-[^']*)'/.exec(text)?.[1];
    if (err.code === 'ERR_PARSE_ARGS_UNKNOWN_OPTION' && flag) throw new UsageError(`unknown option ${flag.split(' ')[0]}`, command);
    if (err.code === 'ERR_PARSE_ARGS_INVALID_OPTION_VALUE' && flag) {
      throw new UsageError(text.includes('argument missing') ? `option ${flag.split(' ')[0]} needs a value` : `option ${flag.split(' ')[0]} takes no value`, command);
    }
    throw new UsageError(text.replace(/\.$/, ''), command);
  }
}

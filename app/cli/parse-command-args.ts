// Thin wrapper over node:util parseArgs that turns its errors into one-line usage errors.
import { parseArgs, type ParseArgsConfig } from 'node:util';
import { UsageError } from './usage-error';

type Options = NonNullable<ParseArgsConfig['options']>;

/**
 * `--flag -3` → `--flag=-3` for a flag that takes a value when the next word is a negative number: parseArgs would
 * read "-3" as an option and give its own message, where the flag's rule ("must be a positive number …") is the
 * useful one. Words after `--` are left alone.
 */
export function joinNegativeValues(argv: readonly string[], options: Options): string[] {
  const out: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const word = argv[i];
    if (word === '--') { out.push(...argv.slice(i)); break; }
    const next = argv[i + 1];
    const takesValue = word.startsWith('--') && !word.includes('=') && options[word.slice(2)]?.type === 'string';
    if (takesValue && next !== undefined && /^-(\d|\.\d)/.test(next)) { out.push(`${word}=${next}`); i++; } else out.push(word);
  }
  return out;
}

/** Parse argv strictly for `command`; unknown flags and missing values become UsageError. */
export function parseCommandArgs<T extends Options>(argv: readonly string[], options: T, command: string) {
  try {
    return parseArgs({ args: joinNegativeValues(argv, options), options, allowPositionals: true, strict: true });
  } catch (e) {
    const err = e as Error & { code?: string };
    const text = err.message.split(/\r?\n/)[0];
    const flag = /'(-[^']*)'/.exec(text)?.[1];
    if (err.code === 'ERR_PARSE_ARGS_UNKNOWN_OPTION' && flag) throw new UsageError(`unknown option ${flag.split(' ')[0]}`, command);
    if (err.code === 'ERR_PARSE_ARGS_INVALID_OPTION_VALUE' && flag) {
      const name = flag.split(' ')[0];
      if (text.includes('ambiguous')) throw new UsageError(`option ${name} needs a value; write ${name}=VALUE for a value that starts with "-"`, command);
      throw new UsageError(text.includes('argument missing') ? `option ${name} needs a value` : `option ${name} takes no value`, command);
    }
    throw new UsageError(text.replace(/\.$/, ''), command);
  }
}

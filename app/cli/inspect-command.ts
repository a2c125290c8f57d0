// `eggline inspect <file>`: what a TIFF / OME-TIFF holds, from its tags only, or an OME-Zarr folder, from its metadata
// (no pixels decoded).
import { basename } from 'node:path';
import { describeStack, readStackInfo, stackFacts } from '../../core/tiff';
import { describeZarr } from '../../core/zarr';
import { openByteSource } from '../batch/deps';
import { isZarrPath, openZarrStack } from '../decode';
import { INSPECT_HELP } from './help';
import { parseCommandArgs } from './parse-command-args';
import { UsageError, type CliIo } from './usage-error';

/** Run `eggline inspect`; exit code 0, 1 when the file cannot be read, 2 for usage errors. */
export async function inspectCommand(argv: readonly string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseCommandArgs(argv, { help: { type: 'boolean', short: 'h' }, json: { type: 'boolean' } } as const, 'inspect');
  if (values.help) { io.stdout.write(INSPECT_HELP); return 0; }
  if (positionals.length !== 1) throw new UsageError(positionals.length === 0 ? 'missing the file to inspect' : 'inspect takes one file', 'inspect');
  const path = positionals[0];
  const label = basename(path);
  let source: Awaited<ReturnType<typeof openByteSource>> | null = null;
  try {
    if (await isZarrPath(path)) {
      const opened = await openZarrStack(path, label);
      await opened.source.close();
      if (values.json) io.stdout.write(`${JSON.stringify({ file: path, ...stackFacts(opened.info, 'OME-Zarr'), zarr: opened.details }, null, 2)}\n`);
      else io.stdout.write(`file: ${path}\n${describeZarr(opened.info, opened.details).join('\n')}\n`);
      return 0;
    }
    source = await openByteSource(path, label);
    const info = await readStackInfo(source, label);
    if (values.json) io.stdout.write(`${JSON.stringify({ file: path, ...stackFacts(info) }, null, 2)}\n`);
    else io.stdout.write(`file: ${path}\n${describeStack(info).join('\n')}\n`);
    return 0;
  } catch (e) {
    const err = e as NodeJS.ErrnoException;
    const text = err.code === 'ENOENT' ? `${label}: file not found` : err.code === 'EISDIR' ? `${label}: is a folder, not a file`
      : err.message.split(/\r?\n/)[0];
    io.stderr.write(`eggline inspect: ${text.startsWith(label) ? text : `${label}: ${text}`}\n`);
    return 1;
  } finally {
    await source?.close().catch(() => undefined);
  }
}

// Batch progress on the terminal: a bar redrawn in place on a TTY, plain lines otherwise (logs, CI, pipes).
import type { BatchProgress } from '../../core/contract';
import type { CliIo } from './usage-error';

/** A text bar such as "[#####-----] 5/10" for `done` of `total`, `widthChars` cells wide. */
export function progressBar(done: number, total: number, widthChars: number): string {
  const filled = total > 0 ? Math.round((done / total) * widthChars) : widthChars;
  return `[${'#'.repeat(filled)}${'-'.repeat(widthChars - filled)}] ${done}/${total}`;
}

/** Shorten text to at most `maxChars`, keeping its end (file names differ at the end). */
export function fitText(text: string, maxChars: number): string {
  return text.length <= maxChars ? text : `…${text.slice(text.length - Math.max(0, maxChars - 1))}`;
}

/** A progress listener writing to stderr; call `end()` to clear the bar. */
export function progressPrinter(io: CliIo): { onProgress: (p: BatchProgress) => void; end: () => void } {
  const tty = io.stderr.isTTY === true;
  let shown = false;
  const clear = (): void => { if (shown) io.stderr.write('\r\x1b[2K'); shown = false; };
  const onProgress = (p: BatchProgress): void => {
    if (p.status === 'ok' || p.status === 'error') {
      if (tty) clear();
      if (!tty || p.status === 'error') io.stderr.write(`[${p.done}/${p.total}] ${p.status === 'ok' ? 'ok   ' : 'error'} ${p.status === 'error' ? p.message ?? p.file : p.file}\n`);
    }
    if (tty && (p.status === 'running' || p.status === 'ok' || p.status === 'error')) {
      const bar = progressBar(p.done, p.total, 24);
      const width = Math.max(40, (io.stderr.columns ?? 80) - 1);
      io.stderr.write(`\r\x1b[2K${fitText(`${bar} ${p.file ?? ''}`, width)}`);
      shown = true;
    }
  };
  return { onProgress, end: clear };
}

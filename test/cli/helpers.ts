// Helpers for the end-to-end command-line tests: build once, run `node dist/cli.mjs`, craft bad files.
import { execFile, execFileSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

/** Repository root (tests run with it as the working folder). */
export const ROOT = resolve(fileURLToPath(new URL('.', import.meta.url)), '..', '..');
const CLI = join(ROOT, 'dist', 'cli.mjs');

/** Build dist/cli.mjs and the worker if missing (run `npm run build` first to test the current code). */
export function ensureBuilt(): void {
  if (!existsSync(CLI) || !existsSync(join(ROOT, 'dist', 'batch-worker.mjs'))) {
    execFileSync(process.execPath, ['scripts/build.mjs'], { cwd: ROOT, stdio: 'ignore' });
  }
}

/** Run the built CLI; never rejects. */
export function cli(args: readonly string[], cwd = ROOT): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((done) => {
    execFile(process.execPath, [CLI, ...args], { cwd, timeout: 120_000, maxBuffer: 16 << 20 }, (err, stdout, stderr) => {
      const code = err ? (typeof (err as { code?: unknown }).code === 'number' ? (err as { code: number }).code : -1) : 0;
      done({ code, stdout, stderr });
    });
  });
}

/** Every file below `dir` with its size and mtime, sorted: compared before/after to prove nothing was written. */
export function listing(dir: string): string[] {
  return (readdirSync(dir, { recursive: true }) as string[]).sort().map((f) => {
    const s = statSync(join(dir, f));
    return `${f} ${s.size} ${s.mtimeMs}`;
  });
}

/** A classic little-endian TIFF with one uint16 plane; `ifdLoop` points the IFD's next offset back at itself. */
export function tinyTiff(opts: { widthPx: number; heightPx: number; ifdLoop?: boolean }): Uint8Array {
  // Source: TIFF 6.0 §2 (header, IFD of 12-byte entries, next-IFD offset) and §8 (baseline grey image tags)
  const entries: [tag: number, type: number, value: number][] = [
    [256, 4, opts.widthPx], [257, 4, opts.heightPx], [258, 3, 16], [259, 3, 1], [262, 3, 1],
    [273, 4, 0], [277, 3, 1], [278, 4, opts.heightPx], [279, 4, 0],
  ];
  const ifdOffset = 8;
  const ifdBytes = 2 + entries.length * 12 + 4;
  const dataOffset = ifdOffset + ifdBytes;
  const small = opts.widthPx * opts.heightPx <= 64 * 64;
  const dataBytes = small ? opts.widthPx * opts.heightPx * 2 : 16;
  const buf = new DataView(new ArrayBuffer(dataOffset + dataBytes));
  buf.setUint8(0, 0x49); buf.setUint8(1, 0x49); buf.setUint16(2, 42, true); buf.setUint32(4, ifdOffset, true);
  buf.setUint16(ifdOffset, entries.length, true);
  entries.forEach(([tag, type, value], i) => {
    const at = ifdOffset + 2 + i * 12;
    const v = tag === 273 ? dataOffset : tag === 279 ? opts.widthPx * opts.heightPx * 2 : value;
    buf.setUint16(at, tag, true); buf.setUint16(at + 2, type, true); buf.setUint32(at + 4, 1, true);
    if (type === 3) buf.setUint16(at + 8, v, true); else buf.setUint32(at + 8, v, true);
  });
  buf.setUint32(ifdOffset + 2 + entries.length * 12, opts.ifdLoop ? ifdOffset : 0, true);
  return new Uint8Array(buf.buffer);
}

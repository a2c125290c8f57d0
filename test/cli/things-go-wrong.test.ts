// What the command line does with odd paths and files that are too big: each case with its exact message.
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, realpathSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { tinyTiff as craft } from '../../core/tiff/tiny-tiff';
import { cli, ensureBuilt, tinyTiff } from './helpers';

// Demo data: tiny files made here; the messages are this project's pinned wording.
const dir = realpathSync(mkdtempSync(join(tmpdir(), 'eggline-wrong-')));
const input = join(dir, 'in');
const outside = join(dir, 'elsewhere');
beforeAll(() => {
  ensureBuilt();
  mkdirSync(input);
  mkdirSync(outside);
  writeFileSync(join(input, 'a.tif'), tinyTiff({ widthPx: 8, heightPx: 8 }));
  writeFileSync(join(outside, 'far.tif'), tinyTiff({ widthPx: 8, heightPx: 8 }));
  symlinkSync(join(outside, 'far.tif'), join(input, 'link.tif'));
  symlinkSync(join(dir, 'nothing.tif'), join(input, 'broken.tif'));
  // mkfifo(1) makes a named pipe (from memory: POSIX mkfifo).
  execFileSync('mkfifo', [join(input, 'pipe.tif')]);
  // A 22000 × 22000 Deflate plane declared in a 200 kB file (TIFF 6.0 §8 tags; Compression 8 = Deflate, from memory:
  // Adobe's TIFF Technical Note on Deflate).
  const strip = new Uint8Array(200_000);
  writeFileSync(join(dir, 'big.tif'), craft([
    { tag: 256, type: 4, values: [22000] }, { tag: 257, type: 4, values: [22000] }, { tag: 258, type: 3, values: [16] },
    { tag: 259, type: 3, values: [8] }, { tag: 262, type: 3, values: [1] }, { tag: 273, type: 4, values: [300] },
    { tag: 277, type: 3, values: [1] }, { tag: 278, type: 4, values: [22000] }, { tag: 279, type: 4, values: [strip.length] },
  ], { tail: strip }));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('paths', () => {
  it('inspect refuses a FIFO named like a stack at once instead of waiting for a writer', async () => {
    const r = await cli(['inspect', join(input, 'pipe.tif')]);
    expect([r.code, r.stderr]).toEqual([1, 'eggline inspect: pipe.tif: cannot open file (is a FIFO (named pipe), not a file)\n']);
  });
  it('batch skips the FIFO and the broken link with warnings, reports the link out of the folder, and analyses it', async () => {
    const r = await cli(['batch', input, '--out', join(dir, 'out'), '--jobs', '1']);
    expect(r.stderr.split('\n').filter((l) => l.startsWith('eggline: warning:'))).toEqual([
      `eggline: warning: broken.tif: skipped, a symbolic link to nothing (${join(dir, 'nothing.tif')})`,
      `eggline: warning: link.tif: a symbolic link to ${join(outside, 'far.tif')}, outside the input folder (analysed)`,
      'eggline: warning: pipe.tif: skipped, is a FIFO (named pipe), not a file',
    ]);
    const rows = readFileSync(join(dir, 'out', 'embryos.csv'), 'utf8').trim().split('\n').slice(1).map((l) => l.split(',')[0]);
    expect(rows).toEqual(['a.tif', 'link.tif']);
  });
  it('--out inside the input folder, directly or through a symlink, is a usage error', async () => {
    const inside = await cli(['batch', input, '--out', join(input, 'results')]);
    expect([inside.code, inside.stderr]).toEqual([2,
      `eggline batch: --out must not be inside the input folder (${join(input, 'results')}; nothing is written next to the inputs) (see "eggline batch --help")\n`]);
    symlinkSync(input, join(dir, 'in-link'));
    const back = await cli(['batch', input, '--out', join(dir, 'in-link', 'r')]);
    expect([back.code, back.stderr]).toEqual([2,
      `eggline batch: --out must not be inside the input folder (${join(dir, 'in-link', 'r')}, through a symlink, is ${join(input, 'r')}; nothing is written next to the inputs) (see "eggline batch --help")\n`]);
  });
});

describe('memory budget', () => {
  it('refuses a file whose analysis would need more than --max-memory, saying how to raise it', async () => {
    const big = join(dir, 'bigin');
    mkdirSync(big);
    writeFileSync(join(big, 'big.tif'), readFileSync(join(dir, 'big.tif')));
    const r = await cli(['batch', big, '--out', join(dir, 'bigout'), '--max-memory', '1G', '--jobs', '1']);
    expect(r.code).toBe(1);
    // 22000² px × (24 × 1 channel + 48 + 2 × 2 bytes) + 150 MiB = 36,941,286,400 bytes = 34.4 GiB (worked by hand).
    expect(readFileSync(join(dir, 'bigout', 'embryos.csv'), 'utf8').split('\n')[1]).toMatch(
      /^big\.tif,error,"big\.tif: needs about 34\.4 GiB of memory to analyse \(22000×22000 px planes, 1 channel\), more than the 1\.0 GiB allowed per file; raise the limit with --max-memory",/);
  });
  it('a --max-memory that is not a size is a usage error', async () => {
    const r = await cli(['batch', input, '--out', join(dir, 'o'), '--max-memory', 'lots']);
    expect([r.code, r.stderr]).toEqual([2, 'eggline batch: --max-memory must be a size of at least 64M, like 512M, 4G or 1.5G (got "lots") (see "eggline batch --help")\n']);
  });
});

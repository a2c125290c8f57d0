import { describe, it, expect, beforeEach, afterEach } from 'vitest';
import { mkdtemp, readFile, readdir, rm, mkdir, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { writeFileAtomic } from './atomic-write';

let dir: string;
beforeEach(async () => { dir = await mkdtemp(join(tmpdir(), 'eggline-atomic-')); });
afterEach(async () => { await rm(dir, { recursive: true, force: true }); });

describe('writeFileAtomic', () => {
  it('writes text and bytes exactly', async () => {
    await writeFileAtomic(join(dir, 'a.txt'), 'µm,λ\n');
    await writeFileAtomic(join(dir, 'b.bin'), new Uint8Array([0, 255, 7]));
    expect(await readFile(join(dir, 'a.txt'), 'utf8')).toBe('µm,λ\n');
    expect([...await readFile(join(dir, 'b.bin'))]).toEqual([0, 255, 7]);
  });

  it('backs up the replaced file only when asked', async () => {
    const p = join(dir, 'p.json');
    await writeFileAtomic(p, 'one', { backup: true });
    expect(await readdir(dir)).toEqual(['p.json']);
    await writeFileAtomic(p, 'two', { backup: true });
    expect(await readFile(`${p}.bak`, 'utf8')).toBe('one');
    await writeFileAtomic(p, 'three');
    expect(await readFile(`${p}.bak`, 'utf8')).toBe('one');
    expect(await readFile(p, 'utf8')).toBe('three');
  });

  it('leaves the old content and no temp file when the final rename fails', async () => {
    // A non-empty directory in the target's place makes rename fail on every platform (from memory: POSIX rename(2)).
    const p = join(dir, 'target');
    await mkdir(p);
    await writeFile(join(p, 'keep.txt'), 'old');
    await expect(writeFileAtomic(p, 'new')).rejects.toThrow();
    expect((await readdir(dir)).sort()).toEqual(['target']);
    expect(await readFile(join(p, 'keep.txt'), 'utf8')).toBe('old');
  });
});

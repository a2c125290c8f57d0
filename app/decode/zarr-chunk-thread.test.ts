import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { bloscChunkThread } from './zarr-chunk-thread';

const dir = mkdtempSync(join(tmpdir(), 'eggline-chunk-thread-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('bloscChunkThread', () => {
  it('hands every request to zarrita (null) when its thread cannot run, instead of failing the file', async () => {
    const broken = join(dir, 'broken-worker.mjs');
    writeFileSync(broken, 'throw new Error("cannot start");\n');
    const read = bloscChunkThread(broken)!;
    expect(await read(join(dir, 'any-chunk'), 100)).toBeNull();
    expect(await read(join(dir, 'another'), 100)).toBeNull();
    expect(bloscChunkThread(null)).toBeNull();
  });
});

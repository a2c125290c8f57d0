import { describe, it, expect } from 'vitest';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { API_INVOKE_METHODS } from '../../core/contract';
import { createHandlers } from '../../app/main/handlers';
import { createFakeEngine } from './fake-engine';

// Whatever the page sends, every handler answers with a value (never a throw, never a hang) and a one-line message.
const GARBAGE: unknown[] = [
  undefined, null, 0, -1, 1e308, Number.NaN, '', 'relative/path.tif', '/', '\0', 'x'.repeat(100_000), [], [null], {},
  { path: 42 }, new Uint8Array(3), true, { z: 1.5 }, [['/nested']],
];

describe('handlers with garbage arguments', () => {
  it('return error values with known codes and one-line messages for every method', async () => {
    const dataDir = await mkdtemp(join(tmpdir(), 'eggline-fuzz-'));
    try {
      const api = createHandlers({
        dataDir, emitBatchProgress: () => undefined, engine: createFakeEngine(),
        dialogs: { chooseFolder: async () => null, chooseFiles: async () => null, chooseOutputFolder: async () => null,
          openProjectFile: async () => null, saveFile: async () => null },
      });
      const codes = new Set(['cancelled', 'not-found', 'not-allowed', 'bad-file', 'bad-argument', 'io', 'busy', 'internal']);
      // Methods without arguments only open dialogs (answered null here), read the recent list or stop a movie analysis (none runs).
      const withArgs = API_INVOKE_METHODS.filter((m) => !['openDemo', 'chooseFolder', 'chooseFiles', 'recent', 'openProject', 'chooseOutputFolder', 'cancelMovie'].includes(m));
      for (const method of withArgs) {
        for (const a of GARBAGE) {
          for (const args of [[a], [a, a], [a, a, a]]) {
            const fn = api[method] as (...x: unknown[]) => Promise<{ ok: boolean; error?: { code: string; message: string } }>;
            const r = await fn(...args);
            expect(r.ok, `${method}(${String(a).slice(0, 20)})`).toBe(false);
            expect(codes.has(r.error!.code), r.error!.code).toBe(true);
            expect(r.error!.message).not.toMatch(/\n/);
            expect(r.error!.message.length).toBeLessThan(400);
          }
        }
      }
    } finally {
      await rm(dataDir, { recursive: true, force: true });
    }
  });
});

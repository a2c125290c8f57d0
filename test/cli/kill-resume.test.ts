// kill -9 of a batch's whole process tree at two moments, then --resume: the tables equal an uninterrupted run's.
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cli, ensureBuilt, ROOT } from './helpers';

// Demo data: four stacks of the built-in demo set.
const dir = mkdtempSync(join(tmpdir(), 'eggline-kill-'));
const demo = join(dir, 'demo');
const TABLES = ['embryos.csv', 'boundaries.csv', 'profiles.csv', 'landmarks.csv', 'results.json'];
beforeAll(async () => {
  ensureBuilt();
  await cli(['demo', demo, '--count', '4']);
  await cli(['batch', demo, '--out', join(dir, 'whole'), '--jobs', '1']);
}, 180_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const journalLines = (out: string): number => (existsSync(join(out, 'journal.jsonl')) ? readFileSync(join(out, 'journal.jsonl'), 'utf8').split('\n').filter(Boolean).length : 0);

/** Start a batch in its own process group and SIGKILL the whole group once the journal has `lines` lines. */
async function killAt(out: string, lines: number): Promise<void> {
  const child = spawn(process.execPath, [join(ROOT, 'dist', 'cli.mjs'), 'batch', demo, '--out', out, '--jobs', '1'], { detached: true, stdio: 'ignore' });
  const exited = new Promise((done) => child.once('exit', done));
  while (journalLines(out) < lines) await new Promise((r) => setTimeout(r, 20));
  process.kill(-(child.pid as number), 'SIGKILL');
  await exited;
}

describe('kill -9 and --resume', () => {
  it.each([[1], [3]])('killed after %i journal line(s): nothing claims to be complete; --resume gives the same tables', async (lines) => {
    const out = join(dir, `killed-${lines}`);
    await killAt(out, lines);
    expect(JSON.parse(readFileSync(join(out, 'run.json'), 'utf8'))).toMatchObject({ complete: false, reason: 'killed' });
    const r = await cli(['batch', demo, '--out', out, '--jobs', '1', '--resume']);
    expect(r.code).toBe(0);
    const run = JSON.parse(readFileSync(join(out, 'run.json'), 'utf8'));
    expect(run).toMatchObject({ complete: true, reason: null });
    expect(run.reused).toBeGreaterThanOrEqual(lines - 1);
    for (const t of TABLES) expect(readFileSync(join(out, t), 'utf8'), t).toBe(readFileSync(join(dir, 'whole', t), 'utf8'));
  }, 180_000);
});

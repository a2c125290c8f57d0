// `npm run fuzz [N]`: the fuzz test's generator at scale (default 10,000 mutants) through the real batch; prints
// files tried per kind and the crashes, hangs (over 5 s) and memory blow-ups (over 1.5 GiB) it saw.
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { runBatch } from '../../app/batch/run-batch';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { MUTATION_KINDS, mutants } from './mutants';

const count = Number(process.argv[2] ?? 10_000);
const dir = mkdtempSync(join(tmpdir(), 'eggline-fuzz-run-'));
const input = join(dir, 'in');
mkdirSync(input);
const kinds = new Map<string, string>();
for (const m of mutants(count, 20260101)) { writeFileSync(join(input, m.name), m.bytes); kinds.set(m.name, m.kind); }
const started = Date.now();
const summary = await runBatch({
  folder: input, outDir: join(dir, 'out'), settings: DEFAULT_SETTINGS, doc: null, jobs: 2, timeoutPerFileS: 5,
  maxMemoryBytes: 1.5 * 2 ** 30, workerPath: resolve('dist', 'batch-worker.mjs'),
});
const per = new Map<string, { tried: number; ok: number; error: number; crash: number; hang: number; blowUp: number; longCell: number }>();
for (const k of MUTATION_KINDS) per.set(k, { tried: 0, ok: 0, error: 0, crash: 0, hang: 0, blowUp: 0, longCell: 0 });
for (const r of summary.results) {
  const row = per.get(kinds.get(r.file) ?? '');
  if (!row) continue;
  row.tried += 1;
  row[r.status === 'ok' ? 'ok' : 'error'] += 1;
  const e = r.error ?? '';
  if (/crashed|ran out of memory/.test(e)) row.crash += 1;
  if (/timed out/.test(e)) row.hang += 1;
  if (/used more than/.test(e)) row.blowUp += 1;
  if (e.length > 300 || r.warnings.join('; ').length > 300 * 50) row.longCell += 1;
}
console.log(`${summary.results.length} of ${count} files have a row; complete: ${summary.complete}; ${((Date.now() - started) / 1000).toFixed(0)} s`);
console.log('| kind | tried | ok | error | crashes | hangs (> 5 s) | blow-ups (> 1.5 GiB) |');
console.log('| --- | --- | --- | --- | --- | --- | --- |');
for (const [k, r] of per) console.log(`| ${k} | ${r.tried} | ${r.ok} | ${r.error} | ${r.crash} | ${r.hang} | ${r.blowUp} |`);
rmSync(dir, { recursive: true, force: true });

import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, realpathSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { resultsFromJson } from '../../core/batch';
import { parseCsv } from '../../core/csv';
import { errorResult } from '../../core/model';
import type { ProjectDoc } from '../../core/contract';
import type { EmbryoResult } from '../../core/model';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { runBatch } from './run-batch';
import type { BatchTask } from './task';

// Demo data: a folder of placeholder files and a stand-in analysis that echoes what it was given.
const root = mkdtempSync(join(tmpdir(), 'eggline-runbatch-'));
const input = join(root, 'in');
mkdirSync(join(input, 'sub'), { recursive: true });
mkdirSync(join(input, '.hidden'));
for (const f of ['b.tif', 'a.ome.tiff', 'sub/c.TIF', 'notes.txt', '.hidden/x.tif', '._a.tif', 'bad.tif']) writeFileSync(join(input, f), `bytes of ${f}`);
afterAll(() => rmSync(root, { recursive: true, force: true }));

const fake = async (t: BatchTask): Promise<EmbryoResult> => (t.file === 'bad.tif'
  ? errorResult(t.file, `${t.file}: not a TIFF file`)
  : { ...errorResult(t.file, ''), status: 'ok', error: null, gradientChannel: String(t.settings.fitRangeEl),
    landmarks: (t.handEdits?.landmarks ?? []).map((l) => ({ ...l, xEl: 0.5, xUm: 100, offAxisUm: 0 })) });

const doc: ProjectDoc = {
  schema: 'eggline-project', version: 1, folder: input, settings: DEFAULT_SETTINGS,
  files: { 'sub/c.TIF': { axis: null, landmarks: [{ name: 'furrow', point: { x: 3, y: 4 } }], fitRangeEl: [0.2, 0.4] } },
};

describe('runBatch (in-process mode)', () => {
  it('analyses stack files in sorted order, applies project edits, writes all outputs, leaves the input alone', async () => {
    const before = readdirSync(input, { recursive: true }).sort();
    const progress: string[] = [];
    const out = join(root, 'out');
    const summary = await runBatch({
      folder: input, outDir: out, settings: DEFAULT_SETTINGS, doc, jobs: 0, analyseInProcess: fake,
      onProgress: (p) => progress.push(`${p.status}:${p.file ?? ''}:${p.done}/${p.total}`), commandLine: ['batch', input],
    });
    expect(readdirSync(input, { recursive: true }).sort()).toEqual(before);
    expect(summary.results.map((r) => r.file)).toEqual(['a.ome.tiff', 'b.tif', 'bad.tif', 'sub/c.TIF']);
    expect([summary.ok, summary.failed, summary.cancelled]).toEqual([3, 1, false]);
    expect(summary.results[3].gradientChannel).toBe('0.2,0.4');
    expect(summary.results[0].gradientChannel).toBe('0.1,0.6');
    expect(progress.at(-1)).toBe('finished::4/4');
    expect(readdirSync(out).sort()).toEqual(['boundaries.csv', 'embryos.csv', 'journal.jsonl', 'landmarks.csv', 'profiles.csv', 'results.json', 'run.json']);
    const embryos = parseCsv(readFileSync(join(out, 'embryos.csv'), 'utf8'));
    expect(embryos.slice(1).map((r) => [r[0], r[1], r[2]])).toEqual([
      ['a.ome.tiff', 'ok', ''], ['b.tif', 'ok', ''], ['bad.tif', 'error', 'bad.tif: not a TIFF file'], ['sub/c.TIF', 'ok', ''],
    ]);
    expect(readFileSync(join(out, 'landmarks.csv'), 'utf8')).toContain('sub/c.TIF,furrow,3,4,0.5,100,0');
    expect(resultsFromJson(readFileSync(join(out, 'results.json'), 'utf8'))).toHaveLength(4);
    const run = JSON.parse(readFileSync(join(out, 'run.json'), 'utf8'));
    // Source: SHA-256 of the same bytes from node:crypto (OpenSSL), a reference outside the streamed hashing code
    const { createHash } = await import('node:crypto');
    expect(run.inputs[1]).toEqual({ file: 'b.tif', bytes: 14, sha256: createHash('sha256').update('bytes of b.tif').digest('hex'), status: 'ok', error: null });
    expect(run.software.node).toBe(process.versions.node);
    expect(run.commandLine).toEqual(['batch', input]);
  });
  it('refuses an output folder equal to the input or containing it, and a missing input', async () => {
    const base = { settings: DEFAULT_SETTINGS, doc: null, jobs: 0, analyseInProcess: fake };
    await expect(runBatch({ ...base, folder: input, outDir: input })).rejects.toThrow(`the output folder must not be the input folder (${input})`);
    await expect(runBatch({ ...base, folder: input, outDir: root })).rejects.toThrow(`the output folder must not contain the input folder (${root})`);
    await expect(runBatch({ ...base, folder: join(root, 'nope'), outDir: join(root, 'o2') })).rejects.toThrow(`input folder not found: ${join(root, 'nope')}`);
  });
  it('refuses an output folder inside the input, also through a symlink', async () => {
    const base = { settings: DEFAULT_SETTINGS, doc: null, jobs: 0, analyseInProcess: fake, folder: input };
    const out = join(input, 'results');
    await expect(runBatch({ ...base, outDir: out })).rejects.toThrow(`the output folder must not be inside the input folder (${out} is in ${input})`);
    const link = join(root, 'link-to-sub');
    symlinkSync(join(input, 'sub'), link);
    await expect(runBatch({ ...base, outDir: join(link, 'r') }))
      .rejects.toThrow(`the output folder must not be inside the input folder (${join(link, 'r')} is in ${input} through a symlink: ${join(realpathSync(input), 'sub', 'r')})`);
    rmSync(link);
    expect(existsSync(out)).toBe(false);
  });
});

describe('runBatch cancel', () => {
  it('stops after the current file when the signal fires, writes what finished and marks the run cancelled', async () => {
    const ctrl = new AbortController();
    const out = join(root, 'out-cancel');
    const summary = await runBatch({
      folder: input, outDir: out, settings: DEFAULT_SETTINGS, doc: null, jobs: 0, signal: ctrl.signal,
      analyseInProcess: async (t) => { if (t.index === 1) ctrl.abort(); return fake(t); },
    });
    expect(summary.cancelled).toBe(true);
    expect(summary.results.map((r) => r.file)).toEqual(['a.ome.tiff', 'b.tif']);
    const run = JSON.parse(readFileSync(join(out, 'run.json'), 'utf8'));
    expect(run).toMatchObject({ cancelled: true, complete: false, reason: 'cancelled', reused: 0 });
    expect(run.note).toBe('stopped before every file was analysed: the tables hold the 2 of 4 files that finished; rerun with --resume to analyse the rest');
    expect(run.inputs.map((i: { status: string }) => i.status)).toEqual(['ok', 'ok', 'not-run', 'not-run']);
  });
});

describe('runBatch journal and --resume', () => {
  const tables = (dir: string): string[] => ['embryos.csv', 'boundaries.csv', 'profiles.csv', 'landmarks.csv', 'results.json']
    .map((n) => readFileSync(join(dir, n), 'utf8'));
  const base = { folder: input, settings: DEFAULT_SETTINGS, doc, jobs: 0 };

  it('journals every finished file; a resumed run reuses them and gives the same tables as an uninterrupted run', async () => {
    const whole = join(root, 'whole');
    const full = await runBatch({ ...base, outDir: whole, analyseInProcess: fake });
    expect([full.complete, full.reason, full.reused]).toEqual([true, null, 0]);
    expect(JSON.parse(readFileSync(join(whole, 'run.json'), 'utf8'))).toMatchObject({ complete: true, reason: null, note: null, reused: 0, version: 2 });
    const lines = readFileSync(join(whole, 'journal.jsonl'), 'utf8').trimEnd().split('\n').map((l) => JSON.parse(l));
    expect(lines.map((l) => l.type)).toEqual(['run', 'file', 'file', 'file', 'file']);
    expect(lines[0]).toMatchObject({ schema: 'eggline-journal', version: 1, resumed: false });

    const part = join(root, 'part');
    const ctrl = new AbortController();
    await runBatch({ ...base, outDir: part, signal: ctrl.signal, analyseInProcess: async (t) => { if (t.index === 1) ctrl.abort(); return fake(t); } });
    // A kill while a line was being written leaves half a line: it is skipped.
    writeFileSync(join(part, 'journal.jsonl'), `${readFileSync(join(part, 'journal.jsonl'), 'utf8')}{"type":"file","file":"bad.t`);
    const seen: string[] = [];
    const resumed = await runBatch({ ...base, outDir: part, resume: true, analyseInProcess: async (t) => { seen.push(t.file); return fake(t); } });
    expect(seen).toEqual(['bad.tif', 'sub/c.TIF']);
    expect([resumed.complete, resumed.reused]).toEqual([true, 2]);
    expect(JSON.parse(readFileSync(join(part, 'run.json'), 'utf8'))).toMatchObject({ complete: true, reused: 2 });
    expect(tables(part)).toEqual(tables(whole));
  });

  it('analyses again a file whose bytes changed, and every file whose effective settings changed', async () => {
    const out = join(root, 'changed');
    await runBatch({ ...base, outDir: out, analyseInProcess: fake });
    writeFileSync(join(input, 'b.tif'), 'bytes of b.tif, edited');
    const seen: string[] = [];
    const again = await runBatch({ ...base, outDir: out, resume: true, analyseInProcess: async (t) => { seen.push(t.file); return fake(t); } });
    expect([seen, again.reused]).toEqual([['b.tif'], 3]);
    writeFileSync(join(input, 'b.tif'), 'bytes of b.tif');
    seen.length = 0;
    await runBatch({ ...base, settings: { ...DEFAULT_SETTINGS, fitRangeEl: [0.1, 0.5] }, outDir: out, resume: true, analyseInProcess: async (t) => { seen.push(t.file); return fake(t); } });
    // sub/c.TIF keeps its own fit range from the project, so its effective settings did not change.
    expect(seen).toEqual(['a.ome.tiff', 'b.tif', 'bad.tif']);
  });

  it('--resume without a journal analyses everything and says so; a new run removes the tables of the last one first', async () => {
    const out = join(root, 'fresh');
    const r = await runBatch({ ...base, outDir: out, resume: true, analyseInProcess: fake });
    expect(r.warnings).toContain(`--resume: no journal.jsonl in ${out}, so every file is analysed`);
    let sawRunJson: unknown = null;
    await runBatch({ ...base, outDir: out, analyseInProcess: async (t) => {
      sawRunJson ??= [existsSync(join(out, 'embryos.csv')), JSON.parse(readFileSync(join(out, 'run.json'), 'utf8'))];
      return fake(t);
    } });
    expect(sawRunJson).toMatchObject([false, { complete: false, reason: 'killed' }]);
  });
});

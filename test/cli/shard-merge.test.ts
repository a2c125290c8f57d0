import { cpSync, existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cli, ensureBuilt } from './helpers';

// Demo data: 5 synthetic embryos from `eggline demo --count 5`, analysed whole and in 3 parts.
const dir = mkdtempSync(join(tmpdir(), 'eggline-cli-shard-'));
const demo = join(dir, 'demo');
const single = join(dir, 'single');
const split = join(dir, 'split');
const TABLES = ['embryos.csv', 'boundaries.csv', 'profiles.csv', 'landmarks.csv', 'results.json'];
const json = (path: string): Record<string, unknown> => JSON.parse(readFileSync(path, 'utf8')) as Record<string, unknown>;
type Input = { file: string; bytes: number; sha256: string; status: string };

beforeAll(async () => {
  ensureBuilt();
  expect((await cli(['demo', demo, '--count', '5'])).code).toBe(0);
  expect((await cli(['batch', demo, '--out', single, '--jobs', '1'])).code).toBe(0);
  for (const k of [1, 2, 3]) {
    const r = await cli(['batch', demo, '--out', split, '--jobs', '1', '--shard', `${k}/3`]);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain(`of part ${k} of 3`);
  }
}, 300_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('eggline batch --shard and eggline merge', () => {
  it('puts every file in exactly one part and records the split in each part\'s run.json', () => {
    const parts = [1, 2, 3].map((k) => json(join(split, 'parts', `${k}-of-3`, 'run.json')));
    const files = parts.flatMap((p) => (p.inputs as Input[]).map((i) => i.file));
    expect([...files].sort()).toEqual((json(join(single, 'run.json')).inputs as Input[]).map((i) => i.file));
    const shards = parts.map((p) => p.shard as Record<string, unknown>);
    expect(shards.map((s) => [s.part, s.parts, s.inputCount])).toEqual([[1, 3, 5], [2, 3, 5], [3, 3, 5]]);
    expect(new Set(shards.map((s) => s.inputListSha256)).size).toBe(1);
    expect(shards[0].inputListSha256).toMatch(/^[0-9a-f]{64}$/);
  });

  it('merges into tables byte for byte equal to a one-machine run, and a run.json listing every input', async () => {
    const r = await cli(['merge', split]);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('Merged 3 of 3 parts: 5 files, 5 ok, 0 failed.');
    for (const t of TABLES) expect(readFileSync(join(split, t), 'utf8'), t).toBe(readFileSync(join(single, t), 'utf8'));
    const merged = json(join(split, 'run.json'));
    const strip = (inputs: Input[]): unknown[] => inputs.map(({ file, bytes, sha256, status }) => ({ file, bytes, sha256, status }));
    expect(strip(merged.inputs as Input[])).toEqual(strip(json(join(single, 'run.json')).inputs as Input[]));
    expect(merged.merge).toMatchObject({ parts: 3, partsMerged: [1, 2, 3], missingParts: [], missingFiles: [] });
    expect(merged.cancelled).toBe(false);
  });

  it('refuses a missing part with exit 2 and one line; --allow-missing merges the rest and lists the missing files', async () => {
    const out = join(dir, 'missing');
    cpSync(join(split, 'parts'), join(out, 'parts'), { recursive: true });
    const lost = (json(join(out, 'parts', '2-of-3', 'run.json')).inputs as Input[]).map((i) => i.file);
    rmSync(join(out, 'parts', '2-of-3'), { recursive: true });
    const r = await cli(['merge', out]);
    expect(r.code).toBe(2);
    expect(r.stderr).toBe('eggline merge: part 2 of 3 is missing (no folder parts/2-of-3); rerun it with --shard 2/3, or merge what is there with --allow-missing\n');
    expect(existsSync(join(out, 'embryos.csv'))).toBe(false);
    const a = await cli(['merge', out, '--allow-missing']);
    expect(a.code).toBe(1);
    expect(a.stdout).toContain(`Missing: ${lost.length} files of parts 2 (listed in run.json).`);
    const merged = json(join(out, 'run.json'));
    expect(merged.merge).toMatchObject({ missingParts: [2], missingFiles: lost });
    expect(merged.cancelled).toBe(true);
    expect(readFileSync(join(out, 'embryos.csv'), 'utf8').split('\r\n').length).toBe(5 - lost.length + 2);
  });

  it('refuses a part present twice and parts made with other settings', async () => {
    const twice = join(dir, 'twice');
    cpSync(join(split, 'parts'), join(twice, 'parts'), { recursive: true });
    cpSync(join(twice, 'parts', '3-of-3'), join(twice, 'parts', 'again'), { recursive: true });
    const r = await cli(['merge', twice]);
    expect([r.code, r.stderr]).toEqual([2, 'eggline merge: part 3 of 3 is present twice: parts/3-of-3 and parts/again\n']);

    const other = join(dir, 'other');
    expect((await cli(['batch', demo, '--out', other, '--jobs', '1', '--shard', '1/3', '--fit-range', '0.2,0.6'])).code).toBe(0);
    const mixed = join(dir, 'mixed');
    cpSync(join(split, 'parts'), join(mixed, 'parts'), { recursive: true });
    cpSync(join(other, 'parts', '1-of-3'), join(mixed, 'parts', '1-of-3'), { recursive: true });
    const m = await cli(['merge', mixed]);
    expect([m.code, m.stderr]).toEqual([2, 'eggline merge: parts/2-of-3 was made with other settings than parts/1-of-3 (fitRangeEl: [0.1,0.6] vs [0.2,0.6])\n']);
  }, 120_000);

  it('refuses a part whose input list differs (a file added between parts)', async () => {
    const out = join(dir, 'changed');
    cpSync(join(split, 'parts'), join(out, 'parts'), { recursive: true });
    const record = json(join(out, 'parts', '3-of-3', 'run.json'));
    const shard = record.shard as Record<string, unknown>;
    writeFileSync(join(out, 'parts', '3-of-3', 'run.json'), JSON.stringify({ ...record, shard: { ...shard, inputCount: 6, inputListSha256: '0'.repeat(64) } }));
    const r = await cli(['merge', out]);
    expect([r.code, r.stderr]).toEqual([2, 'eggline merge: parts/3-of-3 was made from another input list than parts/1-of-3 (6 vs 5 files, or files changed in between)\n']);
  });

  it('gives a part with no files (more parts than files) empty tables and exit 0', async () => {
    const out = join(dir, 'six');
    const r = await cli(['batch', demo, '--out', out, '--jobs', '1', '--shard', '6/6']);
    expect([r.code, r.stdout]).toEqual([0, `Part 6 of 6 has no files (5 files in 6 parts); empty tables written to ${join(out, 'parts', '6-of-6')}\n`]);
    expect(readFileSync(join(out, 'parts', '6-of-6', 'embryos.csv'), 'utf8').split('\r\n')).toHaveLength(2);
    expect(json(join(out, 'parts', '6-of-6', 'run.json'))).toMatchObject({ complete: true, shard: { part: 6, parts: 6, inputCount: 5 } });
  });

  it('refuses --samples with --shard, and merge without parts, with exit 2', async () => {
    const s = await cli(['batch', demo, '--out', join(dir, 'x'), '--shard', '1/2', '--samples', join(demo, 'samples.csv')]);
    expect([s.code, s.stderr]).toEqual([2, 'eggline batch: --samples goes to "eggline merge" when a batch is split (--shard); the parts are compared once merged (see "eggline batch --help")\n']);
    const bad = await cli(['batch', demo, '--out', join(dir, 'x'), '--shard', '3/2']);
    expect([bad.code, bad.stderr]).toEqual([2, 'eggline batch: --shard: the part must be from 1 to 2 (got 3) (see "eggline batch --help")\n']);
    const none = await cli(['merge', join(dir, 'nothing-here')]);
    expect(none.code).toBe(2);
    expect(none.stderr).toBe(`eggline merge: no folder ${join(dir, 'nothing-here', 'parts')} (run "eggline batch <folder> --out ${join(dir, 'nothing-here')} --shard K/N" for each part first)\n`);
  });

  it('--slurm writes both scripts, analyses nothing and prints the two submit commands', async () => {
    const out = join(dir, 'cluster');
    const r = await cli(['batch', demo, '--out', out, '--slurm', '2', '--samples', join(demo, 'samples.csv'), '--slurm-options', '--partition=long --time=01:00:00']);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain(`  jobid=$(sbatch --parsable ${join(out, 'eggline-array.sbatch')})\n  sbatch --dependency=afterok:\${jobid%%;*} --kill-on-invalid-dep=yes ${join(out, 'eggline-merge.sbatch')}\n`);
    expect(existsSync(join(out, 'parts'))).toBe(false);
    const array = readFileSync(join(out, 'eggline-array.sbatch'), 'utf8');
    expect(array).toContain(`OUT=${out}\n`);
    expect(array).toContain(`"$NODE" "$EGGLINE" batch ${demo} --out "$OUT" --shard "$PART/$PARTS" --resume`);
    expect(array).toContain(`NODE=${process.execPath} `);
    expect(array).toContain('#SBATCH --partition=long\n#SBATCH --time=01:00:00\n');
    expect(readFileSync(join(out, 'eggline-merge.sbatch'), 'utf8')).toContain(`merge ${out} --samples ${join(demo, 'samples.csv')}\n`);
  });
});

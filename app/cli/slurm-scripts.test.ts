import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import {
  arrayScript, joinSlurmOptions, memPerCpuMiB, mergeMemMiB, mergeScript, parseSlurmOptions, partArguments, quote, submitCommands,
  type SlurmPlan,
} from './slurm-scripts';
import { analysisBytesEstimate, WORKER_BASE_BYTES } from '../../core/tiff';

const dir = mkdtempSync(join(tmpdir(), 'eggline-slurm-scripts-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** What bash makes of a command line: its words. */
function bashWords(line: string): string[] {
  // Source: bash itself (GNU Bash manual §3.1.2 Quoting): printf prints each word bash split and unquoted, NUL-ended.
  return execFileSync('bash', ['-c', `printf '%s\\0' ${line}`], { encoding: 'utf8' }).split('\0').slice(0, -1);
}

describe('quote', () => {
  it('gives words bash reads back unchanged, bare when nothing in them is special', () => {
    const words = ['/data/run 1/in', "it's", '$HOME', 'a;b', '*.tif', '--fit-range=0.1,0.6', '', 'x"y', 'back\\slash', 'new\nline', 'ü µm'];
    expect(bashWords(quote(words))).toEqual(words);
    expect(quote(['/abs/out', '--fit-range=0.1,0.6'])).toBe('/abs/out --fit-range=0.1,0.6');
    expect(quote(["it's"])).toBe("'it'\\''s'");
  });
});

describe('parseSlurmOptions', () => {
  it('groups options with their values, honouring quotes', () => {
    expect(parseSlurmOptions('--partition=long -t 04:00:00 --account lab-a -q "high"')).toEqual([
      ['--partition=long'], ['-t', '04:00:00'], ['--account', 'lab-a'], ['-q', 'high'],
    ]);
    expect(parseSlurmOptions('')).toEqual([]);
  });

  it('refuses what is not an sbatch option, shell syntax, spaces and options the scripts set', () => {
    expect(() => parseSlurmOptions('long')).toThrow('--slurm-options: "long" is not an sbatch option (give e.g. "--partition=long --time=04:00:00")');
    expect(() => parseSlurmOptions('--partition=long; rm -rf x')).toThrow('--slurm-options: only sbatch options are allowed (found shell syntax {"op":";"})');
    expect(() => parseSlurmOptions('--comment "two words"')).toThrow('--slurm-options: "two words" holds a space, which #SBATCH lines cannot carry; edit the scripts instead');
    expect(() => parseSlurmOptions('--array=0-9')).toThrow('--slurm-options: --array is set by Eggline\'s scripts and cannot be given here');
    expect(() => parseSlurmOptions('--dependency afterok:1')).toThrow('--dependency is set by Eggline');
  });
});

describe('joinSlurmOptions and partArguments', () => {
  const options = {
    out: { type: 'string' }, jobs: { type: 'string' }, config: { type: 'string' }, 'fit-range': { type: 'string' },
    'boundary-channel': { type: 'string', multiple: true }, 'no-project': { type: 'boolean' }, slurm: { type: 'string' },
    'slurm-options': { type: 'string' }, samples: { type: 'string' }, normalise: { type: 'string' }, covariate: { type: 'string', multiple: true },
    'background-condition': { type: 'string' },
  } as const;

  it('keeps the settings for the parts, paths made absolute, and leaves out the split\'s and the merge\'s options', () => {
    const argv = joinSlurmOptions(['in', '--out', 'o', '--slurm', '4', '--slurm-options', '--partition=long -t 1:00:00', '--jobs', '4',
      '--config', 'cfg.json', '--fit-range', '0.1,0.5', '--boundary-channel', '2', '--boundary-channel', 'target', '--no-project', '--samples', 's.csv',
      '--normalise', 'none', '--covariate', 'stage', '--background-condition', 'null-stain']);
    expect(argv).toContain('--slurm-options=--partition=long -t 1:00:00');
    expect(partArguments(argv, options, '/home/u')).toEqual([
      '--config=/home/u/cfg.json', '--fit-range=0.1,0.5', '--boundary-channel=2', '--boundary-channel=target', '--no-project',
    ]);
  });
});

describe('sizing', () => {
  it('asks per core for 1.5 × the largest file\'s need (at least 512 MiB), and for the merge 2 GiB plus 0.25 MiB per file', () => {
    // Worked by hand (demo data): 4096×4096 px, 2 uint16 channels → 16 Mi px × 100 B + 150 MiB = 1750 MiB;
    // × 1.5 = 2625 MiB → 2688 MiB (whole 64 MiB). 1024×1024 px needs 250 MiB → 375 MiB → the 512 MiB floor.
    const need = (px: number): number => analysisBytesEstimate(px, px, 2, 'uint16', 1) + WORKER_BASE_BYTES;
    expect(need(4096)).toBe(1750 * 2 ** 20);
    expect(memPerCpuMiB(need(4096))).toBe(2688);
    expect(memPerCpuMiB(need(1024))).toBe(512);
    expect(memPerCpuMiB(0)).toBe(512);
    expect(mergeMemMiB(0)).toBe(2048);
    expect(mergeMemMiB(10_000)).toBe(4608);
  });
});

describe('the scripts', () => {
  const plan: SlurmPlan = {
    folder: '/data/screen 1', outDir: '/scratch/out', parts: 8, cpusPerTask: 2, memPerCpuMiB: 448, mergeMemMiB: 2304,
    nodePath: '/opt/node/bin/node', cliPath: '/opt/eggline/dist/cli.mjs', batchArgs: ['--fit-range=0.1,0.5'],
    mergeArgs: ['--samples', '/data/samples.csv'], userDirectives: [['--partition=long'], ['-t', '04:00:00'], ['--mem', '8G']],
    fileCount: 100, inputBytes: 5e9, largestNeedBytes: 250 * 1024 * 1024, writtenAt: '2026-01-01T00:00:00.000Z',
  };

  it('are valid bash that runs the same Node and Eggline by absolute path, part = task id + 1', () => {
    const array = arrayScript(plan);
    const merge = mergeScript(plan);
    for (const [name, text] of [['array.sbatch', array], ['merge.sbatch', merge]]) {
      writeFileSync(join(dir, name), text);
      execFileSync('bash', ['-n', join(dir, name)]); // Source: bash -n (GNU Bash manual §4.3.1): read commands, do not run them
    }
    expect(array).toContain('#SBATCH --array=0-7\n');
    expect(array).toContain('#SBATCH --cpus-per-task=2\n');
    expect(array).toContain("\"$NODE\" \"$EGGLINE\" batch '/data/screen 1' --out \"$OUT\" --shard \"$PART/$PARTS\" --resume --jobs \"${SLURM_CPUS_PER_TASK:-2}\" --max-memory \"${PER_FILE_MB}M\" --fit-range=0.1,0.5\n");
    expect(array).toContain('NODE=/opt/node/bin/node ');
    expect(array).toContain('EGGLINE=/opt/eggline/dist/cli.mjs ');
    expect(merge).toContain('exec "$NODE" "$EGGLINE" merge /scratch/out --samples /data/samples.csv\n');
  });

  it('let --slurm-options replace the memory Eggline sets and add the rest', () => {
    const array = arrayScript(plan);
    expect(array).not.toContain('--mem-per-cpu');
    expect(array).toContain('#SBATCH --partition=long\n#SBATCH -t 04:00:00\n#SBATCH --mem=8G\n');
    expect(mergeScript({ ...plan, userDirectives: [] })).toContain('#SBATCH --mem=2304M\n');
  });

  it('run part K for task K-1, and refuse to run outside Slurm without a task id', () => {
    const fake = join(dir, 'fake-eggline.sh');
    writeFileSync(fake, 'echo "$@"\n');
    const text = arrayScript({ ...plan, nodePath: '/bin/bash', cliPath: fake, userDirectives: [] });
    writeFileSync(join(dir, 'run.sbatch'), text);
    const out = execFileSync('bash', [join(dir, 'run.sbatch')], { env: { ...process.env, SLURM_ARRAY_TASK_ID: '2', SLURM_CPUS_PER_TASK: '3' }, encoding: 'utf8' });
    expect(out).toBe('batch /data/screen 1 --out /scratch/out --shard 3/8 --resume --jobs 3 --max-memory 448M --fit-range=0.1,0.5\n');
    // Slurm's figure wins: per core as asked (SLURM_MEM_PER_CPU), or the node's memory shared by the cores (SLURM_MEM_PER_NODE).
    const run = (extra: Record<string, string>): string => execFileSync('bash', [join(dir, 'run.sbatch')], {
      env: { ...process.env, SLURM_ARRAY_TASK_ID: '0', SLURM_CPUS_PER_TASK: '4', ...extra }, encoding: 'utf8',
    });
    expect(run({ SLURM_MEM_PER_CPU: '1000' })).toContain('--max-memory 1000M');
    expect(run({ SLURM_MEM_PER_NODE: '8000' })).toContain('--max-memory 2000M');
    const env = { ...process.env };
    delete env.SLURM_ARRAY_TASK_ID;
    expect(() => execFileSync('bash', [join(dir, 'run.sbatch')], { env, stdio: 'pipe' })).toThrow('SLURM_ARRAY_TASK_ID: is not set: submit this script with sbatch');
  });

  it('turn exit status 1 of a complete part (some files failed) into success so the merge still runs, and pass others on', () => {
    const out = join(dir, 'out');
    mkdirSync(join(out, 'parts', '1-of-8'), { recursive: true });
    for (const [code, complete, expected] of [[0, true, 0], [1, true, 0], [1, false, 1], [2, true, 2], [137, false, 137]] as const) {
      writeFileSync(join(out, 'parts', '1-of-8', 'run.json'), JSON.stringify({ complete }, null, 2));
      const fake = join(dir, `exit-${code}.sh`);
      writeFileSync(fake, `exit ${code}\n`);
      writeFileSync(join(dir, 'exit.sbatch'), arrayScript({ ...plan, outDir: out, nodePath: '/bin/bash', cliPath: fake }));
      let status = 0;
      try {
        execFileSync('bash', [join(dir, 'exit.sbatch')], { env: { ...process.env, SLURM_ARRAY_TASK_ID: '0' }, stdio: 'pipe' });
      } catch (e) {
        status = (e as { status: number }).status;
      }
      expect(status).toBe(expected);
    }
  });

  it('print the submit commands, the merge depending on the whole array', () => {
    expect(submitCommands('/scratch/my out')).toBe("jobid=$(sbatch --parsable '/scratch/my out/eggline-array.sbatch')\nsbatch --dependency=afterok:${jobid%%;*} --kill-on-invalid-dep=yes '/scratch/my out/eggline-merge.sbatch'");
  });
});

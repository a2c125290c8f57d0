// `eggline batch … --slurm N`: write a Slurm job array (one task per part) and a merge job, and the commands to submit
// them. The scripts are plain bash with #SBATCH lines, commented so that a user can read and edit them.
import { promises as fs } from 'node:fs';
import { join, resolve } from 'node:path';
import { parseArgs, type ParseArgsConfig } from 'node:util';
import { parse as parseShell } from 'shell-quote';
import { BatchOptionError } from '../../core/batch';
import { analysisBytesEstimate, WORKER_BASE_BYTES } from '../../core/tiff';
import { listStackFiles } from '../batch/list-stacks';
import { sizedFiles, stackInfoOf } from '../batch/shard';
import { EGGLINE_VERSION } from '../batch/versions';
import { writeFileAtomic } from '../project';

/** Words for a bash command line: left bare when made only of characters the shell does not treat specially, else in
 *  single quotes, a quote inside written as '\'' (POSIX Shell Command Language §2.2.2: nothing is special inside
 *  single quotes). */
export function quote(words: readonly string[]): string {
  return words.map((w) => (/^[A-Za-z0-9_/.,:=+@%-]+$/.test(w) ? w : `'${w.replace(/'/g, `'\\''`)}'`)).join(' ');
}

/** Cores per task when --jobs is not given: one worker keeps more than one core busy (libvips decodes the next plane
 *  on its own threads), and two workers on two cores gave 1.22–1.34× the files per second of one (README, bench). */
export const DEFAULT_CPUS_PER_TASK = 2;
/** Memory per core as a multiple of what the largest file's analysis needs (the estimate --max-memory checks, which
 *  includes a worker's own base): the rest is margin and the task's main process. */
export const MEMORY_PER_NEED = 1.5;
/** Least memory per core, MiB: Node, sharp and libvips themselves. */
export const MIN_MIB_PER_CPU = 512;
/** The merge holds every row: about this many MiB per file (results.json, tables) on top of a base (MiB). */
export const MERGE_MIB_PER_FILE = 0.25;
export const MERGE_BASE_MIB = 2048;

/** Options of --slurm-options that Eggline sets itself and that a user's value replaces. */
const OWN = {
  cpus: ['--cpus-per-task', '-c'], mem: ['--mem', '--mem-per-cpu', '--mem-per-gpu'],
  name: ['--job-name', '-J'], output: ['--output', '-o'],
} as const;
/** Options that would break the scripts. */
const REFUSED = ['--array', '-a', '--dependency', '-d', '--wrap', '--wait', '-W', '--parsable'];

/** `--slurm-options "--partition=long …"` as one `--slurm-options=…` argument: its value starts with a dash, which the
 *  argument parser would otherwise take for an option of its own. */
export function joinSlurmOptions(argv: readonly string[]): string[] {
  const out: string[] = [];
  for (let i = 0; i < argv.length; i += 1) {
    if (argv[i] === '--') { out.push(...argv.slice(i)); break; }
    if (argv[i] === '--slurm-options' && i + 1 < argv.length) { out.push(`--slurm-options=${argv[i + 1]}`); i += 1; } else out.push(argv[i]);
  }
  return out;
}

/** Split --slurm-options into sbatch directives (an option and its value, if given apart); throws BatchOptionError. */
export function parseSlurmOptions(text: string): string[][] {
  const tokens = parseShell(text, (name) => `$${name}`);
  const directives: string[][] = [];
  for (const t of tokens) {
    if (typeof t !== 'string') throw new BatchOptionError(`--slurm-options: only sbatch options are allowed (found shell syntax ${JSON.stringify(t)})`);
    if (/\s/.test(t)) throw new BatchOptionError(`--slurm-options: "${t}" holds a space, which #SBATCH lines cannot carry; edit the scripts instead`);
    const last = directives[directives.length - 1];
    if (t.startsWith('-')) {
      const name = t.split('=')[0];
      if (REFUSED.includes(name)) throw new BatchOptionError(`--slurm-options: ${name} is set by Eggline's scripts and cannot be given here`);
      directives.push([t]);
    } else if (last && last.length === 1 && !last[0].includes('=')) last.push(t);
    else throw new BatchOptionError(`--slurm-options: "${t}" is not an sbatch option (give e.g. "--partition=long --time=04:00:00")`);
  }
  return directives;
}

/** True when the user's directives set one of `names`. */
function userSets(directives: readonly string[][], names: readonly string[]): boolean {
  return directives.some((d) => names.includes(d[0].split('=')[0]));
}

/** What the two scripts are made from. */
export interface SlurmPlan {
  readonly folder: string;
  readonly outDir: string;
  readonly parts: number;
  readonly cpusPerTask: number;
  /** Memory per core of an array task, MiB. */
  readonly memPerCpuMiB: number;
  /** Memory of the merge job, MiB. */
  readonly mergeMemMiB: number;
  readonly nodePath: string;
  readonly cliPath: string;
  /** Settings arguments every part gets (paths absolute). */
  readonly batchArgs: readonly string[];
  /** Arguments of the merge (the cohort step's). */
  readonly mergeArgs: readonly string[];
  readonly userDirectives: readonly string[][];
  readonly fileCount: number;
  readonly inputBytes: number;
  /** What the analysis of the largest file needs (analysisBytesEstimate + WORKER_BASE_BYTES), bytes; 0 when no file could be opened. */
  readonly largestNeedBytes: number;
  readonly writtenAt: string;
}

const MIB = 1024 * 1024;

/** Human size in MiB or GiB. */
function size(bytes: number): string {
  return bytes >= 1024 * MIB ? `${(bytes / 1024 / MIB).toFixed(1)} GiB` : `${Math.ceil(bytes / MIB)} MiB`;
}

/** Memory per core of an array task, MiB: MEMORY_PER_NEED × the largest file's need, at least MIN_MIB_PER_CPU,
 *  rounded up to 64 MiB. */
export function memPerCpuMiB(largestNeedBytes: number): number {
  return Math.max(MIN_MIB_PER_CPU, Math.ceil((MEMORY_PER_NEED * largestNeedBytes) / MIB / 64) * 64);
}

/** Memory of the merge job, MiB, rounded up to 256 MiB. */
export function mergeMemMiB(fileCount: number): number {
  return Math.ceil((MERGE_BASE_MIB + MERGE_MIB_PER_FILE * fileCount) / 256) * 256;
}

function header(plan: SlurmPlan, what: string): string[] {
  const array = join(plan.outDir, 'eggline-array.sbatch');
  const merge = join(plan.outDir, 'eggline-merge.sbatch');
  return [
    '#!/bin/bash',
    `# Eggline ${EGGLINE_VERSION}: ${what}`,
    `# Written by "eggline batch … --slurm ${plan.parts}" at ${plan.writtenAt}. Plain bash; safe to edit. Lines starting`,
    '# with #SBATCH are sbatch options (sbatch reads them up to the first command; options given to sbatch on its command',
    '# line win over them).',
    `#   input folder: ${plan.folder} (${plan.fileCount} stack files, ${size(plan.inputBytes)})`,
    `#   results:      ${plan.outDir}/parts/K-of-${plan.parts}, merged into ${plan.outDir}`,
    '# Submit both, the merge only after every task succeeded:',
    `#   jobid=$(sbatch --parsable ${quote([array])})`,
    `#   sbatch --dependency=afterok:\${jobid%%;*} --kill-on-invalid-dep=yes ${quote([merge])}`,
  ];
}

function directives(plan: SlurmPlan, own: { name: string; cpus: string | null; mem: string; output: string }): string[] {
  const u = plan.userDirectives;
  const lines: string[] = [];
  if (!userSets(u, OWN.name)) lines.push(`#SBATCH --job-name=${own.name}`);
  if (!userSets(u, OWN.output)) lines.push(`#SBATCH --output=${own.output}`);
  if (own.cpus && !userSets(u, OWN.cpus)) lines.push(own.cpus);
  if (!userSets(u, OWN.mem)) lines.push(own.mem);
  if (u.length > 0) lines.push('# From --slurm-options:', ...u.map((d) => `#SBATCH ${d.join(d[0].startsWith('--') ? '=' : ' ')}`));
  return lines;
}

function programLines(plan: SlurmPlan): string[] {
  return [
    'set -u',
    `NODE=${quote([plan.nodePath])}   # the Node that wrote these scripts`,
    `EGGLINE=${quote([plan.cliPath])}   # the Eggline that wrote them (${EGGLINE_VERSION})`,
  ];
}

/** Text of eggline-array.sbatch: task i analyses part i+1 of N. */
export function arrayScript(plan: SlurmPlan): string {
  const logs = join(plan.outDir, 'slurm-logs');
  const lines = [
    ...header(plan, `analyse one part of a split batch per task of this job array (part K = task id + 1).`),
    `# Rerun one part alone, e.g. part 3:  sbatch --array=2 ${quote([join(plan.outDir, 'eggline-array.sbatch')])}`,
    '#',
    `#SBATCH --array=0-${plan.parts - 1}`,
    ...directives(plan, {
      name: 'eggline-parts', output: `${logs}/part-%a_%A.out`,
      cpus: `#SBATCH --cpus-per-task=${plan.cpusPerTask}`,
      mem: `#SBATCH --mem-per-cpu=${plan.memPerCpuMiB}M`,
    }).flatMap((l) => (l.startsWith('#SBATCH --cpus-per-task') ? [
      '# Cores per task: Eggline runs one worker thread per core (--jobs below follows this line).', l,
    ] : l.startsWith('#SBATCH --mem-per-cpu') ? [
      `# Memory per core: ${MEMORY_PER_NEED} × what the largest file's analysis needs (${size(plan.largestNeedBytes)}, the estimate`,
      `# --max-memory checks; the bench's peak per worker stayed below it), at least ${MIN_MIB_PER_CPU} MiB.`, l,
    ] : [l])),
    '',
    ...programLines(plan),
    `OUT=${quote([plan.outDir])}`,
    `PARTS=${plan.parts}`,
    '# Slurm sets SLURM_ARRAY_TASK_ID; to run one part by hand, set it yourself (part K is task K-1).',
    'PART=$((${SLURM_ARRAY_TASK_ID:?is not set: submit this script with sbatch} + 1))',
    ...(plan.batchArgs.some((a) => a.startsWith('--max-memory')) ? [] : [
      '# Memory one file may use (--max-memory): what Slurm gave this task per core, so a file too big for it gets an',
      '# error row instead of the task being killed.',
      `CORES=\${SLURM_CPUS_PER_TASK:-${plan.cpusPerTask}}`,
      `PER_FILE_MB=\${SLURM_MEM_PER_CPU:-$(( \${SLURM_MEM_PER_NODE:-$((${plan.memPerCpuMiB} * CORES))} / CORES ))}`,
    ]),
    '',
    '# --resume: a rerun of a part (after a time limit, a node failure) reuses the files it finished, from the',
    '# journal in its parts/K-of-N folder; the first run has no journal yet and analyses every file of the part.',
    `"$NODE" "$EGGLINE" batch ${quote([plan.folder])} --out "$OUT" --shard "$PART/$PARTS" --resume --jobs "\${SLURM_CPUS_PER_TASK:-${plan.cpusPerTask}}"${plan.batchArgs.some((a) => a.startsWith('--max-memory')) ? '' : ' --max-memory "${PER_FILE_MB}M"'}${plan.batchArgs.length ? ` ${quote([...plan.batchArgs])}` : ''}`,
    'status=$?',
    '# Exit status 1: some files failed, or the run stopped early. When the part\'s run.json says it is complete, only',
    '# files failed (each has an error row, and the merge reports them): count that as success so the merge job runs.',
    'if [ "$status" -eq 1 ] && grep -q \'"complete": true\' "$OUT/parts/$PART-of-$PARTS/run.json" 2>/dev/null; then exit 0; fi',
    'exit "$status"',
    '',
  ];
  return lines.join('\n');
}

/** Text of eggline-merge.sbatch: merge the parts, then the cohort step when a sample sheet was given. */
export function mergeScript(plan: SlurmPlan): string {
  const lines = [
    ...header(plan, `merge the ${plan.parts} parts of a split batch into one set of tables.`),
    '#',
    ...directives(plan, {
      name: 'eggline-merge', output: `${join(plan.outDir, 'slurm-logs')}/merge_%j.out`, cpus: '#SBATCH --cpus-per-task=1',
      mem: `#SBATCH --mem=${plan.mergeMemMiB}M`,
    }).flatMap((l) => (l.startsWith('#SBATCH --mem=') ? [
      `# Memory: the merge holds every row, about ${MERGE_MIB_PER_FILE} MiB per file on top of ${MERGE_BASE_MIB} MiB.`, l,
    ] : [l])),
    '',
    ...programLines(plan),
    '',
    `exec "$NODE" "$EGGLINE" merge ${quote([plan.outDir, ...plan.mergeArgs])}`,
    '',
  ];
  return lines.join('\n');
}

/** The two commands that submit the scripts, the merge depending on every task of the array; when a task fails the
 *  merge's dependency can never be met, and --kill-on-invalid-dep=yes cancels it rather than leaving it pending for ever
 *  (sbatch's manual page: "--kill-on-invalid-dep=<yes|no>"). */
export function submitCommands(outDir: string): string {
  return [
    `jobid=$(sbatch --parsable ${quote([join(outDir, 'eggline-array.sbatch')])})`,
    `sbatch --dependency=afterok:\${jobid%%;*} --kill-on-invalid-dep=yes ${quote([join(outDir, 'eggline-merge.sbatch')])}`,
  ].join('\n');
}

/** Options of `eggline batch` that do not go to the parts: they are the split's own, or the merge's. */
const NOT_FOR_PARTS = new Set(['out', 'jobs', 'samples', 'reference', 'shard', 'resume', 'slurm', 'slurm-options', 'help',
  // The comparison's options go to the merge job (they need --samples, which a part never gets).
  'background-condition', 'normalise', 'lambda-posterior-el', 'equivalence-margin', 'covariate']);
/** Options whose value is a path, made absolute for the scripts. */
const PATH_OPTIONS = new Set(['config', 'project']);

/** The settings arguments of a batch command line, for every part (`--name=value`, paths absolute). */
export function partArguments(argv: readonly string[], options: ParseArgsConfig['options'], cwd: string): string[] {
  const { tokens } = parseArgs({ args: [...argv], options, allowPositionals: true, strict: true, tokens: true });
  const out: string[] = [];
  for (const t of (tokens ?? []) as { kind: string; name?: string; value?: string }[]) {
    if (t.kind !== 'option' || t.name === undefined || NOT_FOR_PARTS.has(t.name)) continue;
    out.push(t.value === undefined ? `--${t.name}` : `--${t.name}=${PATH_OPTIONS.has(t.name) ? resolve(cwd, t.value) : t.value}`);
  }
  return out;
}

/** What the analysis of the largest file needs, bytes, by the estimate --max-memory checks (0 when no file opens). */
export async function largestNeedBytes(paths: readonly string[]): Promise<number> {
  let largest = 0;
  const width = 8;
  for (let start = 0; start < paths.length; start += width) {
    const infos = await Promise.all(paths.slice(start, start + width).map((p) => stackInfoOf(p)));
    for (const i of infos) {
      if (i) largest = Math.max(largest, analysisBytesEstimate(i.sizeX, i.sizeY, i.sizeC, i.sampleType, i.samplesPerPixel) + WORKER_BASE_BYTES);
    }
  }
  return largest;
}

/** What `--slurm` needs besides the batch plan. */
export interface SlurmRequest {
  readonly folder: string;
  readonly outDir: string;
  readonly parts: number;
  readonly cpusPerTask: number;
  readonly optionsText: string | null;
  readonly batchArgs: readonly string[];
  readonly mergeArgs: readonly string[];
  readonly nodePath: string;
  readonly cliPath: string;
}

/** Size the tasks from the input folder, write both scripts into the output folder (and its slurm-logs/), return the plan. */
export async function writeSlurmScripts(req: SlurmRequest): Promise<{ plan: SlurmPlan; arrayPath: string; mergePath: string }> {
  const userDirectives = req.optionsText === null ? [] : parseSlurmOptions(req.optionsText);
  const files = await listStackFiles(req.folder, [req.outDir]);
  const stats = (await sizedFiles(files)).map((f) => f.bytes);
  const largest = await largestNeedBytes(files.map((f) => f.path));
  const plan: SlurmPlan = {
    folder: req.folder, outDir: req.outDir, parts: req.parts, cpusPerTask: req.cpusPerTask, memPerCpuMiB: memPerCpuMiB(largest),
    mergeMemMiB: mergeMemMiB(files.length), nodePath: req.nodePath, cliPath: req.cliPath, batchArgs: req.batchArgs, mergeArgs: req.mergeArgs,
    userDirectives, fileCount: files.length, inputBytes: stats.reduce((a, b) => a + b, 0), largestNeedBytes: largest,
    writtenAt: new Date().toISOString(),
  };
  await fs.mkdir(join(req.outDir, 'slurm-logs'), { recursive: true });
  const arrayPath = join(req.outDir, 'eggline-array.sbatch');
  const mergePath = join(req.outDir, 'eggline-merge.sbatch');
  await writeFileAtomic(arrayPath, arrayScript(plan));
  await writeFileAtomic(mergePath, mergeScript(plan));
  await fs.chmod(arrayPath, 0o755);
  await fs.chmod(mergePath, 0o755);
  return { plan, arrayPath, mergePath };
}

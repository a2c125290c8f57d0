// A real one-node Slurm cluster on this machine: `eggline batch --slurm 4` on the demo data, both scripts submitted
// with sbatch --wait, and the merged tables compared with a one-machine run. Needs root, Linux, and Debian's
// slurmctld, slurmd, slurm-client and munge (.ci/run installs them); elsewhere the test says why and is skipped.
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { chmodSync, chownSync, existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { hostname, tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cli, ensureBuilt } from '../cli/helpers';

const BINARIES = ['slurmctld', 'slurmd', 'sbatch', 'sinfo', 'munged', 'mungekey'];

function which(name: string): string | null {
  for (const dir of (process.env.PATH ?? '').split(':').concat(['/usr/sbin', '/usr/bin', '/sbin', '/bin'])) {
    if (dir && existsSync(join(dir, name))) return join(dir, name);
  }
  return null;
}

function mungeIds(): { uid: number; gid: number } | null {
  const line = readFileSync('/etc/passwd', 'utf8').split('\n').find((l) => l.startsWith('munge:'));
  if (!line) return null;
  const f = line.split(':');
  return { uid: Number(f[2]), gid: Number(f[3]) };
}

/** Why this machine cannot run the test, or null. */
function skipReason(): string | null {
  if (process.platform !== 'linux') return `not Linux (${process.platform})`;
  if (process.getuid?.() !== 0) return 'not root (the one-node cluster runs slurmd as root and munged as the munge user)';
  const absent = BINARIES.filter((b) => which(b) === null);
  if (absent.length > 0) return `not installed: ${absent.join(', ')} (apt-get install slurmctld slurmd slurm-client munge)`;
  if (mungeIds() === null) return 'no munge user (the munge package creates it)';
  return null;
}

const reason = skipReason();
if (reason) console.log(`Slurm cluster test skipped: ${reason}`);

const dir = mkdtempSync(join(tmpdir(), 'eggline-slurm-'));
const daemons: ChildProcess[] = [];
const conf = join(dir, 'slurm.conf');
const env = { ...process.env, SLURM_CONF: conf };

/** Stop the daemons this test started, by their pids; safe to call more than once and from an exit handler. */
function stopDaemons(): void {
  for (const d of daemons.splice(0).reverse()) {
    if (d.pid !== undefined && d.exitCode === null && d.signalCode === null) {
      try { process.kill(d.pid, 'SIGTERM'); } catch { /* already gone */ }
    }
  }
}
const onSignal = (sig: NodeJS.Signals): void => { stopDaemons(); process.exit(sig === 'SIGINT' ? 130 : 143); };

function start(name: string, args: string[], ids?: { uid: number; gid: number }): ChildProcess {
  const log = join(dir, `${name}.out`);
  const child = spawn(which(name) as string, args, { env, stdio: ['ignore', 'pipe', 'pipe'], ...(ids ?? {}) });
  const append = (b: Buffer): void => { writeFileSync(log, b, { flag: 'a' }); };
  child.stdout?.on('data', append);
  child.stderr?.on('data', append);
  daemons.push(child);
  return child;
}

async function until(what: string, test: () => boolean, seconds: number): Promise<void> {
  const end = Date.now() + seconds * 1000;
  while (!test()) {
    if (Date.now() > end) throw new Error(`${what} within ${seconds} s; logs: ${logs()}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

/** The tails of every log, for a failure message that says what went wrong on CI. */
function logs(): string {
  const files = ['munged.out', 'slurmctld.out', 'slurmd.out', 'slurmctld.log', 'slurmd.log'].map((f) => join(dir, f));
  const slurmLogs = join(dir, 'cluster', 'slurm-logs');
  if (existsSync(slurmLogs)) files.push(...execFileSync('ls', [slurmLogs], { encoding: 'utf8' }).split('\n').filter(Boolean).map((f) => join(slurmLogs, f)));
  return files.filter(existsSync).map((f) => `\n--- ${f}\n${readFileSync(f, 'utf8').split('\n').slice(-15).join('\n')}`).join('');
}

function idle(): boolean {
  try {
    return execFileSync('sinfo', ['-h', '-o', '%T'], { env, encoding: 'utf8', timeout: 5000 }).trim() === 'idle';
  } catch {
    return false;
  }
}

/** slurm.conf for one node: this machine (its hardware as `slurmd -C` reports it), state and spool in the temp dir. */
function writeConf(socket: string): void {
  const host = hostname().split('.')[0];
  const node = execFileSync('slurmd', ['-C'], { env, encoding: 'utf8' }).split('\n').find((l) => l.startsWith('NodeName='));
  if (!node) throw new Error('slurmd -C printed no NodeName line');
  const port = 20_000 + Math.floor(Math.random() * 9000) * 2;
  // Source: slurm.conf(5) of Slurm 22.05 (the option names and values below); a minimal configuration as in its
  // "EXAMPLE" section, with the plug-ins that need no cgroups.
  writeFileSync(conf, [
    'ClusterName=eggline-test', `SlurmctldHost=${host}(127.0.0.1)`, `SlurmctldPort=${port}`, `SlurmdPort=${port + 1}`,
    'AuthType=auth/munge', `AuthInfo=socket=${socket}`, 'CredType=cred/munge', 'SlurmUser=root', 'SlurmdUser=root',
    `StateSaveLocation=${join(dir, 'state')}`, `SlurmdSpoolDir=${join(dir, 'spool')}`,
    `SlurmctldPidFile=${join(dir, 'slurmctld.pid')}`, `SlurmdPidFile=${join(dir, 'slurmd.pid')}`,
    `SlurmctldLogFile=${join(dir, 'slurmctld.log')}`, `SlurmdLogFile=${join(dir, 'slurmd.log')}`,
    'ProctrackType=proctrack/linuxproc', 'TaskPlugin=task/none', 'SelectType=select/cons_tres', 'SelectTypeParameters=CR_Core_Memory',
    'MpiDefault=none', 'ReturnToService=2', 'JobCompType=jobcomp/none', 'AccountingStorageType=accounting_storage/none',
    'JobAcctGatherType=jobacct_gather/none', 'SchedulerType=sched/backfill', 'MinJobAge=600', 'KillWait=5', 'InactiveLimit=0',
    `${node.trim()} NodeAddr=127.0.0.1 State=UNKNOWN`, 'PartitionName=eggline Nodes=ALL Default=YES MaxTime=INFINITE State=UP', '',
  ].join('\n'));
}

describe.skipIf(reason !== null)('eggline on a one-node Slurm cluster', () => {
  const demo = join(dir, 'demo');
  const single = join(dir, 'single');
  const cluster = join(dir, 'cluster');

  beforeAll(async () => {
    process.once('exit', stopDaemons);
    process.once('SIGINT', onSignal);
    process.once('SIGTERM', onSignal);
    ensureBuilt();
    chmodSync(dir, 0o755);
    const ids = mungeIds() as { uid: number; gid: number };
    const munge = join(dir, 'munge');
    for (const d of ['state', 'spool']) mkdirSync(join(dir, d));
    mkdirSync(munge, { mode: 0o755 });
    chownSync(munge, ids.uid, ids.gid);
    const key = join(munge, 'munge.key');
    execFileSync('mungekey', ['-c', '-k', key]);
    chownSync(key, ids.uid, ids.gid);
    chmodSync(key, 0o600);
    const socket = join(munge, 'munge.socket');
    start('munged', ['-F', `--key-file=${key}`, `--socket=${socket}`, `--pid-file=${join(munge, 'munged.pid')}`,
      `--log-file=${join(munge, 'munged.log')}`, `--seed-file=${join(munge, 'munged.seed')}`], ids);
    await until('munged did not create its socket', () => existsSync(socket), 15);
    writeConf(socket);
    start('slurmctld', ['-D', '-i', '-f', conf]);
    start('slurmd', ['-D', '-f', conf]);
    const demoRun = cli(['demo', demo, '--count', '8']);
    await until('the node did not become idle', idle, 30);
    expect((await demoRun).code).toBe(0);
    const one = await cli(['batch', demo, '--out', single, '--jobs', '2', '--samples', join(demo, 'samples.csv')], dir);
    expect(one.code, one.stderr).toBe(0);
  }, 120_000);

  afterAll(async () => {
    const running = daemons.filter((d) => d.exitCode === null && d.signalCode === null);
    stopDaemons();
    await Promise.all(running.map((d) => new Promise<void>((done) => {
      const timer = setTimeout(() => { try { process.kill(d.pid as number, 'SIGKILL'); } catch { /* gone */ } done(); }, 10_000);
      d.once('exit', () => { clearTimeout(timer); done(); });
    })));
    process.removeListener('exit', stopDaemons);
    process.removeListener('SIGINT', onSignal);
    process.removeListener('SIGTERM', onSignal);
    rmSync(dir, { recursive: true, force: true });
  }, 30_000);

  it('runs --slurm 4 as a job array and a merge job whose tables equal a one-machine run row for row', async () => {
    const r = await cli(['batch', demo, '--out', cluster, '--slurm', '4', '--jobs', '1', '--samples', join(demo, 'samples.csv')], dir);
    expect(r.code, r.stderr).toBe(0);
    // The two printed commands, each told to wait for its job.
    const commands = r.stdout.split('\n').map((l) => l.trim()).filter((l) => /^(jobid=|sbatch )/.test(l));
    expect(commands).toHaveLength(2);
    expect(commands[0]).toMatch(/^jobid=\$\(sbatch --parsable .*eggline-array\.sbatch\)$/);
    // Source: sbatch(1), --kill-on-invalid-dep=<yes|no>: a merge whose array failed is cancelled, not left pending.
    expect(commands[1]).toMatch(/^sbatch --dependency=afterok:\$\{jobid%%;\*\} --kill-on-invalid-dep=yes .*eggline-merge\.sbatch$/);
    const script = commands.map((c) => c.replace('sbatch ', 'sbatch --wait ')).join(' && \\\n');
    try {
      execFileSync('bash', ['-euc', script], { cwd: dir, env, timeout: 100_000, stdio: 'pipe' });
    } catch (e) {
      throw new Error(`the jobs failed: ${String((e as { stderr?: Buffer }).stderr ?? e)}${logs()}`);
    }
    for (const k of [1, 2, 3, 4]) expect(existsSync(join(cluster, 'parts', `${k}-of-4`, 'run.json')), logs()).toBe(true);
    for (const t of ['embryos.csv', 'boundaries.csv', 'profiles.csv', 'landmarks.csv', 'results.json', 'conditions.csv', 'shifts.csv', 'dosage_fit.csv']) {
      const got = readFileSync(join(cluster, t), 'utf8').split('\n');
      const want = readFileSync(join(single, t), 'utf8').split('\n');
      expect(got.length, t).toBe(want.length);
      got.forEach((row, i) => expect(row, `${t} row ${i}`).toBe(want[i]));
    }
    const merged = JSON.parse(readFileSync(join(cluster, 'run.json'), 'utf8')) as { complete: boolean; merge: { parts: number } };
    expect([merged.complete, merged.merge.parts]).toEqual([true, 4]);
  }, 120_000);
});

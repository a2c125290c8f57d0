// A pool of worker processes that analyses batch tasks. Each worker is a child process, not a thread: a damaged file
// can drive a decoder into a fatal V8 error or native out-of-memory that ends the whole process it runs in, and only a
// separate process keeps that to one file. A worker that crashes, is killed, overruns its time or its memory limit is
// replaced, and its file gets an error row; the batch always goes on to the next file. Workers watch their IPC
// channel and exit when this process goes away, so killing the batch never leaves them running.
import { fork, type ChildProcess } from 'node:child_process';
import { readFile } from 'node:fs/promises';
import { formatByteSize } from '../../core/batch';
import { errorResult } from '../../core/model';
import type { EmbryoResult } from '../../core/model';
import type { BatchTask, InputDigest, WorkerReply } from './task';
import type { TimeShape } from './timelapse-options';
import { mark } from './timeline';

/** How the pool's workers are started (known before the files are). */
export interface PoolStart {
  /** Number of worker processes (≥ 1). */
  readonly jobs: number;
  /** Path of the built worker script (dist/batch-worker.mjs). */
  readonly workerPath: string;
  /** Resident memory a worker may use, bytes; it is killed and its file gets an error row when it uses more. */
  readonly maxMemoryBytes?: number;
  /** Data handed to each worker at start (e.g. libvips threads per worker). */
  readonly workerData?: unknown;
  /** Node flags added to this process's own for each worker (before the script). */
  readonly execArgv?: readonly string[];
  /** Environment variables added to this process's environment for each worker. */
  readonly env?: Readonly<Record<string, string>>;
}

/** How the pool runs its tasks. */
export interface PoolRun {
  /** Per-file limit in milliseconds; the worker is killed and replaced when exceeded. */
  readonly timeoutMs: number;
  readonly signal?: AbortSignal;
  readonly onStart?: (task: BatchTask) => void;
  /** `input` is the file's digest when the worker computed it from the bytes it decoded; `shape` its time shape. */
  readonly onResult?: (task: BatchTask, result: EmbryoResult, input?: InputDigest | null, shape?: TimeShape | null) => void;
  /** Memory reports from workers (bytes), sent after each file. */
  readonly onMemory?: (report: Extract<WorkerReply, { type: 'memory' }>) => void;
}

/** Everything runPool needs. */
export type PoolOptions = PoolStart & PoolRun;

/** Workers started ahead of their files: each loads its code while the batch lists, hashes and orders the files. */
export interface WorkerPool {
  /** Analyse the tasks (once per pool); resolves with results by task index (missing = not run because cancelled).
   *  Workers beyond the number of tasks are stopped; the pool is closed when it resolves. */
  run(tasks: readonly BatchTask[], options: PoolRun): Promise<(EmbryoResult | undefined)[]>;
  /** Stop every worker without running anything (the batch stopped before handing out its files). */
  close(): void;
}

/** How often a worker's resident memory is read, ms. */
const MEMORY_POLL_MS = 100;
/** Bytes of a worker's stderr kept for the error message of a crash. */
const STDERR_KEEP = 4096;

/** Resident memory of a process in bytes from /proc (Linux), or null where that cannot be read. */
export async function residentBytes(pid: number): Promise<number | null> {
  const text = await readFile(`/proc/${pid}/status`, 'utf8').catch(() => null);
  const kb = text?.match(/^VmRSS:\s+(\d+)\s+kB/m)?.[1];
  return kb === undefined ? null : Number(kb) * 1024;
}

/** The reason a worker died, from how it exited and the last lines it wrote to stderr (V8 and Node print why). */
export function deathReason(code: number | null, signal: NodeJS.Signals | null, stderr: string): string {
  if (/heap out of memory|Reached heap limit|Allocation failed|invalid (array|table|string) size|invalid size error|Array buffer allocation failed/i.test(stderr)) {
    return 'the analysis ran out of memory and was stopped (the file may be damaged, or raise the limit with --max-memory)';
  }
  // Node prints the source line, a caret, the error, its stack and its own version; keep the error's line.
  const line = stderr.split(/\r?\n/).map((l) => l.trim().replace(/^#\s*/, '')).find((l) => /^(\w*(Error|Exception)\b|FATAL|Fatal)/.test(l));
  const how = signal ? `ended by ${signal}` : `exit code ${code ?? 'unknown'}`;
  return `the analysis crashed (${how}${line ? `: ${line}` : ''})`;
}

/** V8's heap limit for a worker: half its memory limit (pixels live outside the heap, in typed arrays), so a
 *  runaway JavaScript array ends in V8's own out-of-memory report rather than in the resident-memory check. */
export function heapLimitArgs(maxMemoryBytes: number | undefined): string[] {
  return maxMemoryBytes === undefined ? [] : [`--max-old-space-size=${Math.max(64, Math.floor(maxMemoryBytes / 2 ** 21))}`];
}

interface Slot {
  readonly child: ChildProcess;
  timer: NodeJS.Timeout | null;
  task: BatchTask | null;
  stderr: string;
  killedFor: string | null;
  /** Stopped because nothing was left to do (its exit is no failure). */
  idle: boolean;
}

/** Start `jobs` workers now; hand them tasks with `run`. */
export function openPool(start: PoolStart): WorkerPool {
  const slots = new Set<Slot>();
  /** The run in progress, once `run` was called. */
  let current: {
    readonly tasks: readonly BatchTask[]; readonly options: PoolRun; readonly results: (EmbryoResult | undefined)[];
    next: number; active: number; readonly done: () => void;
  } | null = null;
  let finished = false;
  let poll: NodeJS.Timeout | null = null;
  const finish = (): void => {
    if (finished) return;
    finished = true;
    current?.options.signal?.removeEventListener('abort', onAbort);
    if (poll) clearInterval(poll);
    for (const s of slots) {
      if (s.timer) clearTimeout(s.timer);
      s.child.kill('SIGKILL');
    }
    slots.clear();
    current?.done();
  };
  const onAbort = (): void => finish();
  const settle = (slot: Slot, result: EmbryoResult, input: InputDigest | null = null, shape: TimeShape | null = null): void => {
    const task = slot.task;
    if (!task || finished || !current) return;
    slot.task = null;
    if (slot.timer) clearTimeout(slot.timer);
    slot.timer = null;
    current.results[task.index] = result;
    current.active -= 1;
    current.options.onResult?.(task, result, input, shape);
  };
  const kill = (slot: Slot, why: string): void => {
    if (slot.killedFor !== null) return;
    slot.killedFor = why;
    slot.child.kill('SIGKILL');
  };
  /** Give the slot its next task; a slot with nothing left to do is stopped, and the last one ends the run. */
  const feed = (slot: Slot): void => {
    if (finished || !current) return;
    const run = current;
    if (run.next >= run.tasks.length) {
      slot.idle = true;
      slots.delete(slot);
      slot.child.kill('SIGKILL');
      if (run.active === 0) finish();
      return;
    }
    const task = run.tasks[run.next];
    run.next += 1;
    run.active += 1;
    slot.task = task;
    slot.stderr = '';
    run.options.onStart?.(task);
    slot.timer = setTimeout(() => kill(slot, `timed out after ${Math.round(run.options.timeoutMs / 1000)} s (the file may be damaged or too large)`), run.options.timeoutMs);
    slot.child.send(task, (e) => { if (e) kill(slot, `the analysis could not be started (${e.message})`); });
  };
  const spawn = (): void => {
    mark('worker started');
    const child = fork(start.workerPath, [], {
      execArgv: [...process.execArgv, ...(start.execArgv ?? []), ...heapLimitArgs(start.maxMemoryBytes)], serialization: 'advanced', stdio: ['ignore', 'inherit', 'pipe', 'ipc'],
      env: { ...process.env, ...start.env, ELECTRON_RUN_AS_NODE: '1', EGGLINE_WORKER_DATA: JSON.stringify(start.workerData ?? null) },
    });
    const slot: Slot = { child, timer: null, task: null, stderr: '', killedFor: null, idle: false };
    slots.add(slot);
    child.stderr?.setEncoding('utf8');
    child.stderr?.on('data', (d: string) => { slot.stderr = (slot.stderr + d).slice(-STDERR_KEEP); });
    let gone = false;
    const replace = (message: string): void => {
      if (gone || slot.idle) return;
      gone = true;
      slots.delete(slot);
      if (slot.task) settle(slot, errorResult(slot.task.file, `${slot.task.file}: ${message}`));
      child.kill('SIGKILL');
      // Before the run, a worker that died is simply not there; run() starts what is missing.
      if (finished || !current) return;
      if (current.next < current.tasks.length) spawn();
      else if (current.active === 0) finish();
    };
    child.on('message', (msg: WorkerReply) => {
      if (msg.type === 'memory') { current?.options.onMemory?.(msg); return; }
      if (msg.type !== 'result' || slot.task?.index !== msg.index) return;
            settle(slot, msg.result, msg.input ?? null, msg.shape ?? null);
      feed(slot);
    });
    child.on('error', (e) => replace(`the analysis could not run (${e.message.split(/\r?\n/)[0]})`));
    // 'close' comes after stderr has ended, so the reason can quote the worker's last words.
    child.on('close', (code, signal) => replace(slot.killedFor ?? deathReason(code, signal, slot.stderr)));
    if (current) feed(slot);
  };
  const watchMemory = (limit: number): void => {
    poll = setInterval(() => {
      for (const s of slots) {
        const pid = s.child.pid;
        if (pid === undefined || s.task === null) continue;
        void residentBytes(pid).then((rss) => {
          if (rss !== null && rss > limit && s.task !== null) {
            kill(s, `used more than ${formatByteSize(limit)} of memory and was stopped (the file may be damaged, or raise the limit with --max-memory)`);
          }
        });
      }
    }, MEMORY_POLL_MS);
    poll.unref();
  };
  for (let i = 0; i < start.jobs; i += 1) spawn();
  return {
    run(tasks, options) {
      if (current) throw new Error('a worker pool runs once');
      return new Promise((resolveAll) => {
        const results: (EmbryoResult | undefined)[] = new Array(tasks.length);
        current = { tasks, options, results, next: 0, active: 0, done: () => resolveAll(results) };
        if (finished) { resolveAll(results); return; }
        if (options.signal?.aborted || tasks.length === 0) { finish(); return; }
        options.signal?.addEventListener('abort', onAbort);
        if (start.maxMemoryBytes !== undefined) watchMemory(start.maxMemoryBytes);
        for (const slot of [...slots]) feed(slot);
        for (let i = slots.size; i < Math.min(start.jobs, tasks.length) && current.next < tasks.length; i += 1) spawn();
      });
    },
    close: finish,
  };
}

/** Run every task on a pool of `opts.jobs` workers (fewer for fewer tasks); resolves with results by task index
 *  (missing entries = not run because cancelled). */
export function runPool(tasks: readonly BatchTask[], opts: PoolOptions): Promise<(EmbryoResult | undefined)[]> {
  return openPool({ ...opts, jobs: Math.min(opts.jobs, tasks.length) }).run(tasks, opts);
}

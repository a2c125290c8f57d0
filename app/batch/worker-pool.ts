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

/** How the pool runs. */
export interface PoolOptions {
  /** Number of worker processes (≥ 1). */
  readonly jobs: number;
  /** Path of the built worker script (dist/batch-worker.mjs). */
  readonly workerPath: string;
  /** Per-file limit in milliseconds; the worker is killed and replaced when exceeded. */
  readonly timeoutMs: number;
  /** Resident memory a worker may use, bytes; it is killed and its file gets an error row when it uses more. */
  readonly maxMemoryBytes?: number;
  readonly signal?: AbortSignal;
  /** Data handed to each worker at start (e.g. libvips threads per worker). */
  readonly workerData?: unknown;
  readonly onStart?: (task: BatchTask) => void;
  /** `input` is the file's digest when the worker computed it from the bytes it decoded. */
  readonly onResult?: (task: BatchTask, result: EmbryoResult, input?: InputDigest | null) => void;
  /** Memory reports from workers (bytes), sent after each file. */
  readonly onMemory?: (report: Extract<WorkerReply, { type: 'memory' }>) => void;
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
}

/** Run every task on the pool; resolves with results by task index (missing entries = not run because cancelled). */
export function runPool(tasks: readonly BatchTask[], opts: PoolOptions): Promise<(EmbryoResult | undefined)[]> {
  const results: (EmbryoResult | undefined)[] = new Array(tasks.length);
  let next = 0;
  let active = 0;
  const slots = new Set<Slot>();
  return new Promise((resolveAll) => {
    let finished = false;
    let poll: NodeJS.Timeout | null = null;
    const finish = (): void => {
      if (finished) return;
      finished = true;
      opts.signal?.removeEventListener('abort', onAbort);
      if (poll) clearInterval(poll);
      for (const s of slots) {
        if (s.timer) clearTimeout(s.timer);
        s.child.kill('SIGKILL');
      }
      slots.clear();
      resolveAll(results);
    };
    const onAbort = (): void => finish();
    const settle = (slot: Slot, result: EmbryoResult, input: InputDigest | null = null): void => {
      const task = slot.task;
      if (!task || finished) return;
      slot.task = null;
      if (slot.timer) clearTimeout(slot.timer);
      slot.timer = null;
      results[task.index] = result;
      active -= 1;
      opts.onResult?.(task, result, input);
    };
    const kill = (slot: Slot, why: string): void => {
      if (slot.killedFor !== null) return;
      slot.killedFor = why;
      slot.child.kill('SIGKILL');
    };
    const spawn = (): void => {
      const child = fork(opts.workerPath, [], {
        execArgv: [...process.execArgv, ...heapLimitArgs(opts.maxMemoryBytes)], serialization: 'advanced', stdio: ['ignore', 'inherit', 'pipe', 'ipc'],
        env: { ...process.env, ELECTRON_RUN_AS_NODE: '1', EGGLINE_WORKER_DATA: JSON.stringify(opts.workerData ?? null) },
      });
      const slot: Slot = { child, timer: null, task: null, stderr: '', killedFor: null };
      slots.add(slot);
      child.stderr?.setEncoding('utf8');
      child.stderr?.on('data', (d: string) => { slot.stderr = (slot.stderr + d).slice(-STDERR_KEEP); });
      let gone = false;
      const replace = (message: string): void => {
        if (gone) return;
        gone = true;
        slots.delete(slot);
        if (slot.task) settle(slot, errorResult(slot.task.file, `${slot.task.file}: ${message}`));
        child.kill('SIGKILL');
        if (!finished && next < tasks.length) spawn();
        else if (active === 0) finish();
      };
      child.on('message', (msg: WorkerReply) => {
        if (msg.type === 'memory') { opts.onMemory?.(msg); return; }
        if (msg.type !== 'result' || slot.task?.index !== msg.index) return;
        settle(slot, msg.result, msg.input ?? null);
        feed();
      });
      child.on('error', (e) => replace(`the analysis could not run (${e.message.split(/\r?\n/)[0]})`));
      // 'close' comes after stderr has ended, so the reason can quote the worker's last words.
      child.on('close', (code, signal) => replace(slot.killedFor ?? deathReason(code, signal, slot.stderr)));
      const feed = (): void => {
        if (finished) return;
        if (next >= tasks.length) {
          if (active === 0) finish();
          return;
        }
        const task = tasks[next];
        next += 1;
        active += 1;
        slot.task = task;
        slot.stderr = '';
        opts.onStart?.(task);
        slot.timer = setTimeout(() => kill(slot, `timed out after ${Math.round(opts.timeoutMs / 1000)} s (the file may be damaged or too large)`), opts.timeoutMs);
        child.send(task, (e) => { if (e) kill(slot, `the analysis could not be started (${e.message})`); });
      };
      feed();
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
    if (opts.signal?.aborted) { finish(); return; }
    opts.signal?.addEventListener('abort', onAbort);
    if (tasks.length === 0) { finish(); return; }
    if (opts.maxMemoryBytes !== undefined) watchMemory(opts.maxMemoryBytes);
    for (let i = 0; i < Math.min(opts.jobs, tasks.length); i += 1) spawn();
  });
}

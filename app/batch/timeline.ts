// A timeline of a batch for measuring where its wall time goes: with EGGLINE_TIMELINE=<file> set, the command line,
// the batch and every worker append one line per step to that file ("TL <ms since 1970> <pid> <step>"); unset,
// nothing is written. A developer's tool (DEVELOPERS.md, "Benchmarks"); it changes no output.
import { appendFileSync } from 'node:fs';

/** Appends `step` with the current time to the timeline file, when one is set. */
export function mark(step: string): void {
  const file = process.env.EGGLINE_TIMELINE;
  if (file) appendFileSync(file, `TL ${(performance.timeOrigin + performance.now()).toFixed(1)} ${process.pid} ${step}\n`);
}

/** Appends this process's start (before Node loaded any code), when a timeline file is set. */
export function markProcessStart(): void {
  const file = process.env.EGGLINE_TIMELINE;
  if (file) appendFileSync(file, `TL ${performance.timeOrigin.toFixed(1)} ${process.pid} process start\n`);
}

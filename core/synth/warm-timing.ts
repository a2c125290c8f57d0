// Timing helper for the micro-benchmarks (*.bench.ts): warm median wall and CPU time of one call.

/** Median of a list of numbers (sorted copy; the upper middle for an even count). */
function median(values: readonly number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return s[s.length >> 1];
}

/**
 * Warm median wall and CPU time (ms) of one call: three warm-up calls, then repeats until budgetMs has passed (at
 * least 5, at most 40 calls). CPU time (process.cpuUsage) is given beside wall time because machines are shared.
 */
export function warmTiming(run: () => unknown, budgetMs = 400): { wallMs: number; cpuMs: number } {
  for (let i = 0; i < 3; i++) run();
  const wall: number[] = [];
  const cpu: number[] = [];
  const start = performance.now();
  while (wall.length < 5 || (wall.length < 40 && performance.now() - start < budgetMs)) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    run();
    wall.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  return { wallMs: median(wall), cpuMs: median(cpu) };
}

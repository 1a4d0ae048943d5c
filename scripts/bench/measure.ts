import { performance } from 'node:perf_hooks';

export interface Timing {
  p50: number;
  p95: number;
  min: number;
  runs: number;
}

/**
 * Runs `fn` `warmup` times untimed, then `runs` times, and reports milliseconds. `before`, when
 * given, runs untimed before each timed run (e.g. a change that makes the next run start cold).
 */
export async function measure(fn: () => unknown, runs = 30, warmup = 3, before?: () => unknown): Promise<Timing> {
  for (let i = 0; i < warmup; i++) await fn();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    if (before) await before();
    const t = performance.now();
    await fn();
    times.push(performance.now() - t);
  }
  times.sort((a, b) => a - b);
  const at = (q: number) => times[Math.min(times.length - 1, Math.ceil(q * times.length) - 1)];
  return { p50: at(0.5), p95: at(0.95), min: times[0], runs };
}

export const ms = (n: number) => `${n.toFixed(1)} ms`;

export function row(label: string, t: Timing, extra = '') {
  console.log(`  ${label.padEnd(46)} p50 ${ms(t.p50).padStart(10)}  p95 ${ms(t.p95).padStart(10)}${extra ? `  ${extra}` : ''}`);
}

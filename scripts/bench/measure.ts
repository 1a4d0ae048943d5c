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
  return summarise(times);
}

/**
 * Times several things in turns (one run of each per round, the order rotated each round), so
 * each sees the same machine conditions and their ratios are not skewed by a busy moment that
 * fell on one of them. Reports each like {@link measure}.
 */
export async function measureTogether<K extends string>(fns: Record<K, () => unknown>, runs = 30, warmup = 3): Promise<Record<K, Timing>> {
  const keys = Object.keys(fns) as K[];
  for (let i = 0; i < warmup; i++) for (const k of keys) await fns[k]();
  const times = Object.fromEntries(keys.map((k) => [k, [] as number[]])) as Record<K, number[]>;
  for (let i = 0; i < runs; i++) {
    for (let j = 0; j < keys.length; j++) {
      const k = keys[(i + j) % keys.length];
      const t = performance.now();
      await fns[k]();
      times[k].push(performance.now() - t);
    }
  }
  return Object.fromEntries(keys.map((k) => [k, summarise(times[k])])) as Record<K, Timing>;
}

function summarise(times: number[]): Timing {
  times.sort((a, b) => a - b);
  const at = (q: number) => times[Math.min(times.length - 1, Math.ceil(q * times.length) - 1)];
  return { p50: at(0.5), p95: at(0.95), min: times[0], runs: times.length };
}

export const ms = (n: number) => `${n.toFixed(1)} ms`;

export function row(label: string, t: Timing, extra = '') {
  console.log(`  ${label.padEnd(46)} p50 ${ms(t.p50).padStart(10)}  p95 ${ms(t.p95).padStart(10)}${extra ? `  ${extra}` : ''}`);
}

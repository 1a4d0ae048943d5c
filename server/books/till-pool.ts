import { Piscina } from 'piscina';
import type { TillTaskInput, TillTaskResult } from './till-task';

/**
 * Reading and matching a till file runs in worker threads (piscina), never on the event loop:
 * a 10 MB file with thousands of items takes seconds of CPU, and the server must go on
 * answering meanwhile. One small pool per process, started on first use; idle threads stop
 * after a minute (and never keep the process alive).
 */
let pool: Piscina | null = null;

export function runInWorker(input: TillTaskInput): Promise<TillTaskResult> {
  pool ??= new Piscina({
    filename: new URL('./till-worker.mjs', import.meta.url).href,
    minThreads: 0,
    maxThreads: 2,
    idleTimeout: 60_000,
    // Below the event loop's thread: a busy machine gives the CPU to answering requests first.
    niceIncrement: 10,
  });
  return pool.run(input) as Promise<TillTaskResult>;
}

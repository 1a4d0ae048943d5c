import type { Logger } from './logger';

/**
 * Work done after the answer has gone (an e-mail whose sending must not show in the answer's
 * timing). Failures are logged, never thrown at nobody; `idle()` waits for what is under way,
 * for a clean shutdown and for tests that check what it did.
 */
export class Background {
  private readonly pending = new Set<Promise<void>>();

  constructor(private readonly logger: Logger) {}

  run(name: string, work: () => Promise<void>): void {
    const p = (async () => {
      try {
        await work();
      } catch (err) {
        this.logger.error({ err, task: name }, 'background task failed');
      }
    })();
    this.pending.add(p);
    void p.finally(() => this.pending.delete(p));
  }

  async idle(): Promise<void> {
    while (this.pending.size > 0) await Promise.all([...this.pending]);
  }
}

import type { MailSender } from './mail-sender';

/**
 * Runs the outbox sender (and the staff reminder scan) in the server process: every `intervalMs` it sends until
 * nothing is due. Several server processes may each run one; SKIP LOCKED keeps them off each other's rows.
 */
export class MailWorker {
  private timer: NodeJS.Timeout | null = null;
  private running: Promise<unknown> | null = null;
  private stopped = false;

  constructor(
    private readonly sender: MailSender,
    private readonly periodic: Array<() => Promise<unknown>> = [],
    private readonly intervalMs = 2000,
  ) {}

  start() {
    if (!this.sender.enabled || this.timer) return;
    this.timer = setInterval(() => void this.tick(), this.intervalMs);
    this.timer.unref();
    void this.tick();
  }

  /** One round: the periodic scans, then the outbox until empty. */
  tick(): Promise<unknown> {
    this.running ??= (async () => {
      for (const scan of this.periodic) await scan();
      await this.sender.drain(() => this.stopped);
    })()
      .catch((error: Error) => console.error(`[mail] sending paused: ${error.message}`))
      .finally(() => {
        this.running = null;
      });
    return this.running;
  }

  async stop() {
    this.stopped = true;
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
    await this.running;
  }
}

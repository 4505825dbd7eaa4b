import type { z } from 'zod';
import type { Clock } from './clock';

/** What a handler is given: the job (payload already checked by the kind's schema) and the runner's clock. */
export interface JobContext<P> {
  job: { id: string; kind: string; uniqueKey: string | null; payload: P; attempts: number; runAt: Date };
  /** The runner's time when the job was claimed. */
  now: Date;
  clock: Clock;
}

export type JobHandler<P> = (context: JobContext<P>) => Promise<void>;

export interface JobKind<P> {
  /** Checks the stored payload before the handler sees it; a payload that fails is a permanent failure. */
  payload: z.ZodType<P>;
  handler: JobHandler<P>;
  /** Attempts before the job is marked failed (default: the row's max_attempts). */
  maxAttempts?: number;
  /** Delay before attempt n+1 after n failed attempts; default 5 s doubling, at most one hour. */
  backoffMs?: (attempts: number) => number;
}

/** A handler asks to be tried again after a given delay (for example a mail relay that said "later"). */
export class RetryJobLater extends Error {
  constructor(
    message: string,
    readonly delayMs: number,
  ) {
    super(message);
    this.name = 'RetryJobLater';
  }
}

/** A failure that another attempt cannot fix: the job is marked failed at once. */
export class PermanentJobError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'PermanentJobError';
  }
}

export function defaultBackoffMs(attempts: number): number {
  return Math.min(5_000 * 2 ** Math.max(0, attempts - 1), 60 * 60_000);
}

/** The handlers a runner knows, by kind. A runner claims only the kinds it has a handler for. */
export class JobRegistry {
  private readonly kinds = new Map<string, JobKind<unknown>>();

  register<P>(kind: string, spec: JobKind<P>): this {
    if (this.kinds.has(kind)) throw new Error(`A handler for the job kind “${kind}” is already registered.`);
    this.kinds.set(kind, spec as JobKind<unknown>);
    return this;
  }

  get(kind: string): JobKind<unknown> | undefined {
    return this.kinds.get(kind);
  }

  kindNames(): string[] {
    return [...this.kinds.keys()];
  }
}

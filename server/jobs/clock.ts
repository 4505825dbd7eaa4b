/** Where jobs and publishing read the time, so tests can move it. */
export interface Clock {
  now(): Date;
}

export const systemClock: Clock = { now: () => new Date() };

/** A clock that stands still until told to move: tests set it just before or just after a due time. */
export class ManualClock implements Clock {
  private instant: number;

  constructor(start: Date | string | number = Date.now()) {
    this.instant = new Date(start).getTime();
  }

  now(): Date {
    return new Date(this.instant);
  }

  set(instant: Date | string | number): void {
    this.instant = new Date(instant).getTime();
  }

  advance(milliseconds: number): void {
    this.instant += milliseconds;
  }
}

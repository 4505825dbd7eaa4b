// Wall-clock time in an IANA zone ↔ UTC instant, with the runtime's time zone database (Intl), whatever the
// process's own TZ. An embargo is entered as a date, a time and a zone; the instant is what the job runner keys on.

export interface LocalDateTime {
  /** YYYY-MM-DD */
  date: string;
  /** HH:MM or HH:MM:SS, 24-hour */
  time: string;
  timeZone: string;
}

export type ZonedInstant =
  | { ok: true; instant: Date; offsetMinutes: number; ambiguous: boolean }
  | { ok: false; reason: 'invalid-date' | 'invalid-time' | 'invalid-zone' | 'skipped'; message: string };

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterFor(timeZone: string): Intl.DateTimeFormat {
  let formatter = formatters.get(timeZone);
  if (!formatter) {
    formatter = new Intl.DateTimeFormat('en-US', {
      timeZone,
      hourCycle: 'h23',
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      second: '2-digit',
    });
    formatters.set(timeZone, formatter);
  }
  return formatter;
}

/** The wall clock in the zone at an instant, as its parts. */
export function wallClockAt(timeZone: string, instant: Date) {
  const parts = formatterFor(timeZone).formatToParts(instant);
  const part = (type: string) => Number(parts.find((p) => p.type === type)?.value);
  return {
    year: part('year'),
    month: part('month'),
    day: part('day'),
    hour: part('hour'),
    minute: part('minute'),
    second: part('second'),
  };
}

/** Minutes the zone is ahead of UTC at an instant (e.g. +60 for Central European Time, −420 for PDT). */
export function zoneOffsetMinutes(timeZone: string, instant: Date): number {
  const wall = wallClockAt(timeZone, instant);
  const asUtc = Date.UTC(wall.year, wall.month - 1, wall.day, wall.hour, wall.minute, wall.second);
  const whole = Math.floor(instant.getTime() / 1000) * 1000;
  return Math.round((asUtc - whole) / 60_000);
}

export function isKnownTimeZone(timeZone: string): boolean {
  try {
    formatterFor(timeZone);
    return true;
  } catch {
    return false;
  }
}

/**
 * The instant a local date and time names in a zone. A time inside a spring-forward gap does not exist there and
 * is refused with words saying so; a time that happens twice (the hour repeated when clocks go back) is the first
 * of the two, and `ambiguous` says it was a choice.
 */
export function zonedTimeToInstant({ date, time, timeZone }: LocalDateTime): ZonedInstant {
  const dateMatch = /^(\d{4})-(\d{2})-(\d{2})$/.exec(date);
  if (!dateMatch) return { ok: false, reason: 'invalid-date', message: 'Enter the date as YYYY-MM-DD.' };
  const [year, month, day] = dateMatch.slice(1).map(Number);
  const probe = new Date(Date.UTC(year, month - 1, day));
  if (probe.getUTCFullYear() !== year || probe.getUTCMonth() !== month - 1 || probe.getUTCDate() !== day) {
    return { ok: false, reason: 'invalid-date', message: `${date} is not a date on the calendar.` };
  }
  const timeMatch = /^([01]\d|2[0-3]):([0-5]\d)(?::([0-5]\d))?$/.exec(time);
  if (!timeMatch) return { ok: false, reason: 'invalid-time', message: 'Enter the time as HH:MM (24-hour clock).' };
  if (!isKnownTimeZone(timeZone)) {
    return { ok: false, reason: 'invalid-zone', message: `“${timeZone}” is not a time zone name this server knows.` };
  }
  const hour = Number(timeMatch[1]);
  const minute = Number(timeMatch[2]);
  const second = Number(timeMatch[3] ?? 0);
  const wallAsUtc = Date.UTC(year, month - 1, day, hour, minute, second);

  // Every instant whose wall clock reads this date and time: try the offsets in force a day either side.
  const offsets = new Set([
    zoneOffsetMinutes(timeZone, new Date(wallAsUtc - 86_400_000)),
    zoneOffsetMinutes(timeZone, new Date(wallAsUtc)),
    zoneOffsetMinutes(timeZone, new Date(wallAsUtc + 86_400_000)),
  ]);
  const matches = [...offsets]
    .map((offset) => ({ offset, instant: new Date(wallAsUtc - offset * 60_000) }))
    .filter(({ offset, instant }) => zoneOffsetMinutes(timeZone, instant) === offset)
    .sort((a, b) => a.instant.getTime() - b.instant.getTime());
  if (matches.length === 0) {
    return {
      ok: false,
      reason: 'skipped',
      message: `${time} does not exist on ${date} in ${timeZone}: the clocks jump forward over it. Choose another time.`,
    };
  }
  return { ok: true, instant: matches[0].instant, offsetMinutes: matches[0].offset, ambiguous: matches.length > 1 };
}

/** The local date and time an instant shows in a zone: HH:MM, or HH:MM:SS when the seconds are not zero. */
export function instantToZonedTime(instant: Date, timeZone: string): LocalDateTime {
  const wall = wallClockAt(timeZone, instant);
  const pad = (n: number) => String(n).padStart(2, '0');
  return {
    date: `${String(wall.year).padStart(4, '0')}-${pad(wall.month)}-${pad(wall.day)}`,
    time: `${pad(wall.hour)}:${pad(wall.minute)}${wall.second ? `:${pad(wall.second)}` : ''}`,
    timeZone,
  };
}

/** "UTC+05:30", "UTC−07:00": an offset as people read it. */
export function formatUtcOffset(offsetMinutes: number): string {
  const sign = offsetMinutes < 0 ? '−' : '+';
  const abs = Math.abs(offsetMinutes);
  return `UTC${sign}${String(Math.floor(abs / 60)).padStart(2, '0')}:${String(abs % 60).padStart(2, '0')}`;
}

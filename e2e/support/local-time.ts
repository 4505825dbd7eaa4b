import { wallClockAt } from '../../shared/domain/publishing/zoned-time';

/** The local date and HH:MM:SS of an instant in a zone, as the schedule form takes them. */
export function localIn(instant: Date, timeZone: string) {
  const wall = wallClockAt(timeZone, instant);
  const pad = (n: number) => String(n).padStart(2, '0');
  return {
    date: `${wall.year}-${pad(wall.month)}-${pad(wall.day)}`,
    time: `${pad(wall.hour)}:${pad(wall.minute)}:${pad(wall.second)}`,
  };
}

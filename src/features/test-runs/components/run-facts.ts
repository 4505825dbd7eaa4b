import { userTimeZone } from '../../../lib/format-time';

/** The value of a datetime-local input for now, in the tester's zone. */
export function localNow(): string {
  const now = new Date();
  const offset = now.getTimezoneOffset() * 60_000;
  return new Date(now.getTime() - offset).toISOString().slice(0, 16);
}

/** A datetime-local value read in the browser's zone, as an ISO instant; null when it is not a time. */
export function instantFromLocal(value: string): string | null {
  if (!value) return null;
  const date = new Date(value);
  return Number.isNaN(date.getTime()) ? null : date.toISOString();
}

export function zoneSentence(): string {
  return `Local time, ${userTimeZone()}.`;
}

/** Empty text is left out of a request. */
export function optionalText(value: string): string | undefined {
  const trimmed = value.trim();
  return trimmed ? trimmed : undefined;
}

import { formatInstant, userTimeZone, zoneAbbreviation } from '../../lib/format-time';

export interface DateTimeProps {
  /** An ISO 8601 instant from the API, or null. */
  value: string | null;
  /** Shown for null, e.g. "Never". */
  fallback?: string;
}

/** A time in the user's zone; the zone is in the tooltip, and pages name it once near their tables. */
export function DateTime({ value, fallback = '—' }: DateTimeProps) {
  if (!value) return <span className="text-muted">{fallback}</span>;
  return (
    <time dateTime={value} title={`${formatInstant(value)} ${zoneAbbreviation(value)} (${userTimeZone()})`}>
      {formatInstant(value)}
    </time>
  );
}

/** The line under a table of such times that names the zone they are in. */
export function DeviceTimeZoneNote() {
  return (
    <>
      Times are in <strong className="font-medium">{userTimeZone()}</strong>, the time zone of this device.
    </>
  );
}

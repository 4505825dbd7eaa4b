// iCalendar (RFC 5545) text for a read-only feed: a VCALENDAR of VEVENTs, each with UID, DTSTAMP and either
// DTSTART/DTEND in UTC or an all-day DTSTART/DTEND (VALUE=DATE). Text values are escaped (§3.3.11) and content
// lines are folded at 75 octets with CRLF and one space (§3.1), never inside a UTF-8 sequence.

export interface CalendarEvent {
  /** Globally unique and stable across fetches, so calendar apps update the event instead of adding it again. */
  uid: string;
  /** When this event's information was last created or changed (UTC). */
  stamp: Date;
  /** A timed event [start, end) in UTC, or an all-day event on calendar dates (YYYY-MM-DD, end exclusive). */
  when: { start: Date; end: Date } | { startDate: string; endDate: string };
  summary: string;
  description?: string;
  location?: string;
}

export interface Calendar {
  /** PRODID: who made the calendar, e.g. "-//Benchwire//Bench feed//EN". */
  productId: string;
  name: string;
  events: readonly CalendarEvent[];
}

/** Escapes a TEXT value: backslash, semicolon, comma and line breaks (RFC 5545 §3.3.11). */
export function escapeText(value: string): string {
  return value
    .replace(/\\/g, '\\\\')
    .replace(/;/g, '\\;')
    .replace(/,/g, '\\,')
    .replace(/\r\n|\r|\n/g, '\\n');
}

/** 20261203T090000Z (RFC 5545 §3.3.5, form 2: UTC). */
export function formatUtc(date: Date): string {
  return date
    .toISOString()
    .replace(/[-:]/g, '')
    .replace(/\.\d{3}/, '');
}

/** 20261203 from 2026-12-03 (RFC 5545 §3.3.4). */
function formatDate(date: string): string {
  return date.replace(/-/g, '');
}

const encoder = new TextEncoder();

/** Folds one content line into pieces of at most 75 octets, continuation lines starting with one space. */
export function foldLine(line: string): string {
  const pieces: string[] = [];
  let current = '';
  let octets = 0;
  for (const char of line) {
    const size = encoder.encode(char).length;
    // The first line holds 75 octets; a continuation line's leading space counts, leaving 74.
    const limit = pieces.length === 0 ? 75 : 74;
    if (octets + size > limit) {
      pieces.push(current);
      current = '';
      octets = 0;
    }
    current += char;
    octets += size;
  }
  pieces.push(current);
  return pieces.join('\r\n ');
}

/** The whole calendar as iCalendar text, CRLF line ends, ready to serve as text/calendar. */
export function formatCalendar(calendar: Calendar): string {
  const lines = [
    'BEGIN:VCALENDAR',
    'VERSION:2.0',
    `PRODID:${calendar.productId}`,
    'CALSCALE:GREGORIAN',
    'METHOD:PUBLISH',
    `X-WR-CALNAME:${escapeText(calendar.name)}`,
  ];
  for (const event of calendar.events) {
    lines.push('BEGIN:VEVENT', `UID:${event.uid}`, `DTSTAMP:${formatUtc(event.stamp)}`);
    if ('start' in event.when) {
      lines.push(`DTSTART:${formatUtc(event.when.start)}`, `DTEND:${formatUtc(event.when.end)}`);
    } else {
      lines.push(
        `DTSTART;VALUE=DATE:${formatDate(event.when.startDate)}`,
        `DTEND;VALUE=DATE:${formatDate(event.when.endDate)}`,
      );
    }
    lines.push(`SUMMARY:${escapeText(event.summary)}`);
    if (event.description) lines.push(`DESCRIPTION:${escapeText(event.description)}`);
    if (event.location) lines.push(`LOCATION:${escapeText(event.location)}`);
    lines.push('TRANSP:OPAQUE', 'END:VEVENT');
  }
  lines.push('END:VCALENDAR');
  return `${lines.map(foldLine).join('\r\n')}\r\n`;
}

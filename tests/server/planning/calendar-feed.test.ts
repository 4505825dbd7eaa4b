import { createHash, randomBytes } from 'node:crypto';
import ICAL from 'ical.js';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { CalendarFeedEntity } from '../../../server/entities/calendar-feed.entity';
import { signedInTeam, testApp, testDataSource, TEST_HOST, type TestApp } from '../support/test-app';
import { assignCells, bookBench, createBench, dayFromToday, roundupOnTheBench } from './support/planning-fixtures';

/** A note with every character RFC 5545 §3.3.11 escapes in TEXT: backslash, semicolon, comma and a line break. */
const awkwardNote = 'Probe 2; taped, re-seat first\nPath C:\\logs\\run-07 — about 90 characters so the line folds too';

async function setUp() {
  const { app, editor, tester, otherTester } = await signedInTeam();
  const { roundupId, matrix } = await roundupOnTheBench(editor.agent, { configurations: 2 });
  const cells = matrix.rows[0].cells;
  await assignCells(editor.agent, roundupId, { cellIds: [cells[0].id] }, tester.user.id, dayFromToday(4));
  await assignCells(editor.agent, roundupId, { cellIds: [cells[1].id] }, otherTester.user.id, dayFromToday(4));
  const benchId = await createBench(editor.agent, 'Lab, back room');
  const day = dayFromToday(2);
  const booking = await bookBench(tester.agent, benchId, {
    startsAt: `${day}T09:00:00Z`,
    endsAt: `${day}T12:30:00Z`,
    cellIds: [cells[0].id],
    note: awkwardNote,
  });
  const theirs = await bookBench(otherTester.agent, benchId, {
    startsAt: `${day}T13:00:00Z`,
    endsAt: `${day}T15:00:00Z`,
    cellIds: [cells[1].id],
  });
  return { app, tester, otherTester, cells, booking, theirs, day };
}

/** Fetches a feed the way a calendar app does: no cookie, no Origin. */
function fetchFeed(app: TestApp, path: string) {
  return request(app).get(path).set('Host', TEST_HOST);
}

describe('private calendar feed', () => {
  it('serves the tester’s bookings and due dates as iCalendar that a general-purpose parser reads', async () => {
    const { app, tester, cells, booking, theirs, day } = await setUp();
    expect((await tester.agent.get('/api/account/calendar-feed')).body).toEqual({ enabled: false, createdAt: null });
    const made = await tester.agent.post('/api/account/calendar-feed');
    expect(made.status, made.text).toBe(201);
    expect(made.headers['cache-control']).toBe('no-store');
    expect(made.body.path).toMatch(/^\/api\/calendar\/[A-Za-z0-9_-]{43}\.ics$/);
    expect((await tester.agent.get('/api/account/calendar-feed')).body.enabled).toBe(true);

    const response = await fetchFeed(app, made.body.path);
    expect(response.status, response.text).toBe(200);
    // RFC 5545 §8.1 (media type) and REFERENCES.md "Calendars".
    expect(response.headers['content-type']).toBe('text/calendar; charset=utf-8');
    const text = response.text;
    // RFC 5545 §3.1: CRLF line ends, content lines at most 75 octets, continuation lines start with one space.
    expect(text.endsWith('\r\n')).toBe(true);
    const physical = text.split('\r\n').slice(0, -1);
    expect(physical.every((line) => !line.includes('\n') && !line.includes('\r'))).toBe(true);
    expect(physical.every((line) => Buffer.byteLength(line, 'utf8') <= 75)).toBe(true);
    expect(physical.some((line) => line.startsWith(' '))).toBe(true);
    // RFC 5545 §3.3.11: the escapes as written in the file.
    const unfolded = text.replace(/\r\n /g, '');
    expect(unfolded).toContain('Probe 2\\; taped\\, re-seat first\\nPath C:\\\\logs\\\\run-07');

    // Parsed by ical.js (a general-purpose iCalendar parser from npm).
    const calendar = new ICAL.Component(ICAL.parse(text));
    expect(calendar.getFirstPropertyValue('version')).toBe('2.0');
    expect(calendar.getFirstPropertyValue('prodid')).toBeTruthy();
    const events = calendar.getAllSubcomponents('vevent').map((component) => new ICAL.Event(component));
    const uids = events.map((event) => event.uid);
    expect(new Set(uids).size).toBe(uids.length);
    expect(uids).not.toContain(`booking-${theirs.id}@benchwire`);

    const slot = events.find((event) => event.uid === `booking-${booking.id}@benchwire`);
    expect(slot).toBeTruthy();
    expect(slot!.startDate.toJSDate().toISOString()).toBe(`${day}T09:00:00.000Z`);
    expect(slot!.endDate.toJSDate().toISOString()).toBe(`${day}T12:30:00.000Z`);
    expect(slot!.startDate.zone.tzid).toBe('UTC');
    expect(slot!.description).toContain(awkwardNote);
    expect(slot!.location).toBe('Lab, back room');
    const stamp = slot!.component.getFirstPropertyValue('dtstamp') as ICAL.Time;
    expect(stamp.zone.tzid).toBe('UTC');
    expect(Math.abs(stamp.toJSDate().getTime() - Date.parse(booking.createdAt))).toBeLessThan(1000);

    const due = events.find((event) => event.uid === `cell-${cells[0].id}-due@benchwire`);
    expect(due).toBeTruthy();
    expect(due!.startDate.isDate).toBe(true);
    expect(due!.startDate.toString()).toBe(dayFromToday(4));
    // An all-day event's DTEND is the exclusive next day (RFC 5545 §3.6.1).
    expect(due!.endDate.toString()).toBe(dayFromToday(5));
    expect(events.find((event) => event.uid === `cell-${cells[1].id}-due@benchwire`)).toBeUndefined();
  });

  it('keeps only a hash of the token; a reset address replaces the old one, which then answers 404', async () => {
    const { app, tester } = await setUp();
    const first = (await tester.agent.post('/api/account/calendar-feed')).body.path as string;
    const token = first.slice('/api/calendar/'.length, -'.ics'.length);
    const row = await (await testDataSource()).getRepository(CalendarFeedEntity).findOneByOrFail({
      userId: tester.user.id,
    });
    expect(row.tokenHash).not.toContain(token);
    expect(row.tokenHash).toBe(createHash('sha256').update(token).digest('hex'));

    const second = (await tester.agent.post('/api/account/calendar-feed')).body.path as string;
    expect(second).not.toBe(first);
    const old = await fetchFeed(app, first);
    expect(old.status).toBe(404);
    expect(old.body.error.code).toBe('not_found');
    expect((await fetchFeed(app, second)).status).toBe(200);

    expect((await tester.agent.delete('/api/account/calendar-feed')).status).toBe(204);
    expect((await fetchFeed(app, second)).status).toBe(404);
    expect((await tester.agent.get('/api/account/calendar-feed')).body.enabled).toBe(false);
  });

  it('answers 404, never 500, for addresses that are not a feed', async () => {
    const app = await testApp();
    for (const path of [
      `/api/calendar/${randomBytes(32).toString('base64url')}.ics`,
      '/api/calendar/short.ics',
      `/api/calendar/${'a'.repeat(500)}.ics`,
      '/api/calendar/%F0%9F%93%85.ics',
    ]) {
      const response = await fetchFeed(app, path);
      expect(response.status, path).toBe(404);
      expect(response.body.error.code, path).toBe('not_found');
    }
  });
});

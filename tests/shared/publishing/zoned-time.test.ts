import { describe, expect, it } from 'vitest';
import {
  formatUtcOffset,
  instantToZonedTime,
  zonedTimeToInstant,
  zoneOffsetMinutes,
} from '../../../shared/domain/publishing/zoned-time';

// Rules from the IANA time zone database: the United States keep daylight time from the second Sunday in March to
// the first Sunday in November, changing at 02:00 local (15 U.S.C. § 260a as amended in 2005): 14 March and
// 7 November in 2027. The European Union changes on the last Sunday in March and October at 01:00 UTC
// (Directive 2000/84/EC): 28 March and 31 October 2027. India keeps UTC+05:30 all year.

function instant(local: { date: string; time: string; timeZone: string }) {
  const result = zonedTimeToInstant(local);
  if (!result.ok) throw new Error(result.message);
  return result;
}

describe('an embargo time in a zone becomes the right UTC instant', () => {
  it('Los Angeles: standard time before the change, daylight time after', () => {
    expect(instant({ date: '2027-03-14', time: '01:30', timeZone: 'America/Los_Angeles' }).instant.toISOString()).toBe(
      '2027-03-14T09:30:00.000Z', // PST, UTC−8
    );
    expect(instant({ date: '2027-03-14', time: '03:30', timeZone: 'America/Los_Angeles' }).instant.toISOString()).toBe(
      '2027-03-14T10:30:00.000Z', // PDT, UTC−7
    );
  });

  it('a time in the spring-forward gap is refused with words saying why', () => {
    const result = zonedTimeToInstant({ date: '2027-03-14', time: '02:30', timeZone: 'America/Los_Angeles' });
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.reason).toBe('skipped');
      expect(result.message).toMatch(/does not exist/);
    }
  });

  it('the repeated hour when clocks go back is the first of the two, flagged', () => {
    const result = instant({ date: '2027-11-07', time: '01:30', timeZone: 'America/Los_Angeles' });
    expect(result.ambiguous).toBe(true);
    expect(result.instant.toISOString()).toBe('2027-11-07T08:30:00.000Z'); // still PDT, UTC−7
    expect(instant({ date: '2027-11-07', time: '02:30', timeZone: 'America/Los_Angeles' }).ambiguous).toBe(false);
  });

  it('Berlin: a schedule set in winter for a date after the change uses summer time', () => {
    expect(instant({ date: '2027-03-27', time: '09:00', timeZone: 'Europe/Berlin' }).instant.toISOString()).toBe(
      '2027-03-27T08:00:00.000Z', // CET, UTC+1
    );
    expect(instant({ date: '2027-03-30', time: '09:00', timeZone: 'Europe/Berlin' }).instant.toISOString()).toBe(
      '2027-03-30T07:00:00.000Z', // CEST, UTC+2
    );
    expect(zonedTimeToInstant({ date: '2027-03-28', time: '02:30', timeZone: 'Europe/Berlin' }).ok).toBe(false);
  });

  it('Kolkata: half-hour offset, no daylight time', () => {
    const result = instant({ date: '2027-06-01', time: '09:00', timeZone: 'Asia/Kolkata' });
    expect(result.instant.toISOString()).toBe('2027-06-01T03:30:00.000Z');
    expect(formatUtcOffset(result.offsetMinutes)).toBe('UTC+05:30');
    expect(formatUtcOffset(zoneOffsetMinutes('America/Los_Angeles', new Date('2027-01-15T12:00:00Z')))).toBe(
      'UTC−08:00',
    );
  });

  it('reads back the local date and time of an instant, whatever the process zone', () => {
    expect(instantToZonedTime(new Date('2027-03-30T07:00:00Z'), 'Europe/Berlin')).toEqual({
      date: '2027-03-30',
      time: '09:00',
      timeZone: 'Europe/Berlin',
    });
    expect(instantToZonedTime(new Date('2027-01-01T07:59:00Z'), 'America/Los_Angeles').date).toBe('2026-12-31');
  });

  it('refuses dates that are not on the calendar, malformed times and unknown zones', () => {
    expect(zonedTimeToInstant({ date: '2027-02-29', time: '09:00', timeZone: 'UTC' })).toMatchObject({
      ok: false,
      reason: 'invalid-date',
    });
    expect(zonedTimeToInstant({ date: '2027-02-28', time: '24:00', timeZone: 'UTC' })).toMatchObject({
      ok: false,
      reason: 'invalid-time',
    });
    expect(zonedTimeToInstant({ date: '2027-02-28', time: '09:00', timeZone: 'Mars/Olympus' })).toMatchObject({
      ok: false,
      reason: 'invalid-zone',
    });
  });
});

/**
 * shared/time-zone.ts: a garden's calendar day of an instant and the instant of a wall-clock time.
 *
 * Offsets and transition dates are from the IANA tz database (tzdata, as shipped with ICU):
 * - America/Los_Angeles: PST UTC−8, PDT UTC−7 from the second Sunday of March 02:00 to the first
 *   Sunday of November 02:00 (US rule since 2007: 8 March and 1 November in 2026).
 * - Asia/Kolkata UTC+5:30 and Asia/Kathmandu UTC+5:45, no summer time.
 * - Pacific/Kiritimati UTC+14, no summer time.
 * - Australia/Lord_Howe: UTC+10:30, and UTC+11 (a half-hour shift) in the southern summer.
 */
import { describe, expect, it } from 'vitest';
import {
  addDays,
  calendarDaysBetween,
  canonicalTimeZone,
  dayInTimeZone,
  instantOfWallClock,
  instantOfWallClockInput,
  isTimeZone,
  offsetMinutesAt,
  timeZoneNames,
  wallClockInput,
} from '@shared/time-zone';

describe('dayInTimeZone', () => {
  it("gives the garden's calendar day of an instant", () => {
    // 03:00Z on 2 June is 20:00 on 1 June at PDT (UTC−7).
    expect(dayInTimeZone('2026-06-02T03:00:00Z', 'America/Los_Angeles')).toBe('2026-06-01');
    expect(dayInTimeZone('2026-06-02T03:00:00Z', 'UTC')).toBe('2026-06-02');
    // 11:00Z on 1 June is 01:00 on 2 June at UTC+14.
    expect(dayInTimeZone(new Date('2026-06-01T11:00:00Z'), 'Pacific/Kiritimati')).toBe('2026-06-02');
    // 18:29Z is 23:59 at UTC+5:30; 18:30Z is midnight, the next day.
    expect(dayInTimeZone(Date.parse('2026-06-01T18:29:00Z'), 'Asia/Kolkata')).toBe('2026-06-01');
    expect(dayInTimeZone(Date.parse('2026-06-01T18:30:00Z'), 'Asia/Kolkata')).toBe('2026-06-02');
  });

  it('follows summer time: the same UTC hour is a different local day in winter and in summer', () => {
    // 07:30Z: 23:30 the day before at PST (UTC−8, January), 00:30 the same day at PDT (UTC−7, July).
    expect(dayInTimeZone('2026-01-15T07:30:00Z', 'America/Los_Angeles')).toBe('2026-01-14');
    expect(dayInTimeZone('2026-07-15T07:30:00Z', 'America/Los_Angeles')).toBe('2026-07-15');
  });
});

describe('offsetMinutesAt', () => {
  it('is the offset in force at that instant', () => {
    expect(offsetMinutesAt(new Date('2026-01-15T12:00:00Z'), 'America/Los_Angeles')).toBe(-480);
    expect(offsetMinutesAt(new Date('2026-06-15T12:00:00Z'), 'America/Los_Angeles')).toBe(-420);
    expect(offsetMinutesAt(new Date('2026-06-15T12:00:00Z'), 'Asia/Kolkata')).toBe(330);
    expect(offsetMinutesAt(new Date('2026-06-15T12:00:00Z'), 'Asia/Kathmandu')).toBe(345);
    expect(offsetMinutesAt(new Date('2026-01-15T12:00:00Z'), 'Australia/Lord_Howe')).toBe(660);
    expect(offsetMinutesAt(new Date('2026-07-15T12:00:00Z'), 'Australia/Lord_Howe')).toBe(630);
    expect(offsetMinutesAt(new Date('2026-07-15T12:00:00Z'), 'UTC')).toBe(0);
  });
});

describe('instantOfWallClock', () => {
  const at = (y: number, m: number, d: number, hh: number, mm = 0) => new Date(instantOfWallClock({ y, m, d, hh, mm, ss: 0 }, 'America/Los_Angeles')).toISOString();

  it('reads a wall-clock time with the offset of that date', () => {
    expect(at(2026, 1, 15, 7)).toBe('2026-01-15T15:00:00.000Z'); // PST
    expect(at(2026, 6, 1, 20)).toBe('2026-06-02T03:00:00.000Z'); // PDT
  });

  it('reads a time skipped in spring with the offset before the change, and a repeated autumn time as the first', () => {
    // 8 March 2026: 02:00 PST jumps to 03:00 PDT; 02:30 does not exist and is read as 02:30 PST (10:30Z, 03:30 PDT).
    expect(at(2026, 3, 8, 2, 30)).toBe('2026-03-08T10:30:00.000Z');
    // 1 November 2026: 01:00–02:00 happens twice (PDT, then PST); the first is 08:30Z.
    expect(at(2026, 11, 1, 1, 30)).toBe('2026-11-01T08:30:00.000Z');
    // Either way the calendar day is the one asked for.
    expect(dayInTimeZone(at(2026, 3, 8, 2, 30), 'America/Los_Angeles')).toBe('2026-03-08');
  });

  it('round-trips every hour of a year through the wall clock (property over 8,760 instants)', () => {
    for (const zone of ['America/Los_Angeles', 'Australia/Lord_Howe']) {
      for (let h = 0; h < 365 * 24; h++) {
        const instant = Date.UTC(2026, 0, 1) + h * 3_600_000;
        const input = wallClockInput(instant, zone);
        const back = instantOfWallClockInput(input, zone)!;
        // The wall clock of the instant read back is the same wall clock (an autumn repeat may give the other instant).
        expect(wallClockInput(new Date(back), zone), `${zone} ${new Date(instant).toISOString()}`).toBe(input);
      }
    }
  });
});

describe('datetime-local values', () => {
  it('shows an instant on the garden clock and reads one back', () => {
    expect(wallClockInput(new Date('2026-06-02T03:00:00Z'), 'America/Los_Angeles')).toBe('2026-06-01T20:00');
    expect(instantOfWallClockInput('2026-06-01T20:00', 'America/Los_Angeles')).toBe('2026-06-02T03:00:00.000Z');
    expect(instantOfWallClockInput('2026-06-01T20:00:30', 'UTC')).toBe('2026-06-01T20:00:30.000Z');
    expect(instantOfWallClockInput('', 'UTC')).toBeNull();
    expect(instantOfWallClockInput('1 June, 8 pm', 'UTC')).toBeNull();
  });
});

describe('zone names', () => {
  it('knows IANA names, in any case, and refuses offsets and made-up names', () => {
    expect(canonicalTimeZone('America/Denver')).toBe('America/Denver');
    // tz database Theory: names are matched case-insensitively.
    expect(canonicalTimeZone('america/denver')).toBe('America/Denver');
    expect(canonicalTimeZone('UTC')).toBe('UTC');
    expect(isTimeZone('Mars/Olympus_Mons')).toBe(false);
    expect(isTimeZone('+02:00')).toBe(false);
    expect(isTimeZone('')).toBe(false);
    expect(isTimeZone('America/Denver; DROP TABLE gardens')).toBe(false);
  });

  it('lists the zones sorted, UTC included', () => {
    const names = timeZoneNames();
    expect(names).toContain('UTC');
    expect(names).toContain('America/Los_Angeles');
    expect(names).toEqual([...names].sort());
    expect(new Set(names).size).toBe(names.length);
    for (const n of names.slice(0, 50)) expect(isTimeZone(n), n).toBe(true);
  });
});

describe('addDays', () => {
  it('steps calendar days across month, year and leap-day boundaries (Gregorian calendar)', () => {
    expect(addDays('2026-12-31', 1)).toBe('2027-01-01');
    expect(addDays('2028-02-28', 1)).toBe('2028-02-29');
    expect(addDays('2026-03-01', -1)).toBe('2026-02-28');
  });
});

describe('calendarDaysBetween', () => {
  it("counts calendar days in the garden's zone, not 24-hour periods", () => {
    // 03:00Z on 1 June is 21:00 on 31 May at MDT (UTC−6, America/Denver); 13:00Z is 07:00 on 1 June.
    // Ten hours apart, yet the day before in Denver; the same day in UTC.
    expect(calendarDaysBetween('2026-06-01T03:00:00Z', '2026-06-01T13:00:00Z', 'America/Denver')).toBe(1);
    expect(calendarDaysBetween('2026-06-01T03:00:00Z', '2026-06-01T13:00:00Z', 'UTC')).toBe(0);
    // Two spans of 47 hours each in Denver: 1 June 00:30 MDT (06:30Z) to 2 June 23:30 MDT (05:30Z on 3 June)
    // is 1 calendar day; 31 May 23:30 MDT (1 June 05:30Z) to 2 June 22:30 MDT (3 June 04:30Z) is 2.
    expect(calendarDaysBetween('2026-06-01T06:30:00Z', '2026-06-03T05:30:00Z', 'America/Denver')).toBe(1);
    expect(calendarDaysBetween('2026-06-01T05:30:00Z', '2026-06-03T04:30:00Z', 'America/Denver')).toBe(2);
  });

  it('is a whole number across a summer-time change (a 23-hour day) and negative for a later day', () => {
    // US spring-forward on 8 March 2026 (tz database): 7 March 12:00 PST (20:00Z) to 9 March 12:00 PDT (19:00Z) is 2 days.
    expect(calendarDaysBetween('2026-03-07T20:00:00Z', '2026-03-09T19:00:00Z', 'America/Los_Angeles')).toBe(2);
    expect(calendarDaysBetween(Date.parse('2026-06-03T12:00:00Z'), new Date('2026-06-01T12:00:00Z'), 'UTC')).toBe(-2);
  });
});

import {
  addMonths,
  appointmentDueAt,
  daysInMonth,
  instantOf,
  knownZone,
  maintenanceDueAt,
  wallClock,
} from './due-dates';

const utc = (iso: string) => new Date(iso);

describe('addMonths: whole calendar months, the day clamped to the month end', () => {
  it.each([
    [{ year: 2026, month: 1, day: 31 }, 1, { year: 2026, month: 2, day: 28 }],
    [{ year: 2028, month: 1, day: 31 }, 1, { year: 2028, month: 2, day: 29 }],
    [{ year: 2026, month: 8, day: 31 }, 1, { year: 2026, month: 9, day: 30 }],
    [{ year: 2026, month: 3, day: 31 }, 6, { year: 2026, month: 9, day: 30 }],
    [{ year: 2026, month: 8, day: 31 }, 6, { year: 2027, month: 2, day: 28 }],
    [{ year: 2026, month: 12, day: 15 }, 1, { year: 2027, month: 1, day: 15 }],
    [{ year: 2026, month: 11, day: 30 }, 14, { year: 2028, month: 1, day: 30 }],
    [{ year: 2028, month: 2, day: 29 }, 12, { year: 2029, month: 2, day: 28 }],
    [{ year: 2026, month: 5, day: 10 }, 60, { year: 2031, month: 5, day: 10 }],
  ])('%j + %i months = %j', (from, months, expected) => {
    expect(addMonths(from, months)).toEqual(expected);
  });

  it('never spills into the month after the one asked for', () => {
    for (let month = 1; month <= 12; month++) {
      for (let add = 1; add <= 24; add++) {
        const to = addMonths({ year: 2027, month, day: 31 }, add);
        expect((to.year - 2027) * 12 + (to.month - month)).toBe(add);
        expect(to.day).toBe(daysInMonth(to.year, to.month));
      }
    }
  });
});

describe('maintenanceDueAt: the close day + N months, 09:00 in the business zone', () => {
  it('31 Jan + 1 month is 28 Feb at 09:00 (UTC business)', () => {
    expect(maintenanceDueAt(utc('2026-01-31T16:45:00Z'), 1, 'UTC').toISOString()).toBe(
      '2026-02-28T09:00:00.000Z',
    );
  });

  it('takes the calendar day in the business zone, not in UTC', () => {
    // 23:30 on 31 Aug in Los Angeles is already 1 Sep in UTC: the day is 31 Aug there.
    const closed = utc('2026-09-01T06:30:00Z');
    expect(wallClock(closed, 'America/Los_Angeles')).toMatchObject({ month: 8, day: 31 });
    // 31 Aug + 6 months = 28 Feb 2027, 09:00 PST (UTC−8).
    expect(maintenanceDueAt(closed, 6, 'America/Los_Angeles').toISOString()).toBe(
      '2027-02-28T17:00:00.000Z',
    );
  });

  it('keeps 09:00 on the wall clock across a clock change (summer to winter)', () => {
    // Closed in Berlin summer time (UTC+2); due in winter time (UTC+1).
    expect(maintenanceDueAt(utc('2026-07-15T10:00:00Z'), 6, 'Europe/Berlin').toISOString()).toBe(
      '2027-01-15T08:00:00.000Z',
    );
  });
});

describe('appointmentDueAt: the same clock time the day before the window starts', () => {
  it('is 24 hours before in a zone without a clock change', () => {
    expect(appointmentDueAt(utc('2026-03-12T08:30:00Z'), 'UTC').toISOString()).toBe(
      '2026-03-11T08:30:00.000Z',
    );
  });

  it('crosses a month and a year end', () => {
    expect(appointmentDueAt(utc('2027-01-01T07:00:00Z'), 'UTC').toISOString()).toBe(
      '2026-12-31T07:00:00.000Z',
    );
    expect(appointmentDueAt(utc('2028-03-01T07:00:00Z'), 'UTC').toISOString()).toBe(
      '2028-02-29T07:00:00.000Z',
    );
  });

  it('is 23 hours before when the clocks went forward overnight', () => {
    // New York went to summer time in the night to 8 Mar 2026: 08:00 EDT (UTC−4) on the 8th,
    // the day before 08:00 EST (UTC−5).
    const start = utc('2026-03-08T12:00:00Z');
    const due = appointmentDueAt(start, 'America/New_York');
    expect(due.toISOString()).toBe('2026-03-07T13:00:00.000Z');
    expect(start.getTime() - due.getTime()).toBe(23 * 3_600_000);
    expect(wallClock(due, 'America/New_York')).toMatchObject({ day: 7, hour: 8, minute: 0 });
  });
});

describe('instantOf: a wall-clock time in a zone', () => {
  it('answers the first of a time that happens twice', () => {
    // London, 25 Oct 2026: 01:30 happens in BST (00:30Z) and again in GMT (01:30Z).
    expect(
      instantOf(
        { year: 2026, month: 10, day: 25, hour: 1, minute: 30, second: 0, millisecond: 0 },
        'Europe/London',
      ).toISOString(),
    ).toBe('2026-10-25T00:30:00.000Z');
  });

  it('moves a skipped time on by the length of the change', () => {
    // New York, 8 Mar 2026: 02:30 does not happen; read with EST it is 07:30Z (03:30 EDT).
    expect(
      instantOf(
        { year: 2026, month: 3, day: 8, hour: 2, minute: 30, second: 0, millisecond: 0 },
        'America/New_York',
      ).toISOString(),
    ).toBe('2026-03-08T07:30:00.000Z');
  });
});

describe('knownZone', () => {
  it('falls back to UTC for a zone this runtime does not know', () => {
    expect(knownZone('Mars/Olympus_Mons')).toBe('UTC');
    expect(knownZone('')).toBe('UTC');
    expect(knownZone('Asia/Tokyo')).toBe('Asia/Tokyo');
  });
});

import { describe, expect, it } from 'vitest';
import {
  addDays,
  layoutDay,
  layoutRoute,
  layoutWeek,
  movedWindow,
  placeInDay,
  startOfWeek,
  type Booking,
} from './calendarLayout';

// Drive factors of the demo business (invented): road factor 1.3, 45 km/h.
const drive = { roadFactor: 1.3, averageKmh: 45 };
const at = (day: number, h: number, m = 0) => new Date(2025, 4, day, h, m).getTime(); // May 2025, local
const base = { lat: 44.6, lng: -124.05 };
// 0.1° of latitude north: 6371.0088 km × π/180 × 0.1 = 11.1195 km in a straight line (haversine,
// IUGG mean radius); × 1.3 = 14.455 km by road; ÷ 45 km/h = 19.27 min → 20 min, worked by hand.
const north = { lat: 44.7, lng: -124.05 };

let n = 0;
function booking(startMs: number, endMs: number, where = base, who: string | null = null): Booking {
  n += 1;
  return { id: `b${n}`, startMs, endMs, ...where, assignedTechId: who };
}

describe('a day of stops (drive between stops, conflicts)', () => {
  it('orders the stops and gives the drive from the one before, rounded up to the minute', () => {
    const later = booking(at(6, 13), at(6, 16), north);
    const first = booking(at(6, 8), at(6, 12), base);
    const stops = layoutRoute([later, first], drive);
    expect(stops.map((s) => s.booking.id)).toEqual([first.id, later.id]);
    expect(stops[0]!.leg).toBeNull();
    expect(stops[1]!.leg).toEqual({ kind: 'drive', minutes: 20, roadKm: 14.5 });
    expect(stops.flatMap((s) => s.conflicts)).toEqual([]);
  });

  it('flags a gap shorter than the drive between two stops, and no time at all when they touch', () => {
    const first = booking(at(6, 8), at(6, 12));
    const tight = booking(at(6, 12, 15), at(6, 14), north); // 15 min for a 20-minute drive
    const touching = booking(at(6, 14), at(6, 15)); // back south, 0 min gap
    const stops = layoutRoute([first, tight, touching], drive);
    expect(stops[1]!.conflicts).toEqual([
      expect.objectContaining({ kind: 'short-gap', withId: first.id, gapMin: 15, driveMin: 20 }),
    ]);
    expect(stops[2]!.conflicts).toEqual([
      expect.objectContaining({ kind: 'short-gap', gapMin: 0, driveMin: 20 }),
    ]);
    expect(stops[0]!.conflicts).toEqual([]);
  });

  it('flags every pair of overlapping windows, not only neighbours; the same place needs no drive', () => {
    const long = booking(at(6, 8), at(6, 17));
    const a = booking(at(6, 9), at(6, 10));
    const b = booking(at(6, 11), at(6, 12));
    const stops = layoutRoute([long, a, b], drive);
    const kinds = (i: number) => stops[i]!.conflicts.map((c) => `${c.kind}:${c.withId}`);
    expect(kinds(0)).toEqual([`overlap:${a.id}`, `overlap:${b.id}`]);
    expect(kinds(1)).toEqual([`overlap:${long.id}`]);
    expect(kinds(2)).toEqual([`overlap:${long.id}`]);
    expect(stops[1]!.leg).toEqual({ kind: 'drive', minutes: 0, roadKm: 0 });
  });

  it('says the drive is unknown without a map position, and flags nothing for it', () => {
    const first = booking(at(6, 8), at(6, 9));
    const nowhere = booking(at(6, 9), at(6, 10), { lat: null, lng: null } as never);
    const stops = layoutRoute([first, nowhere], drive);
    expect(stops[1]!.leg).toEqual({ kind: 'unknown' });
    expect(stops[1]!.conflicts).toEqual([]);
  });

  it('keeps each person’s route apart: a helper’s visit at the same time is no conflict', () => {
    const mine = booking(at(6, 9), at(6, 12));
    const helpers = booking(at(6, 9), at(6, 12), north, 'u-helper');
    const tomorrow = booking(at(7, 9), at(7, 12));
    const day = layoutDay([mine, helpers, tomorrow], at(6, 15), drive);
    expect(day.dayMs).toBe(at(6, 0));
    expect(day.routes.map((r) => [r.who, r.stops.map((s) => s.booking.id)])).toEqual([
      [null, [mine.id]],
      ['u-helper', [helpers.id]],
    ]);
    expect(day.bookings).toBe(2);
    expect(day.conflicts).toBe(0);
  });
});

describe('the week', () => {
  it('runs Monday to Sunday, each booking on the day it starts', () => {
    // 6 May 2025 was a Tuesday.
    expect(startOfWeek(at(6, 15))).toBe(at(5, 0));
    expect(startOfWeek(at(11, 23, 59))).toBe(at(5, 0));
    expect(startOfWeek(at(12, 0))).toBe(at(12, 0));
    const sunday = booking(at(11, 18), at(11, 20));
    const week = layoutWeek([sunday, booking(at(12, 9), at(12, 10))], at(7, 12), drive);
    expect(week.map((d) => d.dayMs)).toEqual([5, 6, 7, 8, 9, 10, 11].map((d) => at(d, 0)));
    expect(week.map((d) => d.bookings)).toEqual([0, 0, 0, 0, 0, 0, 1]);
  });

  it('steps over a summer-time change by calendar days, not 24-hour blocks', () => {
    const d = addDays(new Date(2025, 2, 29).getTime(), 2);
    expect(new Date(d).getDate()).toBe(31);
    expect(new Date(d).getHours()).toBe(0);
  });

  it('places a window in the day drawn from 6:00 to 21:00, clipped at the edges', () => {
    expect(placeInDay({ startMs: at(6, 9), endMs: at(6, 12) }, at(6, 0))).toEqual({
      top: 0.2,
      height: 0.2,
    });
    expect(placeInDay({ startMs: at(6, 5), endMs: at(6, 7) }, at(6, 0)).top).toBe(0);
    expect(placeInDay({ startMs: at(6, 20), endMs: at(6, 23) }, at(6, 0)).height).toBeCloseTo(
      1 / 15,
    );
  });
});

describe('moving a booking', () => {
  const b = { startMs: at(6, 9), endMs: at(6, 12) };
  it('keeps its length when the start moves', () => {
    expect(movedWindow(b, { startMs: at(7, 13) })).toEqual({
      windowStart: new Date(at(7, 13)).toISOString(),
      windowEnd: new Date(at(7, 16)).toISOString(),
    });
  });
  it('takes a new end, and refuses one not after the start', () => {
    expect(movedWindow(b, { endMs: at(6, 14) })?.windowEnd).toBe(new Date(at(6, 14)).toISOString());
    expect(movedWindow(b, { endMs: at(6, 9) })).toBeNull();
  });
});

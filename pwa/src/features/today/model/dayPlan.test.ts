import { describe, expect, it } from 'vitest';
import { dayLegs, type Stop } from './dayPlan';

const H = 3_600_000;
const T0 = Date.parse('2026-05-04T00:00:00.000Z');
const stop = (lat: number | null, lng: number | null, fromH: number, toH: number): Stop => ({
  job: { lat, lng, address: 'x' },
  startMs: T0 + fromH * H,
  endMs: T0 + toH * H,
});
const drive = { roadFactor: 1.3, averageKmh: 40 };

describe('dayLegs — the drive to each visit from the one before', () => {
  it('the first visit has no drive; the next has minutes rounded up and road km', () => {
    // 0.1° of latitude: 11.12 km straight, 14.46 km by road, 21.7 min at 40 km/h.
    const legs = dayLegs([stop(44.6, -124.05, 8, 13), stop(44.7, -124.05, 14, 18)], drive);
    expect(legs[0]).toEqual({ kind: 'first' });
    expect(legs[1]).toMatchObject({
      kind: 'drive',
      minutes: 22,
      roadKm: 14.5,
      words: 'About 22 min drive from the previous visit (14.5 km by road).',
      tight: null,
    });
    expect(legs[1]?.kind === 'drive' && legs[1].how).toContain(
      'common practice, no published source',
    );
  });

  it('says when the drive does not fit between the windows', () => {
    const legs = dayLegs([stop(44.6, -124.05, 8, 13.9), stop(44.7, -124.05, 14, 18)], drive);
    expect(legs[1]).toMatchObject({
      tight: 'Only 6 min between the visits for a drive of about 22 min.',
    });
    const back2back = dayLegs([stop(44.6, -124.05, 8, 14), stop(44.7, -124.05, 14, 18)], drive);
    expect(back2back[1]).toMatchObject({
      tight: expect.stringContaining('runs until this one starts'),
    });
  });

  it('says the drive is unknown when an address has no map position', () => {
    const legs = dayLegs([stop(null, null, 8, 13), stop(44.7, -124.05, 14, 18)], drive);
    expect(legs[1]).toEqual({
      kind: 'unknown',
      words: 'Drive time unknown: an address has no map position.',
    });
  });

  it('takes the business factors: a slower average speed means a longer drive', () => {
    const slow = dayLegs([stop(44.6, -124.05, 8, 9), stop(44.7, -124.05, 12, 13)], {
      roadFactor: 1.3,
      averageKmh: 20,
    });
    expect(slow[1]).toMatchObject({ minutes: 44 });
  });
});

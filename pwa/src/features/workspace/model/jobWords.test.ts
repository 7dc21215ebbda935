import { describe, expect, it } from 'vitest';
import { vehicleDetails, vehicleLabel, windowWords } from './jobWords';

describe('job words', () => {
  it('names the vehicle by year, make and model', () => {
    expect(vehicleLabel({ year: 2018, make: 'Borrow', model: 'Tundrel' })).toBe(
      '2018 Borrow Tundrel',
    );
    expect(vehicleLabel({ year: null, make: 'Borrow', model: '' })).toBe('Borrow');
    expect(vehicleLabel(null)).toBe('Vehicle');
  });

  it('adds colour, body style and plate', () => {
    expect(vehicleDetails({ colour: 'black', bodyStyle: 'suv', plate: 'LKB 3317' })).toBe(
      'black · SUV · LKB 3317',
    );
    expect(vehicleDetails({ colour: '', bodyStyle: 'van', plate: null })).toBe('van');
  });

  it('says the day in words near today', () => {
    const now = new Date(2025, 4, 2, 10, 0).getTime();
    const at = (day: number, h: number) => new Date(2025, 4, day, h, 0).toISOString();
    expect(windowWords({ windowStart: at(2, 8), windowEnd: at(2, 13) }, now, 'en-GB')).toBe(
      'Today, 08:00–13:00',
    );
    expect(windowWords({ windowStart: at(1, 8), windowEnd: at(1, 15) }, now, 'en-GB')).toMatch(
      /^Yesterday, 08:00–15:00$/,
    );
    expect(windowWords({ windowStart: at(3, 9), windowEnd: at(3, 12) }, now, 'en-GB')).toMatch(
      /^Tomorrow, /,
    );
    expect(windowWords({ windowStart: at(6, 9), windowEnd: at(6, 14) }, now, 'en-GB')).toMatch(
      /^Tue,? 6 May, 09:00–14:00$/,
    );
  });
});

import { describe, expect, it } from 'vitest';
import { clockTime, countdown, dayAndTime, durationWords, hoursWords, signedWhen } from './time';
import { decimalText, parseDecimal } from './numbers';

const T = new Date(2026, 4, 15, 14, 32).getTime();

describe('times in words', () => {
  it('says a time of day as the detailer reads it: "14:32"', () => {
    expect(clockTime(T, 'en-GB')).toBe('14:32');
  });

  it('writes a time after midnight with two hour digits where the locale does ("00:13")', () => {
    const afterMidnight = new Date(2026, 4, 15, 0, 13).getTime();
    expect(clockTime(afterMidnight, 'en-GB')).toBe('00:13');
    expect(clockTime(afterMidnight, 'en-US')).toMatch(/^12:13\s?AM$/);
  });

  it('says when a record was signed with its day, and nothing for a time that is not one', () => {
    expect(signedWhen(new Date(T).toISOString(), 'en-GB')).toBe('14:32 on 15 May 2026');
    expect(signedWhen('not a time', 'en-GB')).toBe('');
  });

  it('adds the day only when it is not today, and says "tomorrow"', () => {
    expect(dayAndTime(T, T - 60_000, 'en-GB')).toBe('14:32');
    expect(dayAndTime(T + 86_400_000, T, 'en-GB')).toBe('14:32 tomorrow');
    expect(dayAndTime(T + 3 * 86_400_000, T, 'en-GB')).toBe('Mon 18 May, 14:32');
  });

  it('counts down as a clock, rounding up so 0:00 shows only when the time has come', () => {
    expect(countdown(161_000)).toBe('2:41');
    expect(countdown(160_001)).toBe('2:41');
    expect(countdown(0)).toBe('0:00');
    expect(countdown(3_845_000)).toBe('1:04:05');
    expect(countdown(-5_000)).toBe('0:00');
  });

  it('says a length of time in words, with seconds only where they matter', () => {
    expect(durationWords(40_000)).toBe('40 s');
    expect(durationWords(190_000)).toBe('3 min 10 s');
    expect(durationWords(180_000)).toBe('3 min');
    expect(durationWords(25 * 60_000 + 20_000)).toBe('25 min');
    expect(durationWords(2 * 3_600_000 + 5 * 60_000)).toBe('2 h 05 min');
    expect(durationWords(3 * 86_400_000 + 4 * 3_600_000)).toBe('3 days 4 h');
    expect(hoursWords(12)).toBe('12 h');
    expect(hoursWords(14.75)).toBe('14.8 h');
  });

  it('reads a number typed with a comma or a point; refuses anything else', () => {
    expect(parseDecimal('21,5')).toBe(21.5);
    expect(parseDecimal(' 68 ')).toBe(68);
    expect(parseDecimal('-3.5')).toBe(-3.5);
    expect(parseDecimal('')).toBeNull();
    expect(parseDecimal('21 C')).toBeNull();
    expect(decimalText(21.04)).toBe('21');
    expect(decimalText(69.8)).toBe('69.8');
  });
});

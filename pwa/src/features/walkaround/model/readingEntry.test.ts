import { describe, expect, it } from 'vitest';
import { parseReading, readSpot } from './readingEntry';

describe('typed gauge readings', () => {
  it('reads whole and decimal numbers, with a point or a comma', () => {
    expect(parseReading('112', 'um')).toEqual({ state: 'ok', value: 112, um: 112 });
    expect(parseReading(' 4,5 ', 'mil')).toMatchObject({ state: 'ok', value: 4.5 });
    expect(parseReading('4.5', 'mil')).toMatchObject({ um: 114.3 });
  });

  it('refuses what is not a reading, in words', () => {
    expect(parseReading('abc', 'um').state).toBe('bad');
    expect(parseReading('-3', 'um').state).toBe('bad');
    expect(parseReading('0', 'um').state).toBe('bad');
    expect(parseReading('9000', 'um')).toMatchObject({ state: 'bad' });
    expect(parseReading('', 'um')).toEqual({ state: 'empty' });
  });

  it('needs three readings in a spot, and none wrong', () => {
    expect(readSpot(['110', '112', ''], 'um')).toMatchObject({
      ready: false,
      missing: 'Enter at least 3 readings for the spot (2 so far).',
    });
    expect(readSpot(['110', 'x', '112', '111'], 'um')).toMatchObject({
      ready: false,
      problems: [{ index: 1 }],
    });
    expect(readSpot(['110', '112', '111'], 'um')).toMatchObject({
      ready: true,
      values: [110, 112, 111],
      um: [110, 112, 111],
    });
  });
});

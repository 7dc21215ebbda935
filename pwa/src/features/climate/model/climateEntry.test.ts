import { describe, expect, it } from 'vitest';
import { checkClimate, typedNumber } from './climateEntry';

describe('a climate entry as it is typed', () => {
  it('takes a decimal comma and refuses words', () => {
    expect(typedNumber('18,5')).toBe(18.5);
    expect(typedNumber(' 21 ')).toBe(21);
    expect(typedNumber('warm')).toBeNull();
  });

  it('gives the dew point as soon as air and humidity are in (25 °C, 80 % → 21.3 °C, PsychroLib example)', () => {
    const check = checkClimate({ air: '25', rh: '80', surface: '' }, 'C');
    expect(check.values).toEqual({ airC: 25, rhPct: 80, surfaceC: null });
    expect(check.dewPointC).toBeCloseTo(21.31, 1);
    expect(check.gate).toBeNull();
  });

  it('with the surface, gives the gate and its reasons in words (ISO 8502-4, 3 °C margin)', () => {
    const check = checkClimate({ air: '25', rh: '80', surface: '23' }, 'C');
    expect(check.gate?.ok).toBe(false);
    expect(check.gate?.reasons[0]?.message).toBe(
      'Surface is 1.7 °C above dew point; needs at least 3 °C.',
    );
    expect(checkClimate({ air: '25', rh: '80', surface: '26' }, 'C').gate?.ok).toBe(true);
  });

  it('in °F: converts to °C for recording, and words the reasons in °F', () => {
    const check = checkClimate({ air: '77', rh: '80', surface: '73.4' }, 'F');
    expect(check.values).toEqual({ airC: 25, rhPct: 80, surfaceC: 23 });
    expect(check.gate?.reasons[0]?.message).toBe(
      'Surface is 3 °F above dew point; needs at least 5.4 °F.',
    );
  });

  it('says what is wrong with each field, and records nothing', () => {
    const check = checkClimate({ air: '75', rh: '120', surface: 'hot' }, 'C');
    expect(check.problems).toEqual({
      air: 'Air temperature must be between -40 and 60 °C.',
      rh: 'Humidity is a percentage: above 0, at most 100.',
      surface: 'Type a number, like 21.',
    });
    expect(check.values).toBeNull();
  });

  it('a half-typed minus sign is not a problem yet', () => {
    expect(checkClimate({ air: '-', rh: '', surface: '' }, 'C').problems.air).toBeNull();
  });

  it("checks the product's window when given one", () => {
    const check = checkClimate({ air: '8', rh: '50', surface: '12' }, 'C', { minC: 10 });
    expect(check.gate?.reasons.map((r) => r.code)).toContain('air-below-product-minimum');
  });
});

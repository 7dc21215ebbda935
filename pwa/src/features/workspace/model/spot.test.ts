import { describe, expect, it } from 'vitest';
import {
  LOCATION_DENIED,
  LOCATION_TIMEOUT,
  LOCATION_UNAVAILABLE,
  locationProblem,
  roundSpot,
  spotOf,
  spotWords,
} from './spot';

describe("a job's spot", () => {
  it('is rounded to 5 decimals (about a metre)', () => {
    expect(roundSpot(51.5073512, -0.1277649)).toEqual({ lat: 51.50735, lng: -0.12776 });
  });

  it('needs both figures to be a spot', () => {
    expect(spotOf({ lat: 1, lng: null })).toBeNull();
    expect(spotOf({ lat: null, lng: 2 })).toBeNull();
    expect(spotOf(null)).toBeNull();
    expect(spotOf({ lat: 0, lng: 0 })).toEqual({ lat: 0, lng: 0 });
  });

  it('is said with the side of the world, never a bare minus sign', () => {
    expect(spotWords({ lat: 51.50735, lng: -0.12776 })).toBe('51.50735° N, 0.12776° W');
    expect(spotWords({ lat: -33.8688, lng: 151.2093 })).toBe('33.86880° S, 151.20930° E');
  });

  it('says why there is none, and that nothing changed', () => {
    expect(locationProblem(LOCATION_DENIED)).toMatch(/not allowed.*settings/);
    expect(locationProblem(LOCATION_TIMEOUT)).toMatch(/too long/);
    expect(locationProblem(LOCATION_UNAVAILABLE)).toMatch(/could not find/);
    expect(locationProblem('unsupported')).toMatch(/cannot tell/);
    for (const c of [
      LOCATION_DENIED,
      LOCATION_TIMEOUT,
      LOCATION_UNAVAILABLE,
      'unsupported',
    ] as const) {
      expect(locationProblem(c)).toMatch(/Nothing was changed\.$/);
    }
  });
});

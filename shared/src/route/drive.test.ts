import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  DEFAULT_DRIVE,
  MEAN_EARTH_RADIUS_KM,
  driveEstimate,
  driveMinutes,
  greatCircleKm,
} from './drive';

// Rosetta Code, task "Haversine formula": Nashville International Airport (BNA) N 36°7.2′,
// W 86°40.2′ to Los Angeles International Airport (LAX) N 33°56.4′, W 118°24.0′.
const BNA = { lat: 36.12, lng: -86.67 };
const LAX = { lat: 33.94, lng: -118.4 };

// Movable Type Scripts, "Calculate distance, bearing and more between Latitude/Longitude
// points" (C. Veness), its worked example: 50°03′59″N 005°42′53″W to 58°38′38″N 003°04′12″W.
const dms = (d: number, m: number, s: number) => d + m / 60 + s / 3600;
const southWest = { lat: dms(50, 3, 59), lng: -dms(5, 42, 53) };
const northEast = { lat: dms(58, 38, 38), lng: -dms(3, 4, 12) };

describe('greatCircleKm — haversine', () => {
  it('BNA → LAX is 2886.444 km on a 6371.0 km sphere (Rosetta Code, "Haversine formula")', () => {
    expect(greatCircleKm(BNA, LAX, 6371.0)).toBeCloseTo(2886.444442837983, 6);
  });

  it('BNA → LAX is 2887.260 km on a 6372.8 km sphere (Rosetta Code, the same task)', () => {
    expect(greatCircleKm(BNA, LAX, 6372.8)).toBeCloseTo(2887.25995060711, 6);
  });

  it('the worked example of Movable Type Scripts is 968.9 km (to 4 significant figures, R = 6371 km)', () => {
    expect(Number(greatCircleKm(southWest, northEast, 6371).toPrecision(4))).toBe(968.9);
  });

  it('uses the IUGG mean radius R1 = 6371.0088 km by default (GRS 80, Moritz)', () => {
    expect(MEAN_EARTH_RADIUS_KM).toBe(6371.0088);
    expect(greatCircleKm(BNA, LAX)).toBeCloseTo((2886.444442837983 * 6371.0088) / 6371.0, 6);
  });

  it('a quarter meridian is π/2 × R; antipodes are π × R (geometry of the sphere)', () => {
    expect(greatCircleKm({ lat: 0, lng: 0 }, { lat: 90, lng: 0 })).toBeCloseTo(
      (Math.PI / 2) * MEAN_EARTH_RADIUS_KM,
      9,
    );
    expect(greatCircleKm({ lat: 10, lng: 20 }, { lat: -10, lng: -160 })).toBeCloseTo(
      Math.PI * MEAN_EARTH_RADIUS_KM,
      // Haversine loses digits near antipodes (rounding in sin² near 1): within a metre.
      3,
    );
  });

  it('is symmetric, zero from a point to itself, and never above half the circumference (property)', () => {
    const lat = fc.double({ min: -90, max: 90, noNaN: true });
    const lng = fc.double({ min: -180, max: 180, noNaN: true });
    fc.assert(
      fc.property(lat, lng, lat, lng, (a1, o1, a2, o2) => {
        const p = { lat: a1, lng: o1 };
        const q = { lat: a2, lng: o2 };
        expect(greatCircleKm(p, q)).toBeCloseTo(greatCircleKm(q, p), 6);
        expect(greatCircleKm(p, p)).toBe(0);
        expect(greatCircleKm(p, q)).toBeLessThanOrEqual(Math.PI * MEAN_EARTH_RADIUS_KM + 1e-6);
      }),
    );
  });

  it('refuses positions off the globe, naming the field', () => {
    expect(() => greatCircleKm({ lat: 91, lng: 0 }, LAX)).toThrow(
      expect.objectContaining({ field: 'from.lat', rule: 'range' }),
    );
    expect(() => greatCircleKm(BNA, { lat: 0, lng: Number.NaN })).toThrow(
      expect.objectContaining({ field: 'to.lng', rule: 'finite' }),
    );
  });
});

describe('driveMinutes — road factor and average speed (common practice, no published source)', () => {
  // Two stops 0.1° of latitude apart: 11.12 km on the mean sphere.
  const a = { lat: 44.6, lng: -124.05 };
  const b = { lat: 44.7, lng: -124.05 };
  const straight = 0.1 * (Math.PI / 180) * MEAN_EARTH_RADIUS_KM;

  it('defaults to a road factor of 1.3 and 40 km/h', () => {
    expect(DEFAULT_DRIVE).toEqual({ roadFactor: 1.3, averageKmh: 40 });
    expect(driveMinutes(a, b)).toBeCloseTo(((straight * 1.3) / 40) * 60, 9);
  });

  it("takes the business's own factors", () => {
    const estimate = driveEstimate(a, b, { roadFactor: 1.5, averageKmh: 30 });
    expect(estimate.roadKm).toBeCloseTo(straight * 1.5, 9);
    expect(estimate.minutes).toBeCloseTo(((straight * 1.5) / 30) * 60, 9);
    expect(estimate.reasons[0]).toMatchObject({
      code: 'estimate-from-positions',
      basis: 'common practice, no published source',
    });
    expect(estimate.reasons[0]?.message).toContain('11.1 km in a straight line × 1.5');
  });

  it('is zero between two visits at the same address', () => {
    expect(driveMinutes(a, a)).toBe(0);
  });

  it('refuses a road factor below 1 and a speed of zero', () => {
    expect(() => driveMinutes(a, b, { roadFactor: 0.8 })).toThrow(
      expect.objectContaining({ field: 'roadFactor', rule: 'range' }),
    );
    expect(() => driveMinutes(a, b, { averageKmh: 0 })).toThrow(
      expect.objectContaining({ field: 'averageKmh', rule: 'range' }),
    );
  });
});

// Drive time between two stops, from their positions alone (no map service: the app works
// offline and fetches nothing from outside our own server).
//
//   distance  = great-circle distance (haversine) on a sphere of the mean Earth radius
//   road km   = distance × road factor (roads wind; the crow does not)
//   minutes   = road km ÷ average speed × 60
//
// The haversine formula is exact on a sphere; the sphere is the IUGG mean radius
// R1 = 6371.0088 km (Moritz, "Geodetic Reference System 1980", for the IUGG). On the
// ellipsoid the true distance differs by up to about 0.5 %, far below what the road factor
// guesses. The road factor 1.3 and the average speed 40 km/h are common practice, no
// published source: rough figures for town and suburban driving, editable in Settings.
import { finite, inRange, positive } from '../internal/validate';
import { BASIS, type Reason, reason } from '../reasons';

/** Mean radius of the Earth, R1 = (2a + b) / 3 of GRS 80 (IUGG), in km. */
export const MEAN_EARTH_RADIUS_KM = 6371.0088;

export interface LatLng {
  /** Degrees north (−90…90). */
  readonly lat: number;
  /** Degrees east (−180…180). */
  readonly lng: number;
}

export interface DriveSettings {
  /** Road distance ÷ straight-line distance (≥ 1). */
  readonly roadFactor: number;
  /** Average driving speed door to door (km/h). */
  readonly averageKmh: number;
}

/** Common practice, no published source: editable defaults. */
export const DEFAULT_DRIVE: DriveSettings = { roadFactor: 1.3, averageKmh: 40 };

const DEG = Math.PI / 180;

function point(field: string, p: LatLng): { lat: number; lng: number } {
  return {
    lat: inRange(`${field}.lat`, p?.lat, -90, 90, { unit: '°' }),
    lng: inRange(`${field}.lng`, p?.lng, -180, 180, { unit: '°' }),
  };
}

/**
 * Great-circle distance (km) between two points, by the haversine formula, on a sphere of
 * `radiusKm` (default: the IUGG mean radius).
 */
export function greatCircleKm(from: LatLng, to: LatLng, radiusKm = MEAN_EARTH_RADIUS_KM): number {
  const a = point('from', from);
  const b = point('to', to);
  const r = positive('radiusKm', radiusKm);
  const dLat = (b.lat - a.lat) * DEG;
  const dLng = (b.lng - a.lng) * DEG;
  const h =
    Math.sin(dLat / 2) ** 2 +
    Math.cos(a.lat * DEG) * Math.cos(b.lat * DEG) * Math.sin(dLng / 2) ** 2;
  // Clamp: rounding can push h a hair above 1 for points on opposite sides of the Earth.
  return 2 * r * Math.asin(Math.sqrt(Math.min(1, h)));
}

export interface DriveEstimate {
  /** Straight-line (great-circle) distance, km. */
  readonly straightKm: number;
  /** Estimated road distance, km. */
  readonly roadKm: number;
  /** Estimated drive, minutes (not rounded). */
  readonly minutes: number;
  readonly reasons: readonly Reason<'estimate-from-positions'>[];
}

function checkSettings(settings: Partial<DriveSettings> = {}): DriveSettings {
  return {
    roadFactor: inRange('roadFactor', settings.roadFactor ?? DEFAULT_DRIVE.roadFactor, 1, 5),
    averageKmh: inRange('averageKmh', settings.averageKmh ?? DEFAULT_DRIVE.averageKmh, 1, 200, {
      unit: 'km/h',
    }),
  };
}

/** Distance, road distance and drive time between two stops, with how it was reached. */
export function driveEstimate(
  from: LatLng,
  to: LatLng,
  settings: Partial<DriveSettings> = {},
): DriveEstimate {
  const s = checkSettings(settings);
  const straightKm = greatCircleKm(from, to);
  const roadKm = straightKm * s.roadFactor;
  const minutes = (roadKm / s.averageKmh) * 60;
  return {
    straightKm,
    roadKm,
    minutes,
    reasons: [
      reason(
        'estimate-from-positions',
        'info',
        `Estimated from the two addresses' positions: ${roundTo(straightKm, 1)} km in a straight line × ${s.roadFactor} for the roads, at ${s.averageKmh} km/h. Traffic and detours are not known.`,
        BASIS.commonPractice,
      ),
    ],
  };
}

/** Minutes of driving from one stop to the next (see driveEstimate). */
export function driveMinutes(
  from: LatLng,
  to: LatLng,
  settings: Partial<DriveSettings> = {},
): number {
  return driveEstimate(from, to, settings).minutes;
}

function roundTo(value: number, decimals: number): string {
  const f = 10 ** decimals;
  return String(Math.round(finite('value', value) * f) / f);
}

/**
 * Where a job is, for drive times: a point from the phone's location, rounded, in words, and
 * why the phone could not give one.
 */

export interface Spot {
  lat: number;
  lng: number;
}

/** Rounded to 5 decimals (about a metre): more is noise from a phone. */
export function roundSpot(lat: number, lng: number): Spot {
  const r = (n: number) => Math.round(n * 100_000) / 100_000;
  return { lat: r(lat), lng: r(lng) };
}

/** A stored point, or null when the row has none (both figures are needed). */
export function spotOf(row: { lat: number | null; lng: number | null } | null | undefined) {
  if (!row || row.lat === null || row.lng === null) return null;
  if (!Number.isFinite(row.lat) || !Number.isFinite(row.lng)) return null;
  return { lat: row.lat, lng: row.lng };
}

/** "51.50735° N, 0.12776° W": the figures with the side of the world they are on. */
export function spotWords({ lat, lng }: Spot): string {
  const fig = (n: number) => Math.abs(n).toFixed(5);
  return `${fig(lat)}° ${lat < 0 ? 'S' : 'N'}, ${fig(lng)}° ${lng < 0 ? 'W' : 'E'}`;
}

/** The Geolocation API's error codes (the same numbers in every browser). */
export const LOCATION_DENIED = 1;
export const LOCATION_UNAVAILABLE = 2;
export const LOCATION_TIMEOUT = 3;

/** Why the phone gave no position, in words; the job is left as it was. */
export function locationProblem(code: number | 'unsupported'): string {
  switch (code) {
    case 'unsupported':
      return 'This phone cannot tell the app where it is. Nothing was changed.';
    case LOCATION_DENIED:
      return 'Location is not allowed for Panelpass. Allow it in the phone or browser settings, then tap again. Nothing was changed.';
    case LOCATION_TIMEOUT:
      return 'The phone took too long to find where it is. Try again in the open. Nothing was changed.';
    default:
      return 'The phone could not find where it is right now. Try again in a moment. Nothing was changed.';
  }
}

import { useCallback, useState } from 'react';

export type HereState =
  | { state: 'idle' }
  | { state: 'finding' }
  | { state: 'found'; lat: number; lng: number; accuracyM: number }
  | { state: 'failed'; problem: string };

/** Rounded to 5 decimals (about a metre): more is noise from a phone. */
const round5 = (n: number) => Math.round(n * 100_000) / 100_000;

/**
 * "Use this phone's location": one position from the phone (GPS or network), or why there is
 * none, in words. Asks for permission the first time, as the browser does.
 */
export function useHereLocation() {
  const [here, setHere] = useState<HereState>({ state: 'idle' });
  const locate = useCallback((onFound?: (at: { lat: number; lng: number }) => void) => {
    if (typeof navigator === 'undefined' || !('geolocation' in navigator)) {
      setHere({ state: 'failed', problem: 'This phone cannot tell its position to the app.' });
      return;
    }
    setHere({ state: 'finding' });
    navigator.geolocation.getCurrentPosition(
      (pos) => {
        const at = { lat: round5(pos.coords.latitude), lng: round5(pos.coords.longitude) };
        setHere({ state: 'found', ...at, accuracyM: Math.round(pos.coords.accuracy) });
        onFound?.(at);
      },
      (error) =>
        setHere({
          state: 'failed',
          problem:
            error.code === error.PERMISSION_DENIED
              ? "The phone said no: allow location for Panelpass in the browser's settings, or type the figures."
              : error.code === error.TIMEOUT
                ? 'The phone took too long to find where it is. Try again outside, or type the figures.'
                : 'The phone could not find where it is. Try again, or type the figures.',
        }),
      { enableHighAccuracy: true, timeout: 20_000, maximumAge: 60_000 },
    );
  }, []);
  return { here, locate };
}

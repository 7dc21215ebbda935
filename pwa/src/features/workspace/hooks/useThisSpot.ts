import { useCallback, useRef, useState } from 'react';
import type { CustomerRow, JobRow } from '@panelpass/shared';
import { CommandRefusedError, OutOfSpaceError } from '../../../db/errors';
import { useSync } from '../../../sync/context';
import { locationProblem, roundSpot, spotOf, type Spot } from '../model/spot';

export type SpotState =
  | { state: 'idle' }
  | { state: 'finding' }
  | { state: 'stored'; spot: Spot; customerToo: boolean }
  | { state: 'failed'; problem: string };

/**
 * "Use this spot": one position from the phone, stored in the job (`job.update` lat/lng) and
 * in its customer too when they have none yet (`customer.update`), on the phone at once and
 * sent with the next sync, so it works with no signal. Asks for permission the first time,
 * as the browser does; a refusal is said in words and changes nothing.
 */
export function useThisSpot(job: JobRow, customer: CustomerRow | null | undefined) {
  const sync = useSync();
  const [spot, setSpot] = useState<SpotState>({ state: 'idle' });
  const finding = useRef(false);

  const store = useCallback(
    async (at: Spot) => {
      if (!sync) return;
      try {
        await sync.mutate('job.update', { id: job.id, lat: at.lat, lng: at.lng });
        const customerToo = Boolean(customer) && spotOf(customer) === null;
        if (customer && customerToo) {
          await sync.mutate('customer.update', { id: customer.id, lat: at.lat, lng: at.lng });
        }
        setSpot({ state: 'stored', spot: at, customerToo });
      } catch (error) {
        if (error instanceof CommandRefusedError || error instanceof OutOfSpaceError) {
          setSpot({ state: 'failed', problem: `Not saved: ${error.message}` });
          return;
        }
        throw error;
      }
    },
    [sync, job.id, customer],
  );

  const storeHere = useCallback(() => {
    if (finding.current) return;
    if (typeof navigator === 'undefined' || !('geolocation' in navigator)) {
      setSpot({ state: 'failed', problem: locationProblem('unsupported') });
      return;
    }
    finding.current = true;
    setSpot({ state: 'finding' });
    navigator.geolocation.getCurrentPosition(
      (pos) => {
        finding.current = false;
        void store(roundSpot(pos.coords.latitude, pos.coords.longitude));
      },
      (error) => {
        finding.current = false;
        setSpot({ state: 'failed', problem: locationProblem(error.code) });
      },
      { enableHighAccuracy: true, timeout: 20_000, maximumAge: 60_000 },
    );
  }, [store]);

  return { spot, storeHere };
}

import { useQuery } from '@tanstack/react-query';
import { useEffect, useMemo } from 'react';
import { apiClient } from '../../app/services';
import { useAfterStart } from '../../app/useAfterStart';
import { useSession } from '../auth/hooks/useSession';
import { businessQuery } from './api/businessApi';
import { useOwnUnits } from './hooks/useOwnUnits';
import {
  DEFAULT_FIELD_SETTINGS,
  keepSettings,
  readFieldSettings,
  readKeptSettings,
  unitsView,
  type UnitsView,
} from './model/units';

function storage(): Storage | null {
  try {
    return typeof window === 'undefined' ? null : window.localStorage;
  } catch {
    return null;
  }
}

/**
 * The business's units (µm or mil, °C or °F), default waits and drive-time factors, with the
 * conversions and formatters every field screen uses. From the server when there is a
 * signal (asked once the first screen is up); the last answer is kept on the phone, so it holds
 * offline and meanwhile; µm and °C (and the other defaults) until the owner's settings have been
 * seen once. A helper is given no settings by the server and works with the defaults, in the
 * display units they chose for themselves (Settings, on their phone).
 */
export function useUnits(): UnitsView {
  const user = useSession()?.user ?? null;
  const businessId = user?.businessId ?? '';
  const isOwner = user?.role === 'owner';
  const afterStart = useAfterStart();
  const { data } = useQuery({
    ...businessQuery(apiClient, businessId),
    enabled: businessId !== '' && isOwner && afterStart,
  });
  // TanStack Query keeps `data` the same object until the answer changes.
  const fresh = useMemo(() => (data === undefined ? null : readFieldSettings(data)), [data]);
  const { own } = useOwnUnits();

  useEffect(() => {
    const store = storage();
    if (fresh && store && businessId) keepSettings(store, businessId, fresh);
  }, [fresh, businessId]);

  return useMemo(() => {
    if (fresh) return unitsView(fresh, 'server');
    const store = storage();
    const kept = store && businessId && isOwner ? readKeptSettings(store, businessId) : null;
    if (kept) return unitsView(kept, 'kept');
    const mine = !isOwner && own ? { ...DEFAULT_FIELD_SETTINGS, ...own } : DEFAULT_FIELD_SETTINGS;
    return unitsView(mine, 'defaults');
  }, [fresh, businessId, isOwner, own]);
}

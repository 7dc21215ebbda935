import { useQuery } from '@tanstack/react-query';
import { useEffect, useMemo } from 'react';
import { apiClient } from '../../../app/services';
import { useSession } from '../../auth/hooks/useSession';
import { businessQuery } from '../../settings/api/businessApi';
import {
  keepQuoteSettings,
  readKeptQuoteSettings,
  readQuoteSettings,
  type QuoteSettings,
} from '../model/pricingSettings';

function storage(): Storage | null {
  try {
    return typeof window === 'undefined' ? null : window.localStorage;
  } catch {
    return null;
  }
}

export interface QuoteSettingsView {
  /** Null until the owner's settings have been seen once on this phone. */
  settings: QuoteSettings | null;
  /** `server` (just fetched), `kept` (the copy on this phone) or null (none yet). */
  source: 'server' | 'kept' | null;
  loading: boolean;
}

/**
 * The business's prices for quoting (`GET /api/business`, owner only). The last answer is
 * kept on the phone, so a quote can be priced in a driveway with no signal.
 */
export function useQuoteSettings(): QuoteSettingsView {
  const user = useSession()?.user ?? null;
  const businessId = user?.businessId ?? '';
  const isOwner = user?.role === 'owner';
  const { data, isPending } = useQuery({
    ...businessQuery(apiClient, businessId),
    enabled: businessId !== '' && isOwner,
  });
  const fresh = useMemo(() => (data === undefined ? null : readQuoteSettings(data)), [data]);

  useEffect(() => {
    const store = storage();
    if (fresh && store && businessId) keepQuoteSettings(store, businessId, data);
  }, [fresh, data, businessId]);

  return useMemo(() => {
    if (fresh) return { settings: fresh, source: 'server', loading: false };
    const store = storage();
    const kept = store && businessId && isOwner ? readKeptQuoteSettings(store, businessId) : null;
    if (kept) return { settings: kept, source: 'kept', loading: false };
    return { settings: null, source: null, loading: isOwner && isPending };
  }, [fresh, businessId, isOwner, isPending]);
}

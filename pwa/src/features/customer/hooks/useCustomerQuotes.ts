import { useQuery } from '@tanstack/react-query';
import { useMemo } from 'react';
import { apiClient } from '../../../app/services';
import {
  customerQuoteQuery,
  customerQuotesQuery,
  customerVehiclesQuery,
  type CustomerVehicle,
} from '../api/customerApi';
import type { CustomerQuote } from '../model/quoteRecord';

/** "dark green Tessaly Longroof", as the visits name a vehicle. */
export function vehicleWords(v: CustomerVehicle | undefined): string {
  if (!v) return 'Your vehicle';
  return [v.colour, v.make, v.model].filter(Boolean).join(' ') || v.bodyStyle;
}

export interface QuoteListItem {
  quote: CustomerQuote;
  vehicle: string;
}

/** The customer's quotes (sent, accepted, declined), each with its vehicle in words. */
export function useCustomerQuotes(userId: string) {
  const quotes = useQuery(customerQuotesQuery(apiClient, userId));
  const vehicles = useQuery(customerVehiclesQuery(apiClient, userId));
  const items = useMemo<QuoteListItem[] | undefined>(() => {
    if (!quotes.data) return undefined;
    const byId = new Map((vehicles.data ?? []).map((v) => [v.id, v]));
    return quotes.data.items.map((quote) => ({
      quote,
      vehicle: vehicleWords(byId.get(quote.vehicleId)),
    }));
  }, [quotes.data, vehicles.data]);
  return { items, error: quotes.error, isPending: quotes.isPending };
}

/** One quote with its lines. */
export function useCustomerQuote(quoteId: string) {
  return useQuery(customerQuoteQuery(apiClient, quoteId));
}

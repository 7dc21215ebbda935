import { useQuery } from '@tanstack/react-query';
import { useLiveQuery } from 'dexie-react-hooks';
import { currencyDigits } from '@panelpass/shared';
import { useMemo } from 'react';
import { apiClient } from '../../../app/services';
import { useLocalDb } from '../../../db/hooks';
import { useSession } from '../../auth/hooks/useSession';
import { businessQuery } from '../../settings/api/businessApi';

export interface Money {
  currency: string;
  digits: number;
  /** "$0.0425" for a unit cost of 4.25 minor units: fractions of a cent kept. */
  unitCost: (minor: number) => string;
  /** "$12.50" for 1250 minor units. */
  amount: (minor: number) => string;
}

function knownCurrency(code: unknown): string | null {
  if (typeof code !== 'string' || !/^[A-Z]{3}$/.test(code)) return null;
  try {
    currencyDigits(code);
    return code;
  } catch {
    return null;
  }
}

/**
 * The business's currency and how to write amounts in it: from the owner's profile when
 * there is a signal, else from a payment this phone holds (offline), else US dollars.
 */
export function useMoney(): Money {
  const user = useSession()?.user ?? null;
  const businessId = user?.businessId ?? '';
  const { data } = useQuery({
    ...businessQuery(apiClient, businessId),
    enabled: businessId !== '' && user?.role === 'owner',
  });
  const db = useLocalDb();
  const fromPayments = useLiveQuery(
    async () =>
      db
        ? ((await db.rows('payments').limit(20).toArray()).find((p) => p.currency)?.currency ??
          null)
        : null,
    [db],
  );
  const fromBusiness =
    data && typeof data === 'object' && 'currency' in data ? data.currency : null;
  const currency = knownCurrency(fromBusiness) ?? knownCurrency(fromPayments) ?? 'USD';
  return useMemo(() => moneyIn(currency), [currency]);
}

export function moneyIn(currency: string): Money {
  const digits = currencyDigits(currency);
  const format = (value: number, maxDigits: number) =>
    new Intl.NumberFormat(undefined, {
      style: 'currency',
      currency,
      minimumFractionDigits: digits,
      maximumFractionDigits: maxDigits,
    }).format(value);
  return {
    currency,
    digits,
    unitCost: (minor) => format(minor / 10 ** digits, Math.min(20, digits + 4)),
    amount: (minor) => format(minor / 10 ** digits, digits),
  };
}

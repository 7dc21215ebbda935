import { useQuery } from '@tanstack/react-query';
import { useMemo } from 'react';
import type { JobRow, PaymentRow } from '@panelpass/shared';
import { apiClient } from '../../../app/services';
import { useJobRows, useRow } from '../../../db/hooks';
import { useSession } from '../../auth/hooks/useSession';
import { amountDue, type AmountDue } from '../../handover/model/handoverSummary';
import { businessQuery } from '../../settings/api/businessApi';
import { depositToAsk, paymentLines, type PaymentLine } from '../model/jobMoney';

export interface JobMoney {
  job: JobRow;
  payments: PaymentRow[];
  lines: PaymentLine[];
  currency: string;
  /** Null when the price is not on this phone (a helper's). */
  due: AmountDue | null;
  /** The quote's deposit less deposits paid (null: no quote with a deposit, or paid). */
  depositSuggestion: number | null;
}

/**
 * A job's payments and what is due, live from the phone's database, for the owner (a
 * helper's phone has no payments or prices): undefined while loading.
 */
export function useJobMoney(job: JobRow): JobMoney | undefined {
  const user = useSession()?.user ?? null;
  const owner = user?.role === 'owner';
  const payments = useJobRows('payments', job.id);
  const quote = useRow('quotes', job.quoteId);
  const businessId = user?.businessId ?? '';
  const { data: business } = useQuery({
    ...businessQuery(apiClient, businessId),
    enabled: businessId !== '' && owner,
  });

  return useMemo(() => {
    if (!payments) return undefined;
    const fromPayment = payments.find((p) => p.currency)?.currency;
    const fromBusiness =
      business && typeof business === 'object' && 'currency' in business ? business.currency : null;
    const currency = fromPayment || (typeof fromBusiness === 'string' && fromBusiness) || 'USD';
    const due = amountDue(job.priceMinor, payments, currency);
    return {
      job,
      payments,
      lines: paymentLines(payments),
      currency,
      due,
      depositSuggestion: due ? depositToAsk(quote?.depositMinor, payments, due.dueMinor) : null,
    };
  }, [job, payments, quote, business]);
}

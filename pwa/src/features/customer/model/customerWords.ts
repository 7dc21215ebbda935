import { formatMinor } from '@panelpass/shared';
import { isApiError, isNetworkError } from '../../../api/errors';

/** A job as the customer's list answers it (GET /api/jobs, the fields this screen reads). */
export interface CustomerJob {
  id: string;
  stage: string;
  windowStart: string;
  windowEnd: string;
  vehicleLabel: string;
  quoteId?: string | null;
  amountDueMinor: number;
  priceMinor?: number;
}

/** Why a sign-in link did not open, in words: the server's own message for a spent link. */
export function linkProblemWords(error: unknown): string {
  if (isApiError(error, 410)) return error.message;
  if (isNetworkError(error)) {
    return 'No connection to the server. The link has not been used: try it again when there is a signal.';
  }
  if (isApiError(error)) return error.message;
  return 'The link could not be opened. Try it again, or ask for a new one.';
}

/**
 * The amount due in the business's currency ("€350.00 to pay."); without a currency (not known
 * yet) a plain number with two decimals, so no symbol is guessed.
 */
export function dueWords(
  job: Pick<CustomerJob, 'amountDueMinor' | 'stage'>,
  currency?: string,
): string {
  if (job.amountDueMinor <= 0) return job.stage === 'closed' ? 'Paid in full.' : 'Nothing to pay.';
  const amount = currency
    ? formatMinor(job.amountDueMinor, currency)
    : new Intl.NumberFormat('en-US', {
        minimumFractionDigits: 2,
        maximumFractionDigits: 2,
      }).format(job.amountDueMinor / 100);
  return `${amount} to pay.`;
}

const STAGE_WORDS: Record<string, string> = {
  booked: 'Booked',
  closed: 'Finished',
};

/** "Booked", "In progress", "Finished" for a job's stage. */
export function stageWords(stage: string): string {
  return STAGE_WORDS[stage] ?? 'In progress';
}

/** "Tue 2 Dec" for the visit's day. */
export function visitDay(iso: string, locale?: string): string {
  const at = new Date(iso);
  if (Number.isNaN(at.getTime())) return '';
  return at.toLocaleDateString(locale, { weekday: 'short', day: 'numeric', month: 'short' });
}

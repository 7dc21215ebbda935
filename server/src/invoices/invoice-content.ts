import {
  type BodyStyle,
  fraction,
  percentFraction,
  roundFraction,
  toSafeNumber,
} from '@panelpass/shared';
import type { BusinessSettingsDto } from '../businesses/dto/business-settings.dto';
import type { JsonObject } from '../database/synced.entity';
import type { Job } from '../jobs/job.entity';
import { bpPercent, priceFromSettings } from '../quotes/quote-pricing';
import type { QuoteLine } from '../quotes/quote-line.entity';
import type { Quote } from '../quotes/quote.entity';
import type { QuoteInputsDto } from '../quotes/dto/quote.dto';

export interface InvoiceLine {
  kind: string;
  description: string;
  quantity: number;
  unitPriceMinor: number;
  amountMinor: number;
}

export interface InvoiceContent {
  lines: InvoiceLine[];
  subtotalMinor: number;
  taxMinor: number;
  totalMinor: number;
  taxLabel: string;
}

const roundingWords = { 'half-up': 'rounded half up', 'half-even': 'rounded half to even' };

/**
 * What an invoice says. Every amount comes from @panelpass/shared's pricing:
 *
 * - A job booked from a quote at the quote's total is invoiced with the quote's lines,
 *   subtotal and tax exactly as priceQuote worked them out when the customer accepted.
 * - Any other job has an agreed total that includes tax: the tax in it is
 *   total × rate ÷ (1 + rate), rounded by the business's rounding rule (shared roundFraction).
 */
export function invoiceContent(
  job: Job,
  quote: { quote: Quote; lines: QuoteLine[]; bodyStyle: BodyStyle } | null,
  settings: BusinessSettingsDto,
  currency: string,
): InvoiceContent {
  const tax = settings.tax;
  const rate = bpPercent(tax.rateBp);
  if (quote && quote.quote.totalMinor === job.priceMinor) {
    const q = quote.quote;
    let taxLabel = 'Tax as on the accepted quote';
    try {
      // The quote's tax words, when today's settings still price it the same.
      const again = priceFromSettings(
        settings,
        currency,
        q.inputs as unknown as QuoteInputsDto,
        quote.bodyStyle,
      );
      if (again.result.taxMinor === q.taxMinor) {
        taxLabel = `Tax ${rate} % ${tax.basis === 'per-line' ? 'on each taxable line' : 'on the taxable total'}, ${roundingWords[tax.rounding]}`;
      }
    } catch {
      // Settings changed so much the quote no longer prices: keep the plain label.
    }
    return {
      lines: quote.lines.map((l) => ({
        kind: l.kind,
        description: l.description,
        quantity: l.quantity,
        unitPriceMinor: l.unitPriceMinor,
        amountMinor: l.amountMinor,
      })),
      subtotalMinor: q.subtotalMinor,
      taxMinor: q.taxMinor,
      totalMinor: q.totalMinor,
      taxLabel,
    };
  }
  const total = job.priceMinor;
  const p = percentFraction('tax.ratePercent', rate);
  const included = toSafeNumber(
    'tax',
    roundFraction(fraction(BigInt(total) * p.num, p.den + p.num), tax.rounding),
  );
  const services = job.services.length ? job.services.join(', ') : 'Detailing work';
  return {
    lines: [
      {
        kind: 'agreed',
        description: services,
        quantity: 1,
        unitPriceMinor: total - included,
        amountMinor: total - included,
      },
    ],
    subtotalMinor: total - included,
    taxMinor: included,
    totalMinor: total,
    taxLabel: `Tax ${rate} % included in the agreed price, ${roundingWords[tax.rounding]}`,
  };
}

export const linesJson = (lines: InvoiceLine[]): JsonObject[] =>
  lines.map((l): JsonObject => ({ ...l }));

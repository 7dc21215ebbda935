import { Transform, Type } from 'class-transformer';
import { IsIn, IsInt, IsOptional, Matches, Max, Min } from 'class-validator';

const DAY = /^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/;
const dayMessage = (field: string) => `${field} must be a calendar day written YYYY-MM-DD`;

/** The kinds of entry the Ledger lists; `payment` is a balance payment. */
export const ENTRY_KINDS = ['quote', 'invoice', 'deposit', 'payment', 'refund'] as const;
export type EntryKind = (typeof ENTRY_KINDS)[number];

/**
 * A range of days in the business's time zone, both ends included: `?from=2026-03-01&to=2026-03-31`.
 */
export class LedgerRangeDto {
  /** First day (YYYY-MM-DD, the business's time zone). */
  @Matches(DAY, { message: dayMessage('from') })
  from: string;

  /** Last day, included (YYYY-MM-DD). */
  @Matches(DAY, { message: dayMessage('to') })
  to: string;
}

/** A range, paged. */
export class LedgerPageDto extends LedgerRangeDto {
  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(200)
  limit?: number = 50;

  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(0)
  offset?: number = 0;
}

/** Entries of a range, paged; `kind` keeps some kinds (`?kind=deposit,refund` or repeated). */
export class LedgerEntriesQueryDto extends LedgerPageDto {
  @IsOptional()
  @Transform(({ value }: { value: unknown }) =>
    (Array.isArray(value) ? value : [value])
      .flatMap((v) => String(v).split(','))
      .map((v) => v.trim())
      .filter((v) => v !== ''),
  )
  @IsIn(ENTRY_KINDS, {
    each: true,
    message: `kind must be one or more of: ${ENTRY_KINDS.join(', ')}`,
  })
  kind?: EntryKind[];
}

/** One quote, invoice or movement of money. */
export class LedgerEntryDto {
  id: string;
  kind: EntryKind;
  /** Quotes: when written; invoices: when issued; money: when it was paid. */
  at: string;
  /** Minor units. Money out (a refund) is negative; quotes and invoices give their total. */
  amountMinor: number;
  currency: string;
  /** Quotes: draft, sent, accepted…; invoices: issued; money: succeeded. */
  status: string;
  /** Money: card, cash or cheque. */
  method: string | null;
  jobId: string | null;
  /** Invoices: their number; money: the number of the job's invoice, if issued. */
  invoiceNumber: number | null;
  customerName: string | null;
  vehicleLabel: string | null;
}

export class LedgerKindSumDto {
  count: number;
  amountMinor: number;
}

export class LedgerEntriesDto {
  from: string;
  to: string;
  currency: string;
  items: LedgerEntryDto[];
  /** Entries of the range with the filter. */
  total: number;
  limit: number;
  offset: number;
  /** Count and sum per kind over the whole range (not paged, not filtered). */
  sums: Record<EntryKind, LedgerKindSumDto>;
}

/** What a job brought in and cost. */
export class LedgerFiguresDto {
  /** Deposits and balance payments received, less refunds (minor units). */
  revenueMinor: number;
  /** Products used on the job at their unit cost when used (minor units). */
  materialsMinor: number;
  /** Whole minutes of work (see docs/business.md, "Ledger"). */
  labourMinutes: number;
  /** labourMinutes × the labour cost per hour ÷ 60, rounded half up. */
  labourMinor: number;
  /** revenue − materials − labour. */
  profitMinor: number;
}

export class LedgerJobDto extends LedgerFiguresDto {
  jobId: string;
  windowStart: string;
  stage: string;
  customerName: string;
  vehicleLabel: string;
  /** The agreed price. */
  priceMinor: number;
  /** Deposits and balances received. */
  collectedMinor: number;
  /** Refunds given. */
  refundedMinor: number;
}

export class LedgerJobsDto {
  from: string;
  to: string;
  currency: string;
  labourCostPerHourMinor: number;
  items: LedgerJobDto[];
  total: number;
  limit: number;
  offset: number;
}

export class LedgerMonthDto extends LedgerFiguresDto {
  /** YYYY-MM in the business's time zone. */
  month: string;
  /** Jobs visited that month. */
  jobs: number;
}

export class LedgerTotalsDto extends LedgerFiguresDto {
  jobs: number;
}

export class LedgerMonthsDto {
  from: string;
  to: string;
  currency: string;
  labourCostPerHourMinor: number;
  /** Every month the range touches, oldest first, months without a job at zero. */
  months: LedgerMonthDto[];
  totals: LedgerTotalsDto;
}

import { HttpStatus, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { Business } from '../businesses/business.entity';
import { effectiveSettings } from '../businesses/default-settings';
import { AppException } from '../common/app.exception';
import { minorToDecimal, safeText, toCsv } from './csv';
import {
  ENTRY_KINDS,
  type EntryKind,
  type LedgerEntriesDto,
  type LedgerEntriesQueryDto,
  type LedgerEntryDto,
  type LedgerJobDto,
  type LedgerJobsDto,
  type LedgerMonthsDto,
  type LedgerPageDto,
  type LedgerRangeDto,
} from './dto/ledger.dto';

/** Timer kinds that run while the detailer works at the car; `keep-dry` runs after they leave. */
export const WORK_TIMER_KINDS = ['cure', 'flush', 'dwell', 'custom'] as const;

/** The longest range the Ledger sums in one answer: ten years (months: 120). */
const MAX_DAYS = 3_660;

interface BusinessFacts {
  timezone: string;
  currency: string;
  labourCostPerHourMinor: number;
}

export interface CsvFile {
  filename: string;
  content: string;
}

const toNumber = (v: unknown): number => (v === null || v === undefined ? 0 : Number(v));

function isRealDay(day: string): boolean {
  const d = new Date(`${day}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === day;
}

/**
 * The range checked: real calendar days, `from` not after `to`, at most ten years. Answers the
 * range as the SQL takes it (days; the business's zone turns them into instants in SQL).
 */
function checkRange(range: LedgerRangeDto): { from: string; to: string } {
  const bad = (field: string, message: string) =>
    new AppException(HttpStatus.BAD_REQUEST, 'validation-failed', message, [
      { field, rules: { range: message } },
    ]);
  if (!isRealDay(range.from)) throw bad('from', `from is not a calendar day: ${range.from}`);
  if (!isRealDay(range.to)) throw bad('to', `to is not a calendar day: ${range.to}`);
  const days = (Date.parse(range.to) - Date.parse(range.from)) / 86_400_000;
  if (days < 0) throw bad('to', 'to must not be before from');
  if (days >= MAX_DAYS) throw bad('to', 'A range may cover at most ten years');
  return { from: range.from, to: range.to };
}

/**
 * The jobs of the range with their figures, as SQL. Parameters: $1 business, $2 first day,
 * $3 last day (included), $4 time zone, $5 labour cost per hour (minor units).
 *
 * - A job belongs to the range (and to a month) by the start of its visit window.
 * - Revenue: the job's succeeded deposits and balances, less its succeeded refunds, whenever
 *   they were paid (the money of the visit).
 * - Materials: its `use` stock movements, −qty × the unit cost stored with each movement,
 *   summed exactly (numeric) and rounded half up to a minor unit once per job.
 * - Labour: the time covered by its work timers (cure, flush, dwell, custom), overlaps
 *   counted once (the union of their intervals); a timer's interval runs from its start to
 *   the first of: its end, its acknowledgement, its cancelling, a pause it is still in, now.
 *   Whole minutes (rounded down); cost = minutes × rate ÷ 60 rounded half up, in integers.
 */
const JOBS_SQL = `
  WITH j AS (
    SELECT j.id, j.window_start, j.stage, j.price_minor, j.customer_id, j.vehicle_id
    FROM jobs j
    WHERE j.business_id = $1 AND j.deleted_at IS NULL
      AND j.window_start >= ($2::date)::timestamp AT TIME ZONE $4
      AND j.window_start < ($3::date + 1)::timestamp AT TIME ZONE $4
  ),
  money AS (
    SELECT p.job_id,
      SUM(CASE WHEN p.kind IN ('deposit', 'balance') THEN p.amount_minor ELSE 0 END)::bigint AS collected,
      SUM(CASE WHEN p.kind = 'refund' THEN p.amount_minor ELSE 0 END)::bigint AS refunded
    FROM payments p JOIN j ON j.id = p.job_id
    WHERE p.business_id = $1 AND p.deleted_at IS NULL AND p.status = 'succeeded'
    GROUP BY p.job_id
  ),
  materials AS (
    SELECT m.job_id, ROUND(SUM(-m.qty * m.unit_cost_minor))::bigint AS cost
    FROM stock_movements m JOIN j ON j.id = m.job_id
    WHERE m.business_id = $1 AND m.deleted_at IS NULL AND m.reason = 'use'
    GROUP BY m.job_id
  ),
  spans AS (
    SELECT t.job_id, t.started_at AS s,
      LEAST(t.ends_at, COALESCE(t.acknowledged_at, 'infinity'), COALESCE(t.cancelled_at, 'infinity'),
            COALESCE(t.paused_at, 'infinity'), now()) AS e
    FROM timers t JOIN j ON j.id = t.job_id
    WHERE t.business_id = $1 AND t.deleted_at IS NULL
      AND t.kind IN (${WORK_TIMER_KINDS.map((k) => `'${k}'`).join(', ')})
  ),
  ordered AS (
    SELECT job_id, s, e,
      MAX(e) OVER (PARTITION BY job_id ORDER BY s, e ROWS BETWEEN UNBOUNDED PRECEDING AND 1 PRECEDING) AS reach
    FROM spans WHERE e > s
  ),
  grouped AS (
    SELECT job_id, s, e,
      SUM(CASE WHEN reach IS NULL OR s > reach THEN 1 ELSE 0 END)
        OVER (PARTITION BY job_id ORDER BY s, e ROWS UNBOUNDED PRECEDING) AS island
    FROM ordered
  ),
  islands AS (
    SELECT job_id, MIN(s) AS s, MAX(e) AS e FROM grouped GROUP BY job_id, island
  ),
  labour AS (
    SELECT job_id, FLOOR(SUM(EXTRACT(EPOCH FROM e - s)) / 60)::bigint AS minutes
    FROM islands GROUP BY job_id
  ),
  per_job AS (
    SELECT j.id, j.window_start, j.stage, j.price_minor, j.customer_id, j.vehicle_id,
      COALESCE(money.collected, 0) AS collected,
      COALESCE(money.refunded, 0) AS refunded,
      COALESCE(money.collected, 0) - COALESCE(money.refunded, 0) AS revenue,
      COALESCE(materials.cost, 0) AS materials,
      COALESCE(labour.minutes, 0) AS labour_minutes,
      (2 * COALESCE(labour.minutes, 0) * $5::bigint + 60) / 120 AS labour_cost
    FROM j
    LEFT JOIN money ON money.job_id = j.id
    LEFT JOIN materials ON materials.job_id = j.id
    LEFT JOIN labour ON labour.job_id = j.id
  )`;

const vehicleLabelSql = (v: string) =>
  `TRIM(CONCAT_WS(' ', ${v}.year::text, NULLIF(${v}.make, ''), NULLIF(${v}.model, '')))`;

interface JobRow {
  id: string;
  window_start: Date;
  stage: string;
  price_minor: number;
  customer_name: string | null;
  vehicle_label: string | null;
  collected: string;
  refunded: string;
  revenue: string;
  materials: string;
  labour_minutes: string;
  labour_cost: string;
  total: string;
}

interface MonthRow {
  month: string;
  jobs: string;
  revenue: string;
  materials: string;
  labour_minutes: string;
  labour_cost: string;
}

interface EntryRow {
  id: string;
  kind: EntryKind;
  at: Date;
  amount_minor: string;
  currency: string;
  status: string;
  method: string | null;
  job_id: string | null;
  invoice_number: number | null;
  customer_name: string | null;
  vehicle_label: string | null;
  total: string;
}

/**
 * Entries of the range as SQL: quotes (dated when written), invoices (when issued), and
 * money that moved (succeeded payments, dated when paid; a refund negative). $1 business,
 * $2 first day, $3 last day, $4 time zone.
 */
const ENTRIES_SQL = `
  WITH range AS (
    SELECT ($2::date)::timestamp AT TIME ZONE $4 AS lo, ($3::date + 1)::timestamp AT TIME ZONE $4 AS hi
  ),
  e AS (
    SELECT 'quote'::text AS kind, q.id, q.created_at AS at, q.total_minor::bigint AS amount_minor,
      q.currency, q.status, NULL::text AS method, q.job_id, NULL::int AS invoice_number,
      q.customer_id, q.vehicle_id
    FROM quotes q, range
    WHERE q.business_id = $1 AND q.deleted_at IS NULL AND q.created_at >= range.lo AND q.created_at < range.hi
    UNION ALL
    SELECT 'invoice', i.id, i.issued_at, i.total_minor::bigint, i.currency, 'issued', NULL, i.job_id,
      i.number, j.customer_id, j.vehicle_id
    FROM invoices i JOIN jobs j ON j.id = i.job_id, range
    WHERE i.business_id = $1 AND i.deleted_at IS NULL AND i.issued_at >= range.lo AND i.issued_at < range.hi
    UNION ALL
    SELECT CASE p.kind WHEN 'deposit' THEN 'deposit' WHEN 'refund' THEN 'refund' ELSE 'payment' END,
      p.id, p.paid_at,
      (CASE WHEN p.kind = 'refund' THEN -p.amount_minor ELSE p.amount_minor END)::bigint,
      p.currency, p.status, p.method, p.job_id,
      (SELECT i.number FROM invoices i WHERE i.job_id = p.job_id AND i.deleted_at IS NULL LIMIT 1),
      j.customer_id, j.vehicle_id
    FROM payments p LEFT JOIN jobs j ON j.id = p.job_id, range
    WHERE p.business_id = $1 AND p.deleted_at IS NULL AND p.status = 'succeeded'
      AND p.paid_at >= range.lo AND p.paid_at < range.hi
  )`;

@Injectable()
export class LedgerService {
  constructor(@InjectDataSource() private readonly db: DataSource) {}

  /** Quotes, invoices, deposits, payments and refunds of a range, newest first, paged. */
  async entries(actor: Actor, query: LedgerEntriesQueryDto): Promise<LedgerEntriesDto> {
    const { from, to } = checkRange(query);
    const biz = await this.business(actor);
    const limit = query.limit ?? 50;
    const offset = query.offset ?? 0;
    const kinds = query.kind && query.kind.length ? query.kind : null;
    const rows: EntryRow[] = await this.db.query(
      // The page first, then the names of its rows only: joined before the LIMIT, the names of
      // every entry of the range were looked up, and with many entries the planner read the
      // whole vehicles table (a Seq Scan at scale) instead of a primary-key probe each.
      `${ENTRIES_SQL},
       page AS (
         SELECT e.*, COUNT(*) OVER () AS total FROM e
         WHERE $5::text[] IS NULL OR e.kind = ANY($5::text[])
         ORDER BY e.at DESC, e.id
         LIMIT $6 OFFSET $7)
       SELECT e.kind, e.id, e.at, e.amount_minor, e.currency, e.status, e.method, e.job_id,
         e.invoice_number, c.name AS customer_name, ${vehicleLabelSql('v')} AS vehicle_label,
         e.total
       FROM page e
       LEFT JOIN customers c ON c.id = e.customer_id
       LEFT JOIN vehicles v ON v.id = e.vehicle_id
       ORDER BY e.at DESC, e.id`,
      [actor.businessId, from, to, biz.timezone, kinds, limit, offset],
    );
    const sumRows: { kind: EntryKind; count: string; amount: string }[] = await this.db.query(
      `${ENTRIES_SQL}
       SELECT kind, COUNT(*) AS count, COALESCE(SUM(amount_minor), 0)::bigint AS amount
       FROM e GROUP BY kind`,
      [actor.businessId, from, to, biz.timezone],
    );
    const sums = Object.fromEntries(
      ENTRY_KINDS.map((k) => [k, { count: 0, amountMinor: 0 }]),
    ) as LedgerEntriesDto['sums'];
    for (const r of sumRows)
      sums[r.kind] = { count: toNumber(r.count), amountMinor: toNumber(r.amount) };
    let total = toNumber(rows[0]?.total);
    if (!rows.length && offset > 0) {
      // Past the end: count without the window, so the pager still knows how far it goes.
      total = ENTRY_KINDS.filter((k) => !kinds || kinds.includes(k)).reduce(
        (n, k) => n + sums[k].count,
        0,
      );
    }
    return {
      from,
      to,
      currency: biz.currency,
      items: rows.map((r): LedgerEntryDto => ({
        id: r.id,
        kind: r.kind,
        at: r.at.toISOString(),
        amountMinor: toNumber(r.amount_minor),
        currency: r.currency,
        status: r.status,
        method: r.method,
        jobId: r.job_id,
        invoiceNumber: r.invoice_number,
        customerName: r.customer_name,
        vehicleLabel: r.vehicle_label || null,
      })),
      total,
      limit,
      offset,
      sums,
    };
  }

  /** Each job visited in the range: revenue, materials, labour and profit; newest visit first. */
  async jobs(actor: Actor, query: LedgerPageDto): Promise<LedgerJobsDto> {
    const { from, to } = checkRange(query);
    const biz = await this.business(actor);
    const limit = query.limit ?? 50;
    const offset = query.offset ?? 0;
    const params = [actor.businessId, from, to, biz.timezone, biz.labourCostPerHourMinor];
    const rows: JobRow[] = await this.db.query(
      `${JOBS_SQL}
       SELECT per_job.*, c.name AS customer_name, ${vehicleLabelSql('v')} AS vehicle_label,
         COUNT(*) OVER () AS total
       FROM per_job
       LEFT JOIN customers c ON c.id = per_job.customer_id
       LEFT JOIN vehicles v ON v.id = per_job.vehicle_id
       ORDER BY per_job.window_start DESC, per_job.id
       LIMIT $6 OFFSET $7`,
      [...params, limit, offset],
    );
    let total = toNumber(rows[0]?.total);
    if (!rows.length && offset > 0) {
      const counted: { n: string }[] = await this.db.query(
        `${JOBS_SQL} SELECT COUNT(*) AS n FROM per_job`,
        params,
      );
      const count = counted[0];
      total = toNumber(count?.n);
    }
    return {
      from,
      to,
      currency: biz.currency,
      labourCostPerHourMinor: biz.labourCostPerHourMinor,
      items: rows.map((r): LedgerJobDto => {
        const revenueMinor = toNumber(r.revenue);
        const materialsMinor = toNumber(r.materials);
        const labourMinor = toNumber(r.labour_cost);
        return {
          jobId: r.id,
          windowStart: r.window_start.toISOString(),
          stage: r.stage,
          customerName: r.customer_name ?? '',
          vehicleLabel: r.vehicle_label ?? '',
          priceMinor: r.price_minor,
          collectedMinor: toNumber(r.collected),
          refundedMinor: toNumber(r.refunded),
          revenueMinor,
          materialsMinor,
          labourMinutes: toNumber(r.labour_minutes),
          labourMinor,
          profitMinor: revenueMinor - materialsMinor - labourMinor,
        };
      }),
      total,
      limit,
      offset,
    };
  }

  /** Per month of the range (every month it touches, oldest first): the sums of its jobs. */
  async months(actor: Actor, query: LedgerRangeDto): Promise<LedgerMonthsDto> {
    const { from, to } = checkRange(query);
    const biz = await this.business(actor);
    const rows: MonthRow[] = await this.db.query(
      `${JOBS_SQL},
       by_month AS (
         SELECT to_char(window_start AT TIME ZONE $4, 'YYYY-MM') AS month,
           COUNT(*) AS jobs, SUM(revenue) AS revenue, SUM(materials) AS materials,
           SUM(labour_minutes) AS labour_minutes, SUM(labour_cost) AS labour_cost
         FROM per_job GROUP BY 1
       ),
       calendar AS (
         SELECT to_char(m, 'YYYY-MM') AS month
         FROM generate_series(date_trunc('month', $2::date::timestamp), date_trunc('month', $3::date::timestamp), interval '1 month') AS m
       )
       SELECT calendar.month, COALESCE(b.jobs, 0) AS jobs, COALESCE(b.revenue, 0) AS revenue,
         COALESCE(b.materials, 0) AS materials, COALESCE(b.labour_minutes, 0) AS labour_minutes,
         COALESCE(b.labour_cost, 0) AS labour_cost
       FROM calendar LEFT JOIN by_month b ON b.month = calendar.month
       ORDER BY calendar.month`,
      [actor.businessId, from, to, biz.timezone, biz.labourCostPerHourMinor],
    );
    const months = rows.map((r) => {
      const revenueMinor = toNumber(r.revenue);
      const materialsMinor = toNumber(r.materials);
      const labourMinor = toNumber(r.labour_cost);
      return {
        month: r.month,
        jobs: toNumber(r.jobs),
        revenueMinor,
        materialsMinor,
        labourMinutes: toNumber(r.labour_minutes),
        labourMinor,
        profitMinor: revenueMinor - materialsMinor - labourMinor,
      };
    });
    const totals = months.reduce(
      (t, m) => ({
        jobs: t.jobs + m.jobs,
        revenueMinor: t.revenueMinor + m.revenueMinor,
        materialsMinor: t.materialsMinor + m.materialsMinor,
        labourMinutes: t.labourMinutes + m.labourMinutes,
        labourMinor: t.labourMinor + m.labourMinor,
        profitMinor: t.profitMinor + m.profitMinor,
      }),
      {
        jobs: 0,
        revenueMinor: 0,
        materialsMinor: 0,
        labourMinutes: 0,
        labourMinor: 0,
        profitMinor: 0,
      },
    );
    return {
      from,
      to,
      currency: biz.currency,
      labourCostPerHourMinor: biz.labourCostPerHourMinor,
      months,
      totals,
    };
  }

  /** Invoices issued in the range, by number, for an accountant. */
  async invoicesCsv(actor: Actor, range: LedgerRangeDto): Promise<CsvFile> {
    const { from, to } = checkRange(range);
    const biz = await this.business(actor);
    const rows: {
      number: number;
      issued_on: string;
      customer_name: string | null;
      vehicle_label: string | null;
      subtotal_minor: number;
      tax_minor: number;
      total_minor: number;
      currency: string;
      tax_label: string;
      job_id: string;
      id: string;
    }[] = await this.db.query(
      `SELECT i.number, to_char(i.issued_at AT TIME ZONE $4, 'YYYY-MM-DD') AS issued_on,
         c.name AS customer_name, ${vehicleLabelSql('v')} AS vehicle_label,
         i.subtotal_minor, i.tax_minor, i.total_minor, i.currency, i.tax_label, i.job_id, i.id
       FROM invoices i
       JOIN jobs j ON j.id = i.job_id
       LEFT JOIN customers c ON c.id = j.customer_id
       LEFT JOIN vehicles v ON v.id = j.vehicle_id
       WHERE i.business_id = $1 AND i.deleted_at IS NULL
         AND i.issued_at >= ($2::date)::timestamp AT TIME ZONE $4
         AND i.issued_at < ($3::date + 1)::timestamp AT TIME ZONE $4
       ORDER BY i.number`,
      [actor.businessId, from, to, biz.timezone],
    );
    const content = toCsv(
      [
        'Invoice number',
        'Issued on',
        'Customer',
        'Vehicle',
        'Subtotal',
        'Tax',
        'Total',
        'Currency',
        'Tax rule',
        'Job',
        'Invoice id',
      ],
      rows.map((r) => [
        r.number,
        r.issued_on,
        safeText(r.customer_name),
        safeText(r.vehicle_label),
        minorToDecimal(r.subtotal_minor, r.currency),
        minorToDecimal(r.tax_minor, r.currency),
        minorToDecimal(r.total_minor, r.currency),
        r.currency,
        r.tax_label,
        r.job_id,
        r.id,
      ]),
    );
    return { filename: `invoices-${from}-to-${to}.csv`, content };
  }

  /** Money that moved in the range (deposits, balances, refunds as negative), oldest first. */
  async paymentsCsv(actor: Actor, range: LedgerRangeDto): Promise<CsvFile> {
    const { from, to } = checkRange(range);
    const biz = await this.business(actor);
    const rows: {
      paid_on: string;
      kind: string;
      method: string;
      amount_minor: number;
      currency: string;
      customer_name: string | null;
      vehicle_label: string | null;
      invoice_number: number | null;
      id: string;
      refund_of: string | null;
      job_id: string | null;
    }[] = await this.db.query(
      `SELECT to_char(p.paid_at AT TIME ZONE $4, 'YYYY-MM-DD') AS paid_on, p.kind, p.method,
         p.amount_minor, p.currency, c.name AS customer_name, ${vehicleLabelSql('v')} AS vehicle_label,
         (SELECT i.number FROM invoices i WHERE i.job_id = p.job_id AND i.deleted_at IS NULL LIMIT 1)
           AS invoice_number,
         p.id, p.refund_of, p.job_id
       FROM payments p
       LEFT JOIN jobs j ON j.id = p.job_id
       LEFT JOIN customers c ON c.id = j.customer_id
       LEFT JOIN vehicles v ON v.id = j.vehicle_id
       WHERE p.business_id = $1 AND p.deleted_at IS NULL AND p.status = 'succeeded'
         AND p.paid_at >= ($2::date)::timestamp AT TIME ZONE $4
         AND p.paid_at < ($3::date + 1)::timestamp AT TIME ZONE $4
       ORDER BY p.paid_at, p.id`,
      [actor.businessId, from, to, biz.timezone],
    );
    const content = toCsv(
      [
        'Paid on',
        'Kind',
        'Method',
        'Amount',
        'Currency',
        'Customer',
        'Vehicle',
        'Invoice number',
        'Payment id',
        'Refund of',
        'Job',
      ],
      rows.map((r) => [
        r.paid_on,
        r.kind,
        r.method,
        minorToDecimal(r.kind === 'refund' ? -r.amount_minor : r.amount_minor, r.currency),
        r.currency,
        safeText(r.customer_name),
        safeText(r.vehicle_label),
        r.invoice_number,
        r.id,
        r.refund_of,
        r.job_id,
      ]),
    );
    return { filename: `payments-${from}-to-${to}.csv`, content };
  }

  private async business(actor: Actor): Promise<BusinessFacts> {
    const business = await this.db.manager.findOneByOrFail(Business, { id: actor.businessId });
    const settings = effectiveSettings(business.settings);
    return {
      timezone: business.timezone,
      currency: business.currency,
      labourCostPerHourMinor: Math.max(0, Math.trunc(settings.labourCostPerHourMinor ?? 0)),
    };
  }
}

/**
 * The rows a command makes, computed the same way on the device (optimistically, offline)
 * and on the server (for the record). Pure: every time and id comes in through the
 * arguments or the context, so applying a command twice to the same rows gives the same
 * rows — which is what a rebase after a pull relies on.
 */
import { flushBy, maskRemoveBy, type MaskingTape, type SolventProduct } from '../dwell';
import {
  amountDueMinor,
  childId,
  DEFAULT_CHECKLIST,
  type PaymentLike,
  visitWindowProblem,
} from '../jobs';
import { bodyStyleTemplate, type BodyStyle } from '../panels';
import { InputError } from '../errors';
import type { CommandArgs, JobCreateArgs } from './commands';
import type { TimerTimes } from './timer-clock';
import type {
  ChecklistItemRow,
  JobPanelRow,
  JobRow,
  MaskingItemRow,
  ProductRow,
  PaymentRow,
  RowBase,
  SolventApplicationRow,
  StockMovementRow,
  TimerRow,
} from './rows';

/** Who records the command and when (epoch ms, on the server's clock as well as known). */
export interface EffectContext {
  userId: string;
  businessId: string;
  atMs: number;
}

// Time left on a timer: its own module, so a screen that only shows timers does not carry
// every command's effects.
export { timerRemainingMs } from './timer-clock';

const iso = (ms: number): string => new Date(ms).toISOString();

/** The columns of a row made on the device: version 0 until the server's copy arrives. */
export function newRowBase(id: string, ctx: EffectContext): RowBase {
  const at = iso(ctx.atMs);
  return {
    id,
    businessId: ctx.businessId,
    version: 0,
    createdAt: at,
    updatedAt: at,
    deletedAt: null,
  };
}

/** Temperatures and sizes are stored to one decimal; compute from the stored value. */
export const toOneDecimal = (n: number): number => Math.round(n * 10) / 10;

/** The id of a job's panel made from the body-style template (same on device and server). */
export const jobPanelId = (jobId: string, templateId: string): string =>
  childId(jobId, `panel:${templateId}`);

/** The id of a job's checklist item made from the default checklist. */
export const checklistItemId = (jobId: string, key: string): string =>
  childId(jobId, `check:${key}`);

/** The id of the flush timer a solvent application starts. */
export const flushTimerId = (applicationId: string): string => childId(applicationId, 'timer');

export interface JobCreateRows {
  job: JobRow;
  panels: JobPanelRow[];
  checklist: ChecklistItemRow[];
}

/**
 * A new visit with its panels (the body style's template, top down) and the default
 * checklist. The address and position default to the customer's.
 */
export function jobCreateRows(
  a: JobCreateArgs,
  refs: {
    customer: { address: string; lat: number | null; lng: number | null };
    vehicle: { bodyStyle: string };
  },
  ctx: EffectContext,
): JobCreateRows {
  if (Date.parse(a.windowEnd) <= Date.parse(a.windowStart)) {
    throw new InputError('windowEnd', 'order', 'windowEnd must be after windowStart');
  }
  const tooLong = visitWindowProblem(Date.parse(a.windowStart), Date.parse(a.windowEnd));
  if (tooLong) throw new InputError('windowEnd', 'maxLength', tooLong);
  const base = (id: string) => newRowBase(id, ctx);
  const job: JobRow = {
    ...base(a.id),
    customerId: a.customerId,
    vehicleId: a.vehicleId,
    quoteId: a.quoteId ?? null,
    address: a.address ?? refs.customer.address,
    lat: a.lat ?? refs.customer.lat,
    lng: a.lng ?? refs.customer.lng,
    windowStart: iso(Date.parse(a.windowStart)),
    windowEnd: iso(Date.parse(a.windowEnd)),
    assignedTechId: a.assignedTechId ?? null,
    stage: 'booked',
    conditionNotes: '',
    notes: a.notes ?? '',
    priceMinor: a.priceMinor ?? 0,
    services: a.services ?? [],
  };
  const panels = bodyStyleTemplate(refs.vehicle.bodyStyle as BodyStyle).map(
    (p, position): JobPanelRow => ({
      ...base(jobPanelId(a.id, p.id)),
      jobId: a.id,
      panelKey: p.id,
      label: p.label,
      band: p.band,
      position,
      substrate: p.substrate,
      finish: 'clear-coat',
      hardness: null,
      state: 'todo',
      areaM2: p.areaM2,
      clearEstimateUm: null,
      testSpotNote: '',
    }),
  );
  const checklist = DEFAULT_CHECKLIST.map((c, position): ChecklistItemRow => ({
    ...base(checklistItemId(a.id, c.key)),
    jobId: a.id,
    stage: c.stage,
    key: c.key,
    label: c.label,
    position,
    done: false,
    doneAt: null,
    doneBy: null,
  }));
  return { job, panels, checklist };
}

/**
 * Our own conservative dwell for a solvent whose data-sheet maximum was not entered: three
 * minutes at 20 °C (many spot solvents state 3–5 minutes; the short end errs towards
 * flushing early). Our own rule, no published source.
 */
export const DEFAULT_SOLVENT: SolventProduct = { maxDwellMin: 3 };

/**
 * Our own conservative clean-removal window for tape whose window was not entered: one day.
 * Our own rule, no published source.
 */
export const DEFAULT_TAPE: MaskingTape = { cleanRemovalDays: 1 };

type Properties = Record<string, unknown> | null | undefined;

/** The dwell properties of a solvent product, or the default (and that it was used). */
export function solventOf(properties: Properties): { product: SolventProduct; isDefault: boolean } {
  if (properties && typeof properties.maxDwellMin === 'number') {
    const { maxDwellMin, maxSurfaceC } = properties;
    return {
      product: typeof maxSurfaceC === 'number' ? { maxDwellMin, maxSurfaceC } : { maxDwellMin },
      isDefault: false,
    };
  }
  return { product: DEFAULT_SOLVENT, isDefault: true };
}

/** The clean-removal window of a tape product, or the default (and that it was used). */
export function tapeOf(properties: Properties): { tape: MaskingTape; isDefault: boolean } {
  if (properties && typeof properties.cleanRemovalDays === 'number') {
    const { cleanRemovalDays, cleanRemovalDaysInSun } = properties;
    return {
      tape:
        typeof cleanRemovalDaysInSun === 'number'
          ? { cleanRemovalDays, cleanRemovalDaysInSun }
          : { cleanRemovalDays },
      isDefault: false,
    };
  }
  return { tape: DEFAULT_TAPE, isDefault: true };
}

/** What the flush timer says: "Flush Tarlift off the hood" (the server words it the same). */
export function flushTimerLabel(productName: string | null, panelLabel: string | null): string {
  return `Flush ${productName ?? 'solvent'} off${panelLabel ? ` the ${panelLabel.toLowerCase()}` : ''}`;
}

/**
 * A solvent application and the flush timer it starts (ends at shared `flushBy`). The
 * arguments must carry `appliedAt` (the device fills it in before recording).
 */
export function solventApplyRows(
  a: CommandArgs['solvent.apply'] & { appliedAt: string },
  refs: {
    product: { name: string; properties: Properties } | null;
    panel: { label: string } | null;
  },
  ctx: EffectContext,
): { application: SolventApplicationRow; timer: TimerRow } {
  const appliedAtMs = Date.parse(a.appliedAt);
  const surfaceC = toOneDecimal(a.surfaceTempC);
  const { product } = solventOf(refs.product?.properties);
  const flush = flushBy({ appliedAtMs, product, surfaceC, inSun: a.inSun });
  const application: SolventApplicationRow = {
    ...newRowBase(a.id, ctx),
    jobId: a.jobId,
    panelId: a.panelId ?? null,
    productId: a.productId ?? null,
    surfaceTempC: surfaceC,
    inSun: a.inSun,
    appliedAt: iso(appliedAtMs),
    flushBy: iso(flush.flushByMs),
    flushedAt: null,
    appliedBy: ctx.userId,
  };
  const timer: TimerRow = {
    ...newRowBase(flushTimerId(a.id), ctx),
    jobId: a.jobId,
    kind: 'flush',
    subjectType: 'solvent',
    subjectId: a.id,
    label: flushTimerLabel(refs.product?.name ?? null, refs.panel?.label ?? null),
    startedAt: iso(appliedAtMs),
    endsAt: iso(flush.flushByMs),
    pausedMs: 0,
    pausedAt: null,
    acknowledgedAt: null,
    cancelledAt: null,
    startedBy: ctx.userId,
  };
  return { application, timer };
}

/** A masking item with its remove-by time from the tape's window (shared `maskRemoveBy`). */
export function maskAddRow(
  a: CommandArgs['mask.add'] & { appliedAt: string },
  productProperties: Properties,
  ctx: EffectContext,
): MaskingItemRow {
  const appliedAtMs = Date.parse(a.appliedAt);
  const { removeByMs } = maskRemoveBy({ appliedAtMs, tape: tapeOf(productProperties).tape });
  return {
    ...newRowBase(a.id, ctx),
    jobId: a.jobId,
    what: a.what,
    panelId: a.panelId ?? null,
    productId: a.productId ?? null,
    appliedAt: iso(appliedAtMs),
    removeBy: iso(removeByMs),
    removedAt: null,
  };
}

/** Stock is counted to 3 decimals (the server's numeric(12,3)); sums are rounded to match. */
export const toStockQty = (n: number): number => Math.round(n * 1000) / 1000;

/** The id of the movement that records a new product's opening stock (same on the server). */
export const openingStockId = (productId: string): string => childId(productId, 'opening-stock');

/**
 * A product put on the Shelf, with its opening stock recorded as a movement (so stock is
 * always explained), as the server's `product.create` makes them.
 */
export function productCreateRows(
  a: CommandArgs['product.create'],
  ctx: EffectContext,
): { product: ProductRow; opening: StockMovementRow | null } {
  const stockQty = toStockQty(a.stockQty ?? 0);
  const unitCostMinor = a.unitCostMinor ?? 0;
  const product: ProductRow = {
    ...newRowBase(a.id, ctx),
    name: a.name.trim(),
    kind: a.kind,
    properties: a.properties ?? {},
    unit: a.unit?.trim() || 'mL',
    stockQty,
    amountPerUse: a.amountPerUse ?? 0,
    unitCostMinor,
    lowStockAt: a.lowStockAt ?? 0,
    sdsUrl: a.sdsUrl ?? null,
  };
  const opening: StockMovementRow | null = stockQty
    ? {
        ...newRowBase(openingStockId(a.id), ctx),
        productId: a.id,
        qty: stockQty,
        reason: 'adjust',
        jobId: null,
        sourceType: null,
        sourceId: null,
        unitCostMinor,
      }
    : null;
  return { product, opening };
}

/** Why a stock adjustment is refused: the server's code and words for the same rule. */
export interface StockRefusal {
  code: 'validation-failed' | 'stock-below-zero';
  message: string;
}

/**
 * A restock or a count correction, by the server's rules: a restock adds, nothing goes below
 * zero, and a restock's unit cost becomes the product's (the last price paid).
 */
export function stockAdjustRows(
  a: CommandArgs['stock.adjust'],
  product: Pick<ProductRow, 'stockQty' | 'unit' | 'unitCostMinor'>,
  ctx: EffectContext,
):
  | { movement: StockMovementRow; changes: Pick<ProductRow, 'stockQty' | 'unitCostMinor'> }
  | StockRefusal {
  if (!Number.isFinite(a.qty) || a.qty === 0) {
    return { code: 'validation-failed', message: 'qty must not be zero' };
  }
  if (a.reason === 'restock' && a.qty < 0) {
    return { code: 'validation-failed', message: 'qty of a restock must be above zero' };
  }
  if (product.stockQty + a.qty < -1e-9) {
    return {
      code: 'stock-below-zero',
      message: `Only ${product.stockQty} ${product.unit} in stock; this would take it below zero`,
    };
  }
  const unitCostMinor = a.unitCostMinor ?? product.unitCostMinor ?? 0;
  return {
    movement: {
      ...newRowBase(a.id, ctx),
      productId: a.productId,
      qty: a.qty,
      reason: a.reason,
      jobId: null,
      sourceType: null,
      sourceId: null,
      unitCostMinor,
    },
    changes: {
      stockQty: toStockQty(product.stockQty + a.qty),
      unitCostMinor:
        a.reason === 'restock' && a.unitCostMinor !== undefined
          ? a.unitCostMinor
          : (product.unitCostMinor ?? 0),
    },
  };
}

/**
 * What one use logged in the field (a pass, a solvent, a touch-up layer, a piece of tape)
 * leaves of a product: its `amountPerUse` less, when that is set; null when uses of it are
 * not counted. The server takes it once per record (a unique key); so does the device.
 */
export function stockAfterUse(
  product: Pick<ProductRow, 'stockQty' | 'amountPerUse'>,
): number | null {
  if (!(product.amountPerUse > 0)) return null;
  return toStockQty(product.stockQty - product.amountPerUse);
}

/** The longest wait a timer may have (the server refuses longer). */
export const MAX_TIMER_MS = 30 * 24 * 60 * 60 * 1000;

/** A timer with an absolute end: `endsAt` as given, or `startedAt + durationMs`. */
export function timerStartRow(
  a: CommandArgs['timer.start'] & { startedAt: string },
  ctx: EffectContext,
): TimerRow {
  const startedAtMs = Date.parse(a.startedAt);
  if (a.endsAt !== undefined && a.durationMs !== undefined) {
    throw new InputError('endsAt', 'consistent', 'Give durationMs or endsAt, not both');
  }
  let endsAtMs: number;
  if (a.endsAt !== undefined) endsAtMs = Date.parse(a.endsAt);
  else if (a.durationMs !== undefined) endsAtMs = startedAtMs + a.durationMs;
  else throw new InputError('durationMs', 'non-empty', 'Give durationMs or endsAt');
  if (!(endsAtMs > startedAtMs)) {
    throw new InputError('endsAt', 'order', 'endsAt must be after startedAt');
  }
  if (endsAtMs - startedAtMs > MAX_TIMER_MS) {
    throw new InputError('endsAt', 'range', 'A timer may run at most 30 days');
  }
  return {
    ...newRowBase(a.id, ctx),
    jobId: a.jobId ?? null,
    kind: a.kind,
    subjectType: a.subjectType ?? null,
    subjectId: a.subjectId ?? null,
    label: a.label,
    startedAt: iso(startedAtMs),
    endsAt: iso(endsAtMs),
    pausedMs: 0,
    pausedAt: null,
    acknowledgedAt: null,
    cancelledAt: null,
    startedBy: ctx.userId,
  };
}

/** Pausing a running timer; null when it is already paused or finished with (or ended). */
export function pauseTimer(t: TimerTimes, atMs: number): Pick<TimerRow, 'pausedAt'> | null {
  if (t.pausedAt !== null || t.cancelledAt !== null || t.acknowledgedAt !== null) return null;
  if (atMs >= Date.parse(t.endsAt)) return null;
  return { pausedAt: iso(atMs) };
}

/**
 * Resuming a paused timer: the paused span is added to `pausedMs` and pushes `endsAt` later
 * by exactly as much. Null when it is not paused. A resume stamped before the pause (two
 * clocks) counts as no pause at all.
 */
export function resumeTimer(
  t: TimerTimes,
  atMs: number,
): Pick<TimerRow, 'pausedAt' | 'pausedMs' | 'endsAt'> | null {
  if (t.pausedAt === null) return null;
  const span = Math.max(0, atMs - Date.parse(t.pausedAt));
  return {
    pausedAt: null,
    pausedMs: t.pausedMs + span,
    endsAt: iso(Date.parse(t.endsAt) + span),
  };
}

/** Why a card payment cannot be asked for: the server's code and words for the same rule. */
export interface CardRequestRefusal {
  code: 'nothing-due' | 'amount-exceeds-due' | 'deposit-paid' | 'validation-failed';
  message: string;
}

/**
 * What a card payment request (`payment.request`) asks for, by the server's rules: the amount
 * given, else the whole amount due for a balance (shared `amountDueMinor`), or the quote's
 * deposit less deposits already paid; never more than is due. A refusal in the server's words
 * when it would say no. `quoteDepositMinor` is the deposit on the job's quote (null: none known).
 */
export function cardRequestAmount(
  a: Pick<CommandArgs['payment.request'], 'kind' | 'amountMinor'>,
  refs: { priceMinor: number; payments: readonly PaymentLike[]; quoteDepositMinor: number | null },
): { amountMinor: number } | CardRequestRefusal {
  const due = amountDueMinor(refs.priceMinor, refs.payments);
  if (due === 0) return { code: 'nothing-due', message: 'Nothing is due on this job' };
  let amount = a.amountMinor;
  if (amount === undefined) {
    if (a.kind === 'balance') amount = due;
    else {
      if (!refs.quoteDepositMinor) {
        return {
          code: 'validation-failed',
          message: 'This job has no quote with a deposit: give amountMinor',
        };
      }
      const depositsPaid = refs.payments
        .filter((p) => p.kind === 'deposit' && p.status === 'succeeded')
        .reduce((sum, p) => sum + p.amountMinor, 0);
      amount = Math.min(due, refs.quoteDepositMinor - depositsPaid);
      if (amount <= 0) {
        return {
          code: 'deposit-paid',
          message: 'The deposit of this job is paid already; ask for the balance instead',
        };
      }
    }
  }
  if (amount > due) {
    return {
      code: 'amount-exceeds-due',
      message: `At most what is due can be asked for (${due} minor units)`,
    };
  }
  return { amountMinor: amount };
}

/**
 * The pending card payment a request makes on the device before it reaches the server: no
 * checkout link yet (the server makes it with the provider and the pull brings it), no
 * currency (the business's, filled in by the server). `pending` with a null `checkoutUrl` is
 * how a screen knows the request is still on its way.
 */
export function cardRequestRow(
  a: CommandArgs['payment.request'],
  amountMinor: number,
  refs: { quoteId: string | null; recordedBy: string | null },
  ctx: EffectContext,
): PaymentRow {
  return {
    ...newRowBase(a.id, ctx),
    jobId: a.jobId,
    quoteId: refs.quoteId,
    kind: a.kind,
    method: 'card',
    amountMinor,
    currency: '',
    status: 'pending',
    opId: a.opId,
    providerRef: null,
    checkoutUrl: null,
    failureReason: null,
    paidAt: null,
    recordedBy: refs.recordedBy,
  };
}

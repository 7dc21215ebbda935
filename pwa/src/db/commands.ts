import {
  allowedNextStages,
  amountDueMinor,
  canMoveStage,
  cardRequestAmount,
  cardRequestRow,
  checkGaugeOnSubstrate,
  flushTimerId,
  isJobStage,
  jobCreateRows,
  maskAddRow,
  newRowBase,
  pauseTimer,
  productCreateRows,
  resumeTimer,
  solventApplyRows,
  stockAdjustRows,
  stockAfterUse,
  timerStartRow,
  toMicrometres,
  toOneDecimal,
  visitWindowProblem,
  type CommandArgs,
  type CommandName,
  type EffectContext,
  type JobRow,
  type QuoteInputsArgs,
  type Substrate,
  type SyncRowTypes,
  type SyncTable,
} from '@panelpass/shared';
import { CommandRefusedError } from './errors';
import type { Role } from './localDb';
import type { RowStore } from './rowStore';

/**
 * The local effect of every command: what the phone writes at once, before the server has
 * seen it. Deterministic in (arguments, current rows, context): every time a command needs is
 * filled into its arguments by `prepare` before it is recorded, or taken from the context's
 * `atMs` (stored with the mutation), so re-applying it on a rebase gives the same rows.
 *
 * The checks mirror the server's rules (closed job, stage table, gauge on substrate, owner
 * only) so the phone says no at once; the server still decides. The effects mirror the
 * server's services; where the phone cannot know a value the server sets (the business's
 * currency, a pin's final number) the server's copy replaces it at the next pull.
 */

export interface ApplyContext extends EffectContext {
  role: Role;
}

export interface CommandDef<N extends CommandName> {
  /** Fills in what the effect needs (times default to now, server clock) before recording. */
  prepare?: (args: CommandArgs[N], nowMs: number) => CommandArgs[N];
  apply: (store: RowStore, args: CommandArgs[N], ctx: ApplyContext) => Promise<void>;
}

const iso = (ms: number): string => new Date(ms).toISOString();
const isoOf = (value: string): string => iso(Date.parse(value));

/** The args without `id` and without fields left out (undefined). */
function fieldsOf<A extends { id: string }>(args: A): Partial<Omit<A, 'id'>> {
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(args)) if (k !== 'id' && v !== undefined) out[k] = v;
  return out as Partial<Omit<A, 'id'>>;
}

async function mustGet<T extends SyncTable>(
  store: RowStore,
  table: T,
  id: string,
  what: string,
): Promise<SyncRowTypes[T]> {
  const row = await store.get(table, id);
  if (!row) throw new CommandRefusedError('not-found', `${what} not found on this phone`);
  return row;
}

/** A job that takes field records: there, and not closed. */
async function openJob(store: RowStore, jobId: string): Promise<JobRow> {
  const job = await mustGet(store, 'jobs', jobId, 'Job');
  if (job.stage === 'closed') {
    throw new CommandRefusedError(
      'job-closed',
      'This job is closed; it takes no new field records or changes',
    );
  }
  return job;
}

function ownerOnly(ctx: ApplyContext, what: string): void {
  if (ctx.role !== 'owner') {
    throw new CommandRefusedError('forbidden', `Only the owner may ${what}`);
  }
}

async function patch<T extends SyncTable>(
  store: RowStore,
  table: T,
  row: SyncRowTypes[T],
  changes: Partial<SyncRowTypes[T]>,
  ctx: ApplyContext,
): Promise<void> {
  await store.put(table, { ...row, ...changes, updatedAt: iso(ctx.atMs) });
}

/** A create that was already applied (a retry, or a rebase) changes nothing. */
async function exists(store: RowStore, table: SyncTable, id: string): Promise<boolean> {
  return (await store.get(table, id)) !== undefined;
}

/** The next number on a job's outline or chip list; the server's own number wins on pull. */
async function nextNumber(
  store: RowStore,
  table: 'damage_pins' | 'chips',
  jobId: string,
): Promise<number> {
  const rows = await store.where(table, 'jobId', jobId);
  return 1 + rows.reduce((max, r) => Math.max(max, r.number), 0);
}

const trimmed = (v: string | undefined): string | undefined => v?.trim();

/** A product of one of the kinds that fits the record (a solvent for a solvent…). */
async function productOfKind(
  store: RowStore,
  productId: string | null | undefined,
  kinds: readonly string[],
): Promise<SyncRowTypes['products'] | null> {
  if (!productId) return null;
  const product = await mustGet(store, 'products', productId, 'Product');
  if (!kinds.includes(product.kind)) {
    throw new CommandRefusedError(
      'validation-failed',
      `productId must name a product of kind ${kinds.join(' or ')}; "${product.name}" is ${product.kind}`,
    );
  }
  return product;
}

/** A panel of this job, when one is named. */
async function panelOfJob(
  store: RowStore,
  panelId: string | null | undefined,
  jobId: string,
): Promise<SyncRowTypes['job_panels'] | null> {
  if (!panelId) return null;
  const panel = await mustGet(store, 'job_panels', panelId, 'Panel');
  if (panel.jobId !== jobId) throw new CommandRefusedError('not-found', 'Panel not found');
  return panel;
}

/** The same kinds the server accepts per record. */
const PRODUCT_KINDS = {
  pass: ['compound', 'polish', 'finishing-polish'],
  solvent: ['solvent'],
  tape: ['tape'],
  touchUp: ['touch-up'],
} as const;

/**
 * A use logged in the field takes the product's `amountPerUse` from its stock at once, as
 * the server does (once per record: the effect runs only when the record is new). So the
 * stock a phone shows is the server's count less the uses still waiting to be sent.
 */
async function takeUse(
  store: RowStore,
  productId: string | null | undefined,
  ctx: ApplyContext,
): Promise<void> {
  if (!productId) return;
  const product = await store.get('products', productId);
  if (!product) return;
  const left = stockAfterUse(product);
  if (left !== null) await patch(store, 'products', product, { stockQty: left }, ctx);
}

function timerState(t: SyncRowTypes['timers']): 'cancelled' | 'acknowledged' | 'paused' | 'live' {
  if (t.cancelledAt !== null) return 'cancelled';
  if (t.acknowledgedAt !== null) return 'acknowledged';
  return t.pausedAt !== null ? 'paused' : 'live';
}

function timerDone(action: string, state: string): CommandRefusedError {
  return new CommandRefusedError(
    'timer-action-not-allowed',
    `A timer ${state} takes no more changes; not ${action}`,
  );
}

function withTime<K extends string>(key: K) {
  return <A extends Partial<Record<K, string>>>(args: A, nowMs: number): A => ({
    ...args,
    [key]: args[key] === undefined ? iso(nowMs) : isoOf(args[key]),
  });
}

/** A quote that may still change: a draft or a sent one (as the server says). */
function quoteIsOpen(status: string, action: string): void {
  if (status !== 'draft' && status !== 'sent') {
    throw new CommandRefusedError(
      'quote-status',
      `A ${status} quote cannot be ${action}; only a draft or sent one`,
    );
  }
}

/** The offered visit's times as ISO strings (the server's JSON form of them). */
function quoteInputsIso(inputs: QuoteInputsArgs): QuoteInputsArgs {
  return {
    ...inputs,
    ...(inputs.windowStart === undefined ? {} : { windowStart: isoOf(inputs.windowStart) }),
    ...(inputs.windowEnd === undefined ? {} : { windowEnd: isoOf(inputs.windowEnd) }),
  };
}

/** Both ends of an offered visit or neither, the end after the start (as the server checks). */
function checkOfferedWindow(inputs: QuoteInputsArgs): void {
  const { windowStart, windowEnd } = inputs;
  if (windowStart === undefined && windowEnd === undefined) return;
  if (
    windowStart === undefined ||
    windowEnd === undefined ||
    !(Date.parse(windowEnd) > Date.parse(windowStart))
  ) {
    throw new CommandRefusedError(
      'validation-failed',
      'The visit offered must end after it starts',
    );
  }
  const tooLong = visitWindowProblem(Date.parse(windowStart), Date.parse(windowEnd));
  if (tooLong) throw new CommandRefusedError('validation-failed', tooLong);
}

const stringField = (record: Record<string, unknown>, key: string): string | undefined => {
  const value = record[key];
  return typeof value === 'string' ? value : undefined;
};

type Registry = { [N in CommandName]: CommandDef<N> };

export const COMMANDS: Registry = {
  'customer.create': {
    async apply(store, a, ctx) {
      ownerOnly(ctx, 'add customers');
      if (await exists(store, 'customers', a.id)) return;
      await store.put('customers', {
        ...newRowBase(a.id, ctx),
        name: a.name.trim(),
        email: a.email ?? null,
        phone: a.phone ?? null,
        address: a.address ?? '',
        lat: a.lat ?? null,
        lng: a.lng ?? null,
        notes: a.notes ?? '',
      });
    },
  },
  'customer.update': {
    async apply(store, a, ctx) {
      ownerOnly(ctx, 'change customers');
      const row = await mustGet(store, 'customers', a.id, 'Customer');
      const fields = fieldsOf(a);
      await patch(store, 'customers', row, { ...fields, name: trimmed(a.name) ?? row.name }, ctx);
    },
  },
  'customer.remove': {
    async apply(store, a, ctx) {
      ownerOnly(ctx, 'remove customers');
      await mustGet(store, 'customers', a.id, 'Customer');
      await store.remove('customers', a.id);
    },
  },

  'vehicle.create': {
    async apply(store, a, ctx) {
      ownerOnly(ctx, 'add vehicles');
      if (await exists(store, 'vehicles', a.id)) return;
      await mustGet(store, 'customers', a.customerId, 'Customer');
      await store.put('vehicles', {
        ...newRowBase(a.id, ctx),
        customerId: a.customerId,
        make: trimmed(a.make) ?? '',
        model: trimmed(a.model) ?? '',
        year: a.year ?? null,
        bodyStyle: a.bodyStyle,
        colour: a.colour ?? '',
        paintNotes: a.paintNotes ?? '',
        plate: a.plate ?? null,
      });
    },
  },
  'vehicle.update': {
    async apply(store, a, ctx) {
      ownerOnly(ctx, 'change vehicles');
      const row = await mustGet(store, 'vehicles', a.id, 'Vehicle');
      const fields = fieldsOf(a);
      await patch(
        store,
        'vehicles',
        row,
        { ...fields, make: trimmed(a.make) ?? row.make, model: trimmed(a.model) ?? row.model },
        ctx,
      );
    },
  },
  'vehicle.remove': {
    async apply(store, a, ctx) {
      ownerOnly(ctx, 'remove vehicles');
      await mustGet(store, 'vehicles', a.id, 'Vehicle');
      await store.remove('vehicles', a.id);
    },
  },

  'product.create': {
    async apply(store, a, ctx) {
      ownerOnly(ctx, 'change the Shelf');
      if (await exists(store, 'products', a.id)) return;
      const { product, opening } = productCreateRows(a, ctx);
      await store.put('products', product);
      if (opening) await store.put('stock_movements', opening);
    },
  },
  'product.update': {
    async apply(store, a, ctx) {
      ownerOnly(ctx, 'change the Shelf');
      const row = await mustGet(store, 'products', a.id, 'Product');
      const fields = fieldsOf(a);
      await patch(
        store,
        'products',
        row,
        { ...fields, name: trimmed(a.name) ?? row.name, unit: trimmed(a.unit) ?? row.unit },
        ctx,
      );
    },
  },
  'stock.adjust': {
    async apply(store, a, ctx) {
      ownerOnly(ctx, 'change stock');
      const product = await mustGet(store, 'products', a.productId, 'Product');
      const existing = await store.get('stock_movements', a.id);
      if (existing) {
        if (existing.productId !== product.id) {
          throw new CommandRefusedError('id-taken', 'That id is already in use');
        }
        return;
      }
      const done = stockAdjustRows(a, product, ctx);
      if ('code' in done) throw new CommandRefusedError(done.code, done.message);
      await store.put('stock_movements', done.movement);
      await patch(store, 'products', product, done.changes, ctx);
    },
  },

  'job.create': {
    async apply(store, a, ctx) {
      ownerOnly(ctx, 'book jobs');
      if (await exists(store, 'jobs', a.id)) return;
      const customer = await mustGet(store, 'customers', a.customerId, 'Customer');
      const vehicle = await mustGet(store, 'vehicles', a.vehicleId, 'Vehicle');
      if (vehicle.customerId !== customer.id) {
        throw new CommandRefusedError(
          'vehicle-not-of-customer',
          "That vehicle is not this customer's",
        );
      }
      const rows = jobCreateRows(a, { customer, vehicle }, ctx);
      await store.put('jobs', rows.job);
      for (const panel of rows.panels) await store.put('job_panels', panel);
      for (const item of rows.checklist) await store.put('checklist_items', item);
    },
  },
  'job.update': {
    prepare: (a) => ({
      ...a,
      ...(a.windowStart === undefined ? {} : { windowStart: isoOf(a.windowStart) }),
      ...(a.windowEnd === undefined ? {} : { windowEnd: isoOf(a.windowEnd) }),
    }),
    async apply(store, a, ctx) {
      const job = await mustGet(store, 'jobs', a.id, 'Job');
      const fields = fieldsOf(a);
      if (ctx.role !== 'owner') {
        const refused = Object.keys(fields).filter((k) => k !== 'notes' && k !== 'conditionNotes');
        if (refused.length) {
          throw new CommandRefusedError(
            'forbidden',
            `A helper may not change ${refused.join(', ')}`,
          );
        }
      }
      if (job.stage === 'closed') {
        throw new CommandRefusedError('job-closed', 'This job is closed; it cannot be changed');
      }
      const start = Date.parse(a.windowStart ?? job.windowStart);
      const end = Date.parse(a.windowEnd ?? job.windowEnd);
      if (end <= start) {
        throw new CommandRefusedError('validation-failed', 'windowEnd must be after windowStart');
      }
      const tooLong = visitWindowProblem(start, end);
      if (tooLong) throw new CommandRefusedError('validation-failed', tooLong);
      await patch(store, 'jobs', job, fields, ctx);
    },
  },
  'job.setStage': {
    async apply(store, a, ctx) {
      const job = await mustGet(store, 'jobs', a.id, 'Job');
      if (!isJobStage(job.stage) || !isJobStage(a.stage)) {
        throw new CommandRefusedError('validation-failed', `${a.stage} is not a stage`);
      }
      if (job.stage === a.stage) return;
      if (!canMoveStage(job.stage, a.stage)) {
        const allowed = allowedNextStages(job.stage);
        throw new CommandRefusedError(
          'stage-not-allowed',
          allowed.length
            ? `A job at ${job.stage} can move to ${allowed.join(' or ')}, not ${a.stage}`
            : `A ${job.stage} job cannot change stage`,
        );
      }
      await patch(store, 'jobs', job, { stage: a.stage }, ctx);
    },
  },
  'job.assign': {
    async apply(store, a, ctx) {
      ownerOnly(ctx, 'assign jobs');
      const job = await mustGet(store, 'jobs', a.id, 'Job');
      await patch(store, 'jobs', job, { assignedTechId: a.techId }, ctx);
    },
  },
  'job.remove': {
    async apply(store, a, ctx) {
      ownerOnly(ctx, 'remove jobs');
      await mustGet(store, 'jobs', a.id, 'Job');
      await store.remove('jobs', a.id);
    },
  },

  'pin.add': {
    async apply(store, a, ctx) {
      if (await exists(store, 'damage_pins', a.id)) return;
      await openJob(store, a.jobId);
      await store.put('damage_pins', {
        ...newRowBase(a.id, ctx),
        jobId: a.jobId,
        number: a.number ?? (await nextNumber(store, 'damage_pins', a.jobId)),
        x: a.x,
        y: a.y,
        panelKey: a.panelKey ?? null,
        kind: a.kind,
        severity: a.severity,
        note: a.note ?? '',
        photoId: a.photoId ?? null,
      });
    },
  },
  'pin.update': {
    async apply(store, a, ctx) {
      const pin = await mustGet(store, 'damage_pins', a.id, 'Pin');
      await openJob(store, pin.jobId);
      await patch(store, 'damage_pins', pin, fieldsOf(a), ctx);
    },
  },
  'pin.remove': {
    async apply(store, a) {
      const pin = await mustGet(store, 'damage_pins', a.id, 'Pin');
      await openJob(store, pin.jobId);
      await store.remove('damage_pins', a.id);
    },
  },

  'reading.add': {
    prepare: withTime('takenAt'),
    async apply(store, a, ctx) {
      if (await exists(store, 'film_readings', a.id)) return;
      await openJob(store, a.jobId);
      const panel = await mustGet(store, 'job_panels', a.panelId, 'Panel');
      if (panel.jobId !== a.jobId) throw new CommandRefusedError('not-found', 'Panel not found');
      const check = checkGaugeOnSubstrate(a.gaugeType, panel.substrate as Substrate);
      if (check.validity === 'not-valid') {
        throw new CommandRefusedError(
          'gauge-not-valid-on-substrate',
          check.reasons[0]?.message ??
            `A ${a.gaugeType} gauge cannot measure on ${panel.substrate}`,
        );
      }
      await store.put('film_readings', {
        ...newRowBase(a.id, ctx),
        jobId: a.jobId,
        panelId: a.panelId,
        phase: a.phase,
        readingsUm: a.readings.map((v, i) => toMicrometres(v, a.unit, `readings[${i}]`)),
        unit: a.unit,
        gaugeType: a.gaugeType,
        takenAt: a.takenAt ?? iso(ctx.atMs),
        takenBy: ctx.userId,
      });
    },
  },
  'panel.update': {
    async apply(store, a, ctx) {
      const panel = await mustGet(store, 'job_panels', a.id, 'Panel');
      await openJob(store, panel.jobId);
      await patch(store, 'job_panels', panel, fieldsOf(a), ctx);
    },
  },
  'pass.log': {
    prepare: withTime('loggedAt'),
    async apply(store, a, ctx) {
      if (await exists(store, 'correction_passes', a.id)) return;
      await openJob(store, a.jobId);
      const panel = (await panelOfJob(store, a.panelId, a.jobId))!;
      await productOfKind(store, a.productId, PRODUCT_KINDS.pass);
      await store.put('correction_passes', {
        ...newRowBase(a.id, ctx),
        jobId: a.jobId,
        panelId: a.panelId,
        step: a.step,
        machine: a.machine,
        pad: a.pad,
        productId: a.productId ?? null,
        speedSetting: a.speedSetting,
        passes: a.passes,
        result: a.result,
        note: a.note ?? '',
        loggedAt: a.loggedAt ?? iso(ctx.atMs),
        loggedBy: ctx.userId,
      });
      await takeUse(store, a.productId, ctx);
      if (a.result === 'done') await patch(store, 'job_panels', panel, { state: 'done' }, ctx);
      else if (panel.state === 'todo') {
        await patch(store, 'job_panels', panel, { state: 'in-progress' }, ctx);
      }
    },
  },

  'chip.add': {
    async apply(store, a, ctx) {
      if (await exists(store, 'chips', a.id)) return;
      await openJob(store, a.jobId);
      await panelOfJob(store, a.panelId, a.jobId);
      await productOfKind(store, a.productId, PRODUCT_KINDS.touchUp);
      await store.put('chips', {
        ...newRowBase(a.id, ctx),
        jobId: a.jobId,
        panelId: a.panelId ?? null,
        number: a.number ?? (await nextNumber(store, 'chips', a.jobId)),
        sizeMm: toOneDecimal(a.sizeMm),
        productId: a.productId ?? null,
        layersPlanned: a.layersPlanned,
        note: a.note ?? '',
      });
    },
  },
  'chip.addLayer': {
    prepare: withTime('appliedAt'),
    async apply(store, a, ctx) {
      if (await exists(store, 'chip_layers', a.id)) return;
      const chip = await mustGet(store, 'chips', a.chipId, 'Chip');
      await openJob(store, chip.jobId);
      // A layer without its own product is of the chip's paint.
      const productId = a.productId ?? chip.productId;
      await productOfKind(store, productId, PRODUCT_KINDS.touchUp);
      await store.put('chip_layers', {
        ...newRowBase(a.id, ctx),
        jobId: chip.jobId,
        chipId: a.chipId,
        appliedAt: a.appliedAt ?? iso(ctx.atMs),
        productId,
        appliedBy: ctx.userId,
      });
      await takeUse(store, productId, ctx);
    },
  },

  'solvent.apply': {
    prepare: withTime('appliedAt'),
    async apply(store, a, ctx) {
      if (await exists(store, 'solvent_applications', a.id)) return;
      await openJob(store, a.jobId);
      const panel = await panelOfJob(store, a.panelId, a.jobId);
      const product = await productOfKind(store, a.productId, PRODUCT_KINDS.solvent);
      const { application, timer } = solventApplyRows(
        { ...a, appliedAt: a.appliedAt ?? iso(ctx.atMs) },
        { product, panel },
        ctx,
      );
      await store.put('solvent_applications', application);
      await store.put('timers', timer);
      await takeUse(store, product?.id, ctx);
    },
  },
  'solvent.flush': {
    prepare: withTime('at'),
    async apply(store, a, ctx) {
      const app = await mustGet(store, 'solvent_applications', a.id, 'Solvent application');
      if (app.flushedAt !== null) return;
      await openJob(store, app.jobId);
      const at = a.at ?? iso(ctx.atMs);
      if (Date.parse(at) < Date.parse(app.appliedAt)) {
        throw new CommandRefusedError(
          'validation-failed',
          'at must not be before the solvent went on',
        );
      }
      await patch(store, 'solvent_applications', app, { flushedAt: at }, ctx);
      const timer = await store.get('timers', flushTimerId(a.id));
      if (timer && timer.acknowledgedAt === null) {
        await patch(store, 'timers', timer, { acknowledgedAt: iso(ctx.atMs) }, ctx);
      }
    },
  },

  'mask.add': {
    prepare: withTime('appliedAt'),
    async apply(store, a, ctx) {
      if (await exists(store, 'masking_items', a.id)) return;
      await openJob(store, a.jobId);
      await panelOfJob(store, a.panelId, a.jobId);
      const product = await productOfKind(store, a.productId, PRODUCT_KINDS.tape);
      await store.put(
        'masking_items',
        maskAddRow({ ...a, appliedAt: a.appliedAt ?? iso(ctx.atMs) }, product?.properties, ctx),
      );
      await takeUse(store, product?.id, ctx);
    },
  },
  'mask.remove': {
    prepare: withTime('at'),
    async apply(store, a, ctx) {
      const item = await mustGet(store, 'masking_items', a.id, 'Masking');
      if (item.removedAt !== null) return;
      await openJob(store, item.jobId);
      await patch(store, 'masking_items', item, { removedAt: a.at ?? iso(ctx.atMs) }, ctx);
    },
  },

  'timer.start': {
    prepare: (a, nowMs) => ({
      ...withTime('startedAt')(a, nowMs),
      ...(a.endsAt === undefined ? {} : { endsAt: isoOf(a.endsAt) }),
    }),
    async apply(store, a, ctx) {
      if (await exists(store, 'timers', a.id)) return;
      if (a.jobId) await openJob(store, a.jobId);
      else ownerOnly(ctx, 'start a timer outside a job');
      await store.put(
        'timers',
        timerStartRow({ ...a, startedAt: a.startedAt ?? iso(ctx.atMs) }, ctx),
      );
    },
  },
  'timer.pause': {
    prepare: withTime('at'),
    async apply(store, a, ctx) {
      const timer = await mustGet(store, 'timers', a.id, 'Timer');
      const state = timerState(timer);
      if (state === 'cancelled' || state === 'acknowledged') throw timerDone('pause', state);
      const change = pauseTimer(timer, Date.parse(a.at ?? iso(ctx.atMs)));
      if (change) await patch(store, 'timers', timer, change, ctx);
    },
  },
  'timer.resume': {
    prepare: withTime('at'),
    async apply(store, a, ctx) {
      const timer = await mustGet(store, 'timers', a.id, 'Timer');
      const state = timerState(timer);
      if (state === 'cancelled' || state === 'acknowledged') throw timerDone('resume', state);
      const change = resumeTimer(timer, Date.parse(a.at ?? iso(ctx.atMs)));
      if (change) await patch(store, 'timers', timer, change, ctx);
    },
  },
  'timer.ack': {
    async apply(store, a, ctx) {
      const timer = await mustGet(store, 'timers', a.id, 'Timer');
      if (timer.acknowledgedAt === null && timer.cancelledAt === null) {
        await patch(store, 'timers', timer, { acknowledgedAt: iso(ctx.atMs) }, ctx);
      }
    },
  },
  'timer.cancel': {
    async apply(store, a, ctx) {
      const timer = await mustGet(store, 'timers', a.id, 'Timer');
      if (timer.cancelledAt !== null) return;
      if (timer.acknowledgedAt !== null) throw timerDone('cancel', 'acknowledged');
      {
        await patch(store, 'timers', timer, { cancelledAt: iso(ctx.atMs) }, ctx);
      }
    },
  },

  'check.toggle': {
    async apply(store, a, ctx) {
      const item = await mustGet(store, 'checklist_items', a.id, 'Checklist item');
      await openJob(store, item.jobId);
      await patch(
        store,
        'checklist_items',
        item,
        a.done
          ? { done: true, doneAt: iso(ctx.atMs), doneBy: ctx.userId }
          : { done: false, doneAt: null, doneBy: null },
        ctx,
      );
    },
  },
  'climate.record': {
    prepare: withTime('takenAt'),
    async apply(store, a, ctx) {
      if (await exists(store, 'climate_readings', a.id)) return;
      if (a.jobId) await openJob(store, a.jobId);
      await store.put('climate_readings', {
        ...newRowBase(a.id, ctx),
        jobId: a.jobId ?? null,
        airC: toOneDecimal(a.airC),
        rhPct: toOneDecimal(a.rhPct),
        surfaceC: a.surfaceC === undefined || a.surfaceC === null ? null : toOneDecimal(a.surfaceC),
        takenAt: a.takenAt ?? iso(ctx.atMs),
        takenBy: ctx.userId,
      });
    },
  },

  'photo.attach': {
    prepare: withTime('takenAt'),
    async apply(store, a, ctx) {
      if (await exists(store, 'photos', a.id)) return;
      let vehicleId = a.vehicleId ?? null;
      if (a.jobId) {
        const job = await mustGet(store, 'jobs', a.jobId, 'Job');
        if (vehicleId && vehicleId !== job.vehicleId) {
          throw new CommandRefusedError(
            'vehicle-not-of-job',
            'That vehicle is not the one on this job',
          );
        }
        vehicleId = job.vehicleId;
      } else if (!vehicleId) {
        throw new CommandRefusedError(
          'validation-failed',
          'Give the jobId or the vehicleId the photo belongs to',
        );
      }
      await store.put('photos', {
        ...newRowBase(a.id, ctx),
        jobId: a.jobId ?? null,
        vehicleId,
        subjectType: a.subjectType ?? null,
        subjectId: a.subjectId ?? null,
        kind: a.kind,
        sha256: a.sha256,
        mime: a.mime,
        width: a.width,
        height: a.height,
        bytes: a.bytes,
        caption: a.caption ?? '',
        takenAt: a.takenAt ?? iso(ctx.atMs),
      });
    },
  },
  'signature.capture': {
    async apply(store, a, ctx) {
      if (await exists(store, 'signatures', a.id)) return;
      if (a.jobId) await mustGet(store, 'jobs', a.jobId, 'Job');
      await store.put('signatures', {
        ...newRowBase(a.id, ctx),
        jobId: a.jobId ?? null,
        quoteId: a.quoteId ?? null,
        kind: a.kind,
        signerName: a.signerName,
        imageSha256: a.imageSha256,
        recordHash: a.recordHash,
        record: a.record,
        signedAt: iso(ctx.atMs),
      });
    },
  },
  'quote.create': {
    prepare: (a) => ({ ...a, inputs: quoteInputsIso(a.inputs) }),
    async apply(store, a, ctx) {
      ownerOnly(ctx, 'make quotes');
      if (await exists(store, 'quotes', a.id)) return;
      const customer = await mustGet(store, 'customers', a.customerId, 'Customer');
      const vehicle = await mustGet(store, 'vehicles', a.vehicleId, 'Vehicle');
      if (vehicle.customerId !== customer.id) {
        throw new CommandRefusedError(
          'vehicle-not-of-customer',
          "That vehicle is not this customer's",
        );
      }
      checkOfferedWindow(a.inputs);
      // The totals are the server's to store (it prices with the same shared code); until the
      // pull brings them the screens price the quote from its inputs on the phone.
      await store.put('quotes', {
        ...newRowBase(a.id, ctx),
        customerId: a.customerId,
        vehicleId: a.vehicleId,
        status: 'draft',
        inputs: { ...a.inputs },
        subtotalMinor: 0,
        discountMinor: 0,
        taxMinor: 0,
        totalMinor: 0,
        depositMinor: 0,
        labourHours: 0,
        currency: '',
        validUntil: a.validUntil ?? null,
        sentAt: null,
        acceptedAt: null,
        jobId: null,
      });
    },
  },
  'quote.update': {
    prepare: (a) => (a.inputs === undefined ? a : { ...a, inputs: quoteInputsIso(a.inputs) }),
    async apply(store, a, ctx) {
      ownerOnly(ctx, 'change quotes');
      const quote = await mustGet(store, 'quotes', a.id, 'Quote');
      quoteIsOpen(quote.status, 'changed');
      if (a.inputs) checkOfferedWindow(a.inputs);
      await patch(
        store,
        'quotes',
        quote,
        {
          ...(a.inputs === undefined ? {} : { inputs: { ...a.inputs } }),
          ...(a.validUntil === undefined ? {} : { validUntil: a.validUntil }),
        },
        ctx,
      );
    },
  },
  'quote.send': {
    async apply(store, a, ctx) {
      ownerOnly(ctx, 'send quotes');
      const quote = await mustGet(store, 'quotes', a.id, 'Quote');
      quoteIsOpen(quote.status, 'sent');
      const customer = await store.get('customers', quote.customerId);
      if (customer && !customer.email) {
        throw new CommandRefusedError(
          'no-email',
          'This customer has no e-mail address; add one to the customer before sending the quote',
        );
      }
      await patch(
        store,
        'quotes',
        quote,
        { status: 'sent', sentAt: quote.sentAt ?? iso(ctx.atMs) },
        ctx,
      );
    },
  },
  'quote.accept': {
    prepare: (a) => ({
      ...a,
      ...(a.windowStart === undefined ? {} : { windowStart: isoOf(a.windowStart) }),
      ...(a.windowEnd === undefined ? {} : { windowEnd: isoOf(a.windowEnd) }),
    }),
    async apply(store, a, ctx) {
      ownerOnly(ctx, 'accept quotes for the customer');
      const quote = await mustGet(store, 'quotes', a.id, 'Quote');
      if (quote.status === 'accepted' && quote.jobId) return;
      quoteIsOpen(quote.status, 'accepted');
      const windowStart = a.windowStart ?? stringField(quote.inputs, 'windowStart');
      const windowEnd = a.windowEnd ?? stringField(quote.inputs, 'windowEnd');
      if (!windowStart || !windowEnd) {
        throw new CommandRefusedError(
          'window-needed',
          'This quote offers no visit time: choose one to book it',
        );
      }
      const customer = await mustGet(store, 'customers', quote.customerId, 'Customer');
      const vehicle = await mustGet(store, 'vehicles', quote.vehicleId, 'Vehicle');
      const services = (await store.where('quote_lines', 'quoteId', quote.id))
        .filter((l) => l.kind === 'service')
        .sort((x, y) => x.position - y.position)
        .map((l) => l.description.slice(0, 60));
      if (!(await exists(store, 'jobs', a.jobId))) {
        let rows;
        try {
          rows = jobCreateRows(
            {
              id: a.jobId,
              customerId: quote.customerId,
              vehicleId: quote.vehicleId,
              quoteId: quote.id,
              windowStart,
              windowEnd,
              priceMinor: quote.totalMinor,
              services,
              assignedTechId: null,
            },
            { customer, vehicle },
            ctx,
          );
        } catch {
          throw new CommandRefusedError('validation-failed', 'windowEnd must be after windowStart');
        }
        await store.put('jobs', rows.job);
        for (const panel of rows.panels) await store.put('job_panels', panel);
        for (const item of rows.checklist) await store.put('checklist_items', item);
      }
      await patch(
        store,
        'quotes',
        quote,
        { status: 'accepted', acceptedAt: iso(ctx.atMs), jobId: a.jobId },
        ctx,
      );
    },
  },
  'quote.decline': {
    async apply(store, a, ctx) {
      ownerOnly(ctx, 'decline quotes');
      const quote = await mustGet(store, 'quotes', a.id, 'Quote');
      if (quote.status === 'declined') return;
      quoteIsOpen(quote.status, 'declined');
      await patch(store, 'quotes', quote, { status: 'declined' }, ctx);
    },
  },
  'payment.recordCash': {
    async apply(store, a, ctx) {
      ownerOnly(ctx, 'record payments');
      if (await exists(store, 'payments', a.id)) return;
      if ((await store.where('payments', 'opId', a.opId)).length) return;
      const job = await mustGet(store, 'jobs', a.jobId, 'Job');
      if (a.kind !== 'refund' && typeof job.priceMinor === 'number') {
        // Never more than is due, as the server refuses it (a second phone may differ; the
        // server's answer then comes back as a refusal).
        const payments = await store.where('payments', 'jobId', a.jobId);
        const due = amountDueMinor(
          job.priceMinor,
          payments.map((p) => ({
            kind: p.kind === 'deposit' || p.kind === 'refund' ? p.kind : 'balance',
            status: p.status,
            amountMinor: p.amountMinor,
          })),
        );
        if (a.amountMinor > due) {
          throw new CommandRefusedError(
            'amount-exceeds-due',
            due === 0
              ? 'Nothing is due on this job: it is paid in full'
              : `At most what is due can be recorded (${due} minor units)`,
          );
        }
      }
      await store.put('payments', {
        ...newRowBase(a.id, ctx),
        jobId: a.jobId,
        quoteId: null,
        kind: a.kind,
        method: a.method,
        amountMinor: a.amountMinor,
        // The business's currency is the server's to fill in; the pull brings it.
        currency: '',
        status: 'succeeded',
        opId: a.opId,
        providerRef: null,
        checkoutUrl: null,
        failureReason: null,
        paidAt: iso(ctx.atMs),
        recordedBy: ctx.userId,
      });
    },
  },
  'payment.request': {
    // A pending card payment at once, offline too; the server makes the checkout link with
    // the provider when the request reaches it, and the pull brings the link.
    async apply(store, a, ctx) {
      if (await exists(store, 'payments', a.id)) return;
      if ((await store.where('payments', 'opId', a.opId)).length) return;
      const job = await mustGet(store, 'jobs', a.jobId, 'Job');
      const payments = await store.where('payments', 'jobId', a.jobId);
      let amountMinor = a.amountMinor ?? 0;
      // A helper's phone has no price or payments: the server works the amount out.
      if (typeof job.priceMinor === 'number' && ctx.role === 'owner') {
        const quote = job.quoteId ? await store.get('quotes', job.quoteId) : undefined;
        const deposit = (quote as { depositMinor?: unknown } | undefined)?.depositMinor;
        const asked = cardRequestAmount(a, {
          priceMinor: job.priceMinor,
          payments: payments.map((p) => ({
            kind: p.kind === 'deposit' || p.kind === 'refund' ? p.kind : 'balance',
            status: p.status,
            amountMinor: p.amountMinor,
          })),
          quoteDepositMinor: typeof deposit === 'number' ? deposit : null,
        });
        if ('code' in asked) throw new CommandRefusedError(asked.code, asked.message);
        amountMinor = asked.amountMinor;
      }
      // A new link replaces the job's older open ones of the same kind (as on the server).
      for (const older of payments) {
        if (older.method !== 'card' || older.kind !== a.kind) continue;
        if (older.status !== 'pending' && older.status !== 'failed') continue;
        await patch(
          store,
          'payments',
          older,
          { status: 'expired', failureReason: 'Replaced by a newer payment link' },
          ctx,
        );
      }
      await store.put(
        'payments',
        cardRequestRow(
          a,
          amountMinor,
          { quoteId: job.quoteId, recordedBy: ctx.role === 'customer' ? null : ctx.userId },
          ctx,
        ),
      );
    },
  },
};

/** The definition of a command; an unknown name is a programming error. */
export function commandDef(name: string): CommandDef<CommandName> {
  if (!Object.prototype.hasOwnProperty.call(COMMANDS, name)) {
    throw new Error(`Unknown command "${name}": add it to pwa/src/db/commands.ts`);
  }
  return COMMANDS[name as CommandName] as unknown as CommandDef<CommandName>;
}

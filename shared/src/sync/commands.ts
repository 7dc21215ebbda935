/**
 * The commands a device records as mutations, with their arguments as JSON (dates as ISO
 * strings). The names and fields are the server's command bus's (its DTOs validate them and
 * refuse unknown fields), so nothing here may add a field the server does not take.
 *
 * `expectedVersion` (a stale-write check) is left out on purpose: a device that edits
 * offline would trip it with its own earlier, still-pending change. Offline edits are last
 * write wins per field, as the protocol says.
 */

export interface CustomerFields {
  name: string;
  email?: string | null;
  phone?: string | null;
  address?: string;
  lat?: number | null;
  lng?: number | null;
  notes?: string;
}

export interface VehicleFields {
  make?: string;
  model?: string;
  year?: number | null;
  bodyStyle: string;
  colour?: string;
  paintNotes?: string;
  plate?: string | null;
}

/** The kinds of product on the Shelf (the server's `PRODUCT_KINDS`, same order). */
export const PRODUCT_KINDS = [
  'compound',
  'polish',
  'finishing-polish',
  'solvent',
  'tape',
  'touch-up',
  'protection',
  'cleaner',
  'pad',
  'tool',
  'other',
] as const;
export type ProductKind = (typeof PRODUCT_KINDS)[number];

/**
 * A product's fields on the Shelf (the server's `ProductFieldsDto`). `properties` are what
 * the computations read, by kind (a solvent's dwell, a paint's flash and cure…); `{}` means
 * "not entered". Stock changes only through `stock.adjust` and the uses logged in the field.
 */
export interface ProductFields {
  name: string;
  kind: ProductKind;
  properties?: Record<string, unknown>;
  unit?: string;
  amountPerUse?: number;
  unitCostMinor?: number;
  lowStockAt?: number;
  sdsUrl?: string | null;
}

/** Why stock is added or taken by hand: a delivery, or a count that differed. */
export type StockAdjustReason = 'restock' | 'adjust';

export interface JobCreateArgs {
  id: string;
  customerId: string;
  vehicleId: string;
  quoteId?: string | null;
  address?: string;
  lat?: number | null;
  lng?: number | null;
  windowStart: string;
  windowEnd: string;
  assignedTechId?: string | null;
  services?: string[];
  priceMinor?: number;
  notes?: string;
}

export interface JobUpdateArgs {
  id: string;
  address?: string;
  lat?: number | null;
  lng?: number | null;
  windowStart?: string;
  windowEnd?: string;
  services?: string[];
  priceMinor?: number;
  notes?: string;
  conditionNotes?: string;
}

export interface PinFields {
  number?: number;
  x: number;
  y: number;
  panelKey?: string | null;
  kind: string;
  severity: number;
  note?: string;
  photoId?: string | null;
}

export interface TimerStartArgs {
  id: string;
  jobId?: string | null;
  kind: string;
  subjectType?: string | null;
  subjectId?: string | null;
  label: string;
  startedAt?: string;
  durationMs?: number;
  endsAt?: string;
}

/** A quote's choices, in the ids of the business settings (the server's `QuoteInputsDto`). */
export interface QuoteInputsArgs {
  sizeClass: string;
  condition: string;
  serviceIds: string[];
  chips: number;
  addOnIds: string[];
  /** The travel band chosen, by its `upToKm`; or `distanceKm` instead. */
  travelBand?: number;
  /** Distance to the customer (km, one decimal); the band is looked up. */
  distanceKm?: number;
  discount?: { kind: 'percent' | 'fixed'; percentBp?: number; amountMinor?: number };
  notes?: string;
  /** The visit the quote offers (both or neither). */
  windowStart?: string;
  windowEnd?: string;
}

/** Every command a device may record, by name. */
export interface CommandArgs {
  'customer.create': CustomerFields & { id: string };
  'customer.update': Partial<CustomerFields> & { id: string };
  'customer.remove': { id: string };
  'vehicle.create': VehicleFields & { id: string; customerId: string };
  'vehicle.update': Partial<VehicleFields> & { id: string };
  'vehicle.remove': { id: string };
  'product.create': ProductFields & { id: string; stockQty?: number };
  'product.update': Partial<ProductFields> & { id: string };
  'stock.adjust': {
    id: string;
    productId: string;
    qty: number;
    reason: StockAdjustReason;
    unitCostMinor?: number;
  };
  'job.create': JobCreateArgs;
  'job.update': JobUpdateArgs;
  'job.setStage': { id: string; stage: string };
  'job.assign': { id: string; techId: string | null };
  'job.remove': { id: string };
  'pin.add': PinFields & { id: string; jobId: string };
  'pin.update': Partial<PinFields> & { id: string };
  'pin.remove': { id: string };
  'reading.add': {
    id: string;
    jobId: string;
    panelId: string;
    phase: 'before' | 'after';
    readings: number[];
    unit: 'um' | 'mil';
    gaugeType: 'magnetic' | 'eddy-current' | 'magnetic-eddy' | 'ultrasonic';
    takenAt?: string;
  };
  'panel.update': {
    id: string;
    finish?: string;
    hardness?: 'soft' | 'medium' | 'hard' | 'unknown';
    state?: 'todo' | 'in-progress' | 'done' | 'skipped';
    substrate?: 'steel' | 'aluminium' | 'plastic' | 'composite' | 'unknown';
    clearEstimateUm?: number | null;
    testSpotNote?: string;
  };
  'pass.log': {
    id: string;
    jobId: string;
    panelId: string;
    step: string;
    machine: string;
    pad: string;
    productId?: string;
    speedSetting: string;
    passes: number;
    result: 'another-pass' | 'change-combination' | 'done';
    note?: string;
    loggedAt?: string;
  };
  'chip.add': {
    id: string;
    jobId: string;
    panelId?: string | null;
    number?: number;
    sizeMm: number;
    productId?: string | null;
    layersPlanned: number;
    note?: string;
  };
  'chip.addLayer': { id: string; chipId: string; appliedAt?: string; productId?: string | null };
  'solvent.apply': {
    id: string;
    jobId: string;
    panelId?: string | null;
    productId?: string | null;
    surfaceTempC: number;
    inSun: boolean;
    appliedAt?: string;
  };
  'solvent.flush': { id: string; at?: string };
  'mask.add': {
    id: string;
    jobId: string;
    what: string;
    panelId?: string | null;
    productId?: string | null;
    appliedAt?: string;
  };
  'mask.remove': { id: string; at?: string };
  'timer.start': TimerStartArgs;
  'timer.pause': { id: string; at?: string };
  'timer.resume': { id: string; at?: string };
  'timer.ack': { id: string };
  'timer.cancel': { id: string };
  'check.toggle': { id: string; done: boolean };
  'climate.record': {
    id: string;
    jobId?: string | null;
    airC: number;
    rhPct: number;
    surfaceC?: number | null;
    takenAt?: string;
  };
  'photo.attach': {
    id: string;
    jobId?: string | null;
    vehicleId?: string | null;
    subjectType?: string | null;
    subjectId?: string | null;
    kind: 'before' | 'after' | 'damage' | 'other';
    sha256: string;
    mime: string;
    width: number;
    height: number;
    bytes: number;
    caption?: string;
    takenAt?: string;
  };
  'signature.capture': {
    id: string;
    jobId?: string | null;
    quoteId?: string | null;
    kind: 'condition' | 'acceptance' | 'quote';
    signerName: string;
    imageSha256: string;
    record: Record<string, unknown>;
    recordHash: string;
  };
  'quote.create': {
    id: string;
    customerId: string;
    vehicleId: string;
    inputs: QuoteInputsArgs;
    validUntil?: string | null;
  };
  'quote.update': { id: string; inputs?: QuoteInputsArgs; validUntil?: string | null };
  'quote.send': { id: string };
  'quote.accept': { id: string; jobId: string; windowStart?: string; windowEnd?: string };
  'quote.decline': { id: string };
  'payment.recordCash': {
    id: string;
    opId: string;
    jobId: string;
    kind: 'deposit' | 'balance' | 'refund';
    method: 'cash' | 'cheque';
    amountMinor: number;
  };
  /**
   * A card payment link for the customer's own phone. The opId is made once per request on
   * the device and travels with the queued mutation, so a retried push never asks twice.
   */
  'payment.request': {
    id: string;
    opId: string;
    jobId: string;
    kind: 'deposit' | 'balance';
    amountMinor?: number;
  };
}

export type CommandName = keyof CommandArgs;

/** The SHA-256 hashes of blobs a mutation points at: they must reach the server first. */
export function blobsReferenced(name: string, args: Record<string, unknown>): string[] {
  if (name === 'photo.attach' && typeof args.sha256 === 'string') return [args.sha256];
  if (name === 'signature.capture' && typeof args.imageSha256 === 'string') {
    return [args.imageSha256];
  }
  return [];
}

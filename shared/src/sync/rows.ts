/**
 * The synced rows as a device holds them: the JSON of the server's entities (camelCase
 * fields, ISO date strings, numbers for numeric columns). A row made on the device before
 * the server has seen it carries `version` 0 until a pull brings the server's copy.
 */
import type { SyncRow } from './protocol';

/** Columns every synced row has. */
export interface RowBase extends SyncRow {
  createdAt: string;
  updatedAt: string;
}

export interface CustomerRow extends RowBase {
  name: string;
  email: string | null;
  phone: string | null;
  address: string;
  lat: number | null;
  lng: number | null;
  notes: string;
}

export interface VehicleRow extends RowBase {
  customerId: string;
  make: string;
  model: string;
  year: number | null;
  bodyStyle: string;
  colour: string;
  paintNotes: string;
  plate: string | null;
}

export interface ProductRow extends RowBase {
  name: string;
  kind: string;
  properties: Record<string, unknown>;
  unit: string;
  stockQty: number;
  amountPerUse: number;
  /** Absent for a helper: the server strips money fields. */
  unitCostMinor?: number;
  lowStockAt: number;
  sdsUrl: string | null;
}

/** A change of stock: a use logged in the field, a restock or a count correction (owner only). */
export interface StockMovementRow extends RowBase {
  productId: string;
  /** Added (+) or taken (−), in the product's unit. */
  qty: number;
  /** `use`, `restock` or `adjust`. */
  reason: string;
  jobId: string | null;
  sourceType: string | null;
  sourceId: string | null;
  unitCostMinor: number;
}

export interface JobRow extends RowBase {
  customerId: string;
  vehicleId: string;
  quoteId: string | null;
  address: string;
  lat: number | null;
  lng: number | null;
  windowStart: string;
  windowEnd: string;
  assignedTechId: string | null;
  stage: string;
  conditionNotes: string;
  notes: string;
  /** Absent for a helper. */
  priceMinor?: number;
  services: string[];
}

export interface JobPanelRow extends RowBase {
  jobId: string;
  panelKey: string;
  label: string;
  band: string;
  position: number;
  substrate: string;
  finish: string;
  hardness: string | null;
  state: string;
  areaM2: number;
  clearEstimateUm: number | null;
  testSpotNote: string;
}

export interface ChecklistItemRow extends RowBase {
  jobId: string;
  stage: string;
  key: string;
  label: string;
  position: number;
  done: boolean;
  doneAt: string | null;
  doneBy: string | null;
}

export interface DamagePinRow extends RowBase {
  jobId: string;
  number: number;
  x: number;
  y: number;
  panelKey: string | null;
  kind: string;
  severity: number;
  note: string;
  photoId: string | null;
}

export interface FilmReadingRow extends RowBase {
  jobId: string;
  panelId: string;
  phase: string;
  readingsUm: number[];
  unit: string;
  gaugeType: string;
  takenAt: string;
  takenBy: string;
}

export interface CorrectionPassRow extends RowBase {
  jobId: string;
  panelId: string;
  step: string;
  machine: string;
  pad: string;
  productId: string | null;
  speedSetting: string;
  passes: number;
  result: string;
  note: string;
  loggedAt: string;
  loggedBy: string;
}

export interface ChipRow extends RowBase {
  jobId: string;
  panelId: string | null;
  number: number;
  sizeMm: number;
  productId: string | null;
  layersPlanned: number;
  note: string;
}

export interface ChipLayerRow extends RowBase {
  jobId: string;
  chipId: string;
  appliedAt: string;
  productId: string | null;
  appliedBy: string;
}

export interface SolventApplicationRow extends RowBase {
  jobId: string;
  panelId: string | null;
  productId: string | null;
  surfaceTempC: number;
  inSun: boolean;
  appliedAt: string;
  flushBy: string;
  flushedAt: string | null;
  appliedBy: string;
}

export interface MaskingItemRow extends RowBase {
  jobId: string;
  what: string;
  panelId: string | null;
  productId: string | null;
  appliedAt: string;
  removeBy: string;
  removedAt: string | null;
}

export interface TimerRow extends RowBase {
  jobId: string | null;
  kind: string;
  subjectType: string | null;
  subjectId: string | null;
  label: string;
  startedAt: string;
  endsAt: string;
  pausedMs: number;
  pausedAt: string | null;
  acknowledgedAt: string | null;
  cancelledAt: string | null;
  startedBy: string;
}

export interface ClimateReadingRow extends RowBase {
  jobId: string | null;
  airC: number;
  rhPct: number;
  surfaceC: number | null;
  takenAt: string;
  takenBy: string;
}

export interface PhotoRow extends RowBase {
  jobId: string | null;
  vehicleId: string | null;
  subjectType: string | null;
  subjectId: string | null;
  kind: string;
  sha256: string;
  mime: string;
  width: number;
  height: number;
  bytes: number;
  caption: string;
  takenAt: string;
}

export interface SignatureRow extends RowBase {
  jobId: string | null;
  quoteId: string | null;
  kind: string;
  signerName: string;
  imageSha256: string;
  recordHash: string;
  record: Record<string, unknown>;
  signedAt: string;
}

export interface PaymentRow extends RowBase {
  jobId: string | null;
  quoteId: string | null;
  kind: string;
  method: string;
  amountMinor: number;
  currency: string;
  status: string;
  opId: string;
  providerRef: string | null;
  checkoutUrl: string | null;
  failureReason: string | null;
  paidAt: string | null;
  recordedBy: string | null;
}

export interface QuoteRow extends RowBase {
  customerId: string;
  vehicleId: string;
  /** draft, sent, accepted, declined. */
  status: string;
  /** The choices it was priced from (`QuoteInputsArgs`). */
  inputs: Record<string, unknown>;
  /** The server's pricing; 0 on a quote the server has not priced yet. */
  subtotalMinor: number;
  discountMinor: number;
  taxMinor: number;
  totalMinor: number;
  depositMinor: number;
  labourHours: number;
  /** '' until the server has priced it. */
  currency: string;
  validUntil: string | null;
  sentAt: string | null;
  acceptedAt: string | null;
  jobId: string | null;
}

export interface QuoteLineRow extends RowBase {
  quoteId: string;
  position: number;
  kind: string;
  description: string;
  quantity: number;
  unitPriceMinor: number;
  amountMinor: number;
}

/** The row type of each synced table; tables the device only reads stay generic. */
export interface SyncRowTypes {
  customers: CustomerRow;
  vehicles: VehicleRow;
  products: ProductRow;
  quotes: QuoteRow;
  quote_lines: QuoteLineRow;
  jobs: JobRow;
  job_panels: JobPanelRow;
  checklist_items: ChecklistItemRow;
  damage_pins: DamagePinRow;
  film_readings: FilmReadingRow;
  correction_passes: CorrectionPassRow;
  chips: ChipRow;
  chip_layers: ChipLayerRow;
  solvent_applications: SolventApplicationRow;
  masking_items: MaskingItemRow;
  timers: TimerRow;
  climate_readings: ClimateReadingRow;
  photos: PhotoRow;
  signatures: SignatureRow;
  payments: PaymentRow;
  invoices: RowBase;
  stock_movements: StockMovementRow;
}

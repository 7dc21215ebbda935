import {
  amountDueMinor,
  formatMinor,
  type CanonicalValue,
  type ChipLayerRow,
  type ChipRow,
  type CorrectionPassRow,
  type JobPanelRow,
  type JobRow,
  type PaymentRow,
  type PhotoRow,
  type TimerRow,
  type VehicleRow,
} from '@panelpass/shared';
import { vehicleLabel } from '../../workspace/model/jobWords';

/**
 * What the customer reads and signs at handover: the work done, from the phone's database.
 * Only words and counts go in (no clock, no row versions), so the same work gives the same
 * record and the same hash on any phone (signature.capture, kind acceptance).
 */
export interface AcceptanceRecord {
  [key: string]: CanonicalValue;
  kind: 'acceptance';
  jobId: string;
  vehicle: string;
  address: string;
  panels: { panel: string; passes: string[] }[];
  chips: { number: number; panel: string; layers: string }[];
  protection: { label: string; keepDryUntil: string }[];
  photos: number;
}

export interface SummaryInput {
  job: Pick<JobRow, 'id' | 'address'>;
  vehicle: Pick<VehicleRow, 'year' | 'make' | 'model' | 'colour' | 'plate' | 'bodyStyle'> | null;
  panels: readonly JobPanelRow[];
  passes: readonly CorrectionPassRow[];
  chips: readonly ChipRow[];
  chipLayers: readonly ChipLayerRow[];
  timers: readonly TimerRow[];
  photos: readonly PhotoRow[];
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** "Cut, 2 passes (finished)" — one line per logged pass on a panel. */
function passWords(p: CorrectionPassRow): string {
  const step = p.step.trim() || 'Pass';
  const head = `${step[0]?.toUpperCase() ?? ''}${step.slice(1)}, ${plural(p.passes, 'pass', 'passes')}`;
  return p.result.trim() ? `${head} (${p.result.trim()})` : head;
}

export function buildAcceptanceRecord(input: SummaryInput): AcceptanceRecord {
  const labels = new Map(input.panels.map((p) => [p.id, p.label]));
  const order = new Map(input.panels.map((p) => [p.id, p.position]));
  const byPanel = new Map<string, CorrectionPassRow[]>();
  for (const pass of input.passes) {
    const list = byPanel.get(pass.panelId) ?? [];
    list.push(pass);
    byPanel.set(pass.panelId, list);
  }
  const panels = [...byPanel.entries()]
    .sort(
      ([a], [b]) =>
        (order.get(a) ?? Number.MAX_SAFE_INTEGER) - (order.get(b) ?? Number.MAX_SAFE_INTEGER) ||
        a.localeCompare(b),
    )
    .map(([panelId, list]) => ({
      panel: labels.get(panelId) ?? 'A panel',
      passes: [...list]
        .sort((a, b) => a.loggedAt.localeCompare(b.loggedAt) || a.id.localeCompare(b.id))
        .map(passWords),
    }));
  const chips = [...input.chips]
    .sort((a, b) => a.number - b.number || a.id.localeCompare(b.id))
    .map((c) => {
      const done = input.chipLayers.filter((l) => l.chipId === c.id).length;
      return {
        number: c.number,
        panel: c.panelId ? (labels.get(c.panelId) ?? 'A panel') : 'Not on a panel',
        layers: `${done} of ${plural(c.layersPlanned, 'layer', 'layers')}`,
      };
    });
  const protection = input.timers
    .filter((t) => t.kind === 'keep-dry' && t.cancelledAt === null)
    .sort((a, b) => a.endsAt.localeCompare(b.endsAt) || a.id.localeCompare(b.id))
    .map((t) => ({ label: t.label.trim() || 'Protection', keepDryUntil: t.endsAt }));
  return {
    kind: 'acceptance',
    jobId: input.job.id,
    vehicle: input.vehicle ? vehicleLabel(input.vehicle) : 'The car',
    address: input.job.address,
    panels,
    chips,
    protection,
    photos: input.photos.length,
  };
}

export interface AmountDue {
  dueMinor: number;
  words: string;
  settled: boolean;
}

/**
 * The amount due from the job's price and its payments (shared amountDueMinor), in words;
 * null when the price is not on this phone (a helper's).
 */
export function amountDue(
  priceMinor: number | undefined,
  payments: readonly Pick<PaymentRow, 'kind' | 'status' | 'amountMinor'>[],
  currency: string,
): AmountDue | null {
  if (priceMinor === undefined) return null;
  const dueMinor = amountDueMinor(
    priceMinor,
    payments.map((p) => ({
      kind: p.kind === 'deposit' || p.kind === 'refund' ? p.kind : 'balance',
      status: p.status,
      amountMinor: p.amountMinor,
    })),
  );
  if (dueMinor === 0) return { dueMinor, words: 'Paid in full. Nothing is due.', settled: true };
  const total = formatMinor(priceMinor, currency);
  const due = formatMinor(dueMinor, currency);
  return {
    dueMinor,
    words: dueMinor === priceMinor ? `${due} due.` : `${due} due of ${total}.`,
    settled: false,
  };
}

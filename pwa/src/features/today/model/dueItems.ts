import {
  findOverdue,
  flushStatus,
  InputError,
  maskStatus,
  planChip,
  type ChipLayerRow,
  type ChipRow,
  type ClimateReadingRow,
  type CureProduct,
  type JobPanelRow,
  type MaskingItemRow,
  type ProductRow,
  type SolventApplicationRow,
  type TempReading,
} from '@panelpass/shared';
import { clockTime } from '../../prep/kit/clockTime';

/** Something on a job that needs doing now or soon. */
export interface DueItem {
  key: string;
  kind: 'flush' | 'mask' | 'chip';
  jobId: string;
  /** What to do: "Flush Sap and resin remover off the hood". */
  title: string;
  /** How it stands, in words, from the shared computation ("Flush overdue by 3 min."). */
  detail: string;
  state: 'overdue' | 'ready' | 'due-soon';
  /** When it was or is due (server clock). */
  dueAtMs: number;
}

export interface DueInput {
  /** Jobs still open (not closed): only their items count. */
  openJobIds: ReadonlySet<string>;
  solvents: readonly SolventApplicationRow[];
  masking: readonly MaskingItemRow[];
  chips: readonly ChipRow[];
  layers: readonly ChipLayerRow[];
  products: ReadonlyMap<string, ProductRow>;
  panels: ReadonlyMap<string, JobPanelRow>;
  climate: readonly ClimateReadingRow[];
  nowMs: number;
  /** A chip's next layer this close counts as due soon (default 10 min). */
  chipSoonMs?: number;
}

/** The touch-up paint's cure properties from its Shelf entry; null when none were entered. */
export function cureProductOf(product: ProductRow | null | undefined): CureProduct | null {
  const p = product?.properties;
  if (!p || typeof p.flashMinAtRef !== 'number' || typeof p.cureMinAtRef !== 'number') {
    return null;
  }
  const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);
  const refC = num(p.refC) ?? 20;
  const minC = num(p.minC);
  const maxC = num(p.maxC);
  const maxRhPercent = num(p.maxRhPercent);
  return {
    refC,
    flashMinAtRef: p.flashMinAtRef,
    cureMinAtRef: p.cureMinAtRef,
    ...(minC === undefined ? {} : { minC }),
    ...(maxC === undefined ? {} : { maxC }),
    ...(maxRhPercent === undefined ? {} : { maxRhPercent }),
  };
}

const panelWords = (panel: JobPanelRow | undefined) =>
  panel ? ` off the ${panel.label.toLowerCase()}` : '';

/**
 * Across every open job: solvents to flush (shared `flushStatus`, due soon in the last
 * minute), masking to take off (shared `maskStatus`, due soon in its last day) and chips
 * ready for their next layer or for levelling (shared `planChip` over the job's climate
 * readings). Overdue first, most overdue first (shared `findOverdue`), then what is ready,
 * then what is due soon, soonest first.
 */
export function dueItems(input: DueInput): DueItem[] {
  const { nowMs } = input;
  const items: DueItem[] = [];

  for (const s of input.solvents) {
    if (!input.openJobIds.has(s.jobId) || s.flushedAt) continue;
    const flushByMs = Date.parse(s.flushBy);
    const status = flushStatus({ flushByMs, nowMs });
    if (status.state !== 'overdue' && status.state !== 'due-soon') continue;
    const product = s.productId ? input.products.get(s.productId) : undefined;
    items.push({
      key: `flush:${s.id}`,
      kind: 'flush',
      jobId: s.jobId,
      title: `Flush ${product?.name ?? 'the solvent'}${panelWords(s.panelId ? input.panels.get(s.panelId) : undefined)}`,
      detail: `${status.reasons[0]?.message ?? ''} Flush by ${clockTime(flushByMs)}.`.trim(),
      state: status.state,
      dueAtMs: flushByMs,
    });
  }

  for (const m of input.masking) {
    if (!input.openJobIds.has(m.jobId) || m.removedAt) continue;
    const removeByMs = Date.parse(m.removeBy);
    const status = maskStatus({ removeByMs, nowMs });
    if (status.state !== 'overdue' && status.state !== 'due-soon') continue;
    items.push({
      key: `mask:${m.id}`,
      kind: 'mask',
      jobId: m.jobId,
      title: `Take the masking off: ${m.what}`,
      detail: status.reasons[0]?.message ?? '',
      state: status.state,
      dueAtMs: removeByMs,
    });
  }

  const soon = input.chipSoonMs ?? 10 * 60_000;
  // Chips of one job that are ready (or due soon) together make one item: "Chips 1, 2 and 3".
  const chipGroups = new Map<
    string,
    {
      chips: ChipRow[];
      atMs: number;
      item: Omit<DueItem, 'key' | 'title'> & { what: 'layer' | 'level'; layer: number };
    }
  >();
  for (const chip of [...input.chips].sort((a, b) => a.number - b.number)) {
    if (!input.openJobIds.has(chip.jobId)) continue;
    const own = input.layers.filter((l) => l.chipId === chip.id);
    if (!own.length) continue; // not started: nothing is waiting on it
    const times = own.map((l) => Date.parse(l.appliedAt));
    const product = cureProductOf(
      input.products.get(chip.productId ?? own.at(-1)?.productId ?? ''),
    );
    const readings: TempReading[] = input.climate
      .filter((c) => c.jobId === chip.jobId)
      .map((c) => ({
        atMs: Date.parse(c.takenAt),
        tempC: c.surfaceC ?? c.airC,
        rhPercent: c.rhPct,
      }));
    if (!product || !readings.length) continue;
    let plan;
    try {
      plan = planChip({
        product,
        layersAppliedAtMs: times,
        layersPlanned: chip.layersPlanned,
        readings,
        nowMs: Math.max(nowMs, ...times),
      });
    } catch (error) {
      if (error instanceof InputError) continue;
      throw error;
    }
    const next = plan.layersLeft > 0 ? plan.nextLayerAtMs : null;
    const level = plan.layersLeft === 0 ? plan.levelReadyAtMs : null;
    const at = next ?? level;
    if (at === null) continue;
    const state: DueItem['state'] | null =
      at <= nowMs ? 'ready' : next !== null && at - nowMs <= soon ? 'due-soon' : null;
    if (!state) continue;
    const what = next !== null ? 'layer' : 'level';
    const layer = plan.layersDone + 1;
    const groupKey = `${chip.jobId}:${state}:${what}:${what === 'layer' ? layer : ''}`;
    const group = chipGroups.get(groupKey);
    if (group) {
      group.chips.push(chip);
      group.atMs = Math.max(group.atMs, at);
    } else {
      chipGroups.set(groupKey, {
        chips: [chip],
        atMs: at,
        item: { kind: 'chip', jobId: chip.jobId, detail: '', state, dueAtMs: at, what, layer },
      });
    }
  }
  for (const [groupKey, { chips, atMs, item }] of chipGroups) {
    const numbers = chips.map((c) => c.number);
    const names =
      numbers.length === 1
        ? `Chip ${numbers[0]}`
        : `Chips ${numbers.slice(0, -1).join(', ')} and ${numbers.at(-1)}`;
    const task = item.what === 'layer' ? `layer ${item.layer}` : 'level and polish';
    const detail =
      item.state === 'due-soon'
        ? `Ready for layer ${item.layer} at ${clockTime(atMs)}.`
        : item.what === 'layer'
          ? `Ready for layer ${item.layer} since ${clockTime(atMs)}.`
          : `Cured: ready to level since ${clockTime(atMs)}.`;
    items.push({
      key: `chips:${groupKey}`,
      kind: 'chip',
      jobId: item.jobId,
      title: `${names}: ${task}`,
      detail,
      state: item.state,
      dueAtMs: atMs,
    });
  }

  const overdue = findOverdue(
    items.filter((i) => i.state === 'overdue'),
    nowMs,
  );
  const ready = items.filter((i) => i.state === 'ready').sort((a, b) => a.dueAtMs - b.dueAtMs);
  const dueSoon = items.filter((i) => i.state === 'due-soon').sort((a, b) => a.dueAtMs - b.dueAtMs);
  return [...overdue, ...ready, ...dueSoon];
}

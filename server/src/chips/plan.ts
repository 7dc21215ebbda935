import {
  planChip,
  reason,
  type ChipPlanResult,
  type Reason,
  type TempReading,
} from '@panelpass/shared';
import type { ClimateReading } from '../climate/climate-reading.entity';
import type { Product } from '../products/product.entity';
import { cureProperties } from '../products/properties';
import { fromShared } from '../workspace/field';
import type { ChipLayer } from './chip-layer.entity';
import type { Chip } from './chip.entity';

export interface ChipPlanAnswer {
  /** Shared `planChip`; null when it cannot be planned (see reasons). */
  plan: ChipPlanResult | null;
  reasons: Reason[];
}

/**
 * The touch-up schedule of a chip (shared `planChip`): the job's climate readings as the
 * temperature series (the surface temperature, or the air temperature where no surface
 * temperature was taken) and the cure properties of the chip's product. No times are
 * invented: without the product's cure properties or a temperature reading there is no plan.
 */
export function chipPlan(
  chip: Chip,
  layers: readonly ChipLayer[],
  product: Product | null,
  climate: readonly ClimateReading[],
  now = Date.now(),
): ChipPlanAnswer {
  const cure = cureProperties(product);
  if (!cure) {
    return {
      plan: null,
      reasons: [
        reason(
          'no-cure-properties',
          'warn',
          product
            ? `"${product.name}" has no flash and cure times entered: enter them from its data sheet on the Shelf to get layer times.`
            : 'No touch-up paint named for this chip: name one from the Shelf to get layer times.',
        ),
      ],
    };
  }
  const own = climate.filter((c) => c.jobId === chip.jobId);
  if (!own.length) {
    return {
      plan: null,
      reasons: [
        reason(
          'no-temperature-reading',
          'warn',
          'No temperature reading on this job yet: record the air and panel temperature to get layer times.',
        ),
      ],
    };
  }
  const readings: TempReading[] = own.map((c) => ({
    atMs: c.takenAt.getTime(),
    tempC: c.surfaceC ?? c.airC,
    rhPercent: c.rhPct,
  }));
  const reasons: Reason[] = [];
  if (own.some((c) => c.surfaceC === null)) {
    reasons.push(
      reason(
        'air-temperature-used',
        'info',
        'Where no panel temperature was taken, the air temperature stands in for it; a panel in sun or shade differs.',
      ),
    );
  }
  const times = layers.filter((l) => l.chipId === chip.id).map((l) => l.appliedAt.getTime());
  const nowMs = Math.max(now, ...times);
  const plan = fromShared(() =>
    planChip({
      product: cure,
      layersAppliedAtMs: times,
      layersPlanned: chip.layersPlanned,
      readings,
      nowMs,
    }),
  );
  return { plan, reasons };
}

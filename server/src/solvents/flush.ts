import {
  flushBy,
  flushStatus,
  type DeadlineStatus,
  type FlushByResult,
  type Reason,
} from '@panelpass/shared';
import type { Product } from '../products/product.entity';
import { solventProperties } from '../products/properties';
import { fromShared } from '../workspace/field';
import type { SolventApplication } from './solvent-application.entity';

/**
 * The flush-by time of an application (shared `flushBy`), from the product's data-sheet
 * dwell, or our documented default (products/properties.ts) with a reason saying so.
 */
export function solventFlushBy(
  appliedAt: Date,
  product: Product | null,
  surfaceTempC: number,
  inSun: boolean,
): FlushByResult & { allReasons: Reason[] } {
  const props = solventProperties(product);
  const result = fromShared(
    () =>
      flushBy({
        appliedAtMs: appliedAt.getTime(),
        product: props.product,
        surfaceC: surfaceTempC,
        inSun,
      }),
    { surfaceC: 'surfaceTempC', appliedAtMs: 'appliedAt', product: 'properties' },
  );
  return { ...result, allReasons: [...props.reasons, ...result.reasons] };
}

/** Running, due soon, overdue, flushed in time or late (shared `flushStatus`). */
export function solventStatus(app: SolventApplication, now = Date.now()): DeadlineStatus {
  const flushedAtMs = app.flushedAt?.getTime() ?? null;
  return flushStatus({
    flushByMs: app.flushBy.getTime(),
    nowMs: Math.max(now, flushedAtMs ?? now),
    flushedAtMs,
  });
}

import { maskRemoveBy, maskStatus, type DeadlineStatus, type Reason } from '@panelpass/shared';
import type { Product } from '../products/product.entity';
import { tapeProperties } from '../products/properties';
import { fromShared } from '../workspace/field';
import type { MaskingItem } from './masking-item.entity';

/** Remove-by (shared `maskRemoveBy`) from the tape's window, or our documented default. */
export function removeByFor(
  appliedAt: Date,
  product: Product | null,
): { removeByMs: number; days: number; reasons: Reason[] } {
  const props = tapeProperties(product);
  const result = fromShared(
    () => maskRemoveBy({ appliedAtMs: appliedAt.getTime(), tape: props.tape }),
    { appliedAtMs: 'appliedAt', tape: 'properties' },
  );
  return { ...result, reasons: [...props.reasons, ...result.reasons] };
}

/** Running, due soon, overdue, removed in time or late (shared `maskStatus`). */
export function maskingStatus(item: MaskingItem, now = Date.now()): DeadlineStatus {
  const removedAtMs = item.removedAt?.getTime() ?? null;
  return maskStatus({
    removeByMs: item.removeBy.getTime(),
    nowMs: Math.max(now, removedAtMs ?? now),
    removedAtMs,
  });
}

import type { TempUnit, ThicknessUnit } from '@panelpass/shared';

/**
 * A helper's own display units: how this person reads thickness and temperature on this
 * phone. Only the display changes; every figure is stored in µm and °C whatever is chosen.
 */
export interface OwnUnits {
  thickness: ThicknessUnit;
  temperature: TempUnit;
}

export const ownUnitsKey = (userId: string) => `panelpass-own-units-${userId}`;

/** The helper's choice kept on the phone; null when they have made none (or it is bad). */
export function readOwnUnits(storage: Storage, userId: string): OwnUnits | null {
  try {
    const text = storage.getItem(ownUnitsKey(userId));
    if (!text) return null;
    const kept = JSON.parse(text) as Partial<OwnUnits> | null;
    if (
      kept &&
      (kept.thickness === 'um' || kept.thickness === 'mil') &&
      (kept.temperature === 'C' || kept.temperature === 'F')
    ) {
      return { thickness: kept.thickness, temperature: kept.temperature };
    }
    return null;
  } catch {
    return null;
  }
}

/** Keeps the choice; false when the phone's storage refused it (full or blocked). */
export function keepOwnUnits(storage: Storage, userId: string, units: OwnUnits): boolean {
  try {
    storage.setItem(ownUnitsKey(userId), JSON.stringify(units));
    return true;
  } catch {
    return false;
  }
}

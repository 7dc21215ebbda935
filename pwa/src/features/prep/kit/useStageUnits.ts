import { useMemo } from 'react';
import { stageUnits, type StageUnits } from './units';

/**
 * The business's units for the stage screens. Until the settings' `useUnits()` is in the
 * app, µm and °C (the server's defaults for a new business) with no keep-dry default.
 */
export function useStageUnits(): StageUnits {
  return useMemo(() => stageUnits(), []);
}

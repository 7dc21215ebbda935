import { describe, expect, it } from 'vitest';
import { allowedNextStages, canMoveStage, JOB_STAGES } from './stages';

describe('job stages', () => {
  it('run Booked → Walkaround → Prep → Correction → Finish → Handover → Closed', () => {
    for (let i = 0; i + 1 < JOB_STAGES.length; i++) {
      expect(canMoveStage(JOB_STAGES[i]!, JOB_STAGES[i + 1]!)).toBe(true);
    }
  });

  it('allow one step back but no skipping', () => {
    expect(allowedNextStages('prep')).toEqual(['correction', 'walkaround']);
    expect(canMoveStage('booked', 'prep')).toBe(false);
    expect(canMoveStage('walkaround', 'finish')).toBe(false);
  });

  it('keep a closed job closed', () => {
    expect(allowedNextStages('closed')).toEqual([]);
    expect(canMoveStage('closed', 'handover')).toBe(false);
  });
});

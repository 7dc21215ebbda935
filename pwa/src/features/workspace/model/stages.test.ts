import { describe, expect, it } from 'vitest';
import { canMoveStage } from '@panelpass/shared';
import { backWords, forwardWords, stageMoves, stageSteps } from './stages';

describe('the stage bar', () => {
  it('marks the stages before the current one done, the current now, the rest later', () => {
    const steps = stageSteps('prep');
    expect(steps.map((s) => `${s.label}:${s.stateWord}`)).toEqual([
      'Booked:Done',
      'Walkaround:Done',
      'Prep:Now',
      'Correction:Later',
      'Chips:Any time',
      'Finish:Later',
      'Handover:Later',
      'Closed:Later',
    ]);
  });

  it('shows a closed job with every stage done', () => {
    expect(stageSteps('closed').every((s) => s.state === 'done' || s.view === 'chips')).toBe(true);
  });
});

describe('the moves offered at the bottom', () => {
  it('offers the next stage forward and one back, as the shared stage table allows', () => {
    expect(stageMoves('walkaround')).toEqual({ forward: 'prep', back: 'booked' });
    expect(stageMoves('booked')).toEqual({ forward: 'walkaround', back: null });
    expect(stageMoves('closed')).toEqual({ forward: null, back: null });
    expect(stageMoves('nonsense')).toEqual({ forward: null, back: null });
  });

  it('only ever offers moves the table allows', () => {
    for (const stage of [
      'booked',
      'walkaround',
      'prep',
      'correction',
      'finish',
      'handover',
    ] as const) {
      const { forward, back } = stageMoves(stage);
      if (forward) expect(canMoveStage(stage, forward)).toBe(true);
      if (back) expect(canMoveStage(stage, back)).toBe(true);
    }
  });

  it('words the moves', () => {
    expect(forwardWords('prep')).toBe('Move to Prep');
    expect(forwardWords('closed')).toBe('Close the job');
    expect(backWords('walkaround')).toBe('Back to Walkaround');
  });
});

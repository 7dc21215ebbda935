import type { CorrectionPassRow, FilmReadingRow, JobPanelRow } from '@panelpass/shared';
import { describe, expect, it } from 'vitest';
import {
  beforeSpotsUm,
  budgetBar,
  budgetState,
  budgetWords,
  panelBudget,
  passCheck,
} from './budget';

const panel: Pick<JobPanelRow, 'id' | 'substrate' | 'clearEstimateUm'> = {
  id: 'hood',
  substrate: 'steel',
  clearEstimateUm: null,
};

let n = 0;
function pass(step: string, passes: number, minute: number): CorrectionPassRow {
  n += 1;
  return {
    id: `p${n}`,
    businessId: 'b',
    version: 1,
    createdAt: '',
    updatedAt: '',
    deletedAt: null,
    jobId: 'j',
    panelId: 'hood',
    step,
    machine: 'rotary',
    pad: 'foam',
    productId: null,
    speedSetting: '3',
    passes,
    result: 'another-pass',
    note: '',
    loggedAt: new Date(Date.UTC(2026, 4, 15, 9, minute)).toISOString(),
    loggedBy: 'u',
  };
}

function reading(
  values: number[],
  gaugeType = 'magnetic-eddy',
  phase = 'before',
  panelId = 'hood',
): FilmReadingRow {
  n += 1;
  return {
    id: `r${n}`,
    businessId: 'b',
    version: 1,
    createdAt: '',
    updatedAt: '',
    deletedAt: null,
    jobId: 'j',
    panelId,
    phase,
    readingsUm: values,
    unit: 'um',
    gaugeType,
    takenAt: '2026-05-15T08:00:00.000Z',
    takenBy: 'u',
  };
}

describe('panelBudget — the clear-coat budget of a panel (shared clearCoatBudget)', () => {
  it('counts every logged pass: 35 µm clear, 25 % may go, one heavy-compound pass takes up to 5 µm', () => {
    const b = panelBudget(panel, [], [pass('heavy-compound', 1, 0)], 'um');
    expect(b).not.toBeNull();
    expect(b?.reserveUm).toBeCloseTo(26.25, 9);
    expect(b?.clearLeftUm.lowUm).toBe(30);
    expect(budgetWords(b!, 'um')).toBe('About 30 µm of clear left — reserve is 26 µm');
    expect(budgetWords(b!, 'mil')).toBe('About 1.18 mil of clear left — reserve is 1.03 mil');
    expect(budgetBar(b!)).toEqual({ leftPct: (30 / 35) * 100, reservePct: 75 });
  });

  it('takes the panel’s own clear estimate when one was entered', () => {
    const b = panelBudget({ ...panel, clearEstimateUm: 50 }, [], [], 'um');
    expect(b?.reserveUm).toBe(37.5);
    expect(budgetState(b!)).toEqual({ tone: 'go', tag: 'Clear to spare' });
  });

  it('uses only valid before spots: a magnetic reading on plastic is no film thickness', () => {
    const bumper = { ...panel, substrate: 'plastic' };
    expect(beforeSpotsUm(bumper, [reading([70, 72, 74], 'magnetic')])).toEqual([]);
    expect(beforeSpotsUm(bumper, [reading([70, 72, 74], 'ultrasonic')])).toEqual([72]);
    expect(beforeSpotsUm(panel, [reading([100, 100, 100], 'magnetic', 'after')])).toEqual([]);
  });

  it('says the film is too thin to correct when the thinnest before spot is under 80 µm', () => {
    const b = panelBudget(panel, [reading([120, 121, 119]), reading([76, 78, 77])], [], 'um');
    expect(budgetState(b!)).toEqual({ tone: 'stop', tag: 'Film too thin' });
  });
});

describe('passCheck — warned BEFORE a pass is logged, with the pass added', () => {
  const logged = [pass('heavy-compound', 1, 0)];
  const current = panelBudget(panel, [], logged, 'um');

  it('asks to confirm a pass that would go into the reserve, and says by how much', () => {
    const proposal = { step: 'heavy-compound', passes: 1 };
    const proposed = panelBudget(panel, [], logged, 'um', proposal);
    const check = passCheck(current, proposed, proposal, 'um');
    expect(check.confirm).toBe(
      '1 heavy compound pass could take up to 5 µm and go about 1 µm into the reserve: about 25 µm of clear left — reserve is 26 µm after it.',
    );
    expect(check.note).toBeNull();
  });

  it('lets a light pass through without asking', () => {
    const proposal = { step: 'finishing', passes: 2 };
    const proposed = panelBudget(panel, [], logged, 'um', proposal);
    expect(passCheck(current, proposed, proposal, 'um')).toEqual({ confirm: null, note: null });
  });

  it('notes, without asking, when one more pass of the kind would then cross the reserve', () => {
    const proposal = { step: 'polish', passes: 1 };
    const proposed = panelBudget(panel, [], logged, 'um', proposal);
    const check = passCheck(current, proposed, proposal, 'um');
    expect(check.confirm).toBeNull();
    expect(check.note).toBe('After 1 polish pass, one more polish pass would go into the reserve.');
  });

  it('asks again on a panel whose reserve is already reached', () => {
    const spent = [pass('heavy-compound', 2, 0)];
    const proposal = { step: 'finishing', passes: 1 };
    const check = passCheck(
      panelBudget(panel, [], spent, 'um'),
      panelBudget(panel, [], spent, 'um', proposal),
      proposal,
      'um',
    );
    expect(check.confirm).toMatch(/^The reserve is already reached on this panel/);
  });

  it('asks on a panel whose film reads under the floor, with the shared reason', () => {
    const thin = [reading([75, 76, 77])];
    const proposal = { step: 'finishing', passes: 1 };
    const check = passCheck(
      panelBudget(panel, thin, [], 'um'),
      panelBudget(panel, thin, [], 'um', proposal),
      proposal,
      'um',
    );
    expect(check.confirm).toBe(
      'Total film reads 76 µm, under 80 µm: avoid machine correction on this panel.',
    );
  });
});

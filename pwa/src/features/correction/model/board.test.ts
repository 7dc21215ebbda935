import type { JobPanelRow } from '@panelpass/shared';
import { describe, expect, it } from 'vitest';
import { budgetApplies, panelsByBand, progressOf, stepForProductKind } from './board';

function panel(id: string, band: string, position: number, state = 'todo'): JobPanelRow {
  return {
    id,
    businessId: 'b',
    version: 1,
    createdAt: '',
    updatedAt: '',
    deletedAt: null,
    jobId: 'j',
    panelKey: id,
    label: id,
    band,
    position,
    substrate: 'steel',
    finish: 'clear-coat',
    hardness: null,
    state,
    areaM2: 1,
    clearEstimateUm: null,
    testSpotNote: '',
  };
}

describe('the panel board', () => {
  it('groups panels top to bottom in the four bands, in board order inside each', () => {
    const groups = panelsByBand([
      panel('rocker', 'lower', 9),
      panel('hood', 'upper', 2),
      panel('roof', 'top', 0),
      panel('door', 'middle', 5),
      panel('mirror', 'upper', 1),
    ]);
    expect(groups.map((g) => [g.band, g.panels.map((p) => p.id)])).toEqual([
      ['top', ['roof']],
      ['upper', ['mirror', 'hood']],
      ['middle', ['door']],
      ['lower', ['rocker']],
    ]);
  });

  it('says the board’s progress in words (shared boardProgress: skipped panels do not count)', () => {
    const { progress, words } = progressOf([
      panel('a', 'top', 0, 'done'),
      panel('b', 'upper', 1, 'in-progress'),
      panel('c', 'upper', 2, 'skipped'),
      panel('d', 'middle', 3),
    ]);
    expect(words).toBe('1 of 3 panels done · 1 working · 1 skipped');
    expect(progress?.nextPanelId).toBe('b');
    expect(Math.round(progress?.percentDone ?? 0)).toBe(33);
  });

  it('budgets clear coat only where there is one (not chrome, vinyl or textured plastic)', () => {
    expect(budgetApplies('clear-coat')).toBe(true);
    expect(budgetApplies('gloss-black-trim')).toBe(true);
    expect(budgetApplies('chrome')).toBe(false);
    expect(budgetApplies('textured-plastic')).toBe(false);
  });

  it('suggests the budget step from the product’s kind on the Shelf', () => {
    expect(stepForProductKind('compound')).toBe('heavy-compound');
    expect(stepForProductKind('finishing-polish')).toBe('finishing');
    expect(stepForProductKind('tape')).toBeNull();
  });
});

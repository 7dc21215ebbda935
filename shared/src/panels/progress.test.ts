import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { BoardPanel, PANEL_STATES, boardFromTemplate, boardProgress } from './progress';

describe('panel board progress', () => {
  const board: BoardPanel[] = [
    { id: 'roof', state: 'done', areaM2: 1.5 },
    { id: 'hood', state: 'done', areaM2: 1.5 },
    { id: 'trunk-lid', state: 'in-progress', areaM2: 1 },
    { id: 'left-front-door', state: 'todo', areaM2: 1 },
    { id: 'front-bumper', state: 'skipped', areaM2: 1 },
  ];

  it('counts by state and gives percent done by panel and by area, leaving skipped out', () => {
    const p = boardProgress(board);
    expect(p.counts).toEqual({ todo: 1, 'in-progress': 1, done: 2, skipped: 1 });
    expect(p.percentDone).toBe(50);
    expect(p.percentDoneByArea).toBe(60);
    expect(p.areaDoneM2).toBe(3);
    expect(p.areaLeftM2).toBe(2);
    expect(p.nextPanelId).toBe('trunk-lid');
  });

  it('starts at 0 % from a template and ends at 100 %', () => {
    const fresh = boardFromTemplate('suv');
    expect(boardProgress(fresh).percentDone).toBe(0);
    expect(boardProgress(fresh).nextPanelId).toBe('roof');
    const finished = boardProgress(fresh.map((p) => ({ ...p, state: 'done' as const })));
    expect(finished).toMatchObject({ percentDone: 100, percentDoneByArea: 100, nextPanelId: null });
    expect(finished.reasons[0]?.code).toBe('nothing-left');
  });

  it('stays within 0–100 % and the counts add up (property)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            state: fc.constantFrom(...PANEL_STATES),
            areaM2: fc.double({ min: 0, max: 5, noNaN: true }),
          }),
          {
            minLength: 1,
            maxLength: 25,
          },
        ),
        (rows) => {
          const p = boardProgress(rows.map((r, i) => ({ id: `p${i}`, ...r })));
          expect(Object.values(p.counts).reduce((a, b) => a + b, 0)).toBe(rows.length);
          for (const v of [p.percentDone, p.percentDoneByArea]) {
            expect(v).toBeGreaterThanOrEqual(0);
            expect(v).toBeLessThanOrEqual(100 + 1e-9);
          }
        },
      ),
    );
  });

  it('refuses an empty board, duplicate ids, unknown states and negative areas', () => {
    expect(() => boardProgress([])).toThrow(
      expect.objectContaining({ field: 'panels', rule: 'non-empty' }),
    );
    expect(() => boardProgress([board[0] as BoardPanel, board[0] as BoardPanel])).toThrow(
      expect.objectContaining({ field: 'panels[1].id', rule: 'unique' }),
    );
    expect(() => boardProgress([{ id: 'roof', state: 'waxed' as 'done', areaM2: 1 }])).toThrow(
      expect.objectContaining({ field: 'panels[0].state', rule: 'one-of' }),
    );
    expect(() => boardProgress([{ id: 'roof', state: 'todo', areaM2: -1 }])).toThrow(
      expect.objectContaining({ field: 'panels[0].areaM2', rule: 'non-negative' }),
    );
  });
});

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { clearCoatBudget } from './clear-coat-budget';

// Defaults under test are common practice, no published source (check-values.md):
// clear 35–50 µm, heavy compound 3–5 µm, polish 1–2 µm, finishing < 1 µm per pass,
// remove no more than ~25 % of the clear over the car's life.
describe('clear-coat budget', () => {
  it('starts from 35 µm of clear with a 25 % allowance (8.75 µm)', () => {
    const budget = clearCoatBudget({ passes: [] });
    expect(budget).toMatchObject({
      estimatedClearUm: 35,
      allowanceUm: 8.75,
      reserveUm: 26.25,
      status: 'plenty',
    });
    expect(budget.passesLeft).toEqual({ 'heavy-compound': 1, polish: 4, finishing: 8 });
    expect(budget.reasons.map((r) => r.code)).toEqual(['clear-estimated']);
  });

  it('counts each logged pass at the high end of its removal range', () => {
    const budget = clearCoatBudget({
      estimatedClearUm: 40,
      passes: [{ step: 'polish', count: 2 }],
    });
    expect(budget.removedUm).toEqual({ lowUm: 2, highUm: 4 });
    expect(budget.clearLeftUm).toEqual({ lowUm: 36, highUm: 38 });
    expect(budget.allowanceLeftUm).toBe(6);
  });

  it('warns BEFORE the reserve: the next pass of this kind would cross it', () => {
    // 35 µm clear → 8.75 µm allowance; one heavy compound pass (≤ 5 µm) leaves 3.75 µm.
    const budget = clearCoatBudget({ passes: [{ step: 'heavy-compound', count: 1 }] });
    expect(budget.status).toBe('next-pass-crosses-reserve');
    expect(budget.ok).toBe(true);
    expect(budget.reasons[0]?.message).toBe(
      'Another heavy-compound pass (up to 5 µm) would go into the reserve: only 3.8 µm left. Use a lighter step or stop.',
    );
    // A polish pass (≤ 2 µm) still fits.
    expect(
      clearCoatBudget({ passes: [{ step: 'heavy-compound', count: 1 }], nextStep: 'polish' })
        .status,
    ).toBe('plenty');
    expect(budget.passesLeft).toMatchObject({ 'heavy-compound': 0, polish: 1, finishing: 3 });
  });

  it('stops once the reserve is reached', () => {
    const budget = clearCoatBudget({
      passes: [
        { step: 'heavy-compound', count: 1 },
        { step: 'polish', count: 2 },
      ],
    });
    expect(budget.status).toBe('reserve-reached');
    expect(budget.ok).toBe(false);
  });

  it('includes clear removed in earlier jobs, and user-edited removal rates', () => {
    const budget = clearCoatBudget({
      estimatedClearUm: 50,
      removedBeforeUm: 6,
      passes: [{ step: 'wet-sand', count: 1 }],
      removalPerPassUm: { 'wet-sand': { lowUm: 4, highUm: 6 }, polish: { lowUm: 1, highUm: 2 } },
    });
    expect(budget.removedUm).toEqual({ lowUm: 10, highUm: 12 });
    expect(budget.allowanceLeftUm).toBe(0.5);
    expect(budget.status).toBe('next-pass-crosses-reserve');
  });

  it('stops correction when the total film reads under 80 µm', () => {
    const budget = clearCoatBudget({ passes: [], totalFilmUm: 76 });
    expect(budget.reasons.map((r) => r.code)).toContain('total-film-under-floor');
    expect(budget.ok).toBe(false);
  });

  it('never grows as passes are logged (property)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            step: fc.constantFrom('heavy-compound', 'polish', 'finishing'),
            count: fc.integer({ min: 0, max: 5 }),
          }),
        ),
        fc.record({
          step: fc.constantFrom('heavy-compound', 'polish', 'finishing'),
          count: fc.integer({ min: 1, max: 5 }),
        }),
        (passes, extra) => {
          const before = clearCoatBudget({ estimatedClearUm: 45, passes });
          const after = clearCoatBudget({ estimatedClearUm: 45, passes: [...passes, extra] });
          expect(after.allowanceLeftUm).toBeLessThan(before.allowanceLeftUm);
          for (const step of Object.keys(before.passesLeft)) {
            expect(after.passesLeft[step]).toBeLessThanOrEqual(before.passesLeft[step] ?? 0);
          }
        },
      ),
    );
  });

  it('refuses unknown steps, negative counts and a broken removal table', () => {
    expect(() => clearCoatBudget({ passes: [{ step: 'sanding', count: 1 }] })).toThrow(
      expect.objectContaining({ field: 'passes[0].step', rule: 'one-of' }),
    );
    expect(() => clearCoatBudget({ passes: [{ step: 'polish', count: -1 }] })).toThrow(
      expect.objectContaining({ field: 'passes[0].count', rule: 'non-negative' }),
    );
    expect(() =>
      clearCoatBudget({ passes: [], removalPerPassUm: { polish: { lowUm: 3, highUm: 2 } } }),
    ).toThrow(expect.objectContaining({ field: 'removalPerPassUm.polish.highUm', rule: 'order' }));
    expect(() => clearCoatBudget({ passes: [], estimatedClearUm: -5 })).toThrow(
      expect.objectContaining({ field: 'estimatedClearUm' }),
    );
  });
});

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../errors';
import { dewPointC } from './dew-point';
import { climateGate } from './gate';

// A typical data-sheet window (check-values.md: "Typical window on data sheets:
// 10–35 °C, RH ≤ 85 %") — not a real product.
const typicalWindow = { minC: 10, maxC: 35, maxRhPercent: 85 };

describe('climate gate', () => {
  it('goes when the surface is well above the dew point and inside the product window', () => {
    const result = climateGate({ airC: 22, rhPercent: 50, surfaceC: 24, product: typicalWindow });
    expect(result.ok).toBe(true);
    expect(result.reasons.filter((r) => r.severity === 'stop')).toEqual([]);
    expect(result.summary).toMatch(/^Go:/);
    expect(result.requiredMarginC).toBe(3);
  });

  it('requires surface ≥ dew point + 3 °C (ISO 8502-4:2017)', () => {
    // 25 °C, 80 % → dew point 21.309 °C (PsychroLib documentation example).
    const justBelow = climateGate({ airC: 25, rhPercent: 80, surfaceC: 24.2 });
    expect(justBelow.ok).toBe(false);
    expect(justBelow.reasons.map((r) => r.code)).toContain('surface-too-close-to-dew-point');
    expect(justBelow.reasons[0]?.message).toBe(
      'Surface is 2.9 °C above dew point; needs at least 3 °C.',
    );
    expect(justBelow.reasons[0]?.basis).toBe('ISO 8502-4');
    const justAbove = climateGate({ airC: 25, rhPercent: 80, surfaceC: 24.4 });
    expect(justAbove.ok).toBe(true);
  });

  it('passes at exactly the required margin', () => {
    const dew = dewPointC(20, 60);
    expect(climateGate({ airC: 20, rhPercent: 60, surfaceC: dew + 3 }).ok).toBe(true);
  });

  it('calls out condensation when the surface is at or below the dew point', () => {
    const result = climateGate({ airC: 20, rhPercent: 90, surfaceC: 15 });
    expect(result.reasons.map((r) => r.code)).toEqual([
      'surface-at-or-below-dew-point',
      'no-product-limits',
    ]);
  });

  it('lists every failing reason, not only the first', () => {
    const result = climateGate({ airC: 8, rhPercent: 92, surfaceC: 7.5, product: typicalWindow });
    expect(result.ok).toBe(false);
    expect(result.reasons.filter((r) => r.severity === 'stop').map((r) => r.code)).toEqual([
      'surface-too-close-to-dew-point',
      'air-below-product-minimum',
      'surface-below-product-minimum',
      'humidity-above-product-maximum',
    ]);
  });

  it('flags a hot panel and hot air against the product maximum', () => {
    const result = climateGate({ airC: 37, rhPercent: 30, surfaceC: 52, product: typicalWindow });
    expect(result.reasons.map((r) => r.code)).toEqual([
      'air-above-product-maximum',
      'surface-above-product-maximum',
    ]);
  });

  it('uses the wider of the ISO margin and the product margin; 5 °F charts via minMarginC', () => {
    const wide = climateGate({
      airC: 20,
      rhPercent: 50,
      surfaceC: dewPointC(20, 50) + 4,
      product: { minAboveDewPointC: 5 },
    });
    expect(wide.requiredMarginC).toBe(5);
    expect(wide.reasons[0]?.code).toBe('surface-too-close-to-dew-point');
    const usChart = climateGate({ airC: 20, rhPercent: 50, surfaceC: 10, minMarginC: (5 * 5) / 9 });
    expect(usChart.requiredMarginC).toBeCloseTo(2.778, 3);
  });

  it('writes its messages in °F when asked, keeping the result in °C', () => {
    const result = climateGate({ airC: 25, rhPercent: 80, surfaceC: 23, displayUnit: 'F' });
    expect(result.reasons[0]?.message).toBe(
      'Surface is 3 °F above dew point; needs at least 5.4 °F.',
    );
    expect(result.dewPointC).toBeCloseTo(21.309, 2);
  });

  it('warns that frost forms above a dew point below 0 °C', () => {
    const result = climateGate({ airC: 2, rhPercent: 60, surfaceC: 6 });
    expect(result.ok).toBe(true);
    expect(result.reasons.map((r) => r.code)).toContain('frost-possible');
  });

  it('is monotonic in surface temperature: a warmer surface never fails the dew rule a cooler one passed (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 40, noNaN: true }),
        fc.double({ min: 10, max: 100, noNaN: true }),
        fc.double({ min: -10, max: 60, noNaN: true }),
        fc.double({ min: 0, max: 20, noNaN: true }),
        (air, rh, surface, warmer) => {
          const dewRule = (s: number) =>
            climateGate({ airC: air, rhPercent: rh, surfaceC: s }).reasons.some((r) =>
              r.code.startsWith('surface-'),
            );
          const cool = climateGate({ airC: air, rhPercent: rh, surfaceC: surface });
          const warm = climateGate({ airC: air, rhPercent: rh, surfaceC: surface + warmer });
          expect(warm.marginC).toBeGreaterThanOrEqual(cool.marginC);
          if (!dewRule(surface)) expect(dewRule(surface + warmer)).toBe(false);
        },
      ),
    );
  });

  it('refuses bad input with a typed error naming the field', () => {
    expect(() => climateGate({ airC: 20, rhPercent: 120, surfaceC: 20 })).toThrow(
      expect.objectContaining({ field: 'rhPercent' }),
    );
    expect(() => climateGate({ airC: 20, rhPercent: 50, surfaceC: Number.NaN })).toThrow(
      expect.objectContaining({ field: 'surfaceC', rule: 'finite' }),
    );
    expect(() =>
      climateGate({ airC: 20, rhPercent: 50, surfaceC: 20, product: { minC: 30, maxC: 10 } }),
    ).toThrow(InputError);
    expect(() => climateGate({ airC: 20, rhPercent: 50, surfaceC: 20, minMarginC: -1 })).toThrow(
      expect.objectContaining({ field: 'minMarginC', rule: 'non-negative' }),
    );
  });
});

import Qty from 'js-quantities';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  concentrateForWaterMl,
  flOzToMl,
  mixForBottle,
  mlToFlOz,
  ratioFromLabel,
  ratioLabel,
} from './dilution';

describe('dilution', () => {
  it('"1:10" = 1 part concentrate + 10 water: 1 L → 90.9 mL + 909.1 mL (cleaning convention, check-values.md)', () => {
    const ratio = ratioFromLabel('1:10', 'concentrate:water');
    expect(ratio).toEqual({ concentrateParts: 1, waterParts: 10 });
    const mix = mixForBottle({ ratio, bottleMl: 1000 });
    expect(mix.concentrateMl).toBe(90.9);
    expect(mix.waterMl).toBe(909.1);
    expect(mix.reasons.map((r) => r.code)).toEqual(['rounded']);
  });

  it('reads the water-first label "10:1" as the same ratio, and prints both ways', () => {
    const ratio = ratioFromLabel('10:1', 'water:concentrate');
    expect(ratio).toEqual({ concentrateParts: 1, waterParts: 10 });
    expect(ratioLabel(ratio)).toBe('1:10');
    expect(ratioLabel(ratio, 'water:concentrate')).toBe('10:1');
  });

  it('always adds up to the bottle, and the concentrate is within half a step of exact (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.1, max: 50, noNaN: true }),
        fc.double({ min: 0, max: 1000, noNaN: true }),
        fc.integer({ min: 1, max: 50_000 }),
        fc.constantFrom(0, 1, 2),
        (c, w, bottleMl, decimals) => {
          const mix = mixForBottle({
            ratio: { concentrateParts: c, waterParts: w },
            bottleMl,
            decimals,
          });
          const scale = 10 ** decimals;
          expect(Math.round(mix.concentrateMl * scale) + Math.round(mix.waterMl * scale)).toBe(
            bottleMl * scale,
          );
          expect(Math.abs(mix.concentrateMl - (bottleMl * c) / (c + w))).toBeLessThanOrEqual(
            0.5 / scale + 1e-9,
          );
        },
      ),
    );
  });

  it('works in whole millilitres and for a neat product', () => {
    expect(
      mixForBottle({ ratio: { concentrateParts: 1, waterParts: 4 }, bottleMl: 500, decimals: 0 }),
    ).toMatchObject({
      concentrateMl: 100,
      waterMl: 400,
      reasons: [],
    });
    expect(
      mixForBottle({ ratio: { concentrateParts: 1, waterParts: 0 }, bottleMl: 750 }).waterMl,
    ).toBe(0);
  });

  it('converts US fluid ounces exactly and agrees with js-quantities (reference library)', () => {
    expect(flOzToMl(32)).toBeCloseTo(946.352946, 6);
    expect(flOzToMl(16)).toBeCloseTo(Qty('16 floz').to('ml').scalar, 5);
    expect(mlToFlOz(flOzToMl(24))).toBeCloseTo(24, 12);
    const quart = mixForBottle({
      ratio: { concentrateParts: 1, waterParts: 10 },
      bottleMl: flOzToMl(32),
    });
    expect(quart.bottleMl).toBe(946.4);
    expect(quart.reasons.map((r) => r.code)).toContain('bottle-rounded');
  });

  it('gives the concentrate for water already measured', () => {
    expect(concentrateForWaterMl(500, { concentrateParts: 1, waterParts: 10 })).toBe(50);
  });

  it('refuses bad ratios, labels and bottles', () => {
    expect(() => ratioFromLabel('1-10', 'concentrate:water')).toThrow(
      expect.objectContaining({ field: 'label', rule: 'format' }),
    );
    expect(() => ratioFromLabel('1:10', 'any' as 'concentrate:water')).toThrow(
      expect.objectContaining({ field: 'order' }),
    );
    expect(() => ratioFromLabel('0:10', 'concentrate:water')).toThrow(
      expect.objectContaining({ field: 'label.concentrateParts', rule: 'positive' }),
    );
    expect(() =>
      mixForBottle({ ratio: { concentrateParts: 1, waterParts: -2 }, bottleMl: 1000 }),
    ).toThrow(expect.objectContaining({ field: 'ratio.waterParts' }));
    expect(() =>
      mixForBottle({ ratio: { concentrateParts: 1, waterParts: 10 }, bottleMl: 0 }),
    ).toThrow(expect.objectContaining({ field: 'bottleMl', rule: 'positive' }));
    expect(() =>
      mixForBottle({ ratio: { concentrateParts: 1, waterParts: 10 }, bottleMl: 1000, decimals: 3 }),
    ).toThrow(expect.objectContaining({ field: 'decimals' }));
  });
});
